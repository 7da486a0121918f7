import { requirePositive } from '../shared/validate';

export type ESeries = 'E6' | 'E12' | 'E24' | 'E48' | 'E96' | 'E192';

export const E_SERIES: readonly ESeries[] = ['E6', 'E12', 'E24', 'E48', 'E96', 'E192'];

/** Tolerance each series is meant for (±%) [S: IEC 60063]; E192 also serves ±0.25 % and ±0.1 %. */
export const E_SERIES_TOLERANCE_PERCENT: Record<ESeries, number> = { E6: 20, E12: 10, E24: 5, E48: 2, E96: 1, E192: 0.5 };

// IEC 60063:2015 lists, as two- or three-digit significands. E24 keeps its historical values
// (27, 30, 33, 36, 39, 43, 47, 82 where 10^(i/24) rounds to 26, 29, 32, 35, 38, 42, 46, 83).
const E24_DIGITS = [10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91] as const;
// E192 follows round(100·10^(i/192)) except 920, where the formula gives 919.
const E192_DIGITS = [
  100, 101, 102, 104, 105, 106, 107, 109, 110, 111, 113, 114, 115, 117, 118, 120, 121, 123, 124, 126, 127, 129, 130, 132, 133, 135, 137, 138, 140, 142, 143, 145, 147, 149, 150, 152, 154, 156, 158,
  160, 162, 164, 165, 167, 169, 172, 174, 176, 178, 180, 182, 184, 187, 189, 191, 193, 196, 198, 200, 203, 205, 208, 210, 213, 215, 218, 221, 223, 226, 229, 232, 234, 237, 240, 243, 246, 249, 252,
  255, 258, 261, 264, 267, 271, 274, 277, 280, 284, 287, 291, 294, 298, 301, 305, 309, 312, 316, 320, 324, 328, 332, 336, 340, 344, 348, 352, 357, 361, 365, 370, 374, 379, 383, 388, 392, 397, 402,
  407, 412, 417, 422, 427, 432, 437, 442, 448, 453, 459, 464, 470, 475, 481, 487, 493, 499, 505, 511, 517, 523, 530, 536, 542, 549, 556, 562, 569, 576, 583, 590, 597, 604, 612, 619, 626, 634, 642,
  649, 657, 665, 673, 681, 690, 698, 706, 715, 723, 732, 741, 750, 759, 768, 777, 787, 796, 806, 816, 825, 835, 845, 856, 866, 876, 887, 898, 909, 920, 931, 942, 953, 965, 976, 988,
] as const;

const every = (list: readonly number[], step: number) => list.filter((_, i) => i % step === 0);

const DIGITS: Record<ESeries, readonly number[]> = {
  E6: every(E24_DIGITS, 4),
  E12: every(E24_DIGITS, 2),
  E24: E24_DIGITS,
  E48: every(E192_DIGITS, 4),
  E96: every(E192_DIGITS, 2),
  E192: E192_DIGITS,
};

function requireSeries(series: string): ESeries {
  if (!(E_SERIES as readonly string[]).includes(series)) {
    throw new RangeError(`Preferred-value series must be one of ${E_SERIES.join(', ')} (got "${String(series)}").`);
  }
  return series as ESeries;
}

/** n · 10^p computed so that the result is the double nearest the exact decimal value. */
function scaled(n: number, p: number): number {
  return p >= 0 ? n * 10 ** p : n / 10 ** -p;
}

/** Significant digits a series is written with: 2 for E6–E24, 3 for E48–E192. */
function digitsOf(series: ESeries): number {
  return series === 'E6' || series === 'E12' || series === 'E24' ? 2 : 3;
}

/** Every value of an IEC 60063 series in one decade, as 1.0 … 9.1 (E24) or 1.00 … 9.88 (E192). */
export function preferredValues(series: ESeries): number[] {
  const s = requireSeries(series);
  const shift = 1 - digitsOf(s);
  return DIGITS[s].map((d) => scaled(d, shift));
}

/** Members of a series in the decade of the value and in both neighbouring decades, ascending. */
function candidates(value: number, s: ESeries): number[] {
  const e = Math.floor(Math.log10(value));
  const shift = 1 - digitsOf(s);
  const out: number[] = [];
  for (let k = e - 1; k <= e + 1; k++) for (const d of DIGITS[s]) out.push(scaled(d, k + shift));
  return out;
}

/** The series member nearest a value by the log rule (smallest |ln(x/v)|; boundaries at √(v_k·v_k+1)); ties go up. */
export function nearestPreferredValue(value: number, series: ESeries): number {
  const x = requirePositive(value, 'Value');
  const s = requireSeries(series);
  let best = Number.NaN;
  let bestDistance = Number.POSITIVE_INFINITY;
  for (const v of candidates(x, s)) {
    const d = Math.abs(Math.log(x / v));
    if (d <= bestDistance) {
      best = v;
      bestDistance = d;
    }
  }
  return best;
}

/**
 * The smallest series member at or above a value (e.g. the next standard resistor that is not smaller).
 * A value within a relative 1e-12 of a member counts as that member (2.2 × 100 gives 220, not 330).
 */
export function nextPreferredAtOrAbove(value: number, series: ESeries): number {
  const x = requirePositive(value, 'Value');
  const s = requireSeries(series);
  return candidates(x, s).find((v) => v >= x * (1 - 1e-12)) as number;
}

/** Whether a value is a member of a series (to a relative 1e-9). */
export function isPreferredValue(value: number, series: ESeries): boolean {
  const x = requirePositive(value, 'Value');
  const v = nearestPreferredValue(x, series);
  return Math.abs(x - v) <= 1e-9 * v;
}
