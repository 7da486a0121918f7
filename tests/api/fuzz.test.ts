// API fuzzing with fast-check over every JSON write route of the route table: payloads drawn from
// each route's zod schema (as JSON Schema), the same with one value swapped for a hostile one, and
// arbitrary JSON. Whatever comes in, the answer is never a 5xx, never shows a stack trace or a server
// path, and every error has the standard shape. fast-check prints the seed of a failing run.
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ZodType } from 'zod';
import { allRoutes } from '../../apps/api/src/modules/routes';
import type { RouteDef } from '../../apps/api/src/http/route';
import { demoRecords, type DemoRecords } from '../support/demo-records';
import { arbitraryOf, jsonSchemaOf } from '../support/schema-arbitrary';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

/** Payloads per route; with the 40-odd JSON write routes, well over 1,000 per run. */
const RUNS_PER_ROUTE = 25;

let t: TestApp;
let d: DemoRecords;
let admin: Agent;
let sent = 0;
beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  d = await demoRecords(t);
  admin = await t.as('admin');
}, 120_000);
afterAll(async () => {
  console.log(`fuzz: ${sent} payloads sent`);
  await t.close();
});

const HOSTILE: unknown[] = [
  '\u0000',
  'a\u0000b',
  '\uD800',
  '\uFFFF\uFFFE',
  'x'.repeat(200_000),
  '',
  '   ',
  '<script>alert(1)</script>',
  "'; drop table users; --",
  '" OR 1=1 --',
  'NEAR(a b) AND "x*',
  '../../../../etc/passwd',
  "=cmd|' /C calc'!A0",
  '1e309',
  'NaN',
  '-0',
  '9'.repeat(400),
  1e308,
  -1e308,
  Number.MAX_VALUE,
  Number.MIN_VALUE,
  2 ** 53 + 1,
  -1,
  0,
  0.1 + 0.2,
  true,
  null,
  [],
  {},
  JSON.parse(`${'['.repeat(20)}${']'.repeat(20)}`),
  JSON.parse('{"__proto__": {"polluted": true}, "constructor": {"prototype": {"polluted": true}}}'),
  Array.from({ length: 2000 }, (_v, i) => i),
  Object.fromEntries(Array.from({ length: 500 }, (_v, i) => [`k${i}`, i])),
];

/** Deeply nested JSON (the body parser and the validation must not fall over). */
const deep = (n: number): unknown => {
  let v: unknown = 'bottom';
  for (let i = 0; i < n; i++) v = i % 2 ? [v] : { v };
  return v;
};

/** Every place in a JSON value (paths to objects' keys and arrays' items). */
function places(value: unknown, path: (string | number)[] = []): (string | number)[][] {
  const out: (string | number)[][] = [path];
  if (Array.isArray(value)) value.forEach((v, i) => out.push(...places(v, [...path, i])));
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) out.push(...places(v, [...path, k]));
  return out;
}
function replaceAt(value: unknown, path: (string | number)[], leaf: unknown): unknown {
  if (path.length === 0) return leaf;
  const [head, ...rest] = path;
  const copy = (Array.isArray(value) ? [...value] : { ...(value as object) }) as Record<string | number, unknown>;
  copy[head!] = replaceAt(copy[head!], rest, leaf);
  return copy;
}

function payloads(r: RouteDef): fc.Arbitrary<unknown> {
  const shaped = arbitraryOf(jsonSchemaOf(r.spec.body as ZodType));
  const mutated = fc.tuple(shaped, fc.nat(), fc.constantFrom(...HOSTILE)).map(([v, n, h]) => {
    const all = places(v);
    return replaceAt(v, all[n % all.length]!, h);
  });
  const extraKey = fc.tuple(shaped, fc.string({ maxLength: 12 }), fc.constantFrom(...HOSTILE)).map(([v, k, h]) => (v && typeof v === 'object' && !Array.isArray(v) ? { ...v, [k || 'extra']: h } : v));
  return fc.oneof(
    { weight: 4, arbitrary: shaped },
    { weight: 4, arbitrary: mutated },
    { weight: 1, arbitrary: extraKey },
    { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
    { weight: 1, arbitrary: fc.constantFrom(...HOSTILE, deep(3000)) },
  );
}

/** URLs with the draft's ids, so that payloads reach the handlers and the database. */
function urlFor(path: string): string {
  const rec = d.draft;
  return path.replace(/:(\w+)/g, (_m, name: string) => {
    const id = (v: number | null) => String(v ?? 999_999);
    if (name === 'findingId') return id(rec.finding);
    if (name === 'loadId') return id(rec.load);
    if (name === 'converterId') return id(rec.converter);
    if (path.startsWith('/api/teardowns/')) return id(rec.teardown);
    if (path.startsWith('/api/photos/')) return id(rec.photo);
    if (path.startsWith('/api/callouts/')) return id(rec.callout);
    if (path.startsWith('/api/parts/')) return id(rec.part);
    if (path.startsWith('/api/measurements/')) return id(rec.measurement);
    if (path.startsWith('/api/runs/')) return id(rec.run);
    if (path.startsWith('/api/lineups/')) return id(d.lineups.draft);
    if (path.startsWith('/api/devices/')) return id(rec.device);
    if (path.startsWith('/api/users/')) return id(d.users.engineer2 ?? null);
    return '999999';
  });
}

const STACK = /\n\s+at \S|\bat [\w.<>]+ \(|node_modules|\/work\/|\.ts:\d+:\d+|Error: .*\n/;

describe('fuzzing the JSON write routes', () => {
  const routes = allRoutes({ env: {} } as never, 'test').filter((r) => r.spec.body && !r.spec.multipart && r.spec.method !== 'get');

  it('covers the JSON write routes of the route table', () => {
    expect(routes.length * RUNS_PER_ROUTE).toBeGreaterThanOrEqual(1000);
  });

  for (const r of routes) {
    const key = `${r.spec.method.toUpperCase()} ${r.spec.path}`;
    it(`${key}: no 5xx, no stack trace, the standard error shape`, async () => {
      const url = urlFor(r.spec.path);
      await fc.assert(
        fc.asyncProperty(payloads(r), async (body) => {
          sent++;
          const m = r.spec.method as 'post' | 'put' | 'patch';
          // Sent as JSON text, so that a bare number, string or null is a body too.
          const res = await admin.agent[m](url).set('X-CSRF-Token', admin.csrf).set('X-Confirm-Unpublish', 'yes').set('Content-Type', 'application/json').send(JSON.stringify(body));
          const text = res.text ?? '';
          if (res.status >= 500) throw new Error(`${key} answered ${res.status}: ${text.slice(0, 300)}`);
          if (STACK.test(text)) throw new Error(`${key} answer shows a stack trace or a server path: ${text.slice(0, 300)}`);
          if (res.status >= 400) {
            const e = res.body?.error;
            if (!e || typeof e.code !== 'string' || typeof e.message !== 'string') throw new Error(`${key} ${res.status} without the standard error body: ${text.slice(0, 200)}`);
          }
        }),
        { numRuns: RUNS_PER_ROUTE },
      );
    });
  }
});
