import { plain, withPrefix } from '../shared/text';
import { rankCandidates, type Candidate } from './ranking';

const PICO_PER: Record<string, number> = { p: 1, r: 1, n: 1e3, u: 1e6 };
const UNIT_WORD: Record<string, string> = { p: 'pF', r: 'pF', n: 'nF', u: 'µF' };

export type CapacitorScheme = 'three-digit' | 'picofarads' | 'letter-decimal' | 'value-with-unit';

/** How a capacitor marking was read: the value, the code form and the reading step by step. */
export interface CapacitorMarkingReading {
  farads: number;
  scheme: CapacitorScheme;
  /** Trailing IEC 60062 tolerance letter of a 3-digit code ("104K" → "K"). */
  toleranceLetter: string | null;
  meaning: string[];
  /** 1 for the most likely reading of the code (see ranking.ts), 2 for the next. */
  rank: number;
  /** The rule that ranks the readings, when the code has more than one; null otherwise. */
  rankReason: string | null;
}

type Value = Omit<CapacitorMarkingReading, 'rank' | 'rankReason'>;

/**
 * Tolerance letters read after a 3-digit code: the IEC 60062 letters confirmed for capacitors [S],
 * N ±30 % and P +100 / −0 % among them ("104N", "104P").
 */
const THREE_DIGIT = /^(\d{2})(\d)([bcdfgjkmnpz]?)$/;

function threeDigit(three: RegExpExecArray, code: string): Value {
  const significand = Number(three[1]);
  const last = Number(three[2]);
  if (last === 7) {
    throw new RangeError(`Capacitor marking "${code}": a last digit of 7 is not used in the 3-digit code.`);
  }
  const multiplier = last === 8 ? 0.01 : last === 9 ? 0.1 : 10 ** last;
  const pf = last === 8 ? significand / 100 : last === 9 ? significand / 10 : significand * 10 ** last;
  const farads = last === 8 ? significand / 1e14 : last === 9 ? significand / 1e13 : (significand * 10 ** last) / 1e12;
  return {
    farads,
    scheme: 'three-digit',
    toleranceLetter: three[3] ? (three[3] as string).toUpperCase() : null,
    meaning: [
      `3-digit code in picofarads: "${three[1]}" are the significant digits, "${last}" is the multiplier × ${plain(multiplier)}${last >= 8 ? ' [M]' : ''}.`,
      `${significand} × ${plain(multiplier)} pF = ${plain(pf, 6)} pF = ${withPrefix(farads, 'F')}.`,
    ],
  };
}

/** Every way the characters read; a code that fits a form but breaks it goes to `errors`. */
function readValues(s: string, code: string, errors: string[]): Value[] {
  const out: Value[] = [];
  const three = THREE_DIGIT.exec(s);
  if (three) {
    try {
      out.push(threeDigit(three, code));
    } catch (err) {
      errors.push((err as Error).message);
    }
  }
  if (/^\d{1,2}$/.test(s)) {
    out.push({
      farads: Number(s) / 1e12,
      scheme: 'picofarads',
      toleranceLetter: null,
      meaning: [`One or two digits are the value in picofarads: ${Number(s)} pF.`],
    });
  }
  const letter = /^(\d*)([pnur])(\d*)f?$/.exec(s);
  if (letter && (letter[1] !== '' || letter[3] !== '')) {
    const value = Number(`${letter[1] || '0'}.${letter[3] || '0'}`);
    const unitLetter = letter[2] as string;
    const farads = (value * (PICO_PER[unitLetter] as number)) / 1e12;
    out.push({
      farads,
      scheme: 'letter-decimal',
      toleranceLetter: null,
      meaning: [
        `"${unitLetter === 'r' ? 'R' : unitLetter}" stands for the decimal point and means ${UNIT_WORD[unitLetter]}${unitLetter === 'r' ? ' on a capacitor' : ''}.`,
        unitLetter === 'p' || unitLetter === 'r' ? `Read as ${plain(value, 6)} pF.` : `${plain(value, 6)} ${UNIT_WORD[unitLetter]} = ${plain(value * 1e3, 6)} ${unitLetter === 'n' ? 'pF' : 'nF'}.`,
      ],
    });
  }
  const decimal = /^(\d+\.\d+)([pnu])f?$/.exec(s);
  if (decimal) {
    const unitLetter = decimal[2] as string;
    const farads = (Number(decimal[1]) * (PICO_PER[unitLetter] as number)) / 1e12;
    out.push({
      farads,
      scheme: 'value-with-unit',
      toleranceLetter: null,
      meaning: [`A value with its unit: ${decimal[1]} ${UNIT_WORD[unitLetter]} = ${withPrefix(farads, 'F')}.`],
    });
  }
  return out;
}

const WHAT: Record<CapacitorScheme, string> = {
  'three-digit': 'a 3-digit code in pF',
  picofarads: 'a value in picofarads',
  'letter-decimal': 'a value with the letter as its unit',
  'value-with-unit': 'a value with its unit',
};

/**
 * Every valid reading of a capacitor marking, most likely first (ranking rule in ranking.ts): "104N" is
 * 100 nF ±30 %, then 104 nF; "100n" is 100 nF, then 10 pF ±30 %. Spaces inside the code are ignored.
 */
export function readCapacitorMarkings(code: string): CapacitorMarkingReading[] {
  if (typeof code !== 'string' || code.trim() === '') throw new RangeError('Capacitor marking is empty.');
  const s = code.replace(/\s+/g, '').replace(/[µμ]/g, 'u').toLowerCase();
  const errors: string[] = [];
  const candidates: (Candidate & Value)[] = readValues(s, code, errors).map((v) => {
    const tolerance = v.toleranceLetter !== null;
    const unitLetterLast = v.scheme === 'letter-decimal' && /[np]$/.test(s);
    return {
      ...v,
      value: v.farads,
      unit: 'F',
      order: tolerance ? 2 : 1,
      letter: tolerance ? 'tolerance' : unitLetterLast ? 'value' : 'none',
      what: tolerance ? `"${s.slice(0, 3)}" with tolerance letter ${v.toleranceLetter as string}` : WHAT[v.scheme],
      form: tolerance ? 'a 3-digit code with a tolerance letter' : WHAT[v.scheme],
    };
  });
  if (candidates.length === 0) {
    throw new RangeError(
      errors[0] ?? `Capacitor marking "${code}" is not a capacitor code the decoder knows: use a 3-digit pF code (104, 104K) or a value with p, n, u or R as the decimal point (4p7, 2n2, 4R7).`,
    );
  }
  const { readings, reason } = rankCandidates(candidates);
  return readings.map((r, i) => ({ farads: r.farads, scheme: r.scheme, toleranceLetter: r.toleranceLetter, meaning: r.meaning, rank: i + 1, rankReason: reason }));
}

/** Reads a capacitor marking, with its code form, tolerance letter and the reading in words: the first-ranked of readCapacitorMarkings. */
export function readCapacitorMarking(code: string): CapacitorMarkingReading {
  return readCapacitorMarkings(code)[0] as CapacitorMarkingReading;
}

// Accepted forms: 3-digit pF code ("104" = 100 nF; last digit 8 = ×0.01, 9 = ×0.1 [M]) optionally followed by a
// tolerance letter ("104K"; "104N" ±30 %, "104P" +100/−0 %); a letter as the decimal point ("4p7", "2n2", "4u7",
// "4R7" = 4.7 pF); a value with a unit ("100n", "0.1u", "10uF"); or one or two digits, read as pF ("47"). A code with
// more than one reading gives the first-ranked ("104N" = 100 nF ±30 %, then 104 nF in readCapacitorMarkings).
/** Capacitance (F) of a capacitor marking: 3-digit pF code ("104"), letter as decimal point ("4p7", "2n2") or value with unit. */
export function decodeCapacitorMarking(code: string): number {
  return readCapacitorMarking(code).farads;
}
