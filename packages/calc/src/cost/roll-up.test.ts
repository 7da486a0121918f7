import { describe, expect, it } from 'vitest';
import { costAtVolumes, rollUpCost, type CostModel, type RollUpInput } from './roll-up';

// REFERENCES §9 illustrative rates, units per 1 EUR [S: ECB convention; C].
const rates = { base: 'EUR', rates: { USD: 1.0856, CNY: 7.85, GBP: 0.8567 } };
// 1 CNY = 1.0856 / 7.85 USD = 0.138292994 USD (§9: CNY→USD 0.138293).
const CNY = 1.0856 / 7.85;

// Invented demo model, money in CNY.
const model: CostModel = {
  currency: 'CNY',
  attritionByCategory: { passive: 0.03, ic: 0.01 },
  defaultAttrition: 0.005,
  smtCostPerPlacement: 0.08,
  thtCostPerJoint: 0.05,
  manualOperations: [
    { label: 'Weld cell tabs', minutes: 1.5 },
    { label: 'Fit heater film into shell', minutes: 2.5 },
  ],
  labourRatePerHour: 30,
  testMinutes: 1,
  packagingCost: 2,
  firstPassYield: 0.98,
  overheadFraction: 0.1,
  freightFraction: 0.05,
  insuranceFraction: 0.01,
  // Insured on the goods alone, as the REFERENCES §10 example; the CIF basis is checked below.
  insuranceBasis: 'goods',
  dutyFraction: 0.027,
  retailMarginFraction: 0.4,
  platformMarginFraction: 0.15,
  confidenceBand: { high: 0.05, medium: 0.1, low: 0.25 },
};

const input: RollUpInput = {
  volume: 1000,
  currency: 'USD',
  rates,
  model,
  lines: [
    {
      partId: 'CELL-1',
      category: 'cell',
      quantity: 1,
      mount: 'manual',
      price: {
        currency: 'USD',
        confidence: 'medium',
        breaks: [
          { minQty: 1, unitPrice: 2.1 },
          { minQty: 1000, unitPrice: 1.8 },
          { minQty: 5000, unitPrice: 1.65 },
        ],
      },
    },
    {
      partId: 'R-10K',
      category: 'passive',
      quantity: 6,
      mount: 'smt',
      price: {
        currency: 'CNY',
        confidence: 'high',
        breaks: [
          { minQty: 100, unitPrice: 0.02 },
          { minQty: 5000, unitPrice: 0.01 },
          { minQty: 10000, unitPrice: 0.008 },
        ],
      },
    },
    {
      partId: 'IC-CHG',
      category: 'ic',
      quantity: 1,
      mount: 'smt',
      price: {
        currency: 'CNY',
        confidence: 'low',
        breaks: [
          { minQty: 1, unitPrice: 1.2 },
          { minQty: 1000, unitPrice: 0.95 },
        ],
      },
    },
    { partId: 'J-USB', category: 'connector', quantity: 1, mount: 'tht' },
  ],
  retail: { amount: 19.99, currency: 'GBP' },
};

describe('rollUpCost — a small BOM worked by hand [C]', () => {
  const r = rollUpCost(input);
  // The same BOM with the connector priced at nothing: every line priced, the same totals, so the margin is complete.
  const full = rollUpCost({
    ...input,
    lines: input.lines.map((l) => (l.partId === 'J-USB' ? { ...l, price: { currency: 'USD', confidence: 'high' as const, breaks: [{ minQty: 1, unitPrice: 0 }] } } : l)),
  });

  it('prices each line at the break for the purchased quantity, converted before attrition', () => {
    // CELL-1: ceil(1 × 1000 × 1.005) = 1005 pieces bought → break 1000 → 1.80 USD; 'cell' not listed → default attrition 0.005
    //   extended = 1 × 1.80 × 1.005 = 1.809
    // R-10K: ceil(6 × 1000 × 1.03) = 6180 → break 5000 → 0.01 CNY = 0.00138293 USD; passive 0.03
    //   extended = 6 × 0.00138293 × 1.03 = 0.00854651
    // IC-CHG: ceil(1000 × 1.01) = 1010 → break 1000 → 0.95 CNY = 0.131378 USD; ic 0.01
    //   extended = 0.131378 × 1.01 = 0.132692
    // J-USB: no price → unpriced, adds nothing
    const [cell, res, ic, usb] = r.lines;
    expect(cell).toMatchObject({ buyQuantity: 1005, unitPrice: 1.8, attrition: 0.005, priced: true, confidence: 'medium', breakMinQty: 1000 });
    expect(cell!.extended).toBeCloseTo(1.809, 12);
    expect(res!.buyQuantity).toBe(6180);
    expect(res!.breakMinQty).toBe(5000);
    expect(res!.unitPrice).toBeCloseTo(0.01 * CNY, 12);
    expect(res!.extended).toBeCloseTo(0.008546507, 9);
    expect(ic!.unitPrice).toBeCloseTo(0.131378344, 9);
    expect(ic!.extended).toBeCloseTo(0.132692127, 9);
    expect(usb).toMatchObject({ unitPrice: null, extended: null, priced: false, confidence: null, attrition: 0.005, breakMinQty: null });
    expect(r.unpricedPartIds).toEqual(['J-USB']);
    // parts = 1.809 + 0.008546507 + 0.132692127 = 1.950238634
    expect(r.partsTotal).toBeCloseTo(1.950238634, 9);
    expect(r.byCategory).toEqual({
      cell: cell!.extended,
      passive: res!.extended,
      ic: ic!.extended,
      connector: 0,
    });
    expect(r.warnings).toEqual([]);
  });

  it('adds assembly, labour, test and packaging converted from the model currency', () => {
    // placements = 6 + 1 = 7; joints = 1 THT part × 2 = 2
    expect(r.placements).toBe(7);
    expect(r.joints).toBe(2);
    // assembly = (7 × 0.08 + 2 × 0.05) CNY = 0.66 CNY = 0.091273376 USD
    expect(r.assembly).toBeCloseTo(0.66 * CNY, 12);
    // labour = (1.5 + 2.5) min / 60 × 30 CNY/h = 2 CNY = 0.276585987 USD
    expect(r.labour).toBeCloseTo(2 * CNY, 12);
    // test = 1 min / 60 × 30 CNY/h = 0.5 CNY = 0.069146497 USD
    expect(r.test).toBeCloseTo(0.5 * CNY, 12);
    // packaging = 2 CNY = 0.276585987 USD
    expect(r.packaging).toBeCloseTo(2 * CNY, 12);
  });

  it('rolls up yield loss, overhead, ex-works, freight, insurance, duty and landed cost', () => {
    // yield loss = (1.950238634 + 0.091273376 + 0.276585987 + 0.069146497) × (1/0.98 − 1) = 0.048719275
    expect(r.yieldLoss).toBeCloseTo(0.048719275, 8);
    // overhead = 0.10 × (2.387244494 + 0.276585987 + 0.048719275) = 0.271254976
    expect(r.overhead).toBeCloseTo(0.271254976, 8);
    // ex-works = 2.712549757 + 0.271254976 = 2.983804733
    expect(r.exWorks).toBeCloseTo(2.983804733, 8);
    // freight = 0.05 × 2.983804733 = 0.149190237; insurance = 0.01 × 2.983804733 = 0.029838047
    expect(r.freight).toBeCloseTo(0.149190237, 8);
    expect(r.insurance).toBeCloseTo(0.029838047, 8);
    // duty on CIF (REFERENCES §10) = 0.027 × (2.983804733 + 0.149190237 + 0.029838047) = 0.085396491
    expect(r.duty).toBeCloseTo(0.085396491, 8);
    // landed = 3.162833017 + 0.085396491 = 3.248229508
    expect(r.landed).toBeCloseTo(3.248229508, 8);
  });

  it('gives the low/high range from each line’s confidence band', () => {
    // low parts = 1.809 × 0.90 + 0.008546507 × 0.95 + 0.132692127 × 0.75; the rest recomputed → 2.986127144
    expect(r.low).toBeCloseTo(2.986127144, 8);
    // high parts = 1.809 × 1.10 + 0.008546507 × 1.05 + 0.132692127 × 1.25 → 3.510331872
    expect(r.high).toBeCloseTo(3.510331872, 8);
  });

  it('works out the implied margin against a retail price in a third currency', () => {
    // With J-USB unpriced the margin is incomplete; priced (at nothing) it is the figure below.
    expect(r.impliedMargin).toMatchObject({ amount: null, fraction: null, complete: false, pricedLines: 3, totalLines: 4 });
    expect(full.landed).toBeCloseTo(r.landed, 12);
    // retail = 19.99 GBP / 0.8567 × 1.0856 = 25.331089063 USD (no sales tax given: the price is taken as before tax)
    expect(r.retail!.amount).toBeCloseTo(25.331089063, 8);
    // net to maker = 25.331089063 × (1 − 0.40) × (1 − 0.15) = 12.918855422
    expect(r.retail!.netToMaker).toBeCloseTo(12.918855422, 8);
    // implied margin = 12.918855422 − 3.248229508 = 9.670625914, i.e. 74.857 % of net
    expect(full.impliedMargin!.amount).toBeCloseTo(9.670625914, 8);
    expect(full.impliedMargin!.fraction).toBeCloseTo(0.748566773, 8);
    expect(full.impliedMargin).toMatchObject({ complete: true, reason: null, pricedLines: 4, totalLines: 4 });
    // retailer's share = 25.331089063 × 0.40 = 10.132435625
    expect(r.retail!.retailerShare).toBeCloseTo(10.132435625, 8);
    // platform fee on what the retailer passes on = (25.331089063 − 10.132435625) × 0.15 = 2.279798016
    expect(r.retail!.platformShare).toBeCloseTo(2.279798016, 8);
    // the three shares give back the retail price: 12.918855422 + 2.279798016 + 10.132435625 = 25.331089063
    expect(r.retail!.netToMaker + r.retail!.platformShare + r.retail!.retailerShare).toBeCloseTo(r.retail!.amount, 12);
  });

  it('lists the steps with their formulas', () => {
    expect(full.steps.map((s) => s.key)).toEqual([
      'parts',
      'assembly',
      'labour',
      'test',
      'packaging',
      'yieldLoss',
      'overhead',
      'exWorks',
      'freight',
      'insurance',
      'duty',
      'landed',
      'low',
      'high',
      'retailBeforeTax',
      'netToMaker',
      'impliedMargin',
    ]);
    // With a line unpriced the margin step is left out (the figure is incomplete).
    expect(r.steps.map((s) => s.key)).not.toContain('impliedMargin');
    const step = Object.fromEntries(r.steps.map((s) => [s.key, s]));
    expect(step.landed!.value).toBe(r.landed);
    expect(step.assembly!.formula).toBe('7 placements × 0.0110634 + 2 joints × 0.00691465 = 0.0912734');
    expect(step.parts!.formula).toMatch(/over 3 priced lines = 1\.95024$/);
    const fullStep = Object.fromEntries(full.steps.map((s) => [s.key, s]));
    expect(fullStep.impliedMargin!.formula).toMatch(/\(74\.8567 % of net\)$/);
  });

  it('gives each step the inputs its formula used, with units', () => {
    const step = Object.fromEntries(r.steps.map((s) => [s.key, s]));
    expect(step.assembly!.inputs).toEqual([
      { label: 'SMT placements per unit', value: 7, unit: '' },
      { label: 'Cost per placement', value: 0.08 * CNY, unit: 'USD' },
      { label: 'Through-hole joints per unit', value: 2, unit: '' },
      { label: 'Cost per joint', value: 0.05 * CNY, unit: 'USD' },
    ]);
    expect(step.labour!.inputs).toEqual([
      { label: 'Manual operations', value: 4, unit: 'min' },
      { label: 'Labour rate', value: 30 * CNY, unit: 'USD/h' },
    ]);
    expect(step.parts!.inputs).toContainEqual({ label: 'Unpriced lines (left out)', value: 1, unit: '' });
    // duty base is CIF = 2.983804733 + 0.149190237 + 0.029838047 = 3.162833017
    expect(step.duty!.inputs[0]!.value).toBeCloseTo(3.162833017, 8);
    expect(step.duty!.inputs[1]).toEqual({ label: 'Duty', value: 2.7, unit: '%' });
    expect(step.yieldLoss!.inputs[1]).toEqual({ label: 'First-pass yield', value: 98, unit: '%' });
    expect(step.overhead!.inputs[0]!.value).toBeCloseTo(2.712549757, 8);
    expect(step.netToMaker!.inputs).toEqual([
      { label: 'Retail price', value: r.retail!.amount, unit: 'USD' },
      { label: 'Retailer margin', value: 40, unit: '%' },
      { label: 'Platform fee', value: 15, unit: '%' },
    ]);
    for (const s of r.steps) expect(s.inputs.length, s.key).toBeGreaterThan(0);
  });
});

describe('rollUpCost — REFERENCES §10 examples', () => {
  const bare: CostModel = {
    currency: 'USD',
    attritionByCategory: {},
    defaultAttrition: 0.02,
    smtCostPerPlacement: 0.01,
    thtCostPerJoint: 0,
    manualOperations: [],
    labourRatePerHour: 0,
    testMinutes: 0,
    packagingCost: 0,
    firstPassYield: 0.97,
    overheadFraction: 0,
    freightFraction: 0,
    dutyFraction: 0,
    retailMarginFraction: 0,
    platformMarginFraction: 0,
    confidenceBand: { high: 0, medium: 0, low: 0 },
  };

  it('BOM $10.00 + 2 % attrition + 200 placements at $0.01, 97 % yield → $12.5773 [CP; C]', () => {
    const r = rollUpCost({
      volume: 1,
      currency: 'USD',
      rates: { base: 'USD', rates: {} },
      model: bare,
      lines: [
        { partId: 'BOM', category: 'bom', quantity: 1, mount: 'manual', price: { currency: 'USD', confidence: 'high', breaks: [{ minQty: 1, unitPrice: 10 }] } },
        { partId: 'PLACEMENTS', category: 'placements', quantity: 200, mount: 'smt' },
      ],
    });
    expect(r.partsTotal).toBeCloseTo(10.2, 12);
    expect(r.assembly).toBeCloseTo(2, 12);
    expect(r.exWorks).toBeCloseTo(12.5773, 4);
    expect(r.landed).toBeCloseTo(12.5773, 4);
    expect(r.retail).toBeNull();
    expect(r.impliedMargin).toBeNull();
    expect(r.steps.map((s) => s.key)).not.toContain('netToMaker');
  });

  it('keystone: a landed cost of $20 against a $40 retail price leaves a 50 % margin [S: marketing dictionaries]', () => {
    const r = rollUpCost({
      volume: 1,
      currency: 'USD',
      rates: { base: 'USD', rates: {} },
      model: { ...bare, defaultAttrition: 0, firstPassYield: 1, smtCostPerPlacement: 0 },
      lines: [{ partId: 'X', category: 'x', quantity: 1, mount: 'manual', price: { currency: 'USD', confidence: 'high', breaks: [{ minQty: 1, unitPrice: 20 }] } }],
      retail: { amount: 40, currency: 'USD' },
    });
    expect(r.impliedMargin).toMatchObject({ amount: 20, fraction: 0.5, complete: true });
    // With every margin taken by the channel there is nothing left to share.
    const all = rollUpCost({
      volume: 1,
      currency: 'USD',
      rates: { base: 'USD', rates: {} },
      model: { ...bare, retailMarginFraction: 1 },
      lines: [],
      retail: { amount: 40, currency: 'USD' },
    });
    expect(all.impliedMargin!.fraction).toBeNull();
  });
});

describe('rollUpCost — price breaks at the volume boundary', () => {
  const line = (breaks: { minQty: number; unitPrice: number }[]) => ({
    ...input,
    currency: 'USD',
    retail: null,
    lines: [{ partId: 'P', category: 'ic', quantity: 2, mount: 'smt' as const, price: { currency: 'USD', confidence: 'high' as const, breaks } }],
  });
  const breaks = [
    { minQty: 10, unitPrice: 1 },
    { minQty: 2000, unitPrice: 0.5 },
  ];

  it('uses the break exactly at the purchased quantity, and the one below just under it [CP]', () => {
    // ic attrition 1 %: ceil(2 × 990 × 1.01) = 2000 bought; ceil(2 × 989 × 1.01) = 1998
    expect(rollUpCost({ ...line(breaks), volume: 990 }).lines[0]!.unitPrice).toBe(0.5);
    expect(rollUpCost({ ...line(breaks), volume: 989 }).lines[0]!.unitPrice).toBe(1);
  });

  it('prices below the first break at that break, with a warning', () => {
    const r = rollUpCost({ ...line(breaks), volume: 4 }); // ceil(8 × 1.01) = 9 pieces < 10
    expect(r.lines[0]).toMatchObject({ unitPrice: 1, belowMinimumOrder: true, breakMinQty: 10 });
    expect(r.warnings[0]).toMatch(/P: 9 pieces is below the smallest price break \(10\)/);
  });

  it('gives the volume table in the order asked', () => {
    const rows = costAtVolumes([1000, 989, 5000], line(breaks));
    expect(rows.map((x) => [x.volume, x.lines[0]!.unitPrice])).toEqual([
      [1000, 0.5],
      [989, 1],
      [5000, 0.5],
    ]);
    expect(() => costAtVolumes([], line(breaks))).toThrow(/volumes needs at least one/);
    expect(() => costAtVolumes([100, 0], line(breaks))).toThrow(/volumes\[1\]/);
  });
});

describe('rollUpCost — errors name the field', () => {
  const withLine = (patch: object) => ({ ...input, lines: [{ ...input.lines[1]!, ...patch }] });

  it('rejects volume, currency and rate problems', () => {
    expect(() => rollUpCost({ ...input, volume: 0 })).toThrow(/volume must be a whole number of at least 1/);
    expect(() => rollUpCost({ ...input, volume: 10.5 })).toThrow(/volume/);
    expect(() => rollUpCost({ ...input, currency: 'JPY' })).toThrow(/^currency: no exchange rate for JPY/);
    expect(() => rollUpCost({ ...input, model: { ...model, currency: 'CHF' } })).toThrow(/^model\.currency: no exchange rate for CHF/);
    expect(() => rollUpCost({ ...input, retail: { amount: 10, currency: 'SEK' } })).toThrow(/^retail\.currency: no exchange rate for SEK/);
    expect(() => rollUpCost({ ...input, retail: { amount: 0, currency: 'USD' } })).toThrow(/retail\.amount/);
    expect(() => rollUpCost(withLine({ price: { currency: 'JPY', confidence: 'high', breaks: [{ minQty: 1, unitPrice: 1 }] } }))).toThrow(/^lines\[0\]\.price\.currency: no exchange rate for JPY/);
    expect(() => rollUpCost(null as never)).toThrow(/needs \{ volume/);
  });

  it('rejects bad lines and prices', () => {
    expect(() => rollUpCost(withLine({ price: { currency: 'CNY', confidence: 'high', breaks: [{ minQty: 1, unitPrice: -1 }] } }))).toThrow(
      /^lines\[0\]\.price\.breaks\[0\]\.unitPrice must be a number not below zero/,
    );
    expect(() =>
      rollUpCost(
        withLine({
          price: {
            currency: 'CNY',
            confidence: 'high',
            breaks: [
              { minQty: 100, unitPrice: 1 },
              { minQty: 50, unitPrice: 0.5 },
            ],
          },
        }),
      ),
    ).toThrow(/^lines\[0\]\.price\.breaks\[1\]\.minQty: price breaks overlap or are out of order/);
    expect(() => rollUpCost(withLine({ price: { currency: 'CNY', confidence: 'sure', breaks: [{ minQty: 1, unitPrice: 1 }] } }))).toThrow(
      /lines\[0\]\.price\.confidence must be one of high, medium, low/,
    );
    expect(() => rollUpCost(withLine({ quantity: 0 }))).toThrow(/lines\[0\]\.quantity must be greater than zero/);
    expect(() => rollUpCost(withLine({ mount: 'glue' }))).toThrow(/lines\[0\]\.mount must be one of smt, tht, manual/);
    expect(() => rollUpCost(withLine({ partId: ' ' }))).toThrow(/lines\[0\]\.partId must be non-empty text/);
    expect(() => rollUpCost(withLine({ category: undefined }))).toThrow(/lines\[0\]\.category/);
    expect(() => rollUpCost({ ...input, lines: [null as never] })).toThrow(/lines\[0\] must be a BOM line/);
    expect(() => rollUpCost({ ...input, lines: 'x' as never })).toThrow(/lines must be a list/);
    // A price with no breaks yet counts as unpriced.
    expect(rollUpCost(withLine({ price: { currency: 'CNY', confidence: 'high', breaks: [] } })).unpricedPartIds).toEqual(['R-10K']);
  });

  it('rejects bad model values', () => {
    const bad = (patch: Partial<CostModel>) => () => rollUpCost({ ...input, model: { ...model, ...patch } });
    expect(bad({ overheadFraction: 10 })).toThrow(/model\.overheadFraction must be between 0 and 1/);
    expect(bad({ attritionByCategory: { passive: -0.1 } })).toThrow(/model\.attritionByCategory\.passive/);
    expect(bad({ firstPassYield: 0 })).toThrow(/model\.firstPassYield must be greater than zero/);
    expect(bad({ manualOperations: [{ label: '', minutes: 1 }] })).toThrow(/model\.manualOperations\[0\]\.label/);
    expect(bad({ manualOperations: [{ label: 'Glue', minutes: -1 }] })).toThrow(/model\.manualOperations\[0\]\.minutes/);
    expect(bad({ manualOperations: undefined as never })).toThrow(/model\.manualOperations must be a list/);
    expect(bad({ confidenceBand: { high: 0.05, medium: 2, low: 0.2 } })).toThrow(/model\.confidenceBand\.medium/);
    expect(bad({ confidenceBand: null as never })).toThrow(/model\.confidenceBand must give/);
    expect(bad({ attritionByCategory: 5 as never })).toThrow(/model\.attritionByCategory must map/);
    expect(bad({ smtCostPerPlacement: -0.01 })).toThrow(/model\.smtCostPerPlacement/);
    expect(() => rollUpCost({ ...input, model: null as never })).toThrow(/model must be a cost model/);
  });
});

describe('rollUpCost — sales tax in the retail price (REFERENCES §12 "Sales tax in the retail price" [CP])', () => {
  // One priced line of 10.00 USD and nothing else: landed = 10.00 exactly, so the margin is read off by hand.
  const flat: CostModel = {
    currency: 'USD',
    attritionByCategory: {},
    defaultAttrition: 0,
    smtCostPerPlacement: 0,
    thtCostPerJoint: 0,
    manualOperations: [],
    labourRatePerHour: 0,
    testMinutes: 0,
    packagingCost: 0,
    overheadFraction: 0,
    freightFraction: 0,
    dutyFraction: 0,
    retailMarginFraction: 0,
    platformMarginFraction: 0,
    confidenceBand: { high: 0, medium: 0, low: 0 },
  };
  const ten = { currency: 'USD', confidence: 'high' as const, breaks: [{ minQty: 1, unitPrice: 10 }] };
  const base = { volume: 1, currency: 'USD', rates: { base: 'USD', rates: {} }, model: flat, lines: [{ partId: 'X', category: 'x', quantity: 1, mount: 'manual' as const, price: ten }] };

  it('takes 20 % VAT out of a price quoted with it: US$24.99 → US$20.825 net [C: net = gross / (1 + v)]', () => {
    const r = rollUpCost({ ...base, retail: { amount: 24.99, currency: 'USD', salesTaxRate: 0.2 } });
    expect(r.landed).toBeCloseTo(10, 12);
    // gross 24.99 as seen; before tax 24.99 / 1.20 = 20.825; tax 24.99 − 20.825 = 4.165
    expect(r.retail!.amount).toBeCloseTo(24.99, 12);
    expect(r.retail!.beforeTax).toBeCloseTo(20.825, 12);
    expect(r.retail!.salesTax).toBeCloseTo(4.165, 12);
    expect(r.retail!.salesTaxRate).toBe(0.2);
    // no channel shares in this model: net to maker = 20.825; margin = 20.825 − 10 = 10.825, 51.981 % of net
    expect(r.retail!.netToMaker).toBeCloseTo(20.825, 12);
    expect(r.impliedMargin!.amount).toBeCloseTo(10.825, 12);
    expect(r.impliedMargin!.fraction).toBeCloseTo(10.825 / 20.825, 12);
    expect(r.impliedMargin!.fraction).toBeCloseTo(0.519807923, 9);
    const step = Object.fromEntries(r.steps.map((s) => [s.key, s]));
    expect(step.retailBeforeTax!.formula).toBe('24.99 ÷ (1 + 0.2) = 20.825');
    expect(step.retailBeforeTax!.inputs).toEqual([
      { label: 'Retail price as seen', value: 24.99, unit: 'USD' },
      { label: 'Sales tax in the price', value: 20, unit: '%' },
    ]);
  });

  it('leaves a price quoted before tax (rate 0, the usual US quote) whole [CP]', () => {
    const r = rollUpCost({ ...base, retail: { amount: 24.99, currency: 'USD', salesTaxRate: 0 } });
    expect(r.retail!.beforeTax).toBe(24.99);
    expect(r.retail!.salesTax).toBe(0);
    expect(r.impliedMargin!.amount).toBeCloseTo(14.99, 12);
  });

  it('takes the tax out before the retailer and platform shares: 19.99 GBP at 20 % with 40 % / 15 % [C]', () => {
    const r = rollUpCost({ ...base, model: { ...flat, retailMarginFraction: 0.4, platformMarginFraction: 0.15 }, retail: { amount: 19.99, currency: 'USD', salesTaxRate: 0.2 } });
    // before tax 19.99 / 1.2 = 16.658333333; retailer 40 % = 6.663333333; platform 15 % of 9.995 = 1.49925; net 8.49575
    expect(r.retail!.beforeTax).toBeCloseTo(16.658333333, 9);
    expect(r.retail!.retailerShare).toBeCloseTo(6.663333333, 9);
    expect(r.retail!.platformShare).toBeCloseTo(1.49925, 9);
    expect(r.retail!.netToMaker).toBeCloseTo(8.49575, 9);
    // the four parts give back the price as seen
    expect(r.retail!.netToMaker + r.retail!.platformShare + r.retail!.retailerShare + r.retail!.salesTax).toBeCloseTo(19.99, 12);
  });

  it('refuses a rate outside 0–100 %', () => {
    expect(() => rollUpCost({ ...base, retail: { amount: 10, currency: 'USD', salesTaxRate: 20 } })).toThrow(/retail\.salesTaxRate must be between 0 and 1/);
  });
});

describe('rollUpCost — a margin with unpriced lines is incomplete, not a number', () => {
  const model0: CostModel = { ...model, currency: 'USD', packagingCost: 0, manualOperations: [], testMinutes: 0 };
  const unpriced = (n: number) => Array.from({ length: n }, (_, k) => ({ partId: `P${k + 1}`, category: 'passive', quantity: 1, mount: 'smt' as const }));
  const priced = (n: number) => unpriced(n).map((l) => ({ ...l, price: { currency: 'USD', confidence: 'high' as const, breaks: [{ minQty: 1, unitPrice: 0.1 }] } }));

  it('0 of 13 lines priced: no margin figure, the reason and the count instead', () => {
    const r = rollUpCost({ volume: 1000, currency: 'USD', rates, model: model0, lines: unpriced(13), retail: { amount: 24.99, currency: 'USD', salesTaxRate: 0 } });
    expect(r.impliedMargin).toMatchObject({ amount: null, fraction: null, complete: false, pricedLines: 0, totalLines: 13 });
    expect(r.impliedMargin!.reason).toMatch(/^0 of 13 lines priced/);
    // The retail split does not depend on the BOM and is still given; the margin step is left out.
    expect(r.retail!.netToMaker).toBeGreaterThan(0);
    expect(r.steps.map((s) => s.key)).not.toContain('impliedMargin');
  });

  it('3 of 13 lines priced: incomplete, at every volume', () => {
    const lines = [...priced(3), ...unpriced(10)];
    const rows = costAtVolumes([100, 1000], { currency: 'USD', rates, model: model0, lines, retail: { amount: 24.99, currency: 'USD', salesTaxRate: 0 } });
    for (const row of rows) {
      expect(row.impliedMargin).toMatchObject({ amount: null, fraction: null, complete: false, pricedLines: 3, totalLines: 13 });
      expect(row.impliedMargin!.reason).toMatch(/^3 of 13 lines priced/);
    }
  });

  it('every line priced: complete, with no reason', () => {
    const r = rollUpCost({ volume: 1000, currency: 'USD', rates, model: model0, lines: priced(13), retail: { amount: 24.99, currency: 'USD', salesTaxRate: 0 } });
    expect(r.impliedMargin).toMatchObject({ complete: true, reason: null, pricedLines: 13, totalLines: 13 });
    expect(typeof r.impliedMargin!.amount).toBe('number');
  });

  it('no parts at all: incomplete too', () => {
    const r = rollUpCost({ volume: 1, currency: 'USD', rates, model: model0, lines: [], retail: { amount: 24.99, currency: 'USD', salesTaxRate: 0 } });
    expect(r.impliedMargin).toMatchObject({ amount: null, complete: false, pricedLines: 0, totalLines: 0 });
    expect(r.impliedMargin!.reason).toMatch(/no parts/i);
  });
});

describe('rollUpCost — the price break is chosen on the purchased quantity, attrition included', () => {
  // Purchased = ceil(quantity × volume × (1 + attrition)); the break is the highest minQty ≤ purchased
  // [CP: attrition is extra parts bought to cover losses, REFERENCES §10].
  const breaks = [
    { minQty: 10, unitPrice: 1 },
    { minQty: 2000, unitPrice: 0.5 },
  ];
  const at = (volume: number) =>
    rollUpCost({
      ...input,
      volume,
      currency: 'USD',
      retail: null,
      // 'ic' attrition is 1 % in the model above.
      lines: [{ partId: 'P', category: 'ic', quantity: 2, mount: 'smt', price: { currency: 'USD', confidence: 'high', breaks } }],
    }).lines[0]!;

  it('990 units: 2 × 990 = 1 980 fitted, but ceil(1 980 × 1.01) = 2 000 bought → the 2 000 break [C]', () => {
    // quantity × volume alone (1 980) would pick the 10 break at 1.00.
    expect(at(990)).toMatchObject({ buyQuantity: 2000, breakMinQty: 2000, unitPrice: 0.5 });
  });

  it('989 units: ceil(1 978 × 1.01 = 1 997.78) = 1 998 bought → still the 10 break [C]', () => {
    expect(at(989)).toMatchObject({ buyQuantity: 1998, breakMinQty: 10, unitPrice: 1 });
  });

  it('no float noise in the purchased quantity: 1 000 × 1.07 is 1 070, not 1 071 [C]', () => {
    const r = rollUpCost({
      ...input,
      volume: 1000,
      currency: 'USD',
      retail: null,
      model: { ...model, attritionByCategory: { passive: 0.07 } },
      lines: [{ partId: 'R', category: 'passive', quantity: 1, mount: 'smt', price: { currency: 'USD', confidence: 'high', breaks: [{ minQty: 1, unitPrice: 0.01 }] } }],
    });
    expect(r.lines[0]!.buyQuantity).toBe(1070);
  });
});

describe('rollUpCost — insurance basis (REFERENCES §10: CIF = FOB + freight + insurance; insurance 0.5–2 % of goods value [S/CP])', () => {
  // Goods (ex-works) 15.00 USD and freight 0.80 USD as in the §10 worked example; insurance 1 %, duty 2.7 % on CIF [S].
  const goods: CostModel = {
    currency: 'USD',
    attritionByCategory: {},
    defaultAttrition: 0,
    smtCostPerPlacement: 0,
    thtCostPerJoint: 0,
    manualOperations: [],
    labourRatePerHour: 0,
    testMinutes: 0,
    packagingCost: 0,
    overheadFraction: 0,
    freightFraction: 0.8 / 15,
    insuranceFraction: 0.01,
    dutyFraction: 0.027,
    retailMarginFraction: 0,
    platformMarginFraction: 0,
    confidenceBand: { high: 0, medium: 0, low: 0 },
  };
  const fob = (m: CostModel) =>
    rollUpCost({
      volume: 1,
      currency: 'USD',
      rates: { base: 'USD', rates: {} },
      model: m,
      lines: [{ partId: 'G', category: 'x', quantity: 1, mount: 'manual', price: { currency: 'USD', confidence: 'high', breaks: [{ minQty: 1, unitPrice: 15 }] } }],
    });

  it('CIF basis (the default): insurance = 1 % × (15.00 + 0.80) = 0.158, CIF 15.958, duty 0.430866 [C]', () => {
    for (const r of [fob(goods), fob({ ...goods, insuranceBasis: 'cif' })]) {
      expect(r.exWorks).toBeCloseTo(15, 12);
      expect(r.freight).toBeCloseTo(0.8, 12);
      expect(r.insurance).toBeCloseTo(0.158, 12);
      expect(r.duty).toBeCloseTo(0.027 * 15.958, 12);
      expect(r.landed).toBeCloseTo(15.958 + 0.430866, 12);
      const step = Object.fromEntries(r.steps.map((s) => [s.key, s]));
      expect(step.insurance!.formula).toBe('0.01 × (15 + 0.8) = 0.158');
      expect(step.insurance!.inputs[0]).toEqual({ label: 'Goods + freight (CIF basis)', value: expect.closeTo(15.8, 12), unit: 'USD' });
    }
  });

  it('goods basis, as the §10 worked example insures: 1 % × 15.00 = 0.15, CIF 15.95, 16.38065 with duty [S/C]', () => {
    const r = fob({ ...goods, insuranceBasis: 'goods' });
    expect(r.insurance).toBeCloseTo(0.15, 12);
    expect(r.exWorks + r.freight + r.insurance).toBeCloseTo(15.95, 12);
    expect(r.duty).toBeCloseTo(0.43065, 12);
    expect(r.landed).toBeCloseTo(16.38065, 12);
    const step = Object.fromEntries(r.steps.map((s) => [s.key, s]));
    expect(step.insurance!.formula).toBe('0.01 × 15 = 0.15');
  });

  it('refuses an unknown basis', () => {
    expect(() => fob({ ...goods, insuranceBasis: 'fob' as never })).toThrow(/model\.insuranceBasis must be one of cif, goods/);
  });
});
