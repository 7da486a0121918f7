// Bench-run analysis: integration, cut-off, charge phases, thermal plateau, downsampling and demo models.
export type { Column as RunColumn, RunSeries, ValueColumn as RunValueColumn } from './series';
export { integrateRun, integrateSeries, type RunTotals, type SeriesTotals } from './integrate';
export {
  detectCutoff,
  analyseDischarge,
  analysePowerBank,
  capacityVersusLabel,
  DEFAULT_CUTOFF_DEBOUNCE_S,
  type IgnoredDips,
  type CutoffRunOptions,
  type CutoffPoint,
  type CutoffReason,
  type DischargeRunAnalysis,
  type PowerBankRunAnalysis,
} from './discharge';
export { detectCurrentPulse, DEFAULT_PULSE_STEP_RATIO, DEFAULT_PULSE_READ_AFTER_S, DEFAULT_PULSE_LEVEL_TOLERANCE, type CurrentPulse, type PulseOptions } from './pulse';
export { analyseCharge, DEFAULT_TERMINATION_FRACTION, type TerminationBasis, type ChargeRunOptions, type ChargeRunAnalysis } from './charge';
export { analyseThermal, type ThermalRunOptions, type ThermalRunAnalysis, type RunSteadyState } from './thermal-run';
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
  type DischargePulse,
  type ChargeSimulation,
  type HeaterSimulation,
} from './models';
export {
  RUN_TIME_UNITS,
  RUN_VOLTAGE_UNITS,
  RUN_CURRENT_UNITS,
  RUN_POWER_UNITS,
  RUN_TEMPERATURE_UNITS,
  RUN_STORED_UNIT,
  runUnitConversion,
  toStoredUnit,
  convertColumnInPlace,
  type RunQuantity,
} from './units';
export { timeToLevel, timeToTemperature } from './crossing';
