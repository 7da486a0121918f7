// Bench-run analysis: integration, cut-off, charge phases, thermal plateau, downsampling and demo models.
export type { Column as RunColumn, RunSeries, ValueColumn as RunValueColumn } from './series';
export { integrateRun, integrateSeries, type RunTotals, type SeriesTotals } from './integrate';
export {
  detectCutoff,
  analyseDischarge,
  analysePowerBank,
  capacityVersusLabel,
  type CutoffRunOptions,
  type CutoffPoint,
  type CutoffReason,
  type DischargeRunAnalysis,
  type PowerBankRunAnalysis,
} from './discharge';
export {
  analyseCharge,
  type ChargeRunOptions,
  type ChargeRunAnalysis,
} from './charge';
export {
  analyseThermal,
  type ThermalRunOptions,
  type ThermalRunAnalysis,
  type RunSteadyState,
} from './thermal-run';
export { downsample, lttbIndices, type DownsampledTrace } from './downsample';
export {
  createSeededRandom,
  lithiumIonOcv,
  firstOrderThermal,
  simulateDischarge,
  simulateCharge,
  simulateHeater,
  MAX_SIMULATED_SAMPLES,
  type SimulationNoise,
  type SimulatedSeries,
  type DischargeSimulation,
  type ChargeSimulation,
  type HeaterSimulation,
} from './models';
