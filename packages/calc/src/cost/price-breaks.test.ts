import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { unitPriceAtQuantity, validatePriceBreaks } from './price-breaks';

const breaks = [
  { minQty: 1, unitPrice: 0.5 },
  { minQty: 100, unitPrice: 0.3 },
  { minQty: 1000, unitPrice: 0.2 },
];

describe('unitPriceAtQuantity', () => {
  it('takes the break with the largest minQty not above the quantity, at and around each boundary [CP]', () => {
    expect(unitPriceAtQuantity(breaks, 1)).toBe(0.5);
    expect(unitPriceAtQuantity(breaks, 99)).toBe(0.5); // one below a break
    expect(unitPriceAtQuantity(breaks, 100)).toBe(0.3); // exactly at a break
    expect(unitPriceAtQuantity(breaks, 101)).toBe(0.3);
    expect(unitPriceAtQuantity(breaks, 999)).toBe(0.3);
    expect(unitPriceAtQuantity(breaks, 1000)).toBe(0.2);
    expect(unitPriceAtQuantity(breaks, 1e9)).toBe(0.2);
    expect(unitPriceAtQuantity(breaks, 99.5)).toBe(0.5); // metres of wire may be fractional
  });

  it('agrees with a brute-force search (property) [C]', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 1, max: 100_000 }), { minLength: 1, maxLength: 8 }), fc.integer({ min: 1, max: 200_000 }), (qtys, qty) => {
        const sorted = [...qtys].sort((a, b) => a - b);
        const list = sorted.map((minQty, k) => ({ minQty, unitPrice: 10 - k }));
        const eligible = list.filter((b) => b.minQty <= qty);
        if (eligible.length === 0) {
          expect(() => unitPriceAtQuantity(list, qty)).toThrow(/below the smallest price break/);
        } else {
          expect(unitPriceAtQuantity(list, qty)).toBe(eligible[eligible.length - 1]!.unitPrice);
        }
      }),
    );
  });

  it('rejects a quantity below the first break or not positive', () => {
    expect(() => unitPriceAtQuantity([{ minQty: 10, unitPrice: 1 }], 9)).toThrow(/quantity 9 is below the smallest price break \(minQty 10\)/);
    expect(() => unitPriceAtQuantity(breaks, 0)).toThrow(/quantity must be greater than zero/);
  });

  it('rejects overlapping or unordered breaks, naming the index', () => {
    expect(() =>
      unitPriceAtQuantity(
        [
          { minQty: 1, unitPrice: 1 },
          { minQty: 100, unitPrice: 0.9 },
          { minQty: 100, unitPrice: 0.8 },
        ],
        150,
      ),
    ).toThrow(/^breaks\[2\]\.minQty: price breaks overlap or are out of order \(minQty 100 after 100\)/);
    expect(() =>
      unitPriceAtQuantity(
        [
          { minQty: 100, unitPrice: 1 },
          { minQty: 10, unitPrice: 0.9 },
        ],
        150,
      ),
    ).toThrow(/breaks\[1\]\.minQty: price breaks overlap or are out of order/);
    expect(() => unitPriceAtQuantity([{ minQty: 1, unitPrice: -0.1 }], 5)).toThrow(/breaks\[0\]\.unitPrice must be a number not below zero/);
    expect(() => unitPriceAtQuantity([], 5)).toThrow(/breaks needs at least one price break/);
  });
});

describe('validatePriceBreaks', () => {
  it('lists every problem with its index and field', () => {
    const problems = validatePriceBreaks([{ minQty: 10, unitPrice: 1 }, { minQty: 0, unitPrice: 1 }, { minQty: 5, unitPrice: -2 }, null as never, { minQty: 20, unitPrice: Number.NaN }]);
    expect(problems.map(({ index, field }) => ({ index, field }))).toEqual([
      { index: 1, field: 'minQty' },
      { index: 2, field: 'minQty' },
      { index: 2, field: 'unitPrice' },
      { index: 3, field: 'breaks' },
      { index: 4, field: 'unitPrice' },
    ]);
    expect(problems[1]!.message).toMatch(/price breaks overlap or are out of order \(minQty 5 after 10\)/);
    expect(validatePriceBreaks(breaks)).toEqual([]);
    expect(validatePriceBreaks('x' as never)).toEqual([{ index: null, field: 'breaks', message: 'breaks must be a list of { minQty, unitPrice }.' }]);
    expect(validatePriceBreaks([], 'lines[0].price.breaks')[0]!.message).toBe('lines[0].price.breaks needs at least one price break.');
  });
});
