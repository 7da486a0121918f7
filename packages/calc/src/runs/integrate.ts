/**
 * Delivered charge and energy of a bench run by the composite trapezoidal rule
 * [S: composite trapezoidal rule, numpy docs]: Ah = Σ ½(I_k + I_k+1)·Δt / 3600,
 * Wh = Σ ½(P_k + P_k+1)·Δt / 3600 with P_k = V_k·I_k taken per sample (never
 * mean V × mean I).
 *
 * Two mean voltages are reported. averageVolts is the charge-weighted mean
 * Wh / Ah = ∫V·I dt / ∫I dt, the "average discharge voltage" of a capacity
 * test and the value REFERENCES §8 gives (3.810667 V for Example A); it equals
 * the time-weighted mean when the current is constant. timeAverageVolts is
 * ∫V dt / duration (3.800000 V for Example A). With no charge moved (Ah = 0)
 * averageVolts falls back to the time-weighted mean. meanSquareVolts is ∫V² dt /
 * duration by the same trapezoids: the average power into a fixed resistance is
 * mean(V²)/R, not (mean V)²/R (REFERENCES §12) [C].
 */
import { requireFinite } from '../shared/validate';
import { at, checkSeriesShape, columnLabel, notFinite, notIncreasing, type RunSeries } from './series';

/** Totals of a run given as one object per sample. */
export interface RunTotals {
  ampHours: number;
  wattHours: number;
  durationS: number;
  /** Charge-weighted mean voltage Wh/Ah, V. */
  averageVolts: number;
  /** Time-weighted mean voltage ∫V dt / duration, V. */
  timeAverageVolts: number;
}

/** Totals of a columnar run; null where the columns present cannot give the figure. */
export interface SeriesTotals {
  ampHours: number | null;
  wattHours: number | null;
  durationS: number;
  /** Charge-weighted mean voltage Wh/Ah (time-weighted when Ah = 0), V. */
  averageVolts: number | null;
  /** Time-weighted mean voltage ∫V dt / duration, V; null without a v column. */
  timeAverageVolts: number | null;
  /** Time-weighted mean of V², ∫V² dt / duration by the same trapezoids, V²; null without a v column. */
  meanSquareVolts: number | null;
  samples: number;
}

/** Trapezoidal Ah, Wh (V·I per sample), duration and mean voltage (Wh/Ah, and ∫V dt / duration) of {t, v, i} samples. */
export function integrateRun(samples: { t: number; v: number; i: number }[]): RunTotals {
  if (!Array.isArray(samples)) throw new RangeError('samples must be a list of {t, v, i} readings.');
  if (samples.length < 2) throw new RangeError(`samples needs at least 2 readings (got ${samples.length}).`);
  const n = samples.length;
  const t = new Float64Array(n);
  const v = new Float64Array(n);
  const i = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const s = samples[k];
    if (s === null || typeof s !== 'object') throw new RangeError(`samples[${k}] must be an object {t, v, i}.`);
    t[k] = requireFinite(s.t, `samples[${k}].t`);
    v[k] = requireFinite(s.v, `samples[${k}].v`);
    i[k] = requireFinite(s.i, `samples[${k}].i`);
    if (k > 0 && !(t[k]! > t[k - 1]!)) {
      throw new RangeError(`samples[${k}].t must be later than samples[${k - 1}].t (got ${t[k]} after ${t[k - 1]}); time must increase strictly.`);
    }
  }
  const totals = integrateRange({ t, v, i }, 0, n - 1);
  return {
    ampHours: totals.ampHours as number,
    wattHours: totals.wattHours as number,
    durationS: totals.durationS,
    averageVolts: totals.averageVolts as number,
    timeAverageVolts: totals.timeAverageVolts as number,
  };
}

/**
 * integrateRun on columnar arrays in one pass with O(1) extra memory. Power is
 * v·i when both are present, else the p column; current is i, else p/v.
 */
export function integrateSeries(series: RunSeries): SeriesTotals {
  const n = checkSeriesShape(series, [], 'integration');
  if (!series.i && !series.p) {
    throw new RangeError(`${columnLabel('i')} or ${columnLabel('p')} is required to integrate a run.`);
  }
  return integrateRange(series, 0, n - 1);
}

/**
 * Integrates samples from..to (inclusive) of a series whose shape is already
 * checked; checks time order and finiteness of the columns it reads as it goes.
 */
export function integrateRange(series: RunSeries, from: number, to: number): SeriesTotals {
  const { t, v, i, p } = series;
  const powerFromVI = v !== undefined && i !== undefined;
  const hasPower = powerFromVI || p !== undefined;
  const currentFromPV = i === undefined && p !== undefined && v !== undefined;
  const hasCurrent = i !== undefined || currentFromPV;

  // Values of the sample last read (no object per sample: a million-sample log allocates nothing).
  let tk = 0;
  let vk = 0;
  let ik = 0;
  let pk = 0;
  const read = (k: number): void => {
    tk = at(t, k);
    if (!Number.isFinite(tk)) notFinite('t', k, tk);
    vk = v ? at(v, k) : 0;
    if (!Number.isFinite(vk)) notFinite('v', k, vk);
    ik = 0;
    pk = 0;
    if (i) {
      ik = at(i, k);
      if (!Number.isFinite(ik)) notFinite('i', k, ik);
    }
    if (powerFromVI) {
      pk = vk * ik;
    } else if (p) {
      pk = at(p, k);
      if (!Number.isFinite(pk)) notFinite('p', k, pk);
    }
    if (currentFromPV) {
      if (!(vk > 0)) {
        throw new RangeError(`series.v[${k}] must be above 0 V to work out the current from power (got ${vk}).`);
      }
      ik = pk / vk;
    }
  };

  read(from);
  const t0 = tk;
  let tPrev = tk;
  let vPrev = vk;
  let iPrev = ik;
  let pPrev = pk;
  let charge = 0; // A·s × 2
  let energy = 0; // W·s × 2
  let voltTime = 0; // V·s × 2
  let voltSquaredTime = 0; // V²·s × 2
  for (let k = from + 1; k <= to; k++) {
    read(k);
    if (!(tk > tPrev)) notIncreasing(k, tPrev, tk);
    const dt = tk - tPrev;
    charge += (iPrev + ik) * dt;
    energy += (pPrev + pk) * dt;
    voltTime += (vPrev + vk) * dt;
    voltSquaredTime += (vPrev * vPrev + vk * vk) * dt;
    tPrev = tk;
    vPrev = vk;
    iPrev = ik;
    pPrev = pk;
  }
  const durationS = tPrev - t0;
  const ampHours = hasCurrent ? charge / 7200 : null;
  const wattHours = hasPower ? energy / 7200 : null;
  const timeAverageVolts = v && durationS > 0 ? voltTime / 2 / durationS : null;
  const meanSquareVolts = v && durationS > 0 ? voltSquaredTime / 2 / durationS : null;
  const averageVolts = ampHours !== null && wattHours !== null && ampHours !== 0 ? wattHours / ampHours : timeAverageVolts;
  return { ampHours, wattHours, durationS, averageVolts, timeAverageVolts, meanSquareVolts, samples: to - from + 1 };
}
