import { plain } from '../shared/text';

/** Colour-code digits [S: IEC 60062:2016 summary pages]. */
export const COLOUR_DIGITS: Record<string, number> = {
  black: 0,
  brown: 1,
  red: 2,
  orange: 3,
  yellow: 4,
  green: 5,
  blue: 6,
  violet: 7,
  grey: 8,
  white: 9,
};
/** Multiplier band as a power of ten: the digit colours, gold −1, silver −2, pink −3 [S]. */
export const COLOUR_MULTIPLIER_EXPONENT: Record<string, number> = { ...COLOUR_DIGITS, gold: -1, silver: -2, pink: -3 };
/** Tolerance band (±%) [S; W (orange) and L (grey) are M]. */
export const COLOUR_TOLERANCE_PERCENT: Record<string, number> = {
  brown: 1,
  red: 2,
  orange: 0.05,
  yellow: 0.02,
  green: 0.5,
  blue: 0.25,
  violet: 0.1,
  grey: 0.01,
  gold: 5,
  silver: 10,
};
/** Temperature-coefficient band of 6-band parts (ppm/K) [M: IEC 60062]. */
export const COLOUR_TEMPCO_PPM_PER_K: Record<string, number> = {
  black: 250,
  brown: 100,
  red: 50,
  orange: 15,
  yellow: 25,
  green: 20,
  blue: 10,
  violet: 5,
  grey: 1,
};

export interface ColourCodeResult {
  ohms: number;
  /** ±%; 20 when there is no tolerance band (3-band parts). */
  tolerancePercent?: number;
  /** Only for 6-band parts. */
  temperatureCoefficientPpmPerK?: number;
}

const ALIASES: Record<string, string> = { gray: 'grey' };

function lookup(table: Record<string, number>, colour: string, role: string, position: number): number {
  const v = table[colour];
  if (v === undefined) {
    const allowed = Object.keys(table).join(', ');
    throw new RangeError(`Band ${position} (${role}) cannot be "${colour}"; use one of ${allowed}.`);
  }
  return v;
}

// 3 bands: 2 digits, multiplier, ±20 %; 4 bands: 2 digits, multiplier, tolerance; 5 bands: 3 digits, multiplier,
// tolerance; 6 bands: 5 bands plus temperature coefficient. A single black band is a 0 Ω link. Colour names in
// English, any case ("grey" or "gray").
/** Resistance (Ω) and tolerance (±%) of a resistor colour code of 3 to 6 bands (a single black band is a 0 Ω link). */
export function decodeColorBands(colors: string[]): ColourCodeResult {
  if (!Array.isArray(colors) || colors.length === 0) throw new RangeError('Colour bands: list at least one band.');
  const bands = colors.map((c, i) => {
    if (typeof c !== 'string' || c.trim() === '') throw new RangeError(`Band ${i + 1} is empty.`);
    const name = c.trim().toLowerCase();
    return ALIASES[name] ?? name;
  });
  if (bands.length === 1) {
    if (bands[0] === 'black') return { ohms: 0 };
    throw new RangeError('Colour bands: a single band is only used for a 0 Ω link (black).');
  }
  if (bands.length < 3 || bands.length > 6) {
    throw new RangeError(`Colour bands: a resistor has 3, 4, 5 or 6 bands (got ${bands.length}).`);
  }
  const digitCount = bands.length >= 5 ? 3 : 2;
  let significand = 0;
  for (let i = 0; i < digitCount; i++) {
    significand = significand * 10 + lookup(COLOUR_DIGITS, bands[i] as string, 'digit', i + 1);
  }
  const exponent = lookup(COLOUR_MULTIPLIER_EXPONENT, bands[digitCount] as string, 'multiplier', digitCount + 1);
  const ohms = exponent >= 0 ? significand * 10 ** exponent : significand / 10 ** -exponent;
  if (bands.length === 3) return { ohms, tolerancePercent: 20 };
  const result: ColourCodeResult = {
    ohms,
    tolerancePercent: lookup(COLOUR_TOLERANCE_PERCENT, bands[digitCount + 1] as string, 'tolerance', digitCount + 2),
  };
  if (bands.length === 6) {
    result.temperatureCoefficientPpmPerK = lookup(COLOUR_TEMPCO_PPM_PER_K, bands[5] as string, 'temperature coefficient', 6);
  }
  return result;
}

/** IEC 60062 letter that each tolerance colour stands for (no band: M). */
export const COLOUR_TOLERANCE_LETTER: Record<string, string> = {
  brown: 'F',
  red: 'G',
  orange: 'W',
  yellow: 'P',
  green: 'D',
  blue: 'C',
  violet: 'B',
  grey: 'L',
  gold: 'J',
  silver: 'K',
};

/** A colour code decoded, with the colour names as read and the reading band by band in words. */
export interface ColourCodeReading extends ColourCodeResult {
  bands: string[];
  toleranceLetter: string | null;
  meaning: string[];
}

const plainNumber = (x: number) => plain(x, 6);

/** Reads a resistor colour code band by band (see decodeColorBands), for showing what each band means. */
export function readColorBands(colors: string[]): ColourCodeReading {
  const result = decodeColorBands(colors);
  const bands = colors.map((c) => {
    const name = c.trim().toLowerCase();
    return ALIASES[name] ?? name;
  });
  if (bands.length === 1) {
    return { ...result, bands, toleranceLetter: null, meaning: ['A single black band marks a 0 Ω link (jumper).'] };
  }
  const digitCount = bands.length >= 5 ? 3 : 2;
  const digits = bands.slice(0, digitCount).map((b) => COLOUR_DIGITS[b] as number);
  const exponent = COLOUR_MULTIPLIER_EXPONENT[bands[digitCount] as string] as number;
  const multiplier = exponent >= 0 ? 10 ** exponent : 1 / 10 ** -exponent;
  const significand = Number(digits.join(''));
  const meaning = [
    `Bands 1–${digitCount} (${bands.slice(0, digitCount).join(', ')}) are the digits ${digits.join(' ')}.`,
    `Band ${digitCount + 1} (${bands[digitCount]}) is the multiplier × ${plainNumber(multiplier)}: ${significand} × ${plainNumber(multiplier)} = ${plainNumber(result.ohms)} Ω.`,
  ];
  let toleranceLetter: string | null = 'M';
  if (bands.length === 3) {
    meaning.push('No tolerance band: ±20 % (M).');
  } else {
    const band = bands[digitCount + 1] as string;
    toleranceLetter = COLOUR_TOLERANCE_LETTER[band] ?? null;
    meaning.push(`Band ${digitCount + 2} (${band}) is the tolerance ±${plainNumber(result.tolerancePercent as number)} %${toleranceLetter ? ` (${toleranceLetter})` : ''}.`);
  }
  if (bands.length === 6) {
    meaning.push(`Band 6 (${bands[5]}) is the temperature coefficient ${result.temperatureCoefficientPpmPerK} ppm/K.`);
  }
  return { ...result, bands, toleranceLetter, meaning };
}
