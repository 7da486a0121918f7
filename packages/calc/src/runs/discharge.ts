/**
 * Discharge and power-bank runs: where the run ends, what it delivered, and
 * how that compares with the label.
 */
import { requireFraction, requireNonNegative, requirePositive } from '../shared/validate';
import { integrateRange } from './integrate';
import { at, checkSeries, columnLabel, optionalFinite, type RunSeries } from './series';

/** Why a run's analysed part ends where it does. */
export type CutoffReason = 'cutoff-voltage' | 'current-stopped' | 'end-of-run';

/** The sample where the analysed part of a run ends. */
export interface CutoffPoint {
  index: number;
  t: number;
  volts: number;
  reason: CutoffReason;
}

export interface CutoffRunOptions {
  /** End-of-discharge voltage, V. When given, the run ends at the first sample at or below it. */
  cutoffVolts?: number | undefined;
  /** Current (A) at or below which the load counts as off; default 2 % of the peak current (or power, if only p is logged). */
  currentFloorA?: number | undefined;
}

/** Default share of the peak current below which the load counts as stopped. */
export const LOAD_OFF_FRACTION = 0.02;

function checkCutoffOptions(opts: CutoffRunOptions): { cutoffVolts: number | undefined; floor: number | undefined } {
  const cutoffVolts = optionalFinite(opts.cutoffVolts, 'cutoffVolts');
  if (cutoffVolts !== undefined) requirePositive(cutoffVolts, 'cutoffVolts');
  const floor = optionalFinite(opts.currentFloorA, 'currentFloorA');
  if (floor !== undefined) requireNonNegative(floor, 'currentFloorA');
  return { cutoffVolts, floor };
}

/** Index of the sample where the run ends; the series is already checked. */
function findCutoff(series: RunSeries, n: number, cutoffVolts: number | undefined, floor: number | undefined): CutoffPoint | null {
  const v = series.v as NonNullable<RunSeries['v']>;
  const point = (index: number, reason: CutoffReason): CutoffPoint => ({
    index,
    t: at(series.t, index),
    volts: at(v, index),
    reason,
  });
  if (cutoffVolts !== undefined) {
    for (let k = 0; k < n; k++) if (at(v, k) <= cutoffVolts) return point(k, 'cutoff-voltage');
    return null;
  }
  // No cut-off voltage: the run ends at the last loaded sample before the load stops.
  const load = series.i ?? series.p;
  if (load) {
    let threshold = floor;
    if (threshold === undefined || series.i === undefined) {
      let peak = 0;
      for (let k = 0; k < n; k++) peak = Math.max(peak, Math.abs(at(load, k)));
      threshold = LOAD_OFF_FRACTION * peak;
    }
    let loaded = false;
    for (let k = 0; k < n; k++) {
      const above = Math.abs(at(load, k)) > threshold;
      if (above) loaded = true;
      else if (loaded) return point(k - 1, 'current-stopped');
    }
  }
  return point(n - 1, 'end-of-run');
}

/**
 * Where a discharge ends: the first sample at or below cutoffVolts (null when
 * the run never gets there), or without a cut-off the last sample before the
 * current falls to about zero, or the last sample.
 */
export function detectCutoff(series: RunSeries, opts: CutoffRunOptions = {}): CutoffPoint | null {
  const n = checkSeries(series, ['v'], 'finding the cut-off');
  const { cutoffVolts, floor } = checkCutoffOptions(opts);
  return findCutoff(series, n, cutoffVolts, floor);
}

/** Results of a discharge run analysed up to its cut-off. */
export interface DischargeRunAnalysis {
  ampHours: number;
  wattHours: number;
  durationS: number;
  /** Charge-weighted mean voltage Wh/Ah, V. */
  averageVolts: number;
  /** Time-weighted mean voltage ∫V dt / duration, V. */
  timeAverageVolts: number;
  endVolts: number;
  minVolts: number;
  cutoff: CutoffPoint | null;
  averageCurrentA: number;
  averagePowerW: number;
  /** Index of the last sample included in the totals. */
  endIndex: number;
}

/**
 * Delivered Ah and Wh (trapezoidal, V·I per sample) from the start to the
 * cut-off (or the whole run if the cut-off is never reached), with mean and
 * end voltages. Needs v and one of i or p.
 */
export function analyseDischarge(series: RunSeries, opts: CutoffRunOptions = {}): DischargeRunAnalysis {
  const n = checkSeries(series, ['v'], 'a discharge analysis');
  if (!series.i && !series.p) {
    throw new RangeError(`${columnLabel('i')} or ${columnLabel('p')} is required for a discharge analysis.`);
  }
  const { cutoffVolts, floor } = checkCutoffOptions(opts);
  const cutoff = findCutoff(series, n, cutoffVolts, floor);
  const endIndex = cutoff ? cutoff.index : n - 1;
  if (endIndex === 0) {
    throw new RangeError(
      cutoffVolts !== undefined
        ? `cutoffVolts (${cutoffVolts} V) is already reached at the first sample; check the cut-off voltage.`
        : 'series: the load is off from the second sample on, so there is no discharge to analyse.',
    );
  }
  const totals = integrateRange(series, 0, endIndex);
  const v = series.v as NonNullable<RunSeries['v']>;
  let minVolts = Infinity;
  for (let k = 0; k <= endIndex; k++) minVolts = Math.min(minVolts, at(v, k));
  const ampHours = totals.ampHours as number;
  const wattHours = totals.wattHours as number;
  return {
    ampHours,
    wattHours,
    durationS: totals.durationS,
    averageVolts: totals.averageVolts as number,
    timeAverageVolts: totals.timeAverageVolts as number,
    endVolts: at(v, endIndex),
    minVolts,
    cutoff,
    averageCurrentA: (ampHours * 3600) / totals.durationS,
    averagePowerW: (wattHours * 3600) / totals.durationS,
    endIndex,
  };
}

/** Output of a power bank measured at its USB port, against the energy of its cells. */
export interface PowerBankRunAnalysis {
  wattHours: number;
  /** Charge delivered at the output voltage, Ah. */
  ampHours: number;
  averageVolts: number;
  durationS: number;
  /** Output energy expressed as Ah at 5 V (what a "capacity at 5 V" figure quotes) [CP]. */
  ampHoursAt5V: number;
  cellEnergyWh: number;
  /** Output Wh / cell Wh. */
  efficiency: number;
  warnings: string[];
}

/** Energy delivered at the output (Wh, Ah at the output voltage) and efficiency = output Wh / cell Wh. */
export function analysePowerBank(series: RunSeries, opts: { cellEnergyWh: number }): PowerBankRunAnalysis {
  const n = checkSeries(series, ['v'], 'a power-bank analysis');
  if (!series.i && !series.p) {
    throw new RangeError(`${columnLabel('i')} or ${columnLabel('p')} is required for a power-bank analysis.`);
  }
  const cellEnergyWh = requirePositive(opts?.cellEnergyWh, 'cellEnergyWh');
  const totals = integrateRange(series, 0, n - 1);
  const wattHours = totals.wattHours as number;
  const efficiency = wattHours / cellEnergyWh;
  const warnings: string[] = [];
  if (efficiency > 1) {
    warnings.push(
      `The output energy (${wattHours.toFixed(2)} Wh) exceeds the cell energy (${cellEnergyWh} Wh); check the cell capacity and voltage.`,
    );
  }
  return {
    wattHours,
    ampHours: totals.ampHours as number,
    averageVolts: totals.averageVolts as number,
    durationS: totals.durationS,
    ampHoursAt5V: wattHours / 5,
    cellEnergyWh,
    efficiency,
    warnings,
  };
}

/** Measured capacity as a percentage of the label, with a warning below warnFraction of it. */
export function capacityVersusLabel(
  measuredAh: number,
  claimedAh: number,
  warnFraction = 0.9,
): { percent: number; warning: boolean } {
  requireNonNegative(measuredAh, 'measuredAh');
  requirePositive(claimedAh, 'claimedAh');
  requireFraction(warnFraction, 'warnFraction');
  return { percent: (measuredAh / claimedAh) * 100, warning: measuredAh < warnFraction * claimedAh };
}
