// Lineup comparison: Pareto frontier, normalised device metrics and weighted scores.
export { paretoFrontier, paretoFrontierXY, type Better } from './pareto';
export {
  comparisonMetrics,
  weightedScores,
  METRICS,
  METRIC_KEYS,
  type MetricKey,
  type MetricInfo,
  type DeviceFigures,
  type DeviceMetrics,
  type ScoredRow,
} from './metrics';
