/**
 * Discharge and power-bank runs: where the run ends, what it delivered, and
 * how that compares with the label.
 */
import { requireFraction, requireNonNegative, requirePositive } from '../shared/validate';
import { integrateRange } from './integrate';
import { findCurrentPulse, type CurrentPulse } from './pulse';
import { at, checkSeries, columnLabel, LOAD_OFF_FRACTION, optionalFinite, type Column, type RunSeries } from './series';
import { plain } from '../shared/text';

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
  /** End-of-discharge voltage, V. When given, the run ends at the first sample at or below it that stays there (see cutoffDebounceSeconds). */
  cutoffVolts?: number | undefined;
  /**
   * How long the voltage must stay at or below cutoffVolts to end the run, s; default 5 s [CP]. A
   * shorter sag (a load step, a contact bounce) is ignored. A dip lasts from its first sample at or
   * below the cut-off to the first sample back above it, so a log sampled more slowly than the
   * debounce cannot resolve a shorter sag and every dip in it ends the run. A dip still in progress
   * at the end of the log, or during which the load stops, ends the run whatever its length. 0 ends
   * the run at the first sample at or below the cut-off.
   */
  cutoffDebounceSeconds?: number | undefined;
  /** Current (A) at or below which the load counts as off; default 2 % of the peak current (or power, if only p is logged). */
  currentFloorA?: number | undefined;
}

/** Default time the voltage must stay below the cut-off to end a discharge, s [CP]. */
export const DEFAULT_CUTOFF_DEBOUNCE_S = 5;

/** Dips below the cut-off too short to end the run. */
export interface IgnoredDips {
  count: number;
  /** Start of the first one, s. */
  firstAtS: number;
  /** Length of the longest one, s. */
  longestS: number;
}

interface CheckedCutoffOptions {
  cutoffVolts: number | undefined;
  debounceS: number;
  floor: number | undefined;
}

function checkCutoffOptions(opts: CutoffRunOptions): CheckedCutoffOptions {
  const cutoffVolts = optionalFinite(opts.cutoffVolts, 'cutoffVolts');
  if (cutoffVolts !== undefined) requirePositive(cutoffVolts, 'cutoffVolts');
  const debounceS = requireNonNegative(optionalFinite(opts.cutoffDebounceSeconds, 'cutoffDebounceSeconds') ?? DEFAULT_CUTOFF_DEBOUNCE_S, 'cutoffDebounceSeconds');
  const floor = optionalFinite(opts.currentFloorA, 'currentFloorA');
  if (floor !== undefined) requireNonNegative(floor, 'currentFloorA');
  return { cutoffVolts, debounceS, floor };
}

/** Current (or power) at or below which the load counts as off: the given floor, else 2 % of the peak. */
function loadOffThreshold(series: RunSeries, n: number, floor: number | undefined): { load: Column; threshold: number } | null {
  const load = series.i ?? series.p;
  if (!load) return null;
  if (floor !== undefined && series.i !== undefined) return { load, threshold: floor };
  let peak = 0;
  for (let k = 0; k < n; k++) peak = Math.max(peak, Math.abs(at(load, k)));
  return { load, threshold: LOAD_OFF_FRACTION * peak };
}

/** Index of the sample where the run ends, and the dips it ignored; the series is already checked. */
function findCutoff(series: RunSeries, n: number, o: CheckedCutoffOptions): { point: CutoffPoint | null; ignored: IgnoredDips | null } {
  const v = series.v as NonNullable<RunSeries['v']>;
  const t = series.t;
  const point = (index: number, reason: CutoffReason): CutoffPoint => ({
    index,
    t: at(t, index),
    volts: at(v, index),
    reason,
  });
  const off = loadOffThreshold(series, n, o.floor);
  const isOff = (k: number) => off !== null && Math.abs(at(off.load, k)) <= off.threshold;
  if (o.cutoffVolts !== undefined) {
    const cutoff = o.cutoffVolts;
    let ignored: IgnoredDips | null = null;
    for (let k = 0; k < n; k++) {
      if (at(v, k) > cutoff) continue;
      // A dip from k to the first sample back above the cut-off (j), or to the end of the log.
      let stopped = isOff(k);
      let j = k + 1;
      while (j < n && at(v, j) <= cutoff) {
        if (isOff(j)) stopped = true;
        j++;
      }
      if (j === n) return { point: point(k, 'cutoff-voltage'), ignored };
      // A load that cuts out lets the voltage spring back: the recovery sample shows it.
      if (isOff(j)) stopped = true;
      const lengthS = at(t, j) - at(t, k);
      if (stopped || lengthS >= o.debounceS) return { point: point(k, 'cutoff-voltage'), ignored };
      ignored = ignored ? { count: ignored.count + 1, firstAtS: ignored.firstAtS, longestS: Math.max(ignored.longestS, lengthS) } : { count: 1, firstAtS: at(t, k), longestS: lengthS };
      k = j - 1;
    }
    return { point: null, ignored };
  }
  // No cut-off voltage: the run ends at the last loaded sample before the load stops.
  if (off) {
    let loaded = false;
    for (let k = 0; k < n; k++) {
      if (!isOff(k)) loaded = true;
      else if (loaded) return { point: point(k - 1, 'current-stopped'), ignored: null };
    }
  }
  return { point: point(n - 1, 'end-of-run'), ignored: null };
}

/**
 * Where a discharge ends: the first sample at or below cutoffVolts that stays there for the
 * debounce time (null when the run never gets there), or without a cut-off the last sample before
 * the current falls to about zero, or the last sample.
 */
export function detectCutoff(series: RunSeries, opts: CutoffRunOptions = {}): CutoffPoint | null {
  const n = checkSeries(series, ['v'], 'finding the cut-off');
  return findCutoff(series, n, checkCutoffOptions(opts)).point;
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
  /** Debounce used for the cut-off, s. */
  cutoffDebounceSeconds: number;
  /** Dips below the cut-off too short to end the run; null when there were none (or no cut-off voltage). */
  ignoredDips: IgnoredDips | null;
  averageCurrentA: number;
  averagePowerW: number;
  /** ∫V² dt / duration over the analysed part (trapezoids), V²: a fixed resistance R takes mean(V²)/R on average. */
  meanSquareVolts: number;
  /** The first current pulse in the analysed part and the DC resistance it gives; null when there is none. */
  internalResistance: CurrentPulse | null;
  /** Index of the last sample included in the totals. */
  endIndex: number;
}

/**
 * Delivered Ah and Wh (trapezoidal, V·I per sample) from the start to the
 * cut-off (or the whole run if the cut-off is never reached), with mean and
 * end voltages, mean V², and the first current pulse's DC resistance. Needs v
 * and one of i or p.
 */
export function analyseDischarge(series: RunSeries, opts: CutoffRunOptions = {}): DischargeRunAnalysis {
  const n = checkSeries(series, ['v'], 'a discharge analysis');
  if (!series.i && !series.p) {
    throw new RangeError(`${columnLabel('i')} or ${columnLabel('p')} is required for a discharge analysis.`);
  }
  const checked = checkCutoffOptions(opts);
  const { cutoffVolts } = checked;
  const { point: cutoff, ignored } = findCutoff(series, n, checked);
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
    cutoffDebounceSeconds: checked.debounceS,
    ignoredDips: ignored,
    averageCurrentA: (ampHours * 3600) / totals.durationS,
    averagePowerW: (wattHours * 3600) / totals.durationS,
    meanSquareVolts: totals.meanSquareVolts as number,
    internalResistance: findCurrentPulse(series, { endIndex, currentFloorA: series.i ? checked.floor : undefined }),
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
    warnings.push(`The output energy (${plain(wattHours, 4)} Wh) exceeds the cell energy (${cellEnergyWh} Wh); check the cell capacity and voltage.`);
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
export function capacityVersusLabel(measuredAh: number, claimedAh: number, warnFraction = 0.9): { percent: number; warning: boolean } {
  requireNonNegative(measuredAh, 'measuredAh');
  requirePositive(claimedAh, 'claimedAh');
  requireFraction(warnFraction, 'warnFraction');
  return { percent: (measuredAh / claimedAh) * 100, warning: measuredAh < warnFraction * claimedAh };
}
