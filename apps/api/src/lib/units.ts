// Quantities typed by people ("2700 mAh", "3.65V", "3R0", "4k7", "35 µm", "60 %") → SI numbers,
// through mathjs's unit system. The server stores SI and keeps the text the user typed.
import { unit as mathUnit } from 'mathjs';
import { SI_UNIT } from '@splitcase/contracts';
import { validationError } from '../http/errors';

export type QuantityKind =
  | 'voltage'
  | 'current'
  | 'resistance'
  | 'capacitance'
  | 'inductance'
  | 'power'
  | 'energy'
  | 'capacity'
  | 'temperature'
  | 'mass'
  | 'length'
  | 'area'
  | 'time'
  | 'frequency'
  | 'fraction'
  | 'count';

/** Stored unit per kind: SI, except Wh and Ah (the trade's units for energy and charge) and °C (contracts' SI_UNIT). */
export const STORED_UNIT: Record<QuantityKind, string> = {
  ...(({ other: _other, 'surface-temperature': _surface, ...measured }) => measured)(SI_UNIT),
  area: 'm²',
  fraction: '',
  count: '',
};

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
  fraction: 'a fraction such as "0.6" or "60 %"',
  count: 'a whole number',
};

export class QuantityError extends Error {}

export interface ParsedQuantity {
  value: number;
  unit: string;
  entered: string;
}

const RKM_MULT: Record<string, number> = { p: 1e-12, n: 1e-9, u: 1e-6, m: 1e-3, r: 1, R: 1, k: 1e3, K: 1e3, M: 1e6, G: 1e9 };

/** Tidy what people type into what mathjs reads. */
function normalise(text: string): string {
  return text
    .trim()
    .replace(/[µμ]/g, 'u')
    .replace(/Ω|Ω|ohms?\b/gi, 'ohm')
    .replace(/°\s*C\b/g, 'degC')
    .replace(/°\s*F\b/g, 'degF')
    .replace(/\bdeg\s*C\b/gi, 'degC')
    .replace(/(\d)\s*(cm|mm|m)²/g, '$1 $2^2')
    .replace(/(\d)\s*(cm|mm|m)2\b/g, '$1 $2^2')
    .replace(/,(?=\d{3}\b)/g, '')
    .replace(/(\d),(\d)/g, '$1.$2');
}

/** "3R0", "R010", "4k7", "2M2" (resistance) or "4n7", "2p2", "1u0" (capacitance): the letter is the decimal point. */
function rkm(text: string, kind: QuantityKind): number | null {
  const letters = kind === 'resistance' ? 'rRkKMG' : kind === 'capacitance' ? 'pnum' : kind === 'inductance' ? 'nmu' : '';
  if (!letters) return null;
  const m = text.match(new RegExp(`^(\\d*)([${letters}])(\\d*)$`));
  if (!m || (!m[1] && !m[3])) return null;
  const mult = kind === 'resistance' ? RKM_MULT[m[2]!]! : RKM_MULT[m[2]!]!;
  return Number(`${m[1] || '0'}.${m[3] || '0'}`) * mult;
}

export function parseQuantity(input: string | number, kind: QuantityKind): ParsedQuantity {
  const entered = String(input).trim();
  if (entered === '') throw new QuantityError('Required');
  if (typeof input === 'number' || /^[-+]?\d*\.?\d+(e[-+]?\d+)?$/i.test(entered)) {
    const value = Number(entered);
    if (!Number.isFinite(value)) throw new QuantityError(`Enter ${KIND_WORDS[kind]}`);
    if (kind === 'count' && !Number.isInteger(value)) throw new QuantityError('Enter a whole number');
    return { value, unit: STORED_UNIT[kind], entered };
  }
  if (kind === 'count') throw new QuantityError('Enter a whole number');
  if (kind === 'fraction') {
    const m = entered.match(/^([-+]?\d*\.?\d+)\s*%$/);
    if (!m) throw new QuantityError(`Enter ${KIND_WORDS[kind]}`);
    return { value: Number(m[1]) / 100, unit: '', entered };
  }
  const code = rkm(entered, kind);
  if (code !== null) return { value: code, unit: STORED_UNIT[kind], entered };
  const target = MATH_TARGET[kind]!;
  let value: number;
  try {
    const u = mathUnit(normalise(entered));
    value = u.toNumber(target);
  } catch {
    throw new QuantityError(`Enter ${KIND_WORDS[kind]} ("${entered}" is not one)`);
  }
  if (!Number.isFinite(value)) throw new QuantityError(`Enter ${KIND_WORDS[kind]}`);
  return { value: Number(value.toPrecision(12)), unit: STORED_UNIT[kind], entered };
}

/**
 * Parse several fields at once; every bad field is reported (400, fields named), none is half-applied.
 * Fields given as null or '' become null. Returns SI values and the text typed per field.
 */
export function parseQuantities<K extends string>(
  body: Partial<Record<K, string | number | null | undefined>>,
  spec: Record<K, QuantityKind>,
  prefix = '',
): { values: Partial<Record<K, number | null>>; entered: Partial<Record<K, string>> } {
  const values: Partial<Record<K, number | null>> = {};
  const entered: Partial<Record<K, string>> = {};
  const errors: Record<string, string> = {};
  for (const key of Object.keys(spec) as K[]) {
    if (!(key in body)) continue;
    const raw = body[key];
    if (raw === null || raw === undefined || (typeof raw === 'string' && raw.trim() === '')) {
      values[key] = null;
      continue;
    }
    try {
      const q = parseQuantity(raw, spec[key]);
      values[key] = q.value;
      if (typeof raw === 'string') entered[key] = q.entered;
    } catch (err) {
      errors[prefix + key] = (err as Error).message;
    }
  }
  if (Object.keys(errors).length) throw validationError(errors);
  return { values, entered };
}
