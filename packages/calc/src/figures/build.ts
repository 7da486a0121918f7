// What every subsystem of the teardown figures shares: the figure builder, keyed inputs, checks of
// the records, and the one way numbers are written into the words of a figure.
import { plain } from '../shared/text';
import { formulaOf, type FormulaKey } from './formulas';
import type { Figure, KeyedInput } from './types';

/** A keyed input ("labelWh", "Label energy", 37, "Wh"). */
export function inp(key: string, label: string, value: KeyedInput['value'], unit?: string): KeyedInput {
  return unit === undefined ? { key, label, value } : { key, label, value, unit };
}

export interface FigureSpec {
  key: string;
  label: string;
  value: number | string;
  unit: string;
  /** The catalogue entry the formula and source come from. */
  family: FormulaKey;
  inputs: KeyedInput[];
  assumptions?: string[];
  warnings?: string[];
  modeId?: string;
  implausible?: boolean;
}

/** A figure with its formula and source from the catalogue. */
export function figure(spec: FigureSpec): Figure {
  const { formula, source } = formulaOf(spec.family);
  const keys = new Set<string>();
  for (const i of spec.inputs) {
    if (keys.has(i.key)) throw new Error(`Figure ${spec.key}: input key "${i.key}" used twice.`);
    keys.add(i.key);
  }
  const out: Figure = {
    key: spec.key,
    label: spec.label,
    value: spec.value,
    unit: spec.unit,
    formula,
    source,
    inputs: spec.inputs,
    assumptions: spec.assumptions ?? [],
    warnings: spec.warnings ?? [],
  };
  if (spec.modeId !== undefined) out.modeId = spec.modeId;
  if (spec.implausible) out.implausible = true;
  return out;
}

/** Numbers in the words of a figure: `digits` significant figures, no trailing zeros (shared/text `plain`). */
export const num = (x: number, digits = 3) => plain(x, digits);

/** A duration in words: "45 s", "10 min", "8 h", "1 h 30 min". */
export function duration(seconds: number): string {
  if (seconds < 90) return `${num(seconds)} s`;
  if (seconds < 3600) return `${num(seconds / 60)} min`;
  const h = Math.floor(seconds / 3600);
  const m = Math.round((seconds - h * 3600) / 60);
  return m === 0 ? `${h} h` : m === 60 ? `${h + 1} h` : `${h} h ${m} min`;
}

export function requireOneOf<T extends string>(value: T, allowed: readonly T[], name: string): T {
  if (!allowed.includes(value)) {
    throw new RangeError(`${name} must be one of ${allowed.join(', ')} (got "${String(value)}").`);
  }
  return value;
}

export function requireId(value: string, name: string, seen: Set<string>): string {
  if (typeof value !== 'string' || value.trim() === '') throw new RangeError(`${name} needs an id.`);
  if (seen.has(value)) throw new RangeError(`${name}: the id "${value}" is used twice.`);
  seen.add(value);
  return value;
}

export function unique(list: string[]): string[] {
  return [...new Set(list)];
}
