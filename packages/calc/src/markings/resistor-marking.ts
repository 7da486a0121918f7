import { plain, withPrefix } from '../shared/text';
import { preferredValues } from './e-series';
import { TOLERANCE_LETTERS } from './letter-codes';

/** EIA-96 multiplier letters as powers of ten [S: several decoders agree]. */
export const EIA96_MULTIPLIER_EXPONENT: Record<string, number> = {
  Z: -3, Y: -2, R: -2, X: -1, S: -1, A: 0, B: 1, H: 1, C: 2, D: 3, E: 4, F: 5,
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
}

const ACCEPTED =
  'a 3- or 4-digit code (472, 4991), R, K or M as the decimal point (4R7, R010, 4K7, 2M2) or an EIA-96 code (68X), optionally followed by a tolerance letter (472J)';

function readValue(s: string, code: string): Omit<ResistorMarkingReading, 'toleranceLetter' | 'valueCode'> | null {
  if (/^0{1,4}$/.test(s)) {
    return { ohms: 0, scheme: 'jumper', meaning: [`"${s}" marks a 0 Ω jumper (a link, not a resistor) [M].`] };
  }
  const eia = /^(\d{2})([ZYRXSABHCDEF])$/.exec(s);
  if (eia) {
    const index = Number(eia[1]);
    if (index < 1 || index > 96) {
      throw new RangeError(`Resistor marking "${code}": an EIA-96 code needs an index from 01 to 96 (got ${eia[1]}).`);
    }
    const significand = eia96Significand(index);
    const exponent = EIA96_MULTIPLIER_EXPONENT[eia[2] as string] as number;
    const ohms = scaled(significand, exponent);
    return {
      ohms,
      scheme: 'eia-96',
      meaning: [
        `EIA-96 code: "${eia[1]}" is the index into the E96 list, value ${significand}.`,
        `"${eia[2]}" is the multiplier × ${plain(scaled(1, exponent))}.`,
        `${significand} × ${plain(scaled(1, exponent))} = ${withPrefix(ohms, 'Ω')}.`,
      ],
    };
  }
  if (/^\d{3,4}$/.test(s)) {
    const digits = s.slice(0, -1);
    const exponent = Number(s.slice(-1));
    const ohms = scaled(Number(digits), exponent);
    return {
      ohms,
      scheme: s.length === 3 ? 'three-digit' : 'four-digit',
      meaning: [
        `${s.length}-digit code: "${digits}" are the significant digits, the last digit "${exponent}" is the power of ten (× ${plain(10 ** exponent)}).`,
        `${Number(digits)} × ${plain(10 ** exponent)} = ${withPrefix(ohms, 'Ω')}.`,
      ],
    };
  }
  const rkm = /^(\d*)([RKM])(\d*)$/.exec(s);
  if (rkm && s.length >= 2 && s.length <= 5 && (rkm[1] !== '' || rkm[3] !== '')) {
    const letter = rkm[2] as string;
    const exponent = RKM_EXPONENT[letter] as number;
    const ohms = scaled(Number(`${rkm[1] || '0'}.${rkm[3] || '0'}`), exponent);
    const unit = letter === 'R' ? 'Ω' : letter === 'K' ? 'kΩ' : 'MΩ';
    return {
      ohms,
      scheme: 'letter-and-digit',
      meaning: [
        `Letter-and-digit code: "${letter}" stands for the decimal point and means ${unit}.`,
        letter === 'R' ? `Read as ${withPrefix(ohms, 'Ω')}.` : `${plain(Number(`${rkm[1] || '0'}.${rkm[3] || '0'}`))} ${unit} = ${plain(ohms, 6)} Ω.`,
      ],
    };
  }
  return null;
}

/** Reads a resistor marking, with its code form, tolerance letter and the reading in words (see decodeResistorMarking). */
export function readResistorMarking(code: string): ResistorMarkingReading {
  if (typeof code !== 'string' || code.trim() === '') throw new RangeError('Resistor marking is empty.');
  const s = code.trim().toUpperCase();
  const whole = readValue(s, code);
  if (whole) return { ...whole, valueCode: s, toleranceLetter: null };
  const last = s.slice(-1);
  if (s.length >= 2 && last in TOLERANCE_LETTERS) {
    const rest = s.slice(0, -1);
    const value = rest.length >= 2 ? readValue(rest, code) : null;
    if (value && value.scheme !== 'eia-96' && value.scheme !== 'jumper') {
      return { ...value, valueCode: rest, toleranceLetter: last };
    }
  }
  throw new RangeError(`Resistor marking "${code}" is not ${ACCEPTED}.`);
}

// Accepted forms: 3-digit ("472" = 4.7 kΩ, "100" = 10 Ω), 4-digit ("4991" = 4.99 kΩ), R, K or M as the decimal
// point (IEC 60062 letter-and-digit code: "4R7", "R010", "12R0", "4K7", "2M2"), EIA-96 ("68X" = 49.9 Ω), "0"/"000"
// jumpers (0 Ω), and a trailing tolerance letter ("472J"). Two digits followed by R are read as EIA-96
// ("12R" = 1.30 Ω), as the code tables do.
/** Resistance (Ω) of a resistor marking: 3- or 4-digit code, R/K/M as decimal point ("4R7", "4K7"), EIA-96 ("68X") or a 0 Ω jumper. */
export function decodeResistorMarking(code: string): number {
  return readResistorMarking(code).ohms;
}
