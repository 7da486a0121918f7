// Read typed quantities for the power system: each field through the one reader (lib/units, by its
// declaration in contracts), then the range it allows. Every bad field is reported at once, named;
// nothing is applied unless all are good.
import { STORED_UNIT, type QuantityField, type QuantityKind } from '@splitcase/contracts';
import { validationError } from '../../http/errors';
import { readQuantity } from '../../lib/units';

export interface FieldRule {
  /** The field's declaration: label, kind, example and how a bare number is read. */
  field: QuantityField;
  /** Smallest allowed value; `above` makes it exclusive. */
  min?: number;
  above?: boolean;
  max?: number;
  /** What follows "<label>: " when the value is above max (default "at most <max> <unit>"). */
  maxMessage?: string;
  /** Says what the field is, for messages ("A cell's voltage"). */
  required?: boolean;
}

export type Raw = string | number | null | undefined;

export interface ReadResult<K extends string> {
  /** SI values of the fields present in the body (null = cleared). */
  values: Partial<Record<K, number | null>>;
  /** Typed text of the fields given as text. */
  entered: Partial<Record<K, string>>;
  /** Fields present in the body (text or number or null). */
  present: K[];
}

/** A limit in the stored unit as the messages say it ("0 V", "100 %", "1"). */
function limit(value: number, kind: QuantityKind): string {
  if (kind === 'fraction') return `${Number((value * 100).toPrecision(12))} %`;
  const unit = STORED_UNIT[kind];
  return unit ? `${value} ${unit}` : String(value);
}

export function readQuantities<K extends string>(body: Partial<Record<K, Raw>>, rules: Record<K, FieldRule>, extraErrors: Record<string, string> = {}): ReadResult<K> {
  const values: Partial<Record<K, number | null>> = {};
  const entered: Partial<Record<K, string>> = {};
  const present: K[] = [];
  const errors: Record<string, string> = { ...extraErrors };
  for (const key of Object.keys(rules) as K[]) {
    if (!(key in body)) {
      if (rules[key].required) errors[key] = 'Required';
      continue;
    }
    present.push(key);
    const raw = body[key];
    const rule = rules[key];
    if (raw === null || raw === undefined || (typeof raw === 'string' && raw.trim() === '')) {
      if (rule.required) errors[key] = 'Required';
      else values[key] = null;
      continue;
    }
    let value: number;
    try {
      value = readQuantity(raw, rule.field).value;
    } catch (err) {
      errors[key] = (err as Error).message;
      continue;
    }
    // Range messages, like the reader's, start with the field's label as the screen shows it.
    const { label, kind } = rule.field;
    if (rule.min !== undefined && (rule.above ? value <= rule.min : value < rule.min)) {
      errors[key] = `${label}: ${rule.above ? 'must be more than' : 'must be at least'} ${limit(rule.min, kind)}`;
      continue;
    }
    if (rule.max !== undefined && value > rule.max) {
      errors[key] = `${label}: ${rule.maxMessage ?? `at most ${limit(rule.max, kind)}`}`;
      continue;
    }
    values[key] = value;
    if (typeof raw === 'string') entered[key] = raw.trim();
  }
  if (Object.keys(errors).length) throw validationError(errors);
  return { values, entered, present };
}

/** Merge typed text: fields given again replace their text; fields given as numbers or cleared lose it. */
export function mergeEntered(previous: Record<string, string> | null | undefined, read: ReadResult<string>): Record<string, string> | null {
  const out: Record<string, string> = { ...(previous ?? {}) };
  for (const key of read.present) {
    const text = read.entered[key];
    if (text !== undefined) out[key] = text;
    else delete out[key];
  }
  return Object.keys(out).length ? out : null;
}
