// Typed inputs of the bench tools → SI numbers, with what was read from each field. Every bad field
// is reported at once (400, fields named); the fields that did parse come back in details.parsed so
// the page can still show their SI values.
import type { ParsedToolInput, QuantityField } from '@splitcase/contracts';
import { ozToMetres } from '@splitcase/calc';
import { AppError, validationError } from '../../http/errors';
import { readNumber, readQuantity, STORED_UNIT } from '../../lib/units';

/** How to read one field beyond its declaration: a copper thickness (also "1 oz"), or a temperature difference. */
export type ToolFieldKind = 'quantity' | 'copper-thickness' | 'temperature-rise';
export type ToolCheck = 'positive' | 'fraction' | 'at-least-one' | 'finite';

export interface ToolFieldSpec {
  /** The field's declaration in contracts: label, kind, example, how a bare number is read. */
  field: QuantityField;
  /** Special readings on top of the declaration; 'quantity' (the default) is the declaration alone. */
  kind?: ToolFieldKind;
  check: ToolCheck;
  required?: boolean;
}

type Raw = string | number | null | undefined;

const COPPER_WEIGHT = /^(\d*[.,]?\d+)\s*oz(?:\s*\/\s*ft(?:²|2|\^2))?$/i;
const RISE = /^([-+\u2212]?\d*[.,]?\d+)\s*(?:°\s*C|deg\s*C|C|K)?$/i;

/** One field in its stored unit: a copper weight in oz/ft² becomes metres (1 oz = 35 µm); a rise in °C or K stays a difference. */
export function readToolField(raw: string | number, field: QuantityField, kind: ToolFieldKind = 'quantity'): ParsedToolInput {
  const entered = String(raw).trim();
  if (kind === 'copper-thickness') {
    const oz = typeof raw === 'string' ? COPPER_WEIGHT.exec(entered) : null;
    if (oz) {
      try {
        return { entered, value: ozToMetres(readNumber(oz[1]!)), unit: 'm' };
      } catch (err) {
        throw new Error(`${field.label}: ${(err as Error).message}`);
      }
    }
    try {
      return readQuantity(raw, field);
    } catch (err) {
      if (typeof raw === 'string' && /^[-+]?[\d.,\s]+$/.test(entered)) throw err;
      throw new Error(`${field.label}: enter a copper thickness such as "35 µm" or a copper weight such as "1 oz" ("${entered}" is neither)`);
    }
  }
  if (kind === 'temperature-rise') {
    const m = typeof raw === 'number' ? [entered, entered] : RISE.exec(entered);
    if (!m) throw new Error(`${field.label}: enter a temperature rise such as "10 °C" or "10 K" ("${entered}" is not one)`);
    try {
      return { entered, value: readNumber(m[1]!), unit: '°C' };
    } catch (err) {
      throw new Error(`${field.label}: ${(err as Error).message}`);
    }
  }
  return readQuantity(raw, field);
}

/** What a value that reads but fails its check is told; like the reader's messages, it starts with the field's label. */
const CHECK_MESSAGE: Record<ToolCheck, (field: QuantityField) => string> = {
  positive: (f) => `${f.label}: must be greater than zero`,
  fraction: (f) => `${f.label}: enter a fraction above 0 % and at most 100 %, such as ${f.example}`,
  'at-least-one': (f) => `${f.label}: enter a whole number of at least 1`,
  finite: (f) => `${f.label}: enter a finite number`,
};

function passes(value: number, check: ToolCheck): boolean {
  if (!Number.isFinite(value)) return false;
  if (check === 'positive') return value > 0;
  if (check === 'fraction') return value > 0 && value <= 1;
  if (check === 'at-least-one') return Number.isInteger(value) && value >= 1;
  return true;
}

export interface ReadFields<K extends string> {
  values: Partial<Record<K, number>>;
  parsed: Record<string, ParsedToolInput>;
  errors: Record<string, string>;
}

/** Reads every field of the spec that is given ('' and null mean "not given"); collects errors instead of throwing. */
export function readToolFields<K extends string>(body: NoInfer<Partial<Record<K, Raw>>>, spec: Record<K, ToolFieldSpec>): ReadFields<K> {
  const values: Partial<Record<K, number>> = {};
  const parsed: Record<string, ParsedToolInput> = {};
  const errors: Record<string, string> = {};
  for (const key of Object.keys(spec) as K[]) {
    const raw = body[key];
    const { field, kind = 'quantity', check, required } = spec[key];
    if (raw === undefined || raw === null || (typeof raw === 'string' && raw.trim() === '')) {
      if (required) errors[key] = 'Required';
      continue;
    }
    let q: ParsedToolInput;
    try {
      q = readToolField(raw, field, kind);
    } catch (err) {
      errors[key] = (err as Error).message;
      continue;
    }
    const unit = kind === 'copper-thickness' ? 'm' : kind === 'temperature-rise' ? '°C' : STORED_UNIT[field.kind];
    parsed[key] = { entered: String(raw).trim(), value: q.value, unit };
    if (!passes(q.value, check)) {
      errors[key] = CHECK_MESSAGE[check](field);
      continue;
    }
    values[key] = q.value;
  }
  return { values, parsed, errors };
}

/** A 400 naming every bad field, carrying what did parse (details.parsed). */
export function toolValidationError(errors: Record<string, string>, parsed: Record<string, ParsedToolInput>): AppError {
  return new AppError('validation_failed', validationError(errors).message, errors, { parsed });
}
