// Payloads from the route table's zod schemas: a fast-check arbitrary of values that mostly fit the
// schema (its JSON Schema: types, enums, patterns, bounds), the places where a string goes, and one
// fixed sample per schema. Custom refinements are not represented: values may still be refused.
import fc from 'fast-check';
import { z, type ZodType } from 'zod';

export type JsonSchema = {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  additionalProperties?: JsonSchema | boolean;
  propertyNames?: JsonSchema;
  items?: JsonSchema;
  prefixItems?: JsonSchema[];
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  enum?: unknown[];
  const?: unknown;
  pattern?: string;
  format?: string;
  minLength?: number;
  maxLength?: number;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minItems?: number;
  maxItems?: number;
  default?: unknown;
};

export const jsonSchemaOf = (schema: ZodType): JsonSchema => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any', cycles: 'ref', reused: 'inline' }) as JsonSchema;

const typesOf = (s: JsonSchema): string[] => (Array.isArray(s.type) ? s.type : s.type ? [s.type] : []);

function stringArb(s: JsonSchema): fc.Arbitrary<string> {
  if (s.pattern) {
    try {
      return fc.stringMatching(new RegExp(s.pattern)).filter((v) => v.length <= (s.maxLength ?? 10_000));
    } catch {
      /* a pattern JavaScript cannot read as is: plain strings */
    }
  }
  if (s.format === 'email') return fc.emailAddress();
  const minLength = s.minLength ?? 0;
  const maxLength = Math.max(minLength, Math.min(s.maxLength ?? 40, 40));
  return fc.string({ minLength, maxLength, unit: 'grapheme' });
}

function numberArb(s: JsonSchema, integer: boolean): fc.Arbitrary<number> {
  const lo = s.minimum ?? (s.exclusiveMinimum !== undefined ? s.exclusiveMinimum + (integer ? 1 : 1e-9) : -1e6);
  const hi = s.maximum ?? (s.exclusiveMaximum !== undefined ? s.exclusiveMaximum - (integer ? 1 : 1e-9) : 1e6);
  const min = Math.max(lo, -1e9);
  const max = Math.min(hi, 1e9);
  if (integer) return fc.integer({ min: Math.ceil(min), max: Math.max(Math.ceil(min), Math.floor(max)) });
  return fc.double({ min, max: Math.max(min, max), noNaN: true, noDefaultInfinity: true });
}

/** Values that mostly fit the schema. */
export function arbitraryOf(s: JsonSchema, depth = 0): fc.Arbitrary<unknown> {
  if (s.const !== undefined) return fc.constant(s.const);
  if (s.enum) return fc.constantFrom(...s.enum);
  const alternatives = s.anyOf ?? s.oneOf;
  if (alternatives?.length) return fc.oneof(...alternatives.map((a) => arbitraryOf(a, depth + 1)));
  if (s.allOf?.length) return arbitraryOf(Object.assign({}, ...s.allOf), depth + 1);
  const types = typesOf(s);
  if (types.length > 1) return fc.oneof(...types.map((type) => arbitraryOf({ ...s, type }, depth + 1)));
  switch (types[0]) {
    case 'string':
      return stringArb(s);
    case 'number':
      return numberArb(s, false);
    case 'integer':
      return numberArb(s, true);
    case 'boolean':
      return fc.boolean();
    case 'null':
      return fc.constant(null);
    case 'array': {
      const minLength = s.minItems ?? 0;
      const maxLength = Math.max(minLength, Math.min(s.maxItems ?? 4, 4));
      if (s.prefixItems) return fc.tuple(...s.prefixItems.map((p) => arbitraryOf(p, depth + 1)));
      return fc.array(depth > 6 ? fc.constant(null) : arbitraryOf(s.items ?? {}, depth + 1), { minLength, maxLength });
    }
    case 'object': {
      const props = s.properties ?? {};
      const required = new Set(s.required ?? []);
      const known = fc.record(Object.fromEntries(Object.entries(props).map(([k, v]) => [k, depth > 6 ? fc.constant(null) : arbitraryOf(v, depth + 1)])), {
        requiredKeys: Object.keys(props).filter((k) => required.has(k)),
      });
      if (typeof s.additionalProperties === 'object') {
        const keys = s.propertyNames ? stringArb(s.propertyNames) : fc.string({ minLength: 1, maxLength: 12 });
        const extra = fc.dictionary(keys, arbitraryOf(s.additionalProperties, depth + 1), { maxKeys: 4 });
        return fc.tuple(known, extra).map(([a, b]) => ({ ...b, ...a }));
      }
      return known;
    }
    default:
      return fc.jsonValue({ maxDepth: 2 });
  }
}

/** One value of the schema, the same on every run, with every optional property present. */
export function sampleOf(s: JsonSchema): unknown {
  if (s.const !== undefined) return s.const;
  if (s.enum) return s.enum[0];
  if (s.default !== undefined) return s.default;
  const alternatives = s.anyOf ?? s.oneOf;
  if (alternatives?.length) {
    // Prefer an alternative that is not null or an empty constant.
    const pick = alternatives.find((a) => !typesOf(a).includes('null') && a.const === undefined) ?? alternatives[0]!;
    return sampleOf(pick);
  }
  const types = typesOf(s).filter((t) => t !== 'null');
  switch (types[0]) {
    case 'object': {
      const out: Record<string, unknown> = {};
      for (const [k, v] of Object.entries(s.properties ?? {})) out[k] = sampleOf(v);
      return out;
    }
    case 'array': {
      const n = Math.max(s.minItems ?? 1, 1);
      return Array.from({ length: n }, () => sampleOf(s.items ?? { type: 'string' }));
    }
    default:
      return fc.sample(arbitraryOf({ ...s, type: types[0] ?? s.type }), { numRuns: 1, seed: 42 })[0];
  }
}

/** Paths (property names, `.`-joined; array items as 0) where the schema takes free text. */
export function stringPaths(s: JsonSchema, prefix: string[] = []): string[][] {
  const alternatives = [...(s.anyOf ?? []), ...(s.oneOf ?? []), ...(s.allOf ?? [])];
  const out: string[][] = [];
  const types = typesOf(s);
  if (types.includes('string') && s.enum === undefined && s.const === undefined) out.push(prefix);
  else if (alternatives.some((a) => typesOf(a).includes('string') && a.enum === undefined && a.const === undefined)) out.push(prefix);
  if (types.includes('object')) for (const [k, v] of Object.entries(s.properties ?? {})) out.push(...stringPaths(v, [...prefix, k]));
  if (types.includes('array') && s.items) out.push(...stringPaths(s.items, [...prefix, '0']));
  for (const a of alternatives) if (typesOf(a).includes('object') || typesOf(a).includes('array')) out.push(...stringPaths(a, prefix));
  const seen = new Set<string>();
  return out.filter((p) => p.length > 0 && !seen.has(p.join('.')) && seen.add(p.join('.')));
}

/** `value` with `path` set to `leaf` (arrays and objects on the way are made when missing). */
export function setPath(value: unknown, path: string[], leaf: unknown): unknown {
  if (path.length === 0) return leaf;
  const [head, ...rest] = path as [string, ...string[]];
  if (/^\d+$/.test(head)) {
    const arr = Array.isArray(value) ? [...value] : [];
    arr[Number(head)] = setPath(arr[Number(head)], rest, leaf);
    return arr;
  }
  const obj = value && typeof value === 'object' && !Array.isArray(value) ? { ...(value as Record<string, unknown>) } : {};
  obj[head] = setPath(obj[head], rest, leaf);
  return obj;
}
