// Supplier quotes are confidential: breaks, quote sources and confidence, line prices and price history
// entries are for admin, engineer, sourcing and lead. A viewer sees the should-cost totals of what it
// may read (a published teardown or lineup) and nothing per line, in every form the API gives them.
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type CostRollUpDto, type Role } from '@splitcase/contracts';
import { allRoutes } from '../../apps/api/src/modules/routes';
import { PRICE_READERS } from '../../apps/api/src/modules/cost/price-visibility';
import { jsonSchemaOf } from '../support/schema-arbitrary';
import { demoRecords, type DemoRecords } from '../support/demo-records';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let d: DemoRecords;
const as = {} as Record<Role, Agent>;
beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  d = await demoRecords(t);
  for (const role of ROLES) as[role] = await t.as(role);
  // A price change on the published teardown, so its history has a price entry.
  const cost = (await as.sourcing.get(`/api/teardowns/${d.published.teardown}/cost`).expect(200)).body as CostRollUpDto;
  const line = cost.lines.find((l) => l.price)!;
  const { currency, breaks, confidence } = line.price!;
  await as.sourcing.put(`/api/parts/${line.partId}/price`, { currency, breaks, source: 'quote', confidence, note: 'Quote from the confidential supplier' }).expect(200);
}, 120_000);
afterAll(() => t.close());

/** Keys that only price detail has, anywhere in a JSON answer. */
const DETAIL_KEYS = ['breaks', 'unitPrice', 'extended', 'breakMinQty', 'confidence', 'priceDate'];
function detailIn(value: unknown, path = '$'): string[] {
  if (Array.isArray(value)) return value.flatMap((v, i) => detailIn(v, `${path}[${i}]`));
  if (!value || typeof value !== 'object') return [];
  return Object.entries(value).flatMap(([k, v]) => [...(DETAIL_KEYS.includes(k) && v !== null ? [`${path}.${k}`] : []), ...detailIn(v, `${path}.${k}`)]);
}

const costOf = async (role: Role, id = d.published.teardown) => (await as[role].get(`/api/teardowns/${id}/cost?volume=1000`).expect(200)).body as CostRollUpDto;

describe('the rule', () => {
  it('price detail is for admin, engineer, sourcing and lead', () => {
    expect([...PRICE_READERS].sort()).toEqual(['admin', 'engineer', 'lead', 'sourcing']);
  });

  it('every route a viewer may call whose answer can hold price detail declares it in the route table', () => {
    const undeclared = allRoutes({ env: {} } as never, 'test')
      .filter((r) => r.spec.access === 'signed-in' || (Array.isArray(r.spec.access) && r.spec.access.includes('viewer')))
      .filter((r) => {
        const schema = r.spec.response ? JSON.stringify(jsonSchemaOf(r.spec.response)) : '';
        // Price breaks, or audit entries (a history holds price entries), or the costed-BOM CSV.
        return /"breaks"|"changes"/.test(schema) || /cost\.csv$/.test(r.spec.path);
      })
      .filter((r) => r.spec.prices !== 'by-role')
      .map((r) => `${r.spec.method.toUpperCase()} ${r.spec.path}`);
    expect(undeclared, "these routes answer with price detail: give them prices: 'by-role' and use ctx.priceView").toEqual([]);
  });
});

describe('cost JSON', () => {
  it('a viewer gets the totals of a published teardown and nothing per line', async () => {
    const full = await costOf('sourcing');
    const viewer = await costOf('viewer');
    expect(full.priceView).toBe('detail');
    expect(viewer.priceView).toBe('totals');
    expect(detailIn(viewer)).toEqual([]);
    for (const line of viewer.lines) expect(line).toMatchObject({ unitPrice: null, extended: null, breakMinQty: null, price: null });
    // The totals are the same figures the others see.
    for (const k of ['partsTotal', 'assembly', 'exWorks', 'landed', 'low', 'high'] as const) expect(viewer[k], k).toBeCloseTo(full[k], 9);
    expect(viewer.volumes).toEqual(full.volumes);
    expect(viewer.impliedMargin).toEqual(full.impliedMargin);
    expect(viewer.lines.map((l) => l.priced)).toEqual(full.lines.map((l) => l.priced));
    // No warning about a single line (they can name a break).
    expect(viewer.warnings.some((w) => /price break/.test(w))).toBe(false);
  });

  it("a viewer gets no subtotal per category: a category of one line would be that line's price", async () => {
    const full = await costOf('lead');
    const single = full.byCategory.find((c) => c.lines === 1 && c.total > 0);
    expect(single, 'the demo teardown has a category of one priced line').toBeDefined();
    expect(full.lines.find((l) => l.category === single!.category)!.extended).toBeCloseTo(single!.total, 9);
    expect((await costOf('viewer')).byCategory).toEqual([]);
  });

  it('admin, engineer, sourcing and lead see the breaks, sources and line prices', async () => {
    for (const role of PRICE_READERS) {
      const c = await costOf(role);
      expect(c.priceView, role).toBe('detail');
      const priced = c.lines.find((l) => l.price);
      expect(priced?.price?.breaks.length, role).toBeGreaterThan(0);
      expect(priced?.unitPrice, role).not.toBeNull();
    }
  });

  it('a viewer still gets 404 on a draft', async () => {
    expect((await as.viewer.get(`/api/teardowns/${d.draft.teardown}/cost`)).status).toBe(404);
    expect((await as.viewer.get(`/api/teardowns/${d.draft.teardown}/cost.csv`)).status).toBe(404);
  });
});

describe('cost.csv', () => {
  const csv = async (role: Role) => {
    const res = await as[role].get(`/api/teardowns/${d.published.teardown}/cost.csv?volume=1000`).expect(200);
    return Papa.parse<Record<string, string>>(res.text.replace(/^\uFEFF/, '').trim(), { header: true }).data;
  };
  it('a viewer gets the lines without any price column filled', async () => {
    const rows = await csv('viewer');
    expect(rows.length).toBeGreaterThan(3);
    for (const row of rows) {
      for (const col of ['currency', 'breaks', 'source', 'confidence', 'price_date', 'note', 'unit_price', 'extended']) expect(row[col], `${col} of ${row.description}`).toBe('');
    }
    expect((await csv('lead')).some((r) => r.breaks !== '' && r.source !== '')).toBe(true);
  });
});

describe('history', () => {
  it('a viewer sees the changes of a published teardown but no price entry', async () => {
    const entries = async (role: Role) => (await as[role].get(`/api/teardowns/${d.published.teardown}/history`).expect(200)).body.entries as { action: string; summary: string; changes: unknown }[];
    const full = await entries('engineer');
    expect(full.some((e) => e.action === 'price.updated')).toBe(true);
    const viewer = await entries('viewer');
    expect(viewer.length).toBeGreaterThan(0);
    expect(viewer.filter((e) => e.action.startsWith('price.'))).toEqual([]);
    expect(JSON.stringify(viewer)).not.toMatch(/confidential supplier/);
  });
});

describe('lineup comparison', () => {
  it('a viewer of a published lineup gets should-cost totals, never a break or a line price', async () => {
    const get = (await as.viewer.get(`/api/lineups/${d.lineups.published}/comparison`).expect(200)).body;
    const post = (await as.viewer.post(`/api/lineups/${d.lineups.published}/comparison`, { weights: { shouldCost: 1 } }).expect(200)).body;
    for (const body of [get, post]) {
      expect(detailIn(body)).toEqual([]);
      expect(JSON.stringify(body)).not.toMatch(/confidential supplier/);
    }
    expect(JSON.stringify(get)).toMatch(/shouldCost/);
  });
});
