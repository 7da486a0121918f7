// Every CSV export of the route table neutralises text a spreadsheet would run as a formula, with one
// rule (apps/api/src/lib/csv.ts), checked against a corpus of injection cells stored through the API.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { allRoutes } from '../../apps/api/src/modules/routes';
import { demoRecords, type DemoRecords } from '../support/demo-records';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

const CORPUS: string[] = JSON.parse(readFileSync(join(import.meta.dirname, '../fixtures/csv-injection-cells.json'), 'utf8')).cells;

let t: TestApp;
let d: DemoRecords;
let admin: Agent;
/** Each corpus cell as the API stored it (text fields are trimmed). */
const stored: string[] = [];
let teardown: number;

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  d = await demoRecords(t);
  admin = await t.as('admin');
  teardown = d.draft.teardown;
  for (const [i, cell] of CORPUS.entries()) {
    const part = await admin.post(`/api/teardowns/${teardown}/parts`, {
      category: 'other',
      designators: cell,
      description: cell,
      makerPartNumber: cell,
      package: cell.slice(0, 80),
      notes: cell,
    });
    expect(part.status, `part ${JSON.stringify(cell)}: ${JSON.stringify(part.body)}`).toBe(201);
    stored.push(part.body.part.description);
    await admin.put(`/api/parts/${part.body.part.id}/price`, { currency: 'USD', breaks: [{ minQty: 1, unitPrice: 0.1 + i / 100 }], source: 'quote', confidence: 'high', note: cell }).expect(200);
    await admin
      .post(`/api/teardowns/${teardown}/measurements`, { quantity: 'voltage', value: '3.7 V', subject: cell, conditions: cell, instrument: cell.slice(0, 160), uncertainty: cell.slice(0, 60) })
      .expect(201);
    await admin.post(`/api/teardowns/${teardown}/findings`, { kind: 'cost-down', severity: 'note', text: `${cell} zqxinject`, tags: [] }).expect(201);
    const device = await admin.post('/api/devices', { maker: cell, model: cell, category: 'other' }).expect(201);
    await admin.post('/api/teardowns', { deviceId: device.body.device.id, summary: `zqxinject ${cell}` }).expect(201);
  }
}, 180_000);
afterAll(() => t.close());

async function download(url: string): Promise<string[][]> {
  const res = await admin
    .get(url)
    .buffer(true)
    .parse((r, cb) => {
      let data = '';
      r.setEncoding('utf8');
      r.on('data', (c: string) => (data += c));
      r.on('end', () => cb(null, data));
    });
  expect(res.status, url).toBe(200);
  expect(res.headers['content-type']).toMatch(/^text\/csv/);
  const text = res.body as string;
  expect(text.startsWith('\uFEFF'), `${url} starts with a BOM (once)`).toBe(true);
  expect(text.startsWith('\uFEFF\uFEFF')).toBe(false);
  const parsed = Papa.parse<string[]>(text.slice(1), { skipEmptyLines: true });
  expect(parsed.errors, url).toEqual([]);
  return parsed.data;
}

/** What a spreadsheet would take for a formula: a first non-blank character that starts one, unless the cell is a plain number. */
const PLAIN_NUMBER = /^-?\d+(\.\d+)?(e[+-]?\d+)?$/i;
const live = (cell: string) => !PLAIN_NUMBER.test(cell) && /^[\s]*[=+\-@\uFF1D\uFF0B\uFF0D\uFF20]/u.test(cell);

function expectInert(url: string, rows: string[][], mustHold: { column: string; values: string[] }[]) {
  const [header, ...body] = rows;
  for (const [r, row] of body.entries()) {
    for (const [c, cell] of row.entries()) expect(live(cell), `${url} row ${r + 2} column ${header![c]}: ${JSON.stringify(cell)}`).toBe(false);
  }
  // The text is kept, behind the quote: nothing else was changed or dropped.
  for (const { column, values } of mustHold) {
    const i = header!.indexOf(column);
    expect(i, `${url} has a column ${column}`).toBeGreaterThanOrEqual(0);
    const cells = new Set(body.map((row) => row[i]));
    for (const v of values) expect(cells.has(v) || cells.has(`'${v}`), `${url} column ${column} holds ${JSON.stringify(v)}`).toBe(true);
  }
}

const EXPORTS: Record<string, () => Promise<void>> = {
  'GET /api/teardowns/:id/parts.csv': async () => {
    const url = `/api/teardowns/${teardown}/parts.csv`;
    expectInert(url, await download(url), [
      { column: 'Description', values: stored },
      { column: 'Notes', values: stored },
    ]);
  },
  'GET /api/teardowns/:id/cost.csv': async () => {
    const url = `/api/teardowns/${teardown}/cost.csv?volume=1000&currency=USD`;
    expectInert(url, await download(url), [
      { column: 'description', values: stored },
      { column: 'maker_part_number', values: stored },
      { column: 'note', values: stored },
    ]);
  },
  'GET /api/teardowns/:id/measurements.csv': async () => {
    const url = `/api/teardowns/${teardown}/measurements.csv`;
    expectInert(url, await download(url), [{ column: 'What was measured', values: stored }]);
  },
  'GET /api/search.csv': async () => {
    const url = '/api/search.csv?q=zqxinject';
    const rows = await download(url);
    expect(rows.length).toBeGreaterThan(CORPUS.length);
    expectInert(url, rows, [{ column: 'Maker', values: stored }]);
  },
};

/** CSV routes that send a file back as it was uploaded: not an export of ours (served as an attachment). */
const AS_UPLOADED = new Set(['GET /api/runs/:id/raw']);

describe('CSV exports and formula injection', () => {
  it('every CSV route of the route table is checked here', () => {
    const csvRoutes = allRoutes({ env: {} } as never, 'test')
      .filter((r) => r.spec.produces === 'text/csv')
      .map((r) => `${r.spec.method.toUpperCase()} ${r.spec.path}`);
    const missing = csvRoutes.filter((k) => !EXPORTS[k] && !AS_UPLOADED.has(k));
    expect(missing, `add the export to EXPORTS in tests/api/csv-exports.test.ts: ${missing.join(', ')}`).toEqual([]);
  });

  for (const [key, check] of Object.entries(EXPORTS)) it(`${key}: no cell of the corpus stays live`, check);

  it('the parts CSV imports back to the text that was stored (the quote is taken off again)', async () => {
    const csv = await admin.get(`/api/teardowns/${teardown}/parts.csv`).buffer(true);
    const res = await admin.post(`/api/teardowns/${teardown}/parts/import?dryRun=1`, { csv: csv.text, mode: 'append' }).expect(200);
    const descriptions = new Set((res.body.rows as { part: { description: string } }[]).map((r) => r.part.description));
    for (const s of stored) expect(descriptions.has(s), JSON.stringify(s)).toBe(true);
  });
});
