// The one reader of quantities and prices typed by people ("2700mah", "3,65 V", "4K7", "10 min",
// "$0.12", "0,12 €") → numbers in the stored unit (SI; Wh, Ah and °C), for every field that takes one.
// A pre-normaliser tidies the number (decimal comma, digit grouping) and the unit (case, µ, Ω, °, ²),
// then mathjs converts. Each field's declaration in contracts (quantity-fields.ts) gives its label,
// kind, example and how a bare number is read. The server stores SI and keeps the text typed.
//
// Numbers [S: SI Brochure, 9th ed., §5.4.4 — the decimal marker is the point or the comma on the
// line; digits may be grouped in threes, separated by a space]:
// - a point is the decimal point when it is the only one ("3.65"); several points group thousands
//   ("1.000.000");
// - a lone comma is a decimal comma ("3,65", "0,12", "0,125", "1234,5"), except a comma followed by
//   exactly three digits after one to three digits ("1,000", "12,500"), which could be either: in
//   whole-number fields (counts, pieces) it groups thousands; elsewhere it is refused, asking for
//   "1000" or "1.000";
// - several commas group thousands ("1,000,000"); with both marks the last one is the decimal
//   marker ("1,234.5", "1.234,5"), and the other must group by threes;
// - spaces group by threes ("10 000 mAh").
// Units [S: SI Brochure Table 7 prefixes; IEC 80000 symbols; IEC 60062 for the R/k/M code]:
// - the exact symbol always wins; otherwise a unit is matched ignoring case only when that is
//   unambiguous for the field's kind ("2700mah" → mAh, "9.99wh" → Wh, "10 MIN" → min). Only the
//   prefixes plausible for the kind exist: capacity has no mega, so "MAH" is mAh, never mega-amp-hours;
//   resistance has both mΩ and MΩ, so "MOHM" is refused and "1M" (as typed) is 1 MΩ;
// - single-letter suffixes are read as typed only: "25k"/"25K" = 25 kΩ, "1M" = 1 MΩ, "100n" = 100 nF.
import { unit as mathUnit } from 'mathjs';
import { exampleUnit, STORED_UNIT, type PriceField, type QuantityField, type QuantityKind } from '@splitcase/contracts';
import { validationError } from '../http/errors';

export type { QuantityKind };
export { STORED_UNIT };

export class QuantityError extends Error {}

export interface ParsedQuantity {
  value: number;
  unit: string;
  entered: string;
}

// ---- numbers ----

const DASHES = /[\u2212\u2012\u2013\u2014]/g;
const SPACES = /[\u00a0\u2009\u202f]/g;

/** Digit groups of three after a lead of one to three digits. */
const grouped = (parts: string[]) => parts.length > 1 && /^\d{1,3}$/.test(parts[0]!) && parts.slice(1).every((g) => /^\d{3}$/.test(g));

/**
 * A number as people write it, by the rules above. `whole` marks a field that takes whole numbers,
 * where "1,000" is a thousand. Throws QuantityError (message without the field's label).
 */
export function readNumber(text: string, whole = false): number {
  const s = text.replace(DASHES, '-').replace(SPACES, ' ').trim();
  const m = /^([-+]?)([\d., ]*[\d])(?:[eE]([-+]?\d+))?$/.exec(s) ?? /^([-+]?)([.,]\d+)(?:[eE]([-+]?\d+))?$/.exec(s);
  if (!m) throw new QuantityError(`"${text.trim()}" is not a number`);
  const [, sign, body, exp] = m as unknown as [string, string, string, string | undefined];
  const notNumber = () => new QuantityError(`"${text.trim()}" is not a number`);
  const dots = body.split('.').length - 1;
  const commas = body.split(',').length - 1;
  let decimal: '.' | ',' | null = null;
  let group: '.' | ',' | null = null;
  if (dots && commas) {
    decimal = body.lastIndexOf('.') > body.lastIndexOf(',') ? '.' : ',';
    group = decimal === '.' ? ',' : '.';
    if ((decimal === '.' ? dots : commas) > 1) throw notNumber();
  } else if (dots === 1) decimal = '.';
  else if (dots > 1) group = '.';
  else if (commas > 1) group = ',';
  else if (commas === 1) {
    const [lead, tail] = body.split(',') as [string, string];
    const leadDigits = lead.replace(/ /g, '');
    const couldGroup = /^\d{3}$/.test(tail) && /^[1-9]\d{0,2}$/.test(leadDigits) && !lead.includes(' ');
    if (!couldGroup) decimal = ',';
    else if (whole) group = ',';
    else {
      throw new QuantityError(`"${text.trim()}" could be ${leadDigits}${tail} or ${leadDigits}.${tail}: write ${leadDigits}${tail}, or ${leadDigits}.${tail} with a point for the decimals`);
    }
  }
  const [intPart, fracPart = ''] = decimal ? (body.split(decimal) as [string, string]) : [body, ''];
  if (decimal && fracPart === '' && intPart === '') throw notNumber();
  if (!/^\d*$/.test(fracPart)) throw notNumber();
  let digits = intPart;
  if (group || intPart.includes(' ')) {
    const parts = intPart.split(group ? new RegExp(`[ ${group === '.' ? '\\.' : ','}]`) : / /);
    if (!grouped(parts)) throw notNumber();
    digits = parts.join('');
  }
  if (!/^\d*$/.test(digits)) throw notNumber();
  const value = Number(`${sign}${digits || '0'}.${fracPart || '0'}${exp ? `e${exp}` : ''}`);
  if (!Number.isFinite(value)) throw notNumber();
  return value;
}

// ---- units ----

interface UnitSpelling {
  /** Shown in messages. */
  symbol: string;
  /** mathjs unit name; for fractions, counts and pieces the factor to the stored value. */
  math: string | number;
  spellings: string[];
  /** Matched only as typed (single letters; a milli that collides with an older spelling). */
  exact?: boolean;
}

const u = (symbol: string, math: string | number, spellings: string[], exact = false): UnitSpelling => ({ symbol, math, spellings, exact });

/** Every unit each kind accepts, with the spellings people use. Only prefixes plausible for the kind. */
const UNITS: Record<QuantityKind, UnitSpelling[]> = {
  voltage: [u('V', 'V', ['V', 'volt', 'volts']), u('mV', 'mV', ['mV', 'millivolt', 'millivolts']), u('kV', 'kV', ['kV']), u('µV', 'uV', ['uV'])],
  current: [u('A', 'A', ['A', 'amp', 'amps', 'ampere', 'amperes']), u('mA', 'mA', ['mA', 'milliamp', 'milliamps']), u('µA', 'uA', ['uA', 'microamp', 'microamps']), u('nA', 'nA', ['nA'])],
  resistance: [
    u('Ω', 'ohm', ['ohm', 'ohms', 'R']),
    u('mΩ', 'mohm', ['mohm', 'mohms', 'milliohm', 'milliohms']),
    u('kΩ', 'kohm', ['kohm', 'kohms', 'kilohm', 'kilohms']),
    u('MΩ', 'Mohm', ['Mohm', 'Mohms', 'megohm', 'megohms']),
    u('kΩ', 'kohm', ['k', 'K'], true),
    u('MΩ', 'Mohm', ['M'], true),
    u('GΩ', 'Gohm', ['G'], true),
  ],
  capacitance: [
    u('F', 'F', ['F', 'farad', 'farads']),
    // "MF"/"MFD" meant microfarads on older parts: millifarads only as typed.
    u('mF', 'mF', ['mF'], true),
    u('µF', 'uF', ['uF']),
    u('nF', 'nF', ['nF']),
    u('pF', 'pF', ['pF']),
    u('µF', 'uF', ['u'], true),
    u('nF', 'nF', ['n'], true),
    u('pF', 'pF', ['p'], true),
  ],
  inductance: [u('H', 'H', ['H', 'henry', 'henries']), u('mH', 'mH', ['mH']), u('µH', 'uH', ['uH']), u('nH', 'nH', ['nH'])],
  power: [u('W', 'W', ['W', 'watt', 'watts']), u('mW', 'mW', ['mW', 'milliwatt', 'milliwatts']), u('kW', 'kW', ['kW', 'kilowatt', 'kilowatts'])],
  energy: [u('Wh', 'Wh', ['Wh']), u('mWh', 'mWh', ['mWh']), u('kWh', 'kWh', ['kWh']), u('J', 'J', ['J', 'joule', 'joules']), u('kJ', 'kJ', ['kJ'])],
  capacity: [u('Ah', 'Ah', ['Ah']), u('mAh', 'mAh', ['mAh']), u('µAh', 'uAh', ['uAh'])],
  temperature: [u('°C', 'degC', ['degC', 'C', 'celsius']), u('°F', 'degF', ['degF', 'F', 'fahrenheit']), u('K', 'K', ['K', 'kelvin'])],
  mass: [u('g', 'g', ['g', 'gram', 'grams']), u('mg', 'mg', ['mg']), u('kg', 'kg', ['kg', 'kilogram', 'kilograms'])],
  length: [
    u('m', 'm', ['m', 'metre', 'metres', 'meter', 'meters']),
    u('cm', 'cm', ['cm']),
    u('mm', 'mm', ['mm']),
    u('µm', 'um', ['um', 'micron', 'microns']),
    u('mil', 'mil', ['mil', 'mils', 'thou']),
    u('in', 'inch', ['in', 'inch', 'inches']),
  ],
  area: [u('m²', 'm^2', ['m2']), u('cm²', 'cm^2', ['cm2']), u('mm²', 'mm^2', ['mm2'])],
  time: [
    u('s', 's', ['s', 'sec', 'secs', 'second', 'seconds']),
    u('ms', 'ms', ['ms']),
    u('min', 'min', ['min', 'mins', 'minute', 'minutes']),
    u('h', 'h', ['h', 'hr', 'hrs', 'hour', 'hours']),
    u('d', 'day', ['d', 'day', 'days']),
  ],
  frequency: [u('Hz', 'Hz', ['Hz']), u('kHz', 'kHz', ['kHz']), u('MHz', 'MHz', ['MHz'])],
  fraction: [u('%', 0.01, ['%', 'percent'])],
  count: [],
  pieces: [u('pcs', 1, ['pcs', 'pc', 'pieces']), u('k', 1e3, ['k', 'K'], true), u('M', 1e6, ['M'], true)],
};

/** The unit text as a spelling key: µ → u, Ω → ohm, ° → deg, ² → 2, no spaces. */
function unitKey(text: string): string {
  return text.replace(/[µμ]/g, 'u').replace(/[ΩΩ]/g, 'ohm').replace(/°/g, 'deg').replace(/\^2|²/g, '2').replace(/\s+/g, '');
}

function resolveUnit(text: string, kind: QuantityKind): UnitSpelling {
  const key = unitKey(text);
  const units = UNITS[kind];
  const exact = units.find((x) => x.spellings.includes(key));
  if (exact) return exact;
  const lower = key.toLowerCase();
  const hits = units.filter((x) => x.spellings.some((s) => s.toLowerCase() === lower));
  const symbols = [...new Set(hits.map((h) => h.symbol))];
  if (hits.length >= 1 && symbols.length === 1 && hits.every((h) => !h.exact)) return hits[0]!;
  if (symbols.length > 1) throw new QuantityError(`"${text}" could be ${symbols.join(' or ')}: type the unit with its case`);
  if (symbols.length === 1) {
    // Matched only as typed (a single letter, "MF"): offer the units it could have meant.
    const near = [...new Set(units.filter((x) => x.symbol.toLowerCase().startsWith(lower.charAt(0))).map((x) => x.symbol))];
    throw new QuantityError(`"${text}" is read only as typed: type the unit in full (${(near.length ? near : symbols).join(' or ')}); the case matters`);
  }
  throw new QuantityError('');
}

const KIND_WORDS: Record<QuantityKind, string> = {
  voltage: 'a voltage such as "3.7 V"',
  current: 'a current such as "350 mA"',
  resistance: 'a resistance such as "3R0", "4k7" or "10 Ω"',
  capacitance: 'a capacitance such as "100 nF" or "4n7"',
  inductance: 'an inductance such as "2.2 µH"',
  power: 'a power such as "9 W"',
  energy: 'an energy such as "10 Wh"',
  capacity: 'a capacity such as "2700 mAh"',
  temperature: 'a temperature such as "45 °C"',
  mass: 'a mass such as "46 g"',
  length: 'a length such as "35 µm" or "0.25 mm"',
  area: 'an area such as "27 cm²"',
  time: 'a time such as "10 min"',
  frequency: 'a frequency such as "1 kHz"',
  fraction: 'a fraction such as "60 %"',
  count: 'a whole number',
  pieces: 'a number of pieces such as "1000" or "5k"',
};
export const kindWords = (kind: QuantityKind) => KIND_WORDS[kind];

/**
 * "3R0", "R010", "4K7", "2M2" (resistance), "4n7", "2p2" (capacitance), "2u2" (inductance): the letter is
 * the decimal point [S: IEC 60062]. The unit may follow ("4k7 Ω", "4n7F"); "47R" is 47 Ω (resistance only).
 */
function rkm(text: string, kind: QuantityKind): number | null {
  const mult: Record<string, number> = { p: 1e-12, n: 1e-9, u: 1e-6, µ: 1e-6, m: 1e-3, r: 1, R: 1, k: 1e3, K: 1e3, M: 1e6, G: 1e9 };
  const CODES: Partial<Record<QuantityKind, { letters: string; unit: string }>> = {
    resistance: { letters: 'rRkKMG', unit: '\u03a9|\u2126|[oO][hH][mM][sS]?' },
    capacitance: { letters: 'pnuµ', unit: '[fF]' },
    inductance: { letters: 'nuµm', unit: '[hH]' },
  };
  const code = CODES[kind];
  if (!code) return null;
  const unit = `(?:${code.unit})?`;
  const m = new RegExp(`^(\\d*)([${code.letters}])(\\d+)${unit}$`).exec(text) ?? (kind === 'resistance' ? new RegExp(`^(\\d+)([rR])()${unit}$`).exec(text) : null);
  if (!m) return null;
  const [, lead, letter, tail] = m as unknown as [string, string, string, string];
  if (!lead && !tail) return null;
  return Number((Number(`${lead || '0'}.${tail || '0'}`) * mult[letter]!).toPrecision(12));
}

const MATH_TARGET: Partial<Record<QuantityKind, string>> = {
  voltage: 'V',
  current: 'A',
  resistance: 'ohm',
  capacitance: 'F',
  inductance: 'H',
  power: 'W',
  energy: 'Wh',
  capacity: 'Ah',
  temperature: 'degC',
  mass: 'kg',
  length: 'm',
  area: 'm^2',
  time: 's',
  frequency: 'Hz',
};

function convert(value: number, spelling: UnitSpelling, kind: QuantityKind): number {
  if (typeof spelling.math === 'number') return value * spelling.math;
  return mathUnit(value, spelling.math).toNumber(MATH_TARGET[kind]!);
}

const NUMBER_THEN_UNIT = /^([-+\u2212]?(?:\d[\d., \u00a0\u2009\u202f]*)?\d(?:[eE][-+]?\d+)?|[-+\u2212]?[.,]\d+)\s*(.*)$/;

const finish = (value: number, kind: QuantityKind, entered: string, label: string): ParsedQuantity => {
  const v = Number(value.toPrecision(12));
  if (!Number.isFinite(v)) throw new QuantityError(`${label}: enter ${KIND_WORDS[kind]}`);
  if (kind === 'count' && !Number.isInteger(v)) throw new QuantityError(`${label}: enter a whole number`);
  return { value: v, unit: STORED_UNIT[kind], entered };
};

/**
 * One quantity field, read by its declaration. A JSON number is in the stored unit; text follows the
 * rules above, and a bare number the field's rule. Messages start with the field's label.
 */
export function readQuantity(input: string | number, field: QuantityField): ParsedQuantity {
  const { kind, label } = field;
  if (typeof input === 'number') {
    if (!Number.isFinite(input)) throw new QuantityError(`${label}: enter ${KIND_WORDS[kind]}`);
    return finish(input, kind, String(input), label);
  }
  const entered = input.trim();
  if (entered === '') throw new QuantityError('Required');
  const notOne = () => new QuantityError(`${label}: enter ${KIND_WORDS[kind]} ("${entered}" is not one)`);
  const code = rkm(entered.replace(/\s+/g, ''), kind);
  if (code !== null) return finish(code, kind, entered, label);
  const m = NUMBER_THEN_UNIT.exec(entered);
  if (!m) throw notOne();
  const [, numberText, unitText] = m as unknown as [string, string, string];
  let n: number;
  try {
    n = readNumber(numberText, kind === 'count' || kind === 'pieces');
  } catch (err) {
    throw new QuantityError(`${label}: ${(err as Error).message}`);
  }
  if (unitText === '') {
    if (kind === 'count' || kind === 'pieces') return finish(n, kind, entered, label);
    const unit = exampleUnit(field);
    const addUnit = `${label}: add a unit, e.g. ${field.example}`;
    if (field.bare === 'refuse') throw new QuantityError(addUnit);
    if ((field.bareAbove !== undefined && n <= field.bareAbove) || (field.bareMax !== undefined && n > field.bareMax)) {
      throw new QuantityError(`${addUnit} (a plain ${numberText} would be read as ${numberText} ${unit})`);
    }
    return finish(convert(n, resolveUnit(unit, kind), kind), kind, entered, label);
  }
  if (kind === 'count') throw new QuantityError(`${label}: enter a whole number`);
  let spelling: UnitSpelling;
  try {
    spelling = resolveUnit(unitText, kind);
  } catch (err) {
    const message = (err as Error).message;
    throw message ? new QuantityError(`${label}: ${message}`) : notOne();
  }
  return finish(convert(n, spelling, kind), kind, entered, label);
}

/**
 * Several fields at once; every bad field is reported (400, fields named), none is half-applied.
 * Fields given as null or '' become null. Returns values in the stored unit and the text typed.
 */
export function readQuantityFields<K extends string>(
  body: Partial<Record<K, string | number | null | undefined>>,
  fields: Record<K, QuantityField>,
): { values: Partial<Record<K, number | null>>; entered: Partial<Record<K, string>>; errors: Partial<Record<K, string>> } {
  const values: Partial<Record<K, number | null>> = {};
  const entered: Partial<Record<K, string>> = {};
  const errors: Partial<Record<K, string>> = {};
  for (const key of Object.keys(fields) as K[]) {
    if (!(key in body)) continue;
    const raw = body[key];
    if (raw === null || raw === undefined || (typeof raw === 'string' && raw.trim() === '')) {
      values[key] = null;
      continue;
    }
    try {
      const q = readQuantity(raw, fields[key]);
      values[key] = q.value;
      if (typeof raw === 'string') entered[key] = q.entered;
    } catch (err) {
      if (!(err instanceof QuantityError)) throw err;
      errors[key] = err.message;
    }
  }
  return { values, entered, errors };
}

/** readQuantityFields that throws the 400 when a field is bad. */
export function readQuantitiesOrThrow<K extends string>(body: Partial<Record<K, string | number | null | undefined>>, fields: Record<K, QuantityField>) {
  const read = readQuantityFields(body, fields);
  if (Object.keys(read.errors).length) throw validationError(read.errors as Record<string, string>);
  return { values: read.values, entered: read.entered };
}

// ---- prices ----

/**
 * Currency marks and the ISO 4217 codes each may stand for [CP: common usage; codes S: ISO 4217].
 * "$" and "¥" are shared, so they are checked against the chosen currency but never pick one.
 */
const CURRENCY_MARKS: [string, string[]][] = [
  ['US$', ['USD']],
  ['NZ$', ['NZD']],
  ['HK$', ['HKD']],
  ['CA$', ['CAD']],
  ['C$', ['CAD']],
  ['A$', ['AUD']],
  ['S$', ['SGD']],
  ['CN¥', ['CNY']],
  ['JP¥', ['JPY']],
  ['RMB', ['CNY']],
  ['$', ['USD', 'CAD', 'AUD', 'NZD', 'HKD', 'SGD', 'MXN']],
  ['€', ['EUR']],
  ['£', ['GBP']],
  ['¥', ['JPY', 'CNY']],
  ['￥', ['JPY', 'CNY']],
  ['₹', ['INR']],
  ['₩', ['KRW']],
];

export interface ParsedPrice {
  amount: number;
  /** The currency the text named, or the one it was checked against; null when neither. */
  currency: string | null;
  entered: string;
}

function currencyOf(mark: string): { mark: string; codes: string[] } {
  const known = CURRENCY_MARKS.find(([m]) => m.toUpperCase() === mark.toUpperCase());
  if (known) return { mark: known[0], codes: known[1] };
  return { mark: mark.toUpperCase(), codes: [mark.toUpperCase()] };
}

const MARK = String.raw`(?:US\$|NZ\$|HK\$|CA\$|C\$|A\$|S\$|CN¥|JP¥|[$€£¥￥₹₩]|[A-Za-z]{3})`;
const PRICE = new RegExp(String.raw`^([-+\u2212]?)\s*(?:(${MARK})\s*)?([-+\u2212]?[\d.,\s\u00a0\u2009\u202f]*\d|[.,]\d+)\s*(${MARK})?$`);

/**
 * A money amount, with or without its currency ("0.12", "$0.12", "0,12 €", "USD 0.12", "0.12 usd").
 * With `currency` (the line's): a currency typed must be that one. Without (none chosen yet): an
 * ISO code or a mark of one currency gives it; "$" or "¥" alone is refused as shared.
 */
export function readPrice(input: string | number, field: PriceField, currency: string | null): ParsedPrice {
  const { label } = field;
  if (typeof input === 'number') {
    if (!Number.isFinite(input)) throw new QuantityError(`${label}: enter an amount such as ${field.example}`);
    return { amount: input, currency, entered: String(input) };
  }
  const entered = input.trim();
  if (entered === '') throw new QuantityError('Required');
  const m = PRICE.exec(entered.replace(SPACES, ' '));
  if (!m || (m[2] && m[4])) throw new QuantityError(`${label}: enter an amount such as ${field.example}, with its currency if you like ("${entered}" is not one)`);
  const [, sign, before, numberText, after] = m as unknown as [string, string, string | undefined, string, string | undefined];
  let amount: number;
  try {
    amount = readNumber(`${sign}${numberText}`);
  } catch (err) {
    throw new QuantityError(`${label}: ${(err as Error).message}`);
  }
  amount = Number(amount.toPrecision(12));
  const markText = before ?? after;
  if (!markText) return { amount, currency, entered };
  const mark = currencyOf(markText);
  const wanted = currency?.toUpperCase() ?? null;
  if (wanted) {
    if (!mark.codes.includes(wanted)) {
      const named = mark.codes.length === 1 ? mark.codes[0]! : `${mark.codes.join(', ')}`;
      throw new QuantityError(
        `${label}: "${mark.mark}" is ${mark.codes.length === 1 ? named : `one of ${named}`}, but this price is in ${wanted}: ${mark.codes.length === 1 ? `choose ${named} as the currency, or ` : ''}type the amount in ${wanted}`,
      );
    }
    return { amount, currency: wanted, entered };
  }
  if (mark.codes.length > 1) throw new QuantityError(`${label}: "${mark.mark}" is used by several currencies (${mark.codes.join(', ')}): give the currency, e.g. ${mark.codes[0]} ${field.example}`);
  return { amount, currency: mark.codes[0]!, entered };
}
