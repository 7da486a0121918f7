/**
 * Temperature logs (thermocouple on a heater surface, a cell, a charger):
 * peak, time to a temperature, steady state and margin to a burn threshold.
 */
import { requirePositive } from '../shared/validate';
import { at, checkSeries, optionalFinite, type Column, type RunSeries } from './series';

export interface ThermalRunOptions {
  /** Temperature whose first crossing is timed, °C. */
  thresholdC?: number | undefined;
  /** Burn threshold for the contact in question, °C (the thermal area of calc works it out from material and contact time). */
  burnThresholdC?: number | undefined;
  /** Material touched, echoed with the margin so the report can say what the threshold applies to. */
  material?: string | undefined;
  /** Contact time the burn threshold applies to, s; echoed with the margin. */
  contactSeconds?: number | undefined;
  /** Length of the sliding window over which the slope is measured, s; default 300 s. */
  windowS?: number | undefined;
  /** Largest |slope| that counts as flat, °C/min; default 0.1 °C/min. */
  slopeToleranceCPerMin?: number | undefined;
  /** How long the slope must stay flat before the plateau is declared, s; default half the window. */
  holdS?: number | undefined;
}

export interface RunSteadyState {
  reached: boolean;
  /** Median temperature over the last flat window of the plateau, °C; null when no plateau was found. */
  temperatureC: number | null;
  /** Start of the plateau (start of the first flat window), s; null when not reached. */
  fromS: number | null;
  /** End of the plateau (end of the last flat window in the same stretch), s. */
  toS: number | null;
  /** Time at which the plateau could first be declared (flat for windowS + holdS), s. */
  declaredAtS: number | null;
  /** The criterion in words, for the report. */
  criterion: string;
}

export interface ThermalRunAnalysis {
  maxC: number;
  maxAtS: number;
  timeToThresholdS: number | null;
  steadyState: RunSteadyState;
  /** burnThresholdC − maxC, °C (negative: the surface got hotter than the threshold); null without a threshold. */
  marginC: number | null;
  burnThreshold: { temperatureC: number; material: string | null; contactSeconds: number | null } | null;
}

export const DEFAULT_PLATEAU_WINDOW_S = 300;
export const DEFAULT_PLATEAU_SLOPE_C_PER_MIN = 0.1;

/**
 * Plateau detector. For each sample k with a full window [t_k − W, t_k]
 * behind it, the slope is (mean T of the second half − mean T of the first
 * half) / (mean t of the second half − mean t of the first half). A window is
 * flat when |slope| ≤ tolerance. The plateau is declared once windows stay
 * flat for holdS in a row; it runs from the start of the first flat window to
 * the end of the last flat window of that stretch, and its temperature is the
 * median over the last window of that span (the most settled part). For a first-order response T0 + ΔT(1 − e^(−t/τ)) the
 * slope is (ΔT/τ)·e^(−t/τ), so the plateau starts near t = τ·ln(ΔT/(τ·tol))
 * (about 3–5 τ for pocket-heater values) [C].
 */
function findPlateau(t: Column, temp: Column, n: number, windowS: number, tolPerS: number, holdS: number) {
  const half = windowS / 2;
  const origin = at(t, 0);
  let a = 0; // first sample of the first half
  let m = 0; // first sample of the second half
  let sum1T = 0;
  let sum1t = 0;
  let n1 = 0;
  let sum2T = 0;
  let sum2t = 0;
  let n2 = 0;
  let runStart = -1;
  let declaredAt = -1;
  let startIndex = -1;
  let lastFlat = -1;
  for (let k = 0; k < n; k++) {
    const tk = at(t, k) - origin;
    sum2T += at(temp, k);
    sum2t += tk;
    n2++;
    while (at(t, m) - origin < tk - half) {
      const tm = at(t, m) - origin;
      const Tm = at(temp, m);
      sum2T -= Tm;
      sum2t -= tm;
      n2--;
      sum1T += Tm;
      sum1t += tm;
      n1++;
      m++;
    }
    while (at(t, a) - origin < tk - windowS) {
      sum1T -= at(temp, a);
      sum1t -= at(t, a) - origin;
      n1--;
      a++;
    }
    let flat = false;
    if (tk >= windowS && n1 > 0 && n2 > 0) {
      const slope = (sum2T / n2 - sum1T / n1) / (sum2t / n2 - sum1t / n1);
      flat = Math.abs(slope) <= tolPerS;
    }
    if (flat) {
      if (runStart === -1) runStart = k;
      if (declaredAt === -1 && tk - (at(t, runStart) - origin) >= holdS) {
        declaredAt = k;
        startIndex = runStart;
      }
      if (declaredAt !== -1) lastFlat = k;
    } else {
      if (declaredAt !== -1) break;
      runStart = -1;
    }
  }
  if (declaredAt === -1) return null;
  return {
    fromS: at(t, startIndex) - windowS,
    toS: at(t, lastFlat),
    declaredAtS: at(t, declaredAt),
  };
}

/**
 * Peak temperature, time to thresholdC (linear interpolation between
 * samples), steady state by the sliding-window slope criterion, and the
 * margin to a burn threshold. Needs t and temp.
 */
export function analyseThermal(series: RunSeries, opts: ThermalRunOptions = {}): ThermalRunAnalysis {
  const n = checkSeries(series, ['temp'], 'a thermal analysis');
  const t = series.t;
  const temp = series.temp as Column;
  const thresholdC = optionalFinite(opts.thresholdC, 'thresholdC');
  const burnThresholdC = optionalFinite(opts.burnThresholdC, 'burnThresholdC');
  const contactSeconds = optionalFinite(opts.contactSeconds, 'contactSeconds');
  if (contactSeconds !== undefined) requirePositive(contactSeconds, 'contactSeconds');
  const windowS = requirePositive(optionalFinite(opts.windowS, 'windowS') ?? DEFAULT_PLATEAU_WINDOW_S, 'windowS');
  const tolCPerMin = requirePositive(optionalFinite(opts.slopeToleranceCPerMin, 'slopeToleranceCPerMin') ?? DEFAULT_PLATEAU_SLOPE_C_PER_MIN, 'slopeToleranceCPerMin');
  const holdS = optionalFinite(opts.holdS, 'holdS') ?? windowS / 2;
  if (holdS < 0) throw new RangeError(`holdS must not be negative (got ${holdS}).`);
  if (opts.material !== undefined && opts.material !== null && typeof opts.material !== 'string') {
    throw new RangeError('material must be text, e.g. "metal" or "plastic".');
  }

  let maxC = -Infinity;
  let maxAt = 0;
  let crossing: number | null = null;
  for (let k = 0; k < n; k++) {
    const T = at(temp, k);
    if (T > maxC) {
      maxC = T;
      maxAt = k;
    }
    if (crossing === null && thresholdC !== undefined && T >= thresholdC) {
      if (k === 0) {
        crossing = at(t, 0);
      } else {
        const Tp = at(temp, k - 1);
        const tp = at(t, k - 1);
        crossing = tp + ((thresholdC - Tp) / (T - Tp)) * (at(t, k) - tp);
      }
    }
  }

  const criterion = `|slope| ≤ ${tolCPerMin} °C/min over a ${windowS} s window (half-window means), held for ${holdS} s`;
  const plateau = findPlateau(t, temp, n, windowS, tolCPerMin / 60, holdS);
  let steadyState: RunSteadyState;
  if (plateau) {
    // Steady temperature: median over the last flat window of the stretch (the most settled part;
    // the median ignores the first few samples of a cool-down that may fall inside that window).
    const medianFrom = Math.max(plateau.fromS, plateau.toS - windowS);
    const last: number[] = [];
    for (let k = 0; k < n; k++) {
      const tk = at(t, k);
      if (tk >= medianFrom && tk <= plateau.toS) last.push(at(temp, k));
    }
    last.sort((x, y) => x - y);
    const mid = last.length >> 1;
    const median = last.length % 2 ? (last[mid] as number) : ((last[mid - 1] as number) + (last[mid] as number)) / 2;
    steadyState = { reached: true, temperatureC: median, ...plateau, criterion };
  } else {
    steadyState = { reached: false, temperatureC: null, fromS: null, toS: null, declaredAtS: null, criterion };
  }

  return {
    maxC,
    maxAtS: at(t, maxAt),
    timeToThresholdS: crossing,
    steadyState,
    marginC: burnThresholdC === undefined ? null : burnThresholdC - maxC,
    burnThreshold: burnThresholdC === undefined ? null : { temperatureC: burnThresholdC, material: opts.material ?? null, contactSeconds: contactSeconds ?? null },
  };
}
