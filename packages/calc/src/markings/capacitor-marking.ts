import { plain, withPrefix } from '../shared/text';

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
}

/** Reads a capacitor marking, with its code form, tolerance letter and the reading in words (see decodeCapacitorMarking). */
export function readCapacitorMarking(code: string): CapacitorMarkingReading {
  if (typeof code !== 'string' || code.trim() === '') throw new RangeError('Capacitor marking is empty.');
  const s = code.trim().replace(/[µμ]/g, 'u').toLowerCase();

  const three = /^(\d{2})(\d)([bcdfgjkmz]?)$/.exec(s);
  if (three) {
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
  if (/^\d{1,2}$/.test(s)) {
    return {
      farads: Number(s) / 1e12,
      scheme: 'picofarads',
      toleranceLetter: null,
      meaning: [`One or two digits are the value in picofarads: ${Number(s)} pF.`],
    };
  }
  const letter = /^(\d*)([pnur])(\d*)f?$/.exec(s);
  if (letter && (letter[1] !== '' || letter[3] !== '')) {
    const value = Number(`${letter[1] || '0'}.${letter[3] || '0'}`);
    const unitLetter = letter[2] as string;
    const farads = (value * (PICO_PER[unitLetter] as number)) / 1e12;
    return {
      farads,
      scheme: 'letter-decimal',
      toleranceLetter: null,
      meaning: [
        `"${unitLetter === 'r' ? 'R' : unitLetter}" stands for the decimal point and means ${UNIT_WORD[unitLetter]}${unitLetter === 'r' ? ' on a capacitor' : ''}.`,
        unitLetter === 'p' || unitLetter === 'r'
          ? `Read as ${plain(value, 6)} pF.`
          : `${plain(value, 6)} ${UNIT_WORD[unitLetter]} = ${plain(value * 1e3, 6)} ${unitLetter === 'n' ? 'pF' : 'nF'}.`,
      ],
    };
  }
  const decimal = /^(\d+\.\d+)([pnu])f?$/.exec(s);
  if (decimal) {
    const unitLetter = decimal[2] as string;
    const farads = (Number(decimal[1]) * (PICO_PER[unitLetter] as number)) / 1e12;
    return {
      farads,
      scheme: 'value-with-unit',
      toleranceLetter: null,
      meaning: [`A value with its unit: ${decimal[1]} ${UNIT_WORD[unitLetter]} = ${withPrefix(farads, 'F')}.`],
    };
  }
  throw new RangeError(
    `Capacitor marking "${code}" is not a 3-digit pF code (104) or a value with p, n, u or R as the decimal point (4p7, 2n2, 4R7).`,
  );
}

// Accepted forms: 3-digit pF code ("104" = 100 nF; last digit 8 = ×0.01, 9 = ×0.1 [M]) optionally followed by a
// tolerance letter ("104K"); a letter as the decimal point ("4p7", "2n2", "4u7", "4R7" = 4.7 pF); a value with a
// unit ("100n", "0.1u", "10uF"); or one or two digits, read as pF ("47").
/** Capacitance (F) of a capacitor marking: 3-digit pF code ("104"), letter as decimal point ("4p7", "2n2") or value with unit. */
export function decodeCapacitorMarking(code: string): number {
  return readCapacitorMarking(code).farads;
}
