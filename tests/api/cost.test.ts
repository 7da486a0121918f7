import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CostModelBody, CostRollUpDto } from '@splitcase/contracts';
import { DeviceSchema } from '../../apps/api/src/modules/devices/device.entity';
import { PartSchema } from '../../apps/api/src/modules/parts/part.entity';
import { TeardownSchema } from '../../apps/api/src/modules/teardowns/teardown.entity';
import { UserSchema } from '../../apps/api/src/modules/users/user.entity';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

// Invented demo rates in the published daily-file structure: USD 1.08, JPY 162.50, GBP 0.85, CNY 7.80 per EUR.
const FIXTURE = readFileSync(fileURLToPath(new URL('../fixtures/eurofxref-demo.xml', import.meta.url)));

let t: TestApp;
const ids = { device: 0, published: 0, draft: 0, cell: 0, ic: 0, res: 0, usb: 0, shell: 0, draftPart: 0 };
const as: Record<string, Agent> = {};

/** A small invented cost model in CNY, simple enough to work by hand. */
const MODEL: CostModelBody = {
  currency: 'CNY',
  volumes: [100, 1000, 5000],
  attritionByCategory: { passive: 0.05, ic: 0.02 },
  defaultAttrition: 0,
  smtCostPerPlacement: 0.1,
  thtCostPerJoint: 0.2,
  thtJointsPerPart: 2,
  manualOperations: [{ label: 'Solder battery leads', minutes: 3 }],
  labourRatePerHour: 36,
  testMinutes: 1,
  packagingCost: 1.8,
  firstPassYield: 1,
  overheadFraction: 0.1,
  freightFraction: 0.05,
  insuranceFraction: 0,
  dutyFraction: 0.02,
  retailMarginFraction: 0.4,
  platformMarginFraction: 0.1,
  confidenceBand: { high: 0.05, medium: 0.1, low: 0.2 },
};

const PRICES = {
  cell: {
    currency: 'USD',
    breaks: [
      { minQty: 1, unitPrice: 2.5 },
      { minQty: 1000, unitPrice: 2.16 },
    ],
    source: 'quote',
    confidence: 'medium',
  },
  ic: {
    currency: 'CNY',
    breaks: [
      { minQty: 1, unitPrice: 3.12 },
      { minQty: 1000, unitPrice: 2.34 },
      { minQty: 5000, unitPrice: 1.95 },
    ],
    source: 'catalogue',
    confidence: 'high',
  },
  res: {
    currency: 'USD',
    breaks: [
      { minQty: 100, unitPrice: 0.01 },
      { minQty: 4000, unitPrice: 0.0054 },
    ],
    source: 'catalogue',
    confidence: 'high',
  },
  usb: { currency: 'GBP', breaks: [{ minQty: 500, unitPrice: 0.17 }], source: 'marketplace', confidence: 'low' },
} as const;

const importFixture = (a: Agent) => a.upload('/api/rates/import').attach('file', FIXTURE, { filename: 'eurofxref-demo.xml', contentType: 'text/xml' });
const cost = async (a: Agent, id: number, q = 'volume=1000&currency=USD') => {
  const res = await a.get(`/api/teardowns/${id}/cost?${q}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as CostRollUpDto;
};

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  // No part routes in this module: the parts are written straight to the database.
  const em = t.orm.em.fork();
  const engineer = await em.findOneOrFail(UserSchema, { email: 'engineer@splitcase.test' });
  const device = em.create(DeviceSchema, {
    maker: 'Testbrook (invented)',
    model: 'Cost Cube 1',
    category: 'pocket-heater',
    retailPrice: 20,
    retailCurrency: 'GBP',
    priceSeenOn: '2026-11-01',
  } as never);
  const published = em.create(TeardownSchema, { device, engineer, date: '2026-11-20', status: 'published', publishedAt: new Date() } as never);
  const draft = em.create(TeardownSchema, { device, engineer, date: '2026-11-21', status: 'draft' } as never);
  const part = (teardown: unknown, position: number, v: Record<string, unknown>) => em.create(PartSchema, { teardown, position, quantity: 1, ...v } as never);
  const cell = part(published, 1, { designators: 'BT1', category: 'cell', description: '18650 cell 2600 mAh', mount: 'manual', makerPartNumber: 'TB-18650-26' });
  const ic = part(published, 2, { designators: 'U1', category: 'ic', description: 'Charger and boost IC', mount: 'smt', makerPartNumber: 'TBX4056' });
  const res = part(published, 3, { designators: 'R1, R2, R3, R4', category: 'passive', description: 'Resistor 0402 10 kΩ', mount: 'smt', quantity: 4 });
  const usb = part(published, 4, { designators: 'J1', category: 'connector', description: 'USB-C receptacle, through-hole', mount: 'tht', makerPartNumber: 'TB-USBC-6P' });
  const shell = part(published, 5, { designators: null, category: 'enclosure', description: 'Shell, ABS, two halves', mount: 'manual' });
  const draftPart = part(draft, 1, { designators: 'U9', category: 'ic', description: 'Draft-only IC', mount: 'smt' });
  await em.flush();
  Object.assign(ids, { device: device.id, published: published.id, draft: draft.id, cell: cell.id, ic: ic.id, res: res.id, usb: usb.id, shell: shell.id, draftPart: draftPart.id });
  for (const role of ['admin', 'engineer', 'sourcing', 'lead', 'viewer']) as[role] = await t.as(role);
});
afterAll(() => t?.close());

describe('rates: the euro reference-rate XML import', () => {
  it('the demo seed gives a current rate table with its date and source', async () => {
    const body = (await as.viewer!.get('/api/rates').expect(200)).body;
    expect(body.current).toMatchObject({ base: 'EUR', kind: 'demo', current: true, source: expect.stringMatching(/demo/i) });
    expect(Object.keys(body.current.rates)).toEqual(expect.arrayContaining(['USD', 'GBP', 'CNY', 'JPY']));
    expect(body.history.length).toBeGreaterThanOrEqual(2);
  });

  it('engineers, leads and viewers may not import; sourcing and admin may', async () => {
    for (const role of ['engineer', 'lead', 'viewer']) {
      const res = await importFixture(as[role]!);
      expect(res.status, role).toBe(403);
    }
    expect((await importFixture(as.admin!)).status).toBe(200);
  });

  it('reads the published element and attribute names into { base: EUR, date, rates } (sourcing)', async () => {
    const res = await importFixture(as.sourcing!).expect(200);
    expect(res.body.rates).toMatchObject({
      base: 'EUR',
      date: '2026-11-27',
      kind: 'import',
      current: true,
      rates: { USD: 1.08, JPY: 162.5, GBP: 0.85, CHF: 0.95, CNY: 7.8, HKD: 8.4, KRW: 1500 },
      createdBy: 'Mei Santori',
    });
    expect(res.body.rates.source).toMatch(/eurofxref-demo\.xml/);
    const list = (await as.engineer!.get('/api/rates').expect(200)).body;
    expect(list.current.id).toBe(res.body.rates.id);
    expect(list.history.filter((h: { current: boolean }) => h.current)).toHaveLength(1);
  });

  it('refuses XML that is not the reference-rate format, malformed XML and a missing file, saving nothing', async () => {
    const before = (await as.sourcing!.get('/api/rates')).body.history.length;
    const other = await as.sourcing!.upload('/api/rates/import').attach('file', Buffer.from('<?xml version="1.0"?><catalogue><item sku="A1" price="2.00"/></catalogue>'), 'prices.xml');
    expect(other.status).toBe(400);
    expect(other.body.error.fields.file).toMatch(/not the euro reference-rate XML format: the root element must be gesmes:Envelope \(found <catalogue>\)/);
    const noRates = await as
      .sourcing!.upload('/api/rates/import')
      .attach('file', Buffer.from('<gesmes:Envelope xmlns:gesmes="http://www.gesmes.org/xml/2002-08-01"><Cube><Cube time="2026-11-27"/></Cube></gesmes:Envelope>'), 'empty.xml');
    expect(noRates.status).toBe(400);
    expect(noRates.body.error.fields.file).toMatch(/Cube time="2026-11-27" has no Cube currency\/rate entries/);
    const broken = await as.sourcing!.upload('/api/rates/import').attach('file', Buffer.from('<gesmes:Envelope><Cube>'), 'broken.xml');
    expect(broken.status).toBe(400);
    expect(broken.body.error.fields.file).toMatch(/not well-formed XML/);
    const missing = await as.sourcing!.upload('/api/rates/import').field('note', 'x');
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.file).toMatch(/Attach the euro reference-rate XML file/);
    expect((await as.sourcing!.get('/api/rates')).body.history.length).toBe(before);
  });
});

describe('prices: who may set them, and bad input', () => {
  it('engineers, leads and viewers get 403; sourcing and admin set prices (price date defaults to today)', async () => {
    for (const role of ['engineer', 'lead', 'viewer']) {
      const res = await as[role]!.put(`/api/parts/${ids.cell}/price`, PRICES.cell);
      expect(res.status, role).toBe(403);
    }
    expect((await (await t.anonymous()).put(`/api/parts/${ids.cell}/price`, PRICES.cell)).status).toBe(401);
    const res = await as.sourcing!.put(`/api/parts/${ids.cell}/price`, PRICES.cell).expect(200);
    expect(res.body.price).toMatchObject({ partId: ids.cell, currency: 'USD', source: 'quote', confidence: 'medium', updatedBy: 'Mei Santori', priceDate: new Date().toISOString().slice(0, 10) });
    await as.admin!.put(`/api/parts/${ids.ic}/price`, PRICES.ic).expect(200);
    await as.sourcing!.put(`/api/parts/${ids.res}/price`, { ...PRICES.res, priceDate: '2026-11-02', note: 'Distributor list price' }).expect(200);
    await as.sourcing!.put(`/api/parts/${ids.usb}/price`, PRICES.usb).expect(200);
    expect((await as.sourcing!.put('/api/parts/999999/price', PRICES.cell)).status).toBe(404);
  });

  it('names the field of overlapping or unordered breaks, negative prices and an unknown currency, and saves nothing', async () => {
    const put = (body: unknown) => as.sourcing!.put(`/api/parts/${ids.cell}/price`, body);
    const overlap = await put({
      ...PRICES.cell,
      breaks: [
        { minQty: 1, unitPrice: 2.5 },
        { minQty: 1000, unitPrice: 2.2 },
        { minQty: 1000, unitPrice: 2.1 },
      ],
    });
    expect(overlap.status).toBe(400);
    expect(overlap.body.error.fields['breaks.2.minQty']).toMatch(/overlap or are out of order: 1000 comes after 1000/);
    const unordered = await put({
      ...PRICES.cell,
      breaks: [
        { minQty: 1000, unitPrice: 2.16 },
        { minQty: 10, unitPrice: 2.5 },
      ],
    });
    expect(unordered.body.error.fields['breaks.1.minQty']).toMatch(/out of order: 10 comes after 1000/);
    const negative = await put({ ...PRICES.cell, breaks: [{ minQty: 1, unitPrice: -0.5 }] });
    expect(negative.status).toBe(400);
    expect(negative.body.error.fields['breaks.0.unitPrice']).toMatch(/must not be negative/);
    const zeroQty = await put({ ...PRICES.cell, breaks: [{ minQty: 0, unitPrice: 1 }] });
    expect(zeroQty.body.error.fields['breaks.0.minQty']).toMatch(/greater than zero/);
    const none = await put({ ...PRICES.cell, breaks: [] });
    expect(none.body.error.fields.breaks).toMatch(/at least one price break/);
    const unknown = await put({ ...PRICES.cell, currency: 'XYZ' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields.currency).toMatch(/No exchange rate for XYZ in the current rate table \(base EUR, 2026-11-27\)/);
    const badCode = await put({ ...PRICES.cell, currency: 'US$' });
    expect(badCode.body.error.fields.currency).toMatch(/three-letter/);
    const badSource = await put({ ...PRICES.cell, source: 'rumour', confidence: 'sure' });
    expect(Object.keys(badSource.body.error.fields).sort()).toEqual(['confidence', 'source']);
    const badDate = await put({ ...PRICES.cell, priceDate: '2026-02-30' });
    expect(badDate.body.error.fields.priceDate).toMatch(/Not a calendar date/);
    // Still the price set before.
    const line = (await cost(as.sourcing!, ids.published)).lines.find((l) => l.partId === ids.cell)!;
    expect(line.price).toMatchObject({ currency: 'USD', breaks: PRICES.cell.breaks });
  });
});

describe('GET /api/teardowns/:id/cost — a small BOM worked by hand [C]', () => {
  beforeAll(async () => {
    await importFixture(as.sourcing!).expect(200);
    await as.sourcing!.put(`/api/teardowns/${ids.published}/cost-model`, MODEL).expect(200);
  });

  it('prices each line at the break for the purchased quantity, converted to USD before attrition', async () => {
    // Line prices are for the roles that see prices (a viewer gets the totals: price-visibility.test.ts).
    const c = await cost(as.lead!, ids.published);
    expect(c).toMatchObject({ volume: 1000, currency: 'USD', rateDate: '2026-11-27', model: { source: 'teardown', currency: 'CNY', volumes: [100, 1000, 5000] } });
    const line = Object.fromEntries(c.lines.map((l) => [l.partId, l]));
    // Rates per 1 EUR (fixture): USD 1.08, GBP 0.85, CNY 7.80. 1 CNY = 1.08 / 7.80 = 0.138461538 USD; 1 GBP = 1.08 / 0.85 = 1.270588235 USD.
    // BT1 cell: 1 × 1000 = 1000 bought → break 1000 → 2.16 USD; 'cell' not listed → attrition 0 → extended 1 × 2.16 × 1.00 = 2.16
    expect(line[ids.cell]).toMatchObject({ quantity: 1, buyQuantity: 1000, breakMinQty: 1000, unitPrice: 2.16, attrition: 0 });
    expect(line[ids.cell]!.extended).toBeCloseTo(2.16, 12);
    // U1 IC: ceil(1000 × 1.02) = 1020 bought → break 1000 → 2.34 CNY × 0.138461538 = 0.324 USD; ic attrition 2 % → 1 × 0.324 × 1.02 = 0.33048
    expect(line[ids.ic]!.unitPrice).toBeCloseTo(0.324, 12);
    expect(line[ids.ic]!.extended).toBeCloseTo(0.33048, 12);
    // R1–R4: ceil(4 × 1000 × 1.05) = 4200 bought (attrition included) → break 4000 → 0.0054 USD; passive 5 % → 4 × 0.0054 × 1.05 = 0.02268
    expect(line[ids.res]).toMatchObject({ quantity: 4, buyQuantity: 4200, breakMinQty: 4000, unitPrice: 0.0054, attrition: 0.05 });
    expect(line[ids.res]!.extended).toBeCloseTo(0.02268, 12);
    // J1: 1000 bought → break 500 → 0.17 GBP × 1.270588235 = 0.216 USD; connector → attrition 0 → 0.216
    expect(line[ids.usb]!.unitPrice).toBeCloseTo(0.216, 12);
    expect(line[ids.usb]!.extended).toBeCloseTo(0.216, 12);
    // The shell has no price: listed, adds nothing.
    expect(line[ids.shell]).toMatchObject({ priced: false, unitPrice: null, extended: null, price: null });
    expect(c.unpricedPartIds).toEqual([ids.shell]);
    // partsTotal = Σ extended = 2.16 + 0.33048 + 0.02268 + 0.216 = 2.72916
    expect(c.partsTotal).toBeCloseTo(2.72916, 10);
    const sum = c.lines.reduce((s, l) => s + (l.extended ?? 0), 0);
    expect(c.partsTotal).toBeCloseTo(sum, 12);
    // The draft teardown's part is not in this BOM.
    expect(c.lines.map((l) => l.partId)).not.toContain(ids.draftPart);
  });

  it('adds assembly, labour, overhead, freight and duty to ex-works and landed cost, with the band and the margin', async () => {
    const c = await cost(as.lead!, ids.published);
    // placements = U1 (1) + R1–R4 (4) = 5 SMT; joints = J1 1 part × 2 = 2
    expect(c.placements).toBe(5);
    expect(c.joints).toBe(2);
    // assembly = (5 × 0.10 + 2 × 0.20) CNY = 0.90 CNY = 0.124615385 USD
    expect(c.assembly).toBeCloseTo(0.124615385, 9);
    // labour = 3 min / 60 × 36 CNY/h = 1.80 CNY = 0.249230769 USD; test = 1/60 × 36 = 0.60 CNY = 0.083076923 USD
    expect(c.labour).toBeCloseTo(0.249230769, 9);
    expect(c.test).toBeCloseTo(0.083076923, 9);
    // packaging = 1.80 CNY = 0.249230769 USD; yield 100 % → no yield loss
    expect(c.packaging).toBeCloseTo(0.249230769, 9);
    expect(c.yieldLoss).toBe(0);
    // overhead = 10 % × (2.72916 + 0.124615385 + 0.249230769 + 0.083076923 + 0.249230769 = 3.435313846) = 0.343531385
    expect(c.overhead).toBeCloseTo(0.343531385, 9);
    // ex-works = 3.435313846 + 0.343531385 = 3.778845231
    expect(c.exWorks).toBeCloseTo(3.778845231, 9);
    // freight = 5 % × 3.778845231 = 0.188942262; insurance 0; duty = 2 % × (3.778845231 + 0.188942262) = 0.07935575
    expect(c.freight).toBeCloseTo(0.188942262, 9);
    expect(c.insurance).toBe(0);
    expect(c.duty).toBeCloseTo(0.07935575, 8);
    // landed = 3.778845231 + 0.188942262 + 0.07935575 = 4.047143242
    expect(c.landed).toBeCloseTo(4.047143242, 9);
    // low: parts at −10 % (medium), −5 % (high), −20 % (low) = 1.944 + 0.313956 + 0.021546 + 0.1728 = 2.452302;
    //   (2.452302 + 0.706153846) × 1.10 × 1.05 × 1.02 = 3.720976832
    expect(c.low).toBeCloseTo(3.720976832, 9);
    // high: 2.376 + 0.347004 + 0.023814 + 0.2592 = 3.006018 → (3.006018 + 0.706153846) × 1.1781 = 4.373309652
    expect(c.high).toBeCloseTo(4.373309652, 9);
    // retail 20.00 GBP = 25.411764706 USD as seen, with the workspace default 20 % VAT for GBP in it [CP: REFERENCES §12]:
    // before tax 25.411764706 / 1.2 = 21.176470588; retailer 40 % = 8.470588235; platform 10 % of the rest = 1.270588235
    // net to maker = 21.176470588 × 0.6 × 0.9 = 11.435294118
    expect(c.retail).toMatchObject({ seen: { amount: 20, currency: 'GBP', on: '2026-11-01' }, salesTax: { rate: 0.2, source: 'workspace', currency: 'GBP' } });
    expect(c.retail!.amount).toBeCloseTo(25.411764706, 9);
    expect(c.retail!.beforeTax).toBeCloseTo(21.176470588, 9);
    expect(c.retail!.retailerShare).toBeCloseTo(8.470588235, 9);
    expect(c.retail!.platformShare).toBeCloseTo(1.270588235, 9);
    expect(c.retail!.netToMaker).toBeCloseTo(11.435294118, 9);
    // The shell is unpriced: the margin is incomplete (no number), with the count of priced lines.
    expect(c.impliedMargin).toMatchObject({ amount: null, fraction: null, complete: false, pricedLines: 4, totalLines: 5 });
    expect(c.impliedMargin!.reason).toMatch(/^4 of 5 lines priced/);
  });

  it('shows how: steps with formulas and inputs, categories, the rates used with their date, a waterfall and the volume table', async () => {
    const c = await cost(as.engineer!, ids.published);
    const step = Object.fromEntries(c.steps.map((s) => [s.key, s]));
    expect(step.assembly!.formula).toMatch(/^5 placements × 0\.0138462 \+ 2 joints × 0\.0276923 = 0\.124615$/);
    expect(step.labour!.inputs).toEqual([
      { label: 'Manual operations', value: 3, unit: 'min' },
      { label: 'Labour rate', value: expect.closeTo(4.984615385, 9), unit: 'USD/h' },
    ]);
    expect(c.byCategory.map((b) => b.category)).toEqual(['cell', 'ic', 'connector', 'passive', 'enclosure']);
    expect(c.byCategory[0]!.share).toBeCloseTo(2.16 / 2.72916, 9);
    expect(c.ratesUsed).toEqual([
      { currency: 'CNY', perBase: 7.8, toReporting: expect.closeTo(0.138461538, 9) },
      { currency: 'GBP', perBase: 0.85, toReporting: expect.closeTo(1.270588235, 9) },
    ]);
    expect(c.rateTable).toMatchObject({ base: 'EUR', date: '2026-11-27' });
    const bars = Object.fromEntries(c.waterfall.map((b) => [b.key, b]));
    expect(bars.exWorks!.end).toBeCloseTo(c.exWorks, 12);
    expect(bars.landed!.end).toBeCloseTo(c.landed, 12);
    // The margin is incomplete (the shell is unpriced): the waterfall stops at landed cost.
    expect(c.waterfall.at(-1)!.key).toBe('landed');
    // The volume table: at 100 units the cell, IC and resistors sit on their first breaks and J1 below its minimum order:
    //   2.50 + 3.12 × 0.138461538 × 1.02 + 4 × 0.01 × 1.05 + 0.216 = 3.19864;
    //   at 5000: 2.16 + 1.95 × 0.138461538 × 1.02 + 0.02268 + 0.216 = 2.67408
    expect(c.volumes.map((v) => v.volume)).toEqual([100, 1000, 5000]);
    expect(c.volumes[0]!.partsTotal).toBeCloseTo(3.19864, 10);
    expect(c.volumes[1]!.landed).toBeCloseTo(c.landed, 12);
    expect(c.volumes[2]!.partsTotal).toBeCloseTo(2.67408, 10);
    const at100 = await cost(as.engineer!, ids.published, 'volume=100&currency=USD');
    expect(at100.lines.find((l) => l.partId === ids.usb)).toMatchObject({ belowMinimumOrder: true, breakMinQty: 500 });
    expect(at100.warnings.join(' ')).toMatch(/J1 \(USB-C receptacle, through-hole\): 100 pieces is below the smallest price break \(500\)/);
    // A volume off the model's list joins the table.
    expect((await cost(as.engineer!, ids.published, 'volume=2500')).volumes.map((v) => v.volume)).toEqual([100, 1000, 2500, 5000]);
  });

  it('defaults to the middle volume of the model and the reporting currency, and converts to another currency through the base', async () => {
    const c = await cost(as.sourcing!, ids.published, '');
    expect(c).toMatchObject({ volume: 1000, currency: 'USD' });
    const eur = await cost(as.sourcing!, ids.published, 'volume=1000&currency=EUR');
    // 1 USD = 1 / 1.08 EUR: every money figure scales by the same factor.
    expect(eur.landed).toBeCloseTo(4.047143242 / 1.08, 9);
    expect(eur.lines.find((l) => l.partId === ids.cell)!.unitPrice).toBeCloseTo(2.0, 12);
  });

  it('a volume of zero, a negative or non-numeric volume, and a currency without a rate are refused naming the field', async () => {
    for (const q of ['volume=0', 'volume=-5', 'volume=abc', 'volume=2.5']) {
      const res = await as.sourcing!.get(`/api/teardowns/${ids.published}/cost?${q}`);
      expect(res.status, q).toBe(400);
      expect(res.body.error.fields['query.volume'], q).toBeTruthy();
    }
    const res = await as.sourcing!.get(`/api/teardowns/${ids.published}/cost?currency=XYZ`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields.currency).toMatch(/No exchange rate for XYZ/);
  });

  it('viewers read published teardowns only (404 on a draft); leads and engineers read drafts', async () => {
    expect((await as.viewer!.get(`/api/teardowns/${ids.draft}/cost`)).status).toBe(404);
    expect((await as.viewer!.get(`/api/teardowns/${ids.draft}/cost.csv`)).status).toBe(404);
    expect((await as.viewer!.get(`/api/teardowns/${ids.draft}/cost-model`)).status).toBe(404);
    expect((await as.lead!.get(`/api/teardowns/${ids.draft}/cost`)).status).toBe(200);
    expect((await as.engineer!.get(`/api/teardowns/${ids.draft}/cost`)).status).toBe(200);
    // Price edits on a part of a draft are refused to an engineer by role (403).
    expect((await as.engineer!.put(`/api/parts/${ids.draftPart}/price`, PRICES.ic)).status).toBe(403);
  });

  it('sensitivity: a changed rate or price moves the totals on the next read', async () => {
    const before = await cost(as.sourcing!, ids.published);
    const current = (await as.sourcing!.get('/api/rates')).body.current;
    // GBP from 0.85 to 0.80 per EUR: J1 becomes 0.17 / 0.80 × 1.08 = 0.2295 USD (+0.0135)
    const saved = await as.sourcing!.put('/api/rates', { base: 'EUR', date: '2026-11-28', source: 'Desk estimate (test)', rates: { ...current.rates, GBP: 0.8 } }).expect(200);
    expect(saved.body.rates).toMatchObject({ kind: 'manual', current: true, date: '2026-11-28' });
    const after = await cost(as.sourcing!, ids.published);
    expect(after.rateDate).toBe('2026-11-28');
    expect(after.partsTotal - before.partsTotal).toBeCloseTo(0.0135, 12);
    // U1 at 1000 from 2.34 to 2.60 CNY: + 0.26 × 0.138461538 × 1.02 = +0.036720
    await as
      .sourcing!.put(`/api/parts/${ids.ic}/price`, {
        ...PRICES.ic,
        breaks: [
          { minQty: 1, unitPrice: 3.12 },
          { minQty: 1000, unitPrice: 2.6 },
          { minQty: 5000, unitPrice: 1.95 },
        ],
      })
      .expect(200);
    const after2 = await cost(as.sourcing!, ids.published);
    expect(after2.partsTotal - after.partsTotal).toBeCloseTo(0.03672, 12);
    // Back to the fixture rates and the first price for the tests that follow.
    await importFixture(as.sourcing!).expect(200);
    await as.sourcing!.put(`/api/parts/${ids.ic}/price`, PRICES.ic).expect(200);
    expect((await cost(as.sourcing!, ids.published)).partsTotal).toBeCloseTo(2.72916, 10);
  });

  it('manual rates: only sourcing and admin, every rate positive, the base at 1', async () => {
    expect((await as.engineer!.put('/api/rates', { base: 'EUR', date: '2026-11-28', source: 'x', rates: { USD: 1.1 } })).status).toBe(403);
    const bad = await as.sourcing!.put('/api/rates', { base: 'EUR', date: '2026-11-31', source: '', rates: { USD: -1, EUR: 2, usd1: 1 } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['date', 'source', 'rates.USD', 'rates.usd1']));
    const warn = await as.admin!.put('/api/rates', { base: 'EUR', date: '2026-11-28', source: 'Test without GBP', rates: { USD: 1.08, CNY: 7.8 } }).expect(200);
    expect(warn.body.warnings.join(' ')).toMatch(/GBP is used by .*part price.* but this table \(EUR, 2026-11-28\) has no GBP rate/);
    // The teardown that needs GBP now says which part cannot be converted.
    const res = await as.sourcing!.get(`/api/teardowns/${ids.published}/cost?volume=1000&currency=USD`);
    expect(res.status).toBe(422);
    expect(res.body.error.fields[`parts.${ids.usb}.currency`]).toMatch(/J1 \(USB-C receptacle, through-hole\) is priced in GBP\. No exchange rate for GBP/);
    await importFixture(as.sourcing!).expect(200);
  });
});

describe('cost models', () => {
  it('the workspace default is read by all and changed by sourcing and admin only, with fields named', async () => {
    const got = (await as.viewer!.get('/api/cost-model').expect(200)).body;
    expect(got.model.volumes).toEqual([1000, 10000, 100000]);
    expect((await as.engineer!.put('/api/cost-model', got.model)).status).toBe(403);
    const bad = await as.sourcing!.put('/api/cost-model', { ...got.model, volumes: [1000, 500], overheadFraction: 1.5, currency: 'dollars' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['currency', 'overheadFraction', 'volumes.1']);
    const saved = (await as.sourcing!.put('/api/cost-model', { ...got.model, testMinutes: 2 }).expect(200)).body;
    expect(saved).toMatchObject({ model: { testMinutes: 2 }, updatedBy: 'Mei Santori' });
  });

  it('a teardown falls back to the default when its own model is dropped', async () => {
    const own = (await as.lead!.get(`/api/teardowns/${ids.published}/cost-model`).expect(200)).body;
    expect(own).toMatchObject({ source: 'teardown', model: { currency: 'CNY' }, defaults: { currency: 'USD' } });
    expect((await as.engineer!.delete(`/api/teardowns/${ids.draft}/cost-model`)).status).toBe(403);
    const dropped = (await as.admin!.delete(`/api/teardowns/${ids.draft}/cost-model`).expect(200)).body;
    expect(dropped.source).toBe('workspace');
  });
});

describe('costed-BOM CSV export and price CSV import', () => {
  const exportCsv = async (a: Agent, id = ids.published) => {
    const res = await a
      .get(`/api/teardowns/${id}/cost.csv?volume=1000&currency=USD`)
      .buffer(true)
      .parse((r, cb) => {
        let data = '';
        r.setEncoding('utf8');
        r.on('data', (c: string) => (data += c));
        r.on('end', () => cb(null, data));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/costed-bom-testbrook-invented-cost-cube-1-1000-USD\.csv/);
    return (res.body as string).replace(/^\uFEFF/, '');
  };
  const parse = (csv: string) => Papa.parse<Record<string, string>>(csv.trim(), { header: true }).data;
  const importCsv = (a: Agent, csv: string, mode: 'preview' | 'apply') =>
    a.upload(`/api/teardowns/${ids.published}/prices/import?mode=${mode}`).attach('file', Buffer.from(csv), { filename: 'prices.csv', contentType: 'text/csv' });

  it('exports one row per line with its price, the volume, the currency and the rate date', async () => {
    const rows = parse(await exportCsv(as.lead!));
    expect(rows).toHaveLength(5);
    expect(rows[1]).toMatchObject({
      designators: 'U1',
      maker_part_number: 'TBX4056',
      category: 'ic',
      quantity: '1',
      currency: 'CNY',
      breaks: '1@3.12;1000@2.34;5000@1.95',
      source: 'catalogue',
      confidence: 'high',
      volume: '1000',
      report_currency: 'USD',
      rate_date: '2026-11-27',
      unit_price: '0.324',
      attrition_pct: '2',
      extended: '0.33048',
    });
    expect(rows[4]).toMatchObject({ description: 'Shell, ABS, two halves', currency: '', breaks: '', unit_price: '', extended: '' });
  });

  it('round trip: the export imports back unchanged; a changed price shows in the preview, saves nothing until applied', async () => {
    const csv = await exportCsv(as.sourcing!);
    const same = (await importCsv(as.sourcing!, csv, 'preview').expect(200)).body;
    expect(same.rows).toHaveLength(4);
    expect(same.skipped).toEqual([{ line: 6, reason: expect.stringMatching(/No price on this line/) }]);
    for (const row of same.rows) expect(row.after).toEqual(row.before);
    expect(same.rows.map((r: { matchedBy: string }) => r.matchedBy)).toEqual(['designators', 'designators', 'designators', 'designators']);

    // Change U1's breaks and price the shell (matched by its description), in a file with the columns in another order.
    const rows = parse(csv);
    rows[1]!.breaks = '1@3.00;1000@2.20;5000@1.80';
    Object.assign(rows[4]!, { currency: 'CNY', breaks: '1000@4.5', source: 'Estimate', confidence: 'LOW', price_date: '2026-11-15' });
    const edited = Papa.unparse(
      rows.map((r) => ({
        confidence: r.confidence,
        breaks: r.breaks,
        designators: r.designators,
        maker_part_number: r.maker_part_number,
        description: r.description,
        currency: r.currency,
        source: r.source,
        price_date: r.price_date,
      })),
    );
    const preview = (await importCsv(as.sourcing!, edited, 'preview').expect(200)).body;
    expect(preview).toMatchObject({ mode: 'preview', saved: 0 });
    const u1 = preview.rows.find((r: { partId: number }) => r.partId === ids.ic);
    expect(u1.before.breaks).toEqual(PRICES.ic.breaks);
    expect(u1.after.breaks).toEqual([
      { minQty: 1, unitPrice: 3 },
      { minQty: 1000, unitPrice: 2.2 },
      { minQty: 5000, unitPrice: 1.8 },
    ]);
    expect(preview.rows.find((r: { partId: number }) => r.partId === ids.shell)).toMatchObject({
      matchedBy: 'description',
      before: null,
      after: { currency: 'CNY', source: 'estimate', confidence: 'low', priceDate: '2026-11-15' },
    });
    expect((await cost(as.sourcing!, ids.published)).unpricedPartIds).toEqual([ids.shell]);

    const applied = (await importCsv(as.sourcing!, edited, 'apply').expect(200)).body;
    expect(applied.saved).toBe(5);
    const after = parse(await exportCsv(as.sourcing!));
    expect(after[1]!.breaks).toBe('1@3;1000@2.2;5000@1.8');
    expect(after[4]).toMatchObject({ currency: 'CNY', breaks: '1000@4.5', source: 'estimate', confidence: 'low', price_date: '2026-11-15' });
    // Back to the hand-worked prices.
    await as.sourcing!.put(`/api/parts/${ids.ic}/price`, PRICES.ic).expect(200);
    await as.sourcing!.delete(`/api/parts/${ids.shell}/price`).expect(204);
    // Matching by maker part number when the designators column is empty.
    const byMpn = `maker_part_number,currency,breaks,source,confidence\nTB-18650-26,USD,1@2.5;1000@2.16,quote,medium\n`;
    expect((await importCsv(as.sourcing!, byMpn, 'preview').expect(200)).body.rows[0]).toMatchObject({ partId: ids.cell, matchedBy: 'makerPartNumber' });
  });

  it('one bad line rolls the whole file back, and the error names the line and column', async () => {
    const csv = [
      'designators,maker_part_number,currency,breaks,source,confidence',
      'BT1,,USD,1@9.99,quote,high',
      'U1,,CNY,1@1.00;1000@0.90,catalogue,high',
      '"R1, R2, R3, R4",,USD,100@-0.01,catalogue,high',
      'J9,,USD,1@1,quote,high',
      'J1,,XYZ,1@1,quote,high',
      'U1,,CNY,1@1,catalogue,high',
    ].join('\n');
    const res = await importCsv(as.sourcing!, csv, 'apply');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/The file has 4 problems; nothing was saved\./);
    expect(res.body.error.fields).toEqual({
      'lines.4.breaks': expect.stringMatching(/^Line 4, column breaks: break 1 \(unitPrice\): Unit price must not be negative/),
      'lines.5.designators': expect.stringMatching(/^Line 5, column designators: no part of this teardown has designators "J9"/),
      'lines.6.currency': expect.stringMatching(/^Line 6, column currency: no exchange rate for XYZ/),
      'lines.7.designators': expect.stringMatching(/^Line 7, column designators: this prices the same part as line 3/),
    });
    const c = await cost(as.sourcing!, ids.published);
    expect(c.lines.find((l) => l.partId === ids.cell)!.price!.breaks).toEqual(PRICES.cell.breaks);
    expect(c.lines.find((l) => l.partId === ids.ic)!.price!.breaks).toEqual(PRICES.ic.breaks);
    expect(c.partsTotal).toBeCloseTo(2.72916, 10);
  });

  it('names a missing column, refuses other roles, and needs a file', async () => {
    const res = await importCsv(as.sourcing!, 'designators,price\nU1,0.3\n', 'preview');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.columns).toMatch(/no column "currency", "breaks", "source", "confidence"/);
    expect((await importCsv(as.engineer!, 'designators,currency,breaks,source,confidence\n', 'preview')).status).toBe(403);
    expect((await as.sourcing!.upload(`/api/teardowns/${ids.published}/prices/import`).field('x', 'y')).body.error.fields.file).toMatch(/Attach the price CSV/);
  });

  it('deleting a price: sourcing and admin only; the line becomes unpriced and the change is in the history', async () => {
    expect((await as.engineer!.delete(`/api/parts/${ids.usb}/price`)).status).toBe(403);
    await as.admin!.delete(`/api/parts/${ids.usb}/price`).expect(204);
    expect((await as.admin!.delete(`/api/parts/${ids.usb}/price`)).status).toBe(404);
    const c = await cost(as.sourcing!, ids.published);
    expect(c.unpricedPartIds).toEqual([ids.usb, ids.shell]);
    const audit = (await as.admin!.get(`/api/audit?entityType=part&entityId=${ids.usb}`).expect(200)).body.entries;
    expect(audit.map((e: { action: string }) => e.action)).toEqual(expect.arrayContaining(['price.deleted', 'price.updated']));
    expect(audit[0].changes.price.from).toBe('GBP 500@0.17 (marketplace, low, ' + new Date().toISOString().slice(0, 10) + ')');
  });
});

describe('the demo seed step prices the parts that exist and creates none', () => {
  it('gives every part an invented price, two demo rate tables (base EUR) and the workspace model; the roll-up then works', async () => {
    const { seedCost } = await import('../../apps/api/src/seed/cost');
    const app = await makeTestApp({ seed: 'users' });
    try {
      const em = app.orm.em.fork();
      const users = Object.fromEntries(
        await Promise.all(['admin', 'engineer', 'sourcing', 'lead', 'viewer'].map(async (r) => [r, await em.findOneOrFail(UserSchema, { email: `${r}@splitcase.test` })])),
      );
      const device = em.create(DeviceSchema, { maker: 'Seedwell (invented)', model: 'S1', category: 'power-bank', retailPrice: 19.99, retailCurrency: 'USD' } as never);
      const teardown = em.create(TeardownSchema, { device, engineer: users.engineer, date: '2026-11-01', status: 'published', publishedAt: new Date() } as never);
      const categories = ['cell', 'ic', 'passive', 'pcb', 'heater', 'enclosure', 'packaging', 'connector'] as const;
      categories.forEach((category, k) =>
        em.create(PartSchema, { teardown, position: k + 1, category, description: `Demo ${category}`, designators: `X${k + 1}`, quantity: k + 1, mount: k % 2 ? 'smt' : 'manual' } as never),
      );
      await em.flush();
      const partsBefore = await em.count(PartSchema, {});
      await seedCost({ env: app.env, em, users: users as never, refs: new Map(), log: () => {} });
      await em.flush();
      const check = app.orm.em.fork();
      expect(await check.count(PartSchema, {})).toBe(partsBefore);
      const { PartPriceSchema } = await import('../../apps/api/src/modules/cost/part-price.entity');
      const prices = await check.find(PartPriceSchema, {});
      expect(prices).toHaveLength(categories.length);
      for (const p of prices) {
        expect(p.note).toMatch(/demo/i);
        expect(p.breaks.length).toBeGreaterThan(0);
        for (let k = 1; k < p.breaks.length; k++) expect(p.breaks[k]!.minQty).toBeGreaterThan(p.breaks[k - 1]!.minQty);
      }
      const sourcing = await app.as('sourcing');
      const rates = (await sourcing.get('/api/rates').expect(200)).body;
      expect(rates.history).toHaveLength(2);
      expect(rates.current).toMatchObject({ base: 'EUR', kind: 'demo', source: 'Demo rates (invented)' });
      for (const code of ['USD', 'GBP', 'CNY', 'JPY']) expect(rates.current.rates[code]).toBeGreaterThan(0);
      const c = await cost(sourcing, teardown.id, '');
      expect(c.unpricedPartIds).toEqual([]);
      expect(c.model.source).toBe('workspace');
      expect(c.landed).toBeGreaterThan(c.partsTotal);
    } finally {
      await app.close();
    }
  });
});

describe('implied margin with sales tax, unpriced lines, the price break on the purchased quantity and CIF insurance', () => {
  // A second invented device priced in EUR, costed in EUR (nothing to convert), with a flat model:
  // no assembly, labour, overhead or channel shares, so each figure can be followed by hand.
  const FLAT: CostModelBody = {
    currency: 'EUR',
    volumes: [100, 1000, 5000],
    attritionByCategory: { passive: 0.05 },
    defaultAttrition: 0,
    smtCostPerPlacement: 0,
    thtCostPerJoint: 0,
    thtJointsPerPart: 2,
    manualOperations: [],
    labourRatePerHour: 0,
    testMinutes: 0,
    packagingCost: 0,
    firstPassYield: 1,
    overheadFraction: 0,
    freightFraction: 0.05,
    insuranceFraction: 0.01,
    dutyFraction: 0.02,
    retailMarginFraction: 0,
    platformMarginFraction: 0,
    confidenceBand: { high: 0, medium: 0, low: 0 },
  };
  const p2 = { device: 0, teardown: 0, ic: 0, res: 0, cell: 0 };
  const eur = (a: Agent, q = 'volume=1000&currency=EUR') => cost(a, p2.teardown, q);
  const price = (breaks: { minQty: number; unitPrice: number }[]) => ({ currency: 'EUR', breaks, source: 'quote', confidence: 'high' });

  beforeAll(async () => {
    await importFixture(as.sourcing!).expect(200);
    const em = t.orm.em.fork();
    const engineer = await em.findOneOrFail(UserSchema, { email: 'engineer@splitcase.test' });
    const device = em.create(DeviceSchema, { maker: 'Testbrook (invented)', model: 'Cost Cube 2', category: 'power-bank', retailPrice: 24.99, retailCurrency: 'EUR' } as never);
    const teardown = em.create(TeardownSchema, { device, engineer, date: '2026-11-22', status: 'published', publishedAt: new Date() } as never);
    const part = (position: number, v: Record<string, unknown>) => em.create(PartSchema, { teardown, position, quantity: 1, ...v } as never);
    const ic = part(1, { designators: 'U1', category: 'ic', description: 'Boost IC', mount: 'smt' });
    const res = part(2, { designators: 'R1, R2', category: 'passive', description: 'Resistor 0402', mount: 'smt', quantity: 2 });
    const cell = part(3, { designators: 'BT1', category: 'cell', description: 'Pouch cell', mount: 'manual' });
    await em.flush();
    Object.assign(p2, { device: device.id, teardown: teardown.id, ic: ic.id, res: res.id, cell: cell.id });
    await as.sourcing!.put(`/api/teardowns/${p2.teardown}/cost-model`, FLAT).expect(200);
    await as.sourcing!.put(`/api/parts/${p2.ic}/price`, price([{ minQty: 1, unitPrice: 4 }])).expect(200);
    await as
      .sourcing!.put(
        `/api/parts/${p2.res}/price`,
        price([
          { minQty: 10, unitPrice: 0.1 },
          { minQty: 2000, unitPrice: 0.05 },
        ]),
      )
      .expect(200);
    await as.sourcing!.put(`/api/parts/${p2.cell}/price`, price([{ minQty: 1, unitPrice: 1.895 }])).expect(200);
  });

  it('CIF insurance (the default basis): 1 % of goods + freight, then duty on CIF [S: REFERENCES §10 CIF = FOB + freight + insurance; C]', async () => {
    const c = await eur(as.lead!);
    // parts at 1000: 4.00 + 2 × 0.05 × 1.05 + 1.895 = 6.00; ex-works 6.00; freight 5 % = 0.30
    expect(c.partsTotal).toBeCloseTo(6, 12);
    expect(c.freight).toBeCloseTo(0.3, 12);
    // insurance on goods + freight: 0.01 × 6.30 = 0.063 (goods only would be 0.06)
    expect(c.insurance).toBeCloseTo(0.063, 12);
    // duty 2 % × CIF (6.30 + 0.063 = 6.363) = 0.12726; landed 6.363 + 0.12726 = 6.49026
    expect(c.duty).toBeCloseTo(0.12726, 12);
    expect(c.landed).toBeCloseTo(6.49026, 12);
    expect(c.steps.find((s) => s.key === 'insurance')).toMatchObject({ label: 'Insurance (CIF basis)', formula: '0.01 × (6 + 0.3) = 0.063' });
    const model = (await as.lead!.get(`/api/teardowns/${p2.teardown}/cost-model`).expect(200)).body.model;
    expect(model.insuranceBasis).toBe('cif');
  });

  it('the goods-only basis insures the ex-works value alone, as the §10 worked example does [S/CP; C]', async () => {
    await as.sourcing!.put(`/api/teardowns/${p2.teardown}/cost-model`, { ...FLAT, insuranceBasis: 'goods' }).expect(200);
    const c = await eur(as.lead!);
    // 0.01 × 6.00 = 0.06; duty 0.02 × 6.36 = 0.1272; landed 6.36 + 0.1272 = 6.4872
    expect(c.insurance).toBeCloseTo(0.06, 12);
    expect(c.landed).toBeCloseTo(6.4872, 12);
    const bad = await as.sourcing!.put(`/api/teardowns/${p2.teardown}/cost-model`, { ...FLAT, insuranceBasis: 'fob' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['insuranceBasis']);
    await as.sourcing!.put(`/api/teardowns/${p2.teardown}/cost-model`, FLAT).expect(200);
  });

  it('the price break is chosen on the purchased quantity, attrition included: 952 units buy 2 000, 951 buy 1 998 [C]', async () => {
    // R1, R2: 2 per unit, passive attrition 5 %. 952 units: 2 × 952 = 1 904 fitted (the 10 break by that rule),
    // but ceil(1 904 × 1.05 = 1 999.2) = 2 000 bought → the 2 000 break at 0.05.
    const at952 = (await eur(as.lead!, 'volume=952&currency=EUR')).lines.find((l) => l.partId === p2.res)!;
    expect(at952).toMatchObject({ buyQuantity: 2000, breakMinQty: 2000, unitPrice: 0.05 });
    // 951 units: ceil(1 902 × 1.05 = 1 997.1) = 1 998 → the 10 break at 0.10.
    const at951 = (await eur(as.lead!, 'volume=951&currency=EUR')).lines.find((l) => l.partId === p2.res)!;
    expect(at951).toMatchObject({ buyQuantity: 1998, breakMinQty: 10, unitPrice: 0.1 });
  });

  it('sales tax from the workspace default for the currency: EUR 20 %, 24.99 → 20.825 before tax [CP: REFERENCES §12; C]', async () => {
    const settings = (await as.viewer!.get('/api/settings').expect(200)).body.settings;
    expect(settings.salesTaxByCurrency).toMatchObject({ EUR: 0.2, USD: 0 });
    const c = await eur(as.lead!);
    expect(c.retail).toMatchObject({ amount: 24.99, salesTax: { rate: 0.2, source: 'workspace', currency: 'EUR' } });
    expect(c.retail!.beforeTax).toBeCloseTo(20.825, 12);
    expect(c.retail!.salesTax.amount).toBeCloseTo(4.165, 12);
    // no channel shares: net to maker = 20.825; margin = 20.825 − 6.49026 = 14.33474, 68.834 % of net
    expect(c.retail!.netToMaker).toBeCloseTo(20.825, 12);
    expect(c.impliedMargin).toMatchObject({ complete: true, reason: null, pricedLines: 3, totalLines: 3, salesTax: { rate: 0.2, source: 'workspace', currency: 'EUR' } });
    expect(c.impliedMargin!.amount).toBeCloseTo(14.33474, 12);
    expect(c.impliedMargin!.fraction).toBeCloseTo(14.33474 / 20.825, 12);
    expect(c.steps.find((s) => s.key === 'retailBeforeTax')!.formula).toBe('24.99 ÷ (1 + 0.2) = 20.825');
    const bars = Object.fromEntries(c.waterfall.map((b) => [b.key, b]));
    expect(bars.salesTax!.value).toBeCloseTo(4.165, 12);
    expect(bars.retail!.end).toBeCloseTo(24.99, 12);
  });

  it('a changed workspace default moves the margin: EUR 21 % → 24.99 / 1.21 = 20.652892562 [C]', async () => {
    const bad = await as.admin!.patch('/api/settings', { salesTaxByCurrency: { EUR: 1.2, usd: 0 } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields['salesTaxByCurrency.EUR']).toMatch(/not be above 100 %/);
    await as.admin!.patch('/api/settings', { salesTaxByCurrency: { EUR: 0.21, USD: 0 } }).expect(200);
    const c = await eur(as.lead!);
    expect(c.retail!.beforeTax).toBeCloseTo(20.652892562, 9);
    expect(c.impliedMargin!.amount).toBeCloseTo(20.652892562 - 6.49026, 9);
    await as.admin!.patch('/api/settings', { salesTaxByCurrency: { EUR: 0.2, USD: 0, GBP: 0.2 } }).expect(200);
  });

  it('sales tax from the device: "10 %" typed on the device wins over the default; 0 means a price before tax', async () => {
    const set = await as.engineer!.patch(`/api/devices/${p2.device}`, { salesTaxRate: '10 %' }).expect(200);
    expect(set.body.device.salesTaxRate).toBe(0.1);
    let c = await eur(as.lead!);
    // 24.99 / 1.10 = 22.718181818; margin 22.718181818 − 6.49026 = 16.227921818
    expect(c.retail!.salesTax).toMatchObject({ rate: 0.1, source: 'device', currency: 'EUR' });
    expect(c.retail!.beforeTax).toBeCloseTo(22.718181818, 9);
    expect(c.impliedMargin!.amount).toBeCloseTo(16.227921818, 9);
    // 0: quoted before tax, nothing taken out (the usual US quote [CP]).
    expect((await as.engineer!.patch(`/api/devices/${p2.device}`, { salesTaxRate: 0 }).expect(200)).body.device.salesTaxRate).toBe(0);
    c = await eur(as.lead!);
    expect(c.retail).toMatchObject({ beforeTax: 24.99, salesTax: { rate: 0, amount: 0, source: 'device' } });
    expect(c.impliedMargin!.amount).toBeCloseTo(24.99 - 6.49026, 12);
    // Bad input names the field and changes nothing; blank goes back to the workspace default.
    for (const [value, message] of [
      ['abc', /as a percentage such as "20 %"/],
      ['120 %', /At most 100 %/],
      [-0.1, /fraction from 0 to 1/],
      [20, /fraction from 0 to 1/],
    ] as const) {
      const res = await as.engineer!.patch(`/api/devices/${p2.device}`, { salesTaxRate: value });
      expect(res.status, String(value)).toBe(400);
      expect(res.body.error.fields.salesTaxRate, String(value)).toMatch(message);
    }
    expect((await as.lead!.get(`/api/devices/${p2.device}`).expect(200)).body.device.salesTaxRate).toBe(0);
    expect((await as.engineer!.patch(`/api/devices/${p2.device}`, { salesTaxRate: '' }).expect(200)).body.device.salesTaxRate).toBeNull();
    expect((await eur(as.lead!)).retail!.salesTax).toMatchObject({ rate: 0.2, source: 'workspace' });
    const audit = (await as.admin!.get(`/api/audit?entityType=device&entityId=${p2.device}`).expect(200)).body.entries;
    expect(audit[0].changes.salesTaxRate).toEqual({ from: 0, to: null });
  });

  it('a new device takes the rate typed as a percentage', async () => {
    const res = await as.engineer!.post('/api/devices', { maker: 'Testbrook (invented)', model: 'Cost Cube 3', category: 'usb-fan', retailPrice: 12, currency: 'GBP', salesTaxRate: '20' }).expect(201);
    expect(res.body.device.salesTaxRate).toBe(0.2);
  });

  it('with a line unpriced the margin is incomplete: no number, the reason and "2 of 3 lines priced", at every volume', async () => {
    await as.sourcing!.delete(`/api/parts/${p2.cell}/price`).expect(204);
    const c = await eur(as.lead!);
    expect(c.impliedMargin).toMatchObject({ amount: null, fraction: null, complete: false, pricedLines: 2, totalLines: 3, salesTax: { rate: 0.2, source: 'workspace' } });
    expect(c.impliedMargin!.reason).toMatch(/^2 of 3 lines priced/);
    for (const row of c.volumes) expect(row.impliedMargin).toMatchObject({ amount: null, complete: false, pricedLines: 2 });
    expect(c.steps.map((s) => s.key)).not.toContain('impliedMargin');
    expect(c.waterfall.at(-1)!.key).toBe('landed');
    // The retail split does not depend on the parts list and is still given.
    expect(c.retail!.beforeTax).toBeCloseTo(20.825, 12);
    await as.sourcing!.put(`/api/parts/${p2.cell}/price`, price([{ minQty: 1, unitPrice: 1.895 }])).expect(200);
    expect((await eur(as.lead!)).impliedMargin!.complete).toBe(true);
  });

  it('a currency with no workspace default and no rate on the device: the margin is incomplete and says what to set', async () => {
    await as.engineer!.patch(`/api/devices/${p2.device}`, { retailPrice: 36000, currency: 'KRW' }).expect(200);
    const c = await eur(as.lead!);
    expect(c.retail).toBeNull();
    expect(c.impliedMargin).toMatchObject({ amount: null, fraction: null, complete: false, salesTax: null, pricedLines: 3, totalLines: 3 });
    expect(c.impliedMargin!.reason).toMatch(/No sales-tax rate for KRW.*Sales tax in the price/);
    expect(c.warnings.join(' ')).toMatch(/No sales-tax rate for KRW/);
    await as.engineer!.patch(`/api/devices/${p2.device}`, { salesTaxRate: '10 %' }).expect(200);
    // 36 000 KRW / 1500 × 1 = 24.00 EUR; before tax 24 / 1.1 = 21.818181818
    expect((await eur(as.lead!)).retail!.beforeTax).toBeCloseTo(21.818181818, 9);
    await as.engineer!.patch(`/api/devices/${p2.device}`, { retailPrice: 24.99, currency: 'EUR', salesTaxRate: null }).expect(200);
  });
});
