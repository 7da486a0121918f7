// The authorization matrix: every route of the route table × every caller (signed out and each
// role), with the status each gets written once in tests/api/access-matrix.txt. A route without a
// row fails, and the message gives the row to add. Then object-level checks: a viewer with the id
// of a draft, a sub-record reached through another teardown, photo and run file URLs.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES } from '@splitcase/contracts';
import { allRoutes } from '../../apps/api/src/modules/routes';
import type { RouteDef } from '../../apps/api/src/http/route';
import { demoRecords, type DemoRecords, type TeardownRecords } from '../support/demo-records';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

const TABLE_FILE = join(import.meta.dirname, 'access-matrix.txt');
const CALLERS = ['anonymous', ...ROLES] as const;
type Caller = (typeof CALLERS)[number];

interface Row {
  key: string;
  line: number;
  expected: Record<Caller, number>;
}

/** Rows of the table: `METHOD /path  anon admin engineer sourcing lead viewer`; # starts a comment. */
function readTable(): Map<string, Row> {
  const rows = new Map<string, Row>();
  readFileSync(TABLE_FILE, 'utf8')
    .split('\n')
    .forEach((text, i) => {
      const line = text.replace(/#.*/, '').trim();
      if (!line) return;
      const [method, path, ...codes] = line.split(/\s+/);
      if (!method || !path || codes.length !== CALLERS.length || codes.some((c) => !/^\d{3}$/.test(c))) {
        throw new Error(`${TABLE_FILE}:${i + 1}: expected "METHOD /path" and ${CALLERS.length} statuses (${CALLERS.join(' ')}), got: ${text}`);
      }
      const key = `${method.toUpperCase()} ${path}`;
      if (rows.has(key)) throw new Error(`${TABLE_FILE}:${i + 1}: a second row for ${key}`);
      rows.set(key, { key, line: i + 1, expected: Object.fromEntries(CALLERS.map((c, k) => [c, Number(codes[k])])) as Record<Caller, number> });
    });
  return rows;
}

const keyOf = (r: RouteDef) => `${r.spec.method.toUpperCase()} ${r.spec.path}`;
const formatRow = (key: string, statuses: number[]) => {
  const [method, path] = key.split(' ');
  return `${method!.padEnd(7)}${path!.padEnd(52)}${statuses
    .map((s, i) => String(s).padEnd(CALLERS[i]!.length + 1))
    .join('')
    .trimEnd()}`;
};

let t: TestApp;
let d: DemoRecords;
const agents = {} as Record<Caller, Agent>;
beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  d = await demoRecords(t);
  agents.anonymous = await t.anonymous();
  for (const role of ROLES) agents[role] = await t.as(role);
}, 120_000);
afterAll(() => t.close());

const NO_SUCH_ID = 999_999;

/** The URL for a route: GETs read published demo records; writes aim at ids that do not exist. */
function urlFor(path: string, method: string, rec: TeardownRecords, lineup: number): string {
  const write = method !== 'get';
  return path.replace(/:(\w+)/g, (_m, name: string) => {
    if (name === 'key') return 'capacity.implausible';
    if (name === 'variant') return 'thumb';
    if (write) return String(NO_SUCH_ID);
    if (name === 'findingId') return String(rec.finding);
    if (name === 'loadId') return String(rec.load);
    if (name === 'converterId') return String(rec.converter);
    if (name === 'modeId') return String(rec.mode);
    if (path.startsWith('/api/teardowns/')) return String(rec.teardown);
    if (path.startsWith('/api/photos/')) return String(rec.photo);
    if (path.startsWith('/api/runs/')) return String(rec.run);
    if (path.startsWith('/api/lineups/')) return String(lineup);
    if (path.startsWith('/api/devices/')) return String(rec.device);
    if (path.startsWith('/api/parts/')) return String(rec.part);
    throw new Error(`no demo id for :${name} in ${path}: add it to urlFor in tests/api/access-matrix.test.ts`);
  });
}

/** Routes that end the caller's session: called with a fresh sign-in. */
const ENDS_SESSION = new Set(['POST /api/auth/logout']);

async function call(caller: Caller, r: RouteDef, url: string): Promise<number> {
  const key = keyOf(r);
  let a = agents[caller];
  if (ENDS_SESSION.has(key)) a = caller === 'anonymous' ? await t.anonymous() : await t.as(caller);
  const m = r.spec.method;
  const res = await (m === 'get' ? a.get(url) : m === 'delete' ? a.delete(url) : a[m](url, r.spec.body ? {} : undefined));
  return res.status;
}

describe('authorization matrix (tests/api/access-matrix.txt)', () => {
  const routes = allRoutes({ env: {} } as never, 'test');

  it('every route of the route table has a row, and every row a route', () => {
    const table = readTable();
    const missing = routes.filter((r) => !table.has(keyOf(r))).map(keyOf);
    const stale = [...table.values()].filter((row) => !routes.some((r) => keyOf(r) === row.key)).map((row) => `${row.key} (line ${row.line})`);
    expect(stale, `rows of ${TABLE_FILE} for routes that no longer exist: remove them`).toEqual([]);
    expect(missing, `${TABLE_FILE} has no row for: ${missing.join(', ')} — the next test prints the rows to add`).toEqual([]);
  });

  it('each caller gets the status of its row', async () => {
    const table = readTable();
    const wrong: string[] = [];
    const toAdd: string[] = [];
    for (const r of routes) {
      const url = urlFor(r.spec.path, r.spec.method, d.published, d.lineups.published);
      const got: number[] = [];
      for (const caller of CALLERS) got.push(await call(caller, r, url));
      const row = table.get(keyOf(r));
      if (!row) {
        toAdd.push(formatRow(keyOf(r), got));
        continue;
      }
      CALLERS.forEach((caller, k) => {
        if (got[k] !== row.expected[caller]) wrong.push(`${row.key} as ${caller}: expected ${row.expected[caller]}, got ${got[k]} (line ${row.line}, ${r.spec.method.toUpperCase()} ${url})`);
      });
    }
    const hint = toAdd.length ? `\nAdd these rows to ${TABLE_FILE} (the statuses seen now; check them against who may call each route):\n${toAdd.join('\n')}\n` : '';
    expect(wrong, hint).toEqual([]);
    expect(toAdd, hint).toEqual([]);
  }, 300_000); // 720 requests: about 13 s alone, several times that on a loaded CI machine
});

/** Reads that answer only for a record of one kind (400 otherwise), with that kind. */
const NEEDS_KIND: Record<string, string> = { 'GET /api/teardowns/:id/loads/:loadId/duty-for-target': 'a heater with a heated area' };

describe('object-level checks', () => {
  const routes = allRoutes({ env: {} } as never, 'test');

  it("a viewer given a draft's ids gets 404 on every read of it (its photos, runs, lineup too); a lead reads them", async () => {
    const reads = routes.filter((r) => r.spec.method === 'get' && /:\w+/.test(r.spec.path) && /^\/api\/(teardowns|photos|runs|lineups)\//.test(r.spec.path));
    expect(reads.length).toBeGreaterThan(20);
    for (const r of reads) {
      const url = urlFor(r.spec.path, 'get', d.draft, d.lineups.draft);
      expect((await agents.viewer.get(url)).status, `viewer GET ${url} (${keyOf(r)})`).toBe(404);
      const lead = (await agents.lead.get(url)).status;
      // A read that needs a record of a kind the demo draft lacks answers 400 for it: never 404 for a reader.
      if (NEEDS_KIND[keyOf(r)]) expect([200, 400], `lead GET ${url} (${keyOf(r)}; needs ${NEEDS_KIND[keyOf(r)]})`).toContain(lead);
      else expect(lead, `lead GET ${url} (${keyOf(r)})`).toBe(200);
    }
  });

  it('photo and run file URLs: 401 signed out, 404 for a viewer on a draft, the file for a reader', async () => {
    for (const variant of ['thumb', 'display', 'original']) {
      const draft = `/api/photos/${d.draft.photo}/${variant}`;
      expect((await agents.anonymous.get(draft)).status, draft).toBe(401);
      expect((await agents.viewer.get(draft)).status, draft).toBe(404);
      const res = await agents.engineer.get(draft);
      expect(res.status, draft).toBe(200);
      expect(res.headers['content-type']).toMatch(/^image\//);
      expect((await agents.viewer.get(`/api/photos/${d.published.photo}/${variant}`)).status).toBe(200);
    }
    for (const suffix of ['raw', 'series', '']) {
      const draft = `/api/runs/${d.draft.run}${suffix ? `/${suffix}` : ''}`;
      expect((await agents.anonymous.get(draft)).status, draft).toBe(401);
      expect((await agents.viewer.get(draft)).status, draft).toBe(404);
      expect((await agents.engineer.get(draft)).status, draft).toBe(200);
    }
  });

  it('a sub-record reached through another teardown is not found (and nothing changes)', async () => {
    const admin = agents.admin;
    const other = d.published;
    const mine = d.draft.teardown;
    const cases: [string, string, unknown][] = [
      ['patch', `/api/teardowns/${mine}/findings/${other.finding}`, { text: 'Moved through another teardown' }],
      ['delete', `/api/teardowns/${mine}/findings/${other.finding}`, undefined],
      ['patch', `/api/teardowns/${mine}/loads/${other.load}`, { label: 'Moved through another teardown' }],
      ['delete', `/api/teardowns/${mine}/loads/${other.load}`, undefined],
      ['patch', `/api/teardowns/${mine}/converters/${other.converter}`, { label: 'Moved through another teardown' }],
      ['delete', `/api/teardowns/${mine}/converters/${other.converter}`, undefined],
    ];
    const before = (await admin.get(`/api/teardowns/${other.teardown}/power`).expect(200)).body;
    const findingsBefore = (await admin.get(`/api/teardowns/${other.teardown}/findings`).expect(200)).body.findings;
    for (const [method, url, body] of cases) {
      const res = await (method === 'delete' ? admin.delete(url) : admin.patch(url, body));
      expect(res.status, `${method.toUpperCase()} ${url}`).toBe(404);
    }
    expect((await admin.get(`/api/teardowns/${other.teardown}/power`)).body).toEqual(before);
    expect((await admin.get(`/api/teardowns/${other.teardown}/findings`)).body.findings).toEqual(findingsBefore);
    // A finding or a pin may not link to the parts or photos of another teardown.
    const link = await admin.post(`/api/teardowns/${mine}/findings`, { kind: 'cost-down', severity: 'note', text: 'Links across teardowns', tags: [], partIds: [other.part], photoIds: [other.photo] });
    expect([400, 404, 422], JSON.stringify(link.body)).toContain(link.status);
    const pin = await admin.post(`/api/photos/${d.draft.photo}/callouts`, { x: 0.5, y: 0.5, label: 'Across', partId: other.part });
    expect([400, 404, 422], JSON.stringify(pin.body)).toContain(pin.status);
  });
});
