/**
 * Constant-current / constant-voltage (CC-CV) charge logs [S: cell makers'
 * application guides]: the charger holds the current until the cell reaches
 * the charge voltage, then holds the voltage while the current tapers to the
 * termination current.
 */
import { requireFraction, requirePositive } from '../shared/validate';
import { integrateRange } from './integrate';
import { at, checkSeries, optionalFinite, type Column, type RunSeries } from './series';
import { plain } from '../shared/text';

export interface ChargeRunOptions {
  /** Charge (CV) voltage, V. Default: estimated from the plateau at the top of the log. */
  cvVolts?: number | undefined;
  /**
   * Termination current in C: the charge ends when the current falls to terminationFraction ×
   * ratedCapacityAh (A); default 0.05 C [S: CC-CV taper ends at about C/10–C/30, 0.05 C common;
   * cell-specific]. Without a rated capacity it is taken of the CC current instead.
   */
  terminationFraction?: number | undefined;
  /** Rated capacity of the pack being charged (cells in parallel × cell rating), Ah: the base of the termination current. */
  ratedCapacityAh?: number | undefined;
  /** How close to the CV voltage counts as on the plateau, V; default 0.01 V [CP]. */
  voltageToleranceV?: number | undefined;
  /** Smallest current fall, as a fraction of the CC current, that counts as the taper starting; default 0.005 [CP]. */
  currentToleranceFraction?: number | undefined;
}

export interface ChargeRunAnalysis {
  cc: { startS: number; endS: number; currentA: number };
  cv: { startS: number; endS: number; volts: number } | null;
  /** First sample of the CV phase: on the plateau with the current starting to fall; null when there is no CV phase. */
  transitionIndex: number | null;
  terminationCurrentA: number;
  /** What the termination fraction was taken of: the rated capacity (in C), or the CC current when no rating was given. */
  terminationBasis: TerminationBasis;
  /** True when the current reached the termination current within the log. */
  terminated: boolean;
  chargeTimeS: number;
  ampHours: number;
  wattHours: number;
  /** Plateau voltage used for detection (given or estimated), V. */
  plateauVolts: number;
  endIndex: number;
}

/** What a termination fraction multiplies. */
export type TerminationBasis = 'rated-capacity' | 'cc-current';

export const DEFAULT_TERMINATION_FRACTION = 0.05;
export const DEFAULT_CV_TOLERANCE_V = 0.01;
export const DEFAULT_CURRENT_TOLERANCE_FRACTION = 0.005;
/** Consecutive samples below the CC level needed to call the taper started (rejects single noise spikes). */
const FALL_RUN = 3;
/** Robust standard deviation from the median absolute deviation of normal noise. */
const MAD_TO_SD = 1.4826;

function median(values: Float64Array): number {
  const sorted = values.slice().sort();
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? (sorted[mid] as number) : ((sorted[mid - 1] as number) + (sorted[mid] as number)) / 2;
}

function segment(column: Column, from: number, to: number): Float64Array {
  const out = new Float64Array(to - from);
  for (let k = from; k < to; k++) out[k - from] = at(column, k);
  return out;
}

/**
 * CC and CV phases of a charge log (needs v and i): the transition is the
 * first sample at the CV plateau (within voltageToleranceV) from which the
 * current falls below the CC level (by more than the noise) and stays there;
 * the charge ends at the first later sample at or below the termination
 * current (terminationFraction × the rated capacity, in C; × the CC current
 * when no rating is given), else at the end of the log.
 */
export function analyseCharge(series: RunSeries, opts: ChargeRunOptions = {}): ChargeRunAnalysis {
  const n = checkSeries(series, ['v', 'i'], 'a charge analysis');
  const v = series.v as Column;
  const i = series.i as Column;
  const t = series.t;
  const givenCv = optionalFinite(opts.cvVolts, 'cvVolts');
  if (givenCv !== undefined) requirePositive(givenCv, 'cvVolts');
  const terminationFraction = requireFraction(optionalFinite(opts.terminationFraction, 'terminationFraction') ?? DEFAULT_TERMINATION_FRACTION, 'terminationFraction');
  const ratedAh = optionalFinite(opts.ratedCapacityAh, 'ratedCapacityAh');
  if (ratedAh !== undefined) requirePositive(ratedAh, 'ratedCapacityAh');
  const tolV = requirePositive(optionalFinite(opts.voltageToleranceV, 'voltageToleranceV') ?? DEFAULT_CV_TOLERANCE_V, 'voltageToleranceV');
  const tolI = requireFraction(optionalFinite(opts.currentToleranceFraction, 'currentToleranceFraction') ?? DEFAULT_CURRENT_TOLERANCE_FRACTION, 'currentToleranceFraction');

  // Plateau voltage: given, or the median of the samples within tolV of the highest voltage.
  let plateauVolts = givenCv;
  if (plateauVolts === undefined) {
    let vMax = -Infinity;
    for (let k = 0; k < n; k++) vMax = Math.max(vMax, at(v, k));
    let count = 0;
    for (let k = 0; k < n; k++) if (at(v, k) >= vMax - tolV) count++;
    const top = new Float64Array(count);
    let j = 0;
    for (let k = 0; k < n; k++) if (at(v, k) >= vMax - tolV) top[j++] = at(v, k);
    plateauVolts = median(top);
  }

  // First sample on the plateau.
  let onPlateau = -1;
  for (let k = 0; k < n; k++) {
    if (at(v, k) >= plateauVolts - tolV) {
      onPlateau = k;
      break;
    }
  }

  // CC current and its noise from the samples before the plateau (at least the first sample).
  const ccEnd = Math.max(onPlateau === -1 ? n : onPlateau, 1);
  const ccSamples = segment(i, 0, ccEnd);
  const ccCurrent = median(ccSamples);
  if (!(ccCurrent > 0)) {
    throw new RangeError(`series.i (current) must be positive while charging (median ${ccCurrent} A); if your logger records charge as negative, flip the sign of the current column.`);
  }
  for (let k = 0; k < ccSamples.length; k++) ccSamples[k] = Math.abs((ccSamples[k] as number) - ccCurrent);
  const noiseSd = MAD_TO_SD * median(ccSamples);
  const fall = Math.max(4 * noiseSd, tolI * ccCurrent);

  // Transition: on the plateau and the current below the CC level for FALL_RUN samples in a row (or to the end).
  let transitionIndex: number | null = null;
  if (onPlateau !== -1) {
    let runStart = -1;
    for (let k = onPlateau; k < n; k++) {
      if (at(i, k) < ccCurrent - fall) {
        if (runStart === -1) runStart = k;
        if (k - runStart + 1 >= FALL_RUN || k === n - 1) break;
      } else {
        runStart = -1;
      }
    }
    if (runStart !== -1) transitionIndex = Math.max(onPlateau, runStart - 1);
  }

  const terminationBasis: TerminationBasis = ratedAh !== undefined ? 'rated-capacity' : 'cc-current';
  // I = n × C_rated (REFERENCES §4): 0.05 C of 3.0 Ah is 0.150 A.
  const terminationCurrentA = terminationFraction * (ratedAh ?? ccCurrent);
  if (terminationBasis === 'rated-capacity' && !(terminationCurrentA < ccCurrent)) {
    throw new RangeError(
      `terminationFraction: ${terminationFraction} C of the rated ${ratedAh} Ah is ${plain(terminationCurrentA, 3)} A, not below the constant current of ${plain(ccCurrent, 3)} A; lower the termination or check the rated capacity.`,
    );
  }
  const searchFrom = transitionIndex ?? 0;
  let endIndex = n - 1;
  let terminated = false;
  for (let k = searchFrom + 1; k < n; k++) {
    if (at(i, k) <= terminationCurrentA) {
      endIndex = k;
      terminated = true;
      break;
    }
  }

  const totals = integrateRange(series, 0, endIndex);
  const t0 = at(t, 0);
  let cv: ChargeRunAnalysis['cv'] = null;
  if (transitionIndex !== null) {
    let sum = 0;
    for (let k = transitionIndex; k <= endIndex; k++) sum += at(v, k);
    cv = { startS: at(t, transitionIndex), endS: at(t, endIndex), volts: sum / (endIndex - transitionIndex + 1) };
  }
  return {
    cc: { startS: t0, endS: at(t, transitionIndex ?? endIndex), currentA: ccCurrent },
    cv,
    transitionIndex,
    terminationCurrentA,
    terminationBasis,
    terminated,
    chargeTimeS: at(t, endIndex) - t0,
    ampHours: totals.ampHours as number,
    wattHours: totals.wattHours as number,
    plateauVolts,
    endIndex,
  };
}
