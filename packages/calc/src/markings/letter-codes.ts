/**
 * IEC 60062 tolerance letters, as printed after a resistor or capacitor value ("104K", "4K7J").
 * REFERENCES §1: B, C, D, F, G, J, K, M, N, Z and capacitor P are confirmed [S]; W, L and resistor P
 * are from memory [M]. On capacitors under 10 pF, B, C and D mean ±0.1, ±0.25 and ±0.5 pF [S] and
 * F means ±1 pF [M].
 */
import { plain } from '../shared/text';

export type MarkedComponent = 'resistor' | 'capacitor';

/** A tolerance as a share of the value (percent) or, for small capacitors, in farads. */
export interface Tolerance {
  letter: string | null;
  /** How far above the marked value the part may be: percent, or farads when absolute. */
  plus: number;
  /** How far below the marked value the part may be (a positive number). */
  minus: number;
  kind: 'percent' | 'absolute';
  /** "±5 %", "+80 / −20 %", "±0.25 pF". */
  text: string;
  source: string;
}

interface LetterRow {
  plus: number;
  minus: number;
  source: string;
}

/** Tolerance letters in percent [S: IEC 60062 summary pages; M where marked]. */
export const TOLERANCE_LETTERS: Readonly<Record<string, LetterRow>> = {
  L: { plus: 0.01, minus: 0.01, source: '[M: IEC 60062] L ±0.01 %' },
  P: { plus: 0.02, minus: 0.02, source: '[M: IEC 60062] P ±0.02 % (resistors)' },
  W: { plus: 0.05, minus: 0.05, source: '[M: IEC 60062] W ±0.05 %' },
  B: { plus: 0.1, minus: 0.1, source: '[S: IEC 60062] B ±0.1 %' },
  C: { plus: 0.25, minus: 0.25, source: '[S: IEC 60062] C ±0.25 %' },
  D: { plus: 0.5, minus: 0.5, source: '[S: IEC 60062] D ±0.5 %' },
  F: { plus: 1, minus: 1, source: '[S: IEC 60062] F ±1 %' },
  G: { plus: 2, minus: 2, source: '[S: IEC 60062] G ±2 %' },
  J: { plus: 5, minus: 5, source: '[S: IEC 60062] J ±5 %' },
  K: { plus: 10, minus: 10, source: '[S: IEC 60062] K ±10 %' },
  M: { plus: 20, minus: 20, source: '[S: IEC 60062] M ±20 %' },
  N: { plus: 30, minus: 30, source: '[S: IEC 60062] N ±30 %' },
  Z: { plus: 80, minus: 20, source: '[S: IEC 60062] Z +80 / −20 %' },
};

/** Capacitor P: +100 / −0 % [S: IEC 60062]. */
const CAPACITOR_P: LetterRow = { plus: 100, minus: 0, source: '[S: IEC 60062] P +100 / −0 % (capacitors)' };

/** Absolute tolerances of capacitors under 10 pF, in pF [S: IEC 60062; F is M]. */
export const SMALL_CAPACITOR_LETTERS_PF: Readonly<Record<string, LetterRow>> = {
  B: { plus: 0.1, minus: 0.1, source: '[S: IEC 60062] B ±0.1 pF under 10 pF' },
  C: { plus: 0.25, minus: 0.25, source: '[S: IEC 60062] C ±0.25 pF under 10 pF' },
  D: { plus: 0.5, minus: 0.5, source: '[S: IEC 60062] D ±0.5 pF under 10 pF' },
  F: { plus: 1, minus: 1, source: '[M: IEC 60062] F ±1 pF under 10 pF' },
};

const num = (x: number) => plain(x, 6);

function percentText(plus: number, minus: number): string {
  return plus === minus ? `±${num(plus)} %` : `+${num(plus)} / −${num(minus)} %`;
}

/** A symmetric tolerance in percent with its source (colour bands, series). */
export function percentTolerance(percent: number, source: string, letter: string | null = null): Tolerance {
  return { letter, plus: percent, minus: percent, kind: 'percent', text: percentText(percent, percent), source };
}

/** Meaning of an IEC 60062 tolerance letter on a resistor or capacitor (capacitors under 10 pF read B, C, D, F in pF). */
export function decodeToleranceLetter(letter: string, component: MarkedComponent, valueF?: number): Tolerance {
  if (typeof letter !== 'string' || !/^[a-zA-Z]$/.test(letter.trim())) {
    throw new RangeError(`Tolerance letter must be one letter such as J or K (got "${String(letter)}").`);
  }
  const l = letter.trim().toUpperCase();
  if (component === 'capacitor' && valueF !== undefined && valueF < 10e-12) {
    const small = SMALL_CAPACITOR_LETTERS_PF[l];
    if (small) {
      return { letter: l, plus: small.plus * 1e-12, minus: small.minus * 1e-12, kind: 'absolute', text: `±${num(small.plus)} pF`, source: small.source };
    }
  }
  const row = component === 'capacitor' && l === 'P' ? CAPACITOR_P : TOLERANCE_LETTERS[l];
  if (!row) {
    throw new RangeError(`Tolerance letter "${l}" is not an IEC 60062 tolerance letter; use one of ${Object.keys(TOLERANCE_LETTERS).join(', ')}.`);
  }
  return { letter: l, plus: row.plus, minus: row.minus, kind: 'percent', text: percentText(row.plus, row.minus), source: row.source };
}

/** Lowest and highest value a part may have at a tolerance. */
export function toleranceRange(value: number, tolerance: Tolerance): { low: number; high: number } {
  if (tolerance.kind === 'absolute') return { low: value - tolerance.minus, high: value + tolerance.plus };
  return { low: value * (1 - tolerance.minus / 100), high: value * (1 + tolerance.plus / 100) };
}
