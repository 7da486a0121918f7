/**
 * A current pulse in a discharge log, read as the DC internal-resistance method reads it
 * [M: IEC 61960-3; REFERENCES §12]: a steady low current I₁ with its voltage U₁, a step to a steady
 * high current I₂, and U₂ read after 1 s at I₂; R = (U₁ − U₂) / (I₂ − I₁).
 *
 * The rule, on the samples as logged:
 * - The step is an increase between two consecutive samples a (the last at the low level) and a + 1
 *   (the first at the high level), to at least minStepRatio × the low current. An electronic load
 *   steps in microseconds, so a logger sampling at 1 Hz or slower sees it within one interval.
 * - Both levels are steady: the low level holds on at least the sample before a (within the level
 *   tolerance of I[a]); the high plateau is every sample from a + 1 within the tolerance of I[a + 1]
 *   (one sample is enough: a 1 s pulse logged at 1 Hz shows once), unless the current rises further
 *   before U₂ is read (a staircase is not a steady level).
 * - The low level is a load: above the load-off floor (2 % of the peak current, as the cut-off
 *   uses), so the start of a discharge from rest is not taken for a pulse.
 * - U₁ is the voltage at a, just before the step. U₂ is the voltage at the first plateau sample at
 *   least readAfterS (1 s) after a: the step happens between a and a + 1, so that is the reading
 *   closest to "after 1 s at I₂" the log holds. If the plateau ends sooner, U₂ is its last sample.
 *   I₁ and I₂ are the currents logged at those same two samples.
 * - A candidate whose voltage does not fall (U₂ ≥ U₁) is skipped. The first pulse that qualifies is
 *   reported.
 */
import { internalResistanceDc } from '../battery/internal-resistance';
import { requireFinite, requirePositive } from '../shared/validate';
import { at, checkSeries, columnLabel, LOAD_OFF_FRACTION, optionalFinite, type Column, type RunSeries } from './series';

/** A current step found in a log, with both levels and the resistance it gives. */
export interface CurrentPulse {
  /** R = (U₁ − U₂) / (I₂ − I₁), Ω. */
  ohms: number;
  lowAmps: number;
  lowVolts: number;
  highAmps: number;
  highVolts: number;
  /** Time of the first sample at the high current, s. */
  atSeconds: number;
  /** Time of the sample U₂ is read at, s. */
  readAtSeconds: number;
  /** Index of the last sample at the low current (U₁). */
  lowIndex: number;
  /** Index of the sample U₂ is read at. */
  readIndex: number;
}

export interface PulseOptions {
  /** Smallest high ÷ low current that counts as a step; default 1.5 (the DC method uses 5: 0.2 It → 1.0 It). */
  minStepRatio?: number | undefined;
  /** How long after the step U₂ is read, s; default 1 s (the DC method). */
  readAfterS?: number | undefined;
  /** How far a steady level may wander, as a fraction of it; default 0.02 [CP]. */
  levelTolerance?: number | undefined;
  /** Current at or below which the load counts as off, A; default 2 % of the peak current. */
  currentFloorA?: number | undefined;
  /** Last sample index to look at (inclusive); default the last sample. */
  endIndex?: number | undefined;
}

export const DEFAULT_PULSE_STEP_RATIO = 1.5;
export const DEFAULT_PULSE_READ_AFTER_S = 1;
export const DEFAULT_PULSE_LEVEL_TOLERANCE = 0.02;
/** Smallest tolerance band of a level, A: keeps a level of a few mA from counting noise as steps. */
const MIN_LEVEL_BAND_A = 0.002;

/** The first current pulse of a discharge log (a step up between two steady current levels) and the DC resistance it gives, or null. */
export function detectCurrentPulse(series: RunSeries, opts: PulseOptions = {}): CurrentPulse | null {
  checkSeries(series, ['v'], 'finding a current pulse');
  if (!series.i && !series.p) throw new RangeError(`${columnLabel('i')} or ${columnLabel('p')} is required for finding a current pulse.`);
  return findCurrentPulse(series, opts);
}

/**
 * The first current pulse (a step up between two steady levels) of a log whose shape and values
 * are already checked (t, v and i, or p with v), or null when there is none.
 */
export function findCurrentPulse(series: RunSeries, opts: PulseOptions = {}): CurrentPulse | null {
  const ratio = requirePositive(optionalFinite(opts.minStepRatio, 'minStepRatio') ?? DEFAULT_PULSE_STEP_RATIO, 'minStepRatio');
  if (!(ratio > 1)) throw new RangeError(`minStepRatio must be above 1 (got ${ratio}).`);
  const readAfterS = requireFinite(optionalFinite(opts.readAfterS, 'readAfterS') ?? DEFAULT_PULSE_READ_AFTER_S, 'readAfterS');
  if (readAfterS < 0) throw new RangeError(`readAfterS must not be negative (got ${readAfterS}).`);
  const tol = requirePositive(optionalFinite(opts.levelTolerance, 'levelTolerance') ?? DEFAULT_PULSE_LEVEL_TOLERANCE, 'levelTolerance');
  const v = series.v as Column | undefined;
  if (!v || (!series.i && !series.p)) return null;
  const t = series.t;
  const last = Math.min(opts.endIndex ?? t.length - 1, t.length - 1);
  const amps = series.i ? (k: number) => at(series.i as Column, k) : (k: number) => at(series.p as Column, k) / at(v, k);

  let floor = optionalFinite(opts.currentFloorA, 'currentFloorA');
  if (floor === undefined) {
    let peak = 0;
    for (let k = 0; k <= last; k++) peak = Math.max(peak, Math.abs(amps(k)));
    floor = LOAD_OFF_FRACTION * peak;
  }
  const band = (level: number) => Math.max(tol * Math.abs(level), MIN_LEVEL_BAND_A);

  for (let a = 1; a < last; a++) {
    const low = amps(a);
    const high = amps(a + 1);
    if (!(low > floor) || high < ratio * low) continue;
    // The low level holds on the sample before the step.
    if (Math.abs(amps(a - 1) - low) > band(low)) continue;
    // The high plateau, and the sample U₂ is read at.
    const highBand = band(high);
    let read = a + 1;
    let j = a + 1;
    for (; j <= last && Math.abs(amps(j) - high) <= highBand; j++) {
      read = j;
      if (at(t, j) - at(t, a) >= readAfterS) break;
    }
    // A plateau that gives way to a further rise before the reading is a staircase, not a steady level.
    if (j <= last && at(t, read) - at(t, a) < readAfterS && amps(j) > high + highBand) continue;
    const lowVolts = at(v, a);
    const highVolts = at(v, read);
    const highAmps = amps(read);
    if (!(highVolts < lowVolts)) continue;
    return {
      ohms: internalResistanceDc({ lowAmps: low, lowVolts, highAmps, highVolts }),
      lowAmps: low,
      lowVolts,
      highAmps,
      highVolts,
      atSeconds: at(t, a + 1),
      readAtSeconds: at(t, read),
      lowIndex: a,
      readIndex: read,
    };
  }
  return null;
}
