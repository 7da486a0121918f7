// Text with control characters (NUL and the rest, other than tab and line breaks) is refused with a
// 400 naming the field, on every route of the route table that reads a JSON body or a query.
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ZodType } from 'zod';
import { allRoutes } from '../../apps/api/src/modules/routes';
import { jsonSchemaOf, sampleOf, setPath, stringPaths } from '../support/schema-arbitrary';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let admin: Agent;
beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  admin = await t.as('admin');
}, 120_000);
afterAll(() => t.close());

const routes = allRoutes({ env: {} } as never, 'test');
const CONTROL_MESSAGE = /control character/i;
const withIds = (path: string) => path.replace(/:(\w+)/g, (_m, name: string) => (name === 'key' ? 'capacity.implausible' : name === 'variant' ? 'thumb' : '1'));
const send = (method: string, url: string, body: unknown) => (method === 'get' ? admin.get(url) : (admin[method as 'post' | 'put' | 'patch'](url, body) as ReturnType<Agent['post']>));

describe('control characters in text', () => {
  const bodies = routes.filter((r) => r.spec.body && !r.spec.multipart);

  it('the walk covers the write routes (and finds their text fields)', () => {
    expect(bodies.length).toBeGreaterThan(40);
    const paths = bodies.flatMap((r) => stringPaths(jsonSchemaOf(r.spec.body as ZodType)));
    expect(paths.length).toBeGreaterThan(100);
  });

  for (const r of bodies) {
    const key = `${r.spec.method.toUpperCase()} ${r.spec.path}`;
    it(`${key}: a NUL in any text field is a 400 naming the field`, async () => {
      const schema = jsonSchemaOf(r.spec.body as ZodType);
      const sample = sampleOf(schema);
      for (const path of stringPaths(schema)) {
        const body = setPath(sample, path, 'ab\u0000cd');
        const res = await send(r.spec.method, withIds(r.spec.path), body);
        const field = path.join('.');
        expect(res.status, `${key} with a NUL in ${field}: ${JSON.stringify(res.body)}`).toBe(400);
        expect(res.body.error.fields?.[field], `${key}: the error names ${field} (${JSON.stringify(res.body.error.fields)})`).toMatch(CONTROL_MESSAGE);
      }
    });
  }

  const queries = routes.filter((r) => r.spec.method === 'get' && r.spec.query);
  for (const r of queries) {
    const key = `GET ${r.spec.path}`;
    it(`${key}: a NUL in a text parameter is a 400 naming it`, async () => {
      const schema = jsonSchemaOf(r.spec.query as ZodType);
      for (const path of stringPaths(schema).filter((p) => p.length === 1)) {
        const res = await admin.get(`${withIds(r.spec.path)}?${encodeURIComponent(path[0]!)}=${encodeURIComponent('ab\u0000cd')}`);
        expect(res.status, `${key}?${path[0]} with a NUL: ${JSON.stringify(res.body)}`).toBe(400);
        expect(res.body.error.fields?.[`query.${path[0]}`], `${key}: names query.${path[0]}`).toMatch(CONTROL_MESSAGE);
      }
    });
  }

  it('a real write: NUL, bell, escape, DEL, a C1 control and a lone carriage return are refused; tab and line breaks are kept', async () => {
    const device = { maker: 'Ctrlworks', model: 'Probe', category: 'other' };
    for (const bad of ['\u0000', '\u0007', '\u001b[31m', '\u007f', '\u0085', 'a\rb']) {
      const res = await admin.post('/api/devices', { ...device, notes: `x${bad}y` });
      expect(res.status, JSON.stringify(bad)).toBe(400);
      expect(res.body.error.fields.notes).toMatch(CONTROL_MESSAGE);
    }
    const res = await admin.post('/api/devices', { ...device, notes: 'col1\tcol2\nline 2\r\nline 3' }).expect(201);
    expect(res.body.device.notes).toBe('col1\tcol2\nline 2\r\nline 3');
  });

  it('no schema of contracts builds a string any other way', () => {
    const dir = join(import.meta.dirname, '../../packages/contracts/src');
    const offenders: string[] = [];
    for (const file of readdirSync(dir).filter((f) => f.endsWith('.ts') && !f.endsWith('.test.ts'))) {
      const source = readFileSync(join(dir, file), 'utf8');
      source.split('\n').forEach((line, i) => {
        // z.string() only inside safeString itself; z.email() only after safeString (through .pipe).
        const raw = /\bz\s*\.\s*(string|coerce\s*\.\s*string|url|uuid|iso|email|stringFormat|templateLiteral)\s*\(/.exec(line);
        if (!raw) return;
        if (file === 'common.ts' && /z\.string\(params\)/.test(line)) return;
        if (/safeString\(\)[^;]*\.pipe\(z\.email\(/.test(line)) return;
        offenders.push(`${file}:${i + 1}: ${line.trim()}`);
      });
      // A string schema spread over lines ("z\n  .string()").
      if (/\bz\s*\n\s*\.string\(/.test(source)) offenders.push(`${file}: z .string() over two lines`);
    }
    expect(offenders, 'use safeString() from common.ts for every text field').toEqual([]);
  });
});
