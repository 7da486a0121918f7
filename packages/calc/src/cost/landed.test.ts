import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { landedCost, marginFromMarkup, markupFromMargin } from './landed';

describe('landedCost', () => {
  it('works the §10 example: FOB 15 + freight 0.80 + 1 % insurance → CIF 15.95 → 16.38065 → 19.65678 [S: customs-valuation guides; C]', () => {
    const r = landedCost({ fob: 15, freight: 0.8, insuranceFraction: 0.01, dutyFraction: 0.027, vatFraction: 0.2 });
    expect(r.insurance).toBeCloseTo(0.15, 12);
    expect(r.cif).toBeCloseTo(15.95, 12);
    expect(r.duty).toBeCloseTo(0.43065, 12);
    expect(r.dutyPaid).toBeCloseTo(16.38065, 12);
    expect(r.vat).toBeCloseTo(3.27613, 12);
    expect(r.landed).toBeCloseTo(19.65678, 12);
    expect(r.brokerage).toBe(0);
  });

  it('adds brokerage after VAT [M]', () => {
    const r = landedCost({ fob: 15, freight: 0.8, insuranceFraction: 0.01, dutyFraction: 0.027, vatFraction: 0.2, brokerage: 0.5 });
    expect(r.landed).toBeCloseTo(20.15678, 12);
  });

  it('names the wrong input', () => {
    const ok = { fob: 15, freight: 0.8, insuranceFraction: 0.01, dutyFraction: 0.027, vatFraction: 0.2 };
    expect(() => landedCost({ ...ok, fob: -1 })).toThrow(/fob/);
    expect(() => landedCost({ ...ok, dutyFraction: 2.7 })).toThrow(/dutyFraction must be between 0 and 1/);
    expect(() => landedCost({ ...ok, brokerage: -1 })).toThrow(/brokerage/);
  });
});

describe('markup and margin', () => {
  it('keystone: $20 at markup 1 retails at $40, a 50 % margin [S: marketing dictionaries]', () => {
    expect(marginFromMarkup(1)).toBe(0.5);
    expect(20 * (1 + markupFromMargin(0.5))).toBe(40);
    // Double keystone: 4 × cost is a markup of 3 [S, CP]
    expect(marginFromMarkup(3)).toBe(0.75);
  });

  it('markups 0.5, 2 and 3 give margins 33.33 %, 66.67 % and 75 % (REFERENCES §10) [C]', () => {
    expect(marginFromMarkup(0.5)).toBeCloseTo(0.333333, 6);
    expect(marginFromMarkup(2)).toBeCloseTo(0.666667, 6);
    expect(marginFromMarkup(3)).toBeCloseTo(0.75, 12);
  });

  it('are inverse of each other (property) [C]', () => {
    fc.assert(
      fc.property(fc.double({ min: -0.99, max: 100, noNaN: true }), (markup) => {
        expect(markupFromMargin(marginFromMarkup(markup))).toBeCloseTo(markup, 6);
      }),
    );
  });

  it('rejects impossible values', () => {
    expect(() => marginFromMarkup(-1)).toThrow(/markup must be above/);
    expect(() => markupFromMargin(1)).toThrow(/margin must be below 1/);
    expect(() => markupFromMargin(Number.NaN)).toThrow(/margin must be a finite number/);
  });
});

describe('landedCost — insurance basis', () => {
  it('CIF basis insures goods + freight: 1 % × (15.00 + 0.80) = 0.158, CIF 15.958 (the §10 example insures goods only: 15.95) [S/CP; C]', () => {
    const r = landedCost({ fob: 15, freight: 0.8, insuranceFraction: 0.01, insuranceBasis: 'cif', dutyFraction: 0.027, vatFraction: 0.2 });
    expect(r.insurance).toBeCloseTo(0.158, 12);
    expect(r.cif).toBeCloseTo(15.958, 12);
    expect(r.duty).toBeCloseTo(0.430866, 12);
    const goods = landedCost({ fob: 15, freight: 0.8, insuranceFraction: 0.01, insuranceBasis: 'goods', dutyFraction: 0.027, vatFraction: 0.2 });
    expect(goods.cif).toBeCloseTo(15.95, 12);
    expect(() => landedCost({ fob: 15, freight: 0.8, insuranceFraction: 0.01, insuranceBasis: 'x' as never, dutyFraction: 0, vatFraction: 0 })).toThrow(/insuranceBasis/);
  });
});
