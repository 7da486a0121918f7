// Price writes under load and at the edges: two first prices for the same part at the same moment,
// and prices (and the other money figures) kept within sane bounds.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoRecords, type DemoRecords } from '../support/demo-records';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let d: DemoRecords;
let sourcing: Agent;
let admin: Agent;
beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  d = await demoRecords(t);
  sourcing = await t.as('sourcing');
  admin = await t.as('admin');
}, 120_000);
afterAll(() => t.close());

const price = (unitPrice: number) => ({ currency: 'USD', breaks: [{ minQty: 1, unitPrice }], source: 'quote', confidence: 'high' });

async function unpricedPart(n: number): Promise<number> {
  const res = await admin.post(`/api/teardowns/${d.draft.teardown}/parts`, { category: 'other', description: `Race part ${n}` });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.part.id;
}

describe('two first prices for the same part', () => {
  it('race: each answer is 200 or 409 (never 500), and the stored price is one of the two sent', async () => {
    for (let n = 0; n < 8; n++) {
      const part = await unpricedPart(n);
      const [a, b] = await Promise.all([sourcing.put(`/api/parts/${part}/price`, price(1.11)), admin.put(`/api/parts/${part}/price`, price(2.22))]);
      for (const res of [a, b]) {
        expect([200, 409], `${res.status} ${JSON.stringify(res.body)}`).toContain(res.status);
        if (res.status === 409) expect(res.body.error).toMatchObject({ code: 'conflict', message: expect.stringMatching(/at the same moment/) });
      }
      expect(a.status === 200 || b.status === 200).toBe(true);
      const rows = (await t.orm.em.fork().getConnection().execute('select breaks from part_prices where part_id = ?', [part])) as { breaks: string }[];
      expect(rows).toHaveLength(1);
      expect([1.11, 2.22]).toContain(JSON.parse(rows[0]!.breaks)[0].unitPrice);
      // Every saved price has its history entry, and only those.
      const history = (await t.orm.em
        .fork()
        .getConnection()
        .execute("select count(*) as n from audit_entries where action = 'price.updated' and entity_id = ?", [String(part)])) as { n: number }[];
      expect(history[0]!.n).toBe([a, b].filter((r) => r.status === 200).length);
    }
  });
});

describe('sane bounds', () => {
  it('a unit price or minimum quantity of 1e308 (or above a billion) is refused naming the field', async () => {
    const part = await unpricedPart(100);
    for (const [body, field] of [
      [price(1e308), 'breaks.0.unitPrice'],
      [price(1_000_000_001), 'breaks.0.unitPrice'],
      [{ ...price(1), breaks: [{ minQty: 1e308, unitPrice: 1 }] }, 'breaks.0.minQty'],
    ] as const) {
      const res = await sourcing.put(`/api/parts/${part}/price`, body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.fields[field], JSON.stringify(res.body.error.fields)).toMatch(/At most/);
    }
    await sourcing.put(`/api/parts/${part}/price`, price(999_999_999)).expect(200);
  });

  it('exchange rates and cost-model money have bounds too', async () => {
    const rates = await sourcing.put('/api/rates', { base: 'EUR', date: '2026-11-28', source: 'Bounds test', rates: { USD: 1e308 } });
    expect(rates.status).toBe(400);
    expect(rates.body.error.fields['rates.USD']).toMatch(/At most/);
    const model = (await sourcing.get('/api/cost-model').expect(200)).body.model;
    const res = await sourcing.put('/api/cost-model', { ...model, labourRatePerHour: 1e308, packagingCost: 1e300 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['labourRatePerHour', 'packagingCost']);
  });
});
