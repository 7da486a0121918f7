import { describe, expect, it } from 'vitest';
import { rollUpCost, type CostModel } from './roll-up';
import { costWaterfall } from './waterfall';

// A small BOM in one currency, worked by hand [C].
const model: CostModel = {
  currency: 'USD',
  attritionByCategory: {},
  defaultAttrition: 0,
  smtCostPerPlacement: 0.01,
  thtCostPerJoint: 0,
  manualOperations: [{ label: 'Solder leads', minutes: 6 }],
  labourRatePerHour: 5,
  testMinutes: 0,
  packagingCost: 0.5,
  overheadFraction: 0.1,
  freightFraction: 0.05,
  dutyFraction: 0,
  retailMarginFraction: 0.5,
  platformMarginFraction: 0.2,
  confidenceBand: { high: 0, medium: 0, low: 0 },
};
const price = (unitPrice: number) => ({ currency: 'USD', confidence: 'high' as const, breaks: [{ minQty: 1, unitPrice }] });

describe('costWaterfall — from parts to retail [C]', () => {
  const r = rollUpCost({
    volume: 100,
    currency: 'USD',
    rates: { base: 'USD', rates: {} },
    model,
    lines: [
      { partId: 'A', category: 'ic', quantity: 1, mount: 'smt', price: price(3) },
      { partId: 'B', category: 'passive', quantity: 100, mount: 'smt', price: price(0.01) },
    ],
    retail: { amount: 20, currency: 'USD' },
  });
  const bars = costWaterfall(r);
  const bar = Object.fromEntries(bars.map((b) => [b.key, b]));

  it('stacks each cost on the running total and stands subtotals on zero', () => {
    // parts = 3 + 100 × 0.01 = 4.00; assembly = 101 placements × 0.01 = 1.01; labour = 6/60 × 5 = 0.50
    // test 0; packaging 0.50; yield loss 0; overhead = 0.10 × (4 + 1.01 + 0.5 + 0.5) = 0.601
    // ex-works = 6.611; freight = 0.05 × 6.611 = 0.33055; insurance 0; duty 0; landed = 6.94155
    expect(bars.map((b) => b.key)).toEqual([
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
      'impliedMargin',
      'netToMaker',
      'platform',
      'retailer',
      'retail',
    ]);
    expect(bar.parts).toMatchObject({ kind: 'step', start: 0, end: 4 });
    expect(bar.assembly!.start).toBeCloseTo(4, 12);
    expect(bar.assembly!.end).toBeCloseTo(5.01, 12);
    expect(bar.labour!.end).toBeCloseTo(5.51, 12);
    expect(bar.packaging!.end).toBeCloseTo(6.01, 12);
    expect(bar.overhead!.end).toBeCloseTo(6.611, 12);
    expect(bar.exWorks).toMatchObject({ kind: 'subtotal', start: 0 });
    expect(bar.exWorks!.end).toBeCloseTo(6.611, 12);
    expect(bar.freight!.start).toBeCloseTo(6.611, 12);
    expect(bar.freight!.end).toBeCloseTo(6.94155, 12);
    expect(bar.landed!.value).toBeCloseTo(6.94155, 12);
  });

  it('splits the retail price into maker margin, platform fee and retailer margin', () => {
    // retailer = 20 × 0.5 = 10; platform = (20 − 10) × 0.2 = 2; net to maker = 8; maker margin = 8 − 6.94155 = 1.05845
    expect(bar.impliedMargin!.value).toBeCloseTo(1.05845, 12);
    expect(bar.impliedMargin!.end).toBeCloseTo(8, 12);
    expect(bar.netToMaker).toMatchObject({ kind: 'subtotal', start: 0, end: 8 });
    expect(bar.platform).toMatchObject({ start: 8, end: 10, value: 2 });
    expect(bar.retailer).toMatchObject({ start: 10, end: 20, value: 10 });
    expect(bar.retail).toMatchObject({ kind: 'total', start: 0, end: 20, value: 20 });
  });

  it('shows a loss as a step down, and stops at landed cost without a retail price', () => {
    const loss = costWaterfall(
      rollUpCost({
        ...r,
        volume: 100,
        rates: { base: 'USD', rates: {} },
        model,
        lines: [{ partId: 'A', category: 'ic', quantity: 1, mount: 'manual', price: price(9) }],
        retail: { amount: 10, currency: 'USD' },
      }),
    );
    const margin = loss.find((b) => b.key === 'impliedMargin')!;
    expect(margin.value).toBeLessThan(0);
    expect(margin.end).toBeLessThan(margin.start);
    const noRetail = costWaterfall(rollUpCost({ volume: 1, currency: 'USD', rates: { base: 'USD', rates: {} }, model, lines: [] }));
    expect(noRetail.at(-1)!.key).toBe('landed');
  });
});

describe('costWaterfall — sales tax and an incomplete margin', () => {
  const base = { volume: 100, currency: 'USD', rates: { base: 'USD', rates: {} }, model };
  const lines = [
    { partId: 'A', category: 'ic', quantity: 1, mount: 'smt' as const, price: price(3) },
    { partId: 'B', category: 'passive', quantity: 100, mount: 'smt' as const, price: price(0.01) },
  ];

  it('puts the sales tax on top of the retailer margin: 24.00 at 20 % → 20.00 before tax, 4.00 tax [CP; C]', () => {
    const bars = costWaterfall(rollUpCost({ ...base, lines, retail: { amount: 24, currency: 'USD', salesTaxRate: 0.2 } }));
    const bar = Object.fromEntries(bars.map((b) => [b.key, b]));
    expect(bars.map((b) => b.key).slice(-6)).toEqual(['impliedMargin', 'netToMaker', 'platform', 'retailer', 'salesTax', 'retail']);
    // before tax 20; retailer 10; platform 2; net 8 — as in the test above; tax 24 − 20 = 4
    expect(bar.retailer!.end).toBeCloseTo(20, 12);
    expect(bar.salesTax!.start).toBeCloseTo(20, 12);
    expect(bar.salesTax!.value).toBeCloseTo(4, 12);
    expect(bar.retail).toMatchObject({ kind: 'total', start: 0, end: 24 });
  });

  it('stops at landed cost while a line is unpriced: no margin is drawn', () => {
    const bars = costWaterfall(rollUpCost({ ...base, lines: [...lines, { partId: 'C', category: 'x', quantity: 1, mount: 'manual' }], retail: { amount: 24, currency: 'USD', salesTaxRate: 0.2 } }));
    expect(bars.at(-1)!.key).toBe('landed');
    expect(bars.map((b) => b.key)).not.toContain('impliedMargin');
  });
});
