import { plain, withPrefix } from '../shared/text';
import { preferredValues } from './e-series';
import { TOLERANCE_LETTERS } from './letter-codes';
import { rankCandidates, type Candidate } from './ranking';

/** EIA-96 multiplier letters as powers of ten [S: several decoders agree]. */
export const EIA96_MULTIPLIER_EXPONENT: Record<string, number> = {
  Z: -3,
  Y: -2,
  R: -2,
  X: -1,
  S: -1,
  A: 0,
  B: 1,
  H: 1,
  C: 2,
  D: 3,
  E: 4,
  F: 5,
};

/** Letters of the IEC 60062 letter-and-digit code that stand for the decimal point and a multiplier. */
const RKM_EXPONENT: Record<string, number> = { R: 0, K: 3, M: 6 };

const scaled = (n: number, p: number) => (p >= 0 ? n * 10 ** p : n / 10 ** -p);

/** The three-digit E96 significand (100 … 976) that an EIA-96 index 1 … 96 stands for. */
export function eia96Significand(index: number): number {
  if (!Number.isInteger(index) || index < 1 || index > 96) {
    throw new RangeError(`EIA-96 index must be a whole number from 01 to 96 (got ${index}).`);
  }
  return Math.round((preferredValues('E96')[index - 1] as number) * 100);
}

export type ResistorScheme = 'jumper' | 'three-digit' | 'four-digit' | 'letter-and-digit' | 'eia-96';

/** How a resistor marking was read: the value, the code form and the reading step by step. */
export interface ResistorMarkingReading {
  ohms: number;
  scheme: ResistorScheme;
  /** The marking without its tolerance letter, upper-cased. */
  valueCode: string;
  /** Trailing IEC 60062 tolerance letter, if the marking has one ("472J" → "J"). */
  toleranceLetter: string | null;
  meaning: string[];
  /** 1 for the most likely reading of the code (see ranking.ts), 2 for the next. */
  rank: number;
  /** The rule that ranks the readings, when the code has more than one; null otherwise. */
  rankReason: string | null;
}

const ACCEPTED = 'a 3- or 4-digit code (472, 4991), R, K or M as the decimal point (4R7, R010, 4K7, 2M2) or an EIA-96 code (68X), optionally followed by a tolerance letter (472J)';

type Value = { ohms: number; scheme: ResistorScheme; meaning: string[] };

/** Every way the characters read as a value (without a tolerance letter); a code that fits a form but breaks it goes to `errors`. */
function readValues(s: string, code: string, errors: string[]): Value[] {
  if (/^0{1,4}$/.test(s)) {
    return [{ ohms: 0, scheme: 'jumper', meaning: [`"${s}" marks a 0 Ω jumper (a link, not a resistor) [M].`] }];
  }
  const out: Value[] = [];
  const eia = /^(\d{2})([ZYRXSABHCDEF])$/.exec(s);
  if (eia) {
    const index = Number(eia[1]);
    if (index < 1 || index > 96) {
      errors.push(`Resistor marking "${code}": an EIA-96 code needs an index from 01 to 96 (got ${eia[1]}).`);
    } else {
      const significand = eia96Significand(index);
      const exponent = EIA96_MULTIPLIER_EXPONENT[eia[2] as string] as number;
      const ohms = scaled(significand, exponent);
      out.push({
        ohms,
        scheme: 'eia-96',
        meaning: [
          `EIA-96 code: "${eia[1]}" is the index into the E96 list, value ${significand}.`,
          `"${eia[2]}" is the multiplier × ${plain(scaled(1, exponent))}.`,
          `${significand} × ${plain(scaled(1, exponent))} = ${withPrefix(ohms, 'Ω')}.`,
        ],
      });
    }
  }
  if (/^\d{3,4}$/.test(s)) {
    const digits = s.slice(0, -1);
    const exponent = Number(s.slice(-1));
    const ohms = scaled(Number(digits), exponent);
    out.push({
      ohms,
      scheme: s.length === 3 ? 'three-digit' : 'four-digit',
      meaning: [
        `${s.length}-digit code: "${digits}" are the significant digits, the last digit "${exponent}" is the power of ten (× ${plain(10 ** exponent)}).`,
        `${Number(digits)} × ${plain(10 ** exponent)} = ${withPrefix(ohms, 'Ω')}.`,
      ],
    });
  }
  const rkm = /^(\d*)([RKM])(\d*)$/.exec(s);
  if (rkm && s.length >= 2 && s.length <= 5 && (rkm[1] !== '' || rkm[3] !== '')) {
    const letter = rkm[2] as string;
    const exponent = RKM_EXPONENT[letter] as number;
    const ohms = scaled(Number(`${rkm[1] || '0'}.${rkm[3] || '0'}`), exponent);
    const unit = letter === 'R' ? 'Ω' : letter === 'K' ? 'kΩ' : 'MΩ';
    out.push({
      ohms,
      scheme: 'letter-and-digit',
      meaning: [
        `Letter-and-digit code: "${letter}" stands for the decimal point and means ${unit}.`,
        letter === 'R' ? `Read as ${withPrefix(ohms, 'Ω')}.` : `${plain(Number(`${rkm[1] || '0'}.${rkm[3] || '0'}`))} ${unit} = ${plain(ohms, 6)} Ω.`,
      ],
    });
  }
  return out;
}

/** Position of each code form in the ranking (ranking.ts, rule 2). */
const ORDER: Record<ResistorScheme, number> = { jumper: 0, 'letter-and-digit': 1, 'three-digit': 1, 'four-digit': 1, 'eia-96': 3 };
const WHAT: Record<ResistorScheme, string> = {
  jumper: 'a 0 Ω jumper',
  'letter-and-digit': 'R-notation, IEC 60062',
  'three-digit': 'a 3-digit code',
  'four-digit': 'a 4-digit code',
  'eia-96': 'an EIA-96 code',
};
const FORM: Record<ResistorScheme, string> = {
  jumper: 'a jumper',
  'letter-and-digit': 'R-notation',
  'three-digit': 'a 3-digit code',
  'four-digit': 'a 4-digit code',
  'eia-96': 'EIA-96',
};

/**
 * Every valid reading of a resistor marking, most likely first (ranking rule in ranking.ts): "10R" is 10 Ω
 * (R-notation), then 1.24 Ω (EIA-96); "102K" is 1 kΩ ±10 %, then 102 kΩ. Spaces inside the code are ignored.
 */
export function readResistorMarkings(code: string): ResistorMarkingReading[] {
  if (typeof code !== 'string' || code.trim() === '') throw new RangeError('Resistor marking is empty.');
  const s = code.replace(/\s+/g, '').toUpperCase();
  const errors: string[] = [];
  const candidates: (Candidate & Value & { valueCode: string })[] = [];
  for (const v of readValues(s, code, errors)) {
    const letterInValue = v.scheme === 'letter-and-digit' && /[KM]$/.test(s);
    candidates.push({
      ...v,
      value: v.ohms,
      unit: 'Ω',
      order: ORDER[v.scheme],
      letter: letterInValue ? 'value' : 'none',
      toleranceLetter: null,
      valueCode: s,
      what: v.scheme === 'letter-and-digit' && !s.includes('R') ? 'letter-and-digit code, IEC 60062' : WHAT[v.scheme],
      form: v.scheme === 'letter-and-digit' && !s.includes('R') ? 'the letter-and-digit code' : FORM[v.scheme],
    });
  }
  const last = s.slice(-1);
  if (s.length >= 3 && last in TOLERANCE_LETTERS) {
    const rest = s.slice(0, -1);
    for (const v of readValues(rest, code, [])) {
      // EIA-96 codes (±1 % parts) and jumpers carry no tolerance letter.
      if (v.scheme === 'eia-96' || v.scheme === 'jumper') continue;
      candidates.push({
        ...v,
        value: v.ohms,
        unit: 'Ω',
        order: 2,
        letter: 'tolerance',
        toleranceLetter: last,
        valueCode: rest,
        what: `"${rest}" with tolerance letter ${last}`,
        form: `${FORM[v.scheme]} with a tolerance letter`,
      });
    }
  }
  if (candidates.length === 0) {
    throw new RangeError(errors[0] ?? `Resistor marking "${code}" is not a resistor code the decoder knows: use ${ACCEPTED}.`);
  }
  const { readings, reason } = rankCandidates(candidates);
  return readings.map((r, i) => ({
    ohms: r.ohms,
    scheme: r.scheme,
    valueCode: r.valueCode,
    toleranceLetter: r.toleranceLetter,
    meaning: r.meaning,
    rank: i + 1,
    rankReason: reason,
  }));
}

/** Reads a resistor marking, with its code form, tolerance letter and the reading in words: the first-ranked of readResistorMarkings. */
export function readResistorMarking(code: string): ResistorMarkingReading {
  return readResistorMarkings(code)[0] as ResistorMarkingReading;
}

// Accepted forms: 3-digit ("472" = 4.7 kΩ, "100" = 10 Ω), 4-digit ("4991" = 4.99 kΩ), R, K or M as the decimal
// point (IEC 60062 letter-and-digit code: "4R7", "R010", "12R0", "4K7", "2M2"), EIA-96 ("68X" = 49.9 Ω), "0"/"000"
// jumpers (0 Ω), and a trailing tolerance letter ("472J"). A code with more than one reading gives the first-ranked:
// two digits and R are R-notation ("12R" = 12 Ω; its EIA-96 reading 1.30 Ω comes second in readResistorMarkings).
/** Resistance (Ω) of a resistor marking: 3- or 4-digit code, R/K/M as decimal point ("4R7", "4K7"), EIA-96 ("68X") or a 0 Ω jumper. */
export function decodeResistorMarking(code: string): number {
  return readResistorMarking(code).ohms;
}
