// Lineup comparison: Pareto frontier, normalised device metrics, weighted scores and the main load.
export { paretoFrontier, paretoFrontierXY, type Better } from './pareto';
export { comparisonMetrics, weightedScores, METRICS, METRIC_KEYS, type MetricKey, type MetricInfo, type DeviceFigures, type DeviceMetrics, type ScoredRow } from './metrics';
export { mainLoads, MAIN_LOAD_KIND, type MainLoadChoice } from './main-load';
export { type ModeRule, type ModeCandidate, type ModeChoice, MODE_RULES, chooseMode } from './mode-choice';
