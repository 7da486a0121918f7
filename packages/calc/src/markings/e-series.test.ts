import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { E_SERIES, E_SERIES_TOLERANCE_PERCENT, isPreferredValue, nearestPreferredValue, nextPreferredAtOrAbove, preferredValues, type ESeries } from './e-series';

// Lists as printed in REFERENCES §1 [S: IEC 60063:2015].
const E6 = [10, 15, 22, 33, 47, 68];
const E12 = [10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82];
const E24 = [10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91];
const E96 = [
  100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150, 154, 158, 162, 165, 169, 174, 178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243, 249,
  255, 261, 267, 274, 280, 287, 294, 301, 309, 316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412, 422, 432, 442, 453, 464, 475, 487, 499, 511, 523, 536, 549, 562, 576, 590, 604, 619, 634,
  649, 665, 681, 698, 715, 732, 750, 768, 787, 806, 825, 845, 866, 887, 909, 931, 953, 976,
];
const asDigits = (series: ESeries, digits: number) => preferredValues(series).map((v) => Math.round(v * 10 ** (digits - 1)));

describe('IEC 60063 E-series values (REFERENCES §1)', () => {
  it('E6 is 10 15 22 33 47 68 [S]', () => expect(asDigits('E6', 2)).toEqual(E6));
  it('E12 is 10 12 15 18 22 27 33 39 47 56 68 82 [S]', () => expect(asDigits('E12', 2)).toEqual(E12));
  it('E24 is the listed 24 values [S]', () => expect(asDigits('E24', 2)).toEqual(E24));
  it('E96 is the listed table, index n = round(100·10^((n−1)/96)) [S; C]', () => {
    expect(asDigits('E96', 3)).toEqual(E96);
    expect(E96.map((_, i) => Math.round(100 * 10 ** (i / 96)))).toEqual(E96);
  });
  it('E48 is every second E96 value, starting at 100 (100, 105, 110, 115, 121 … 953) [S; C]', () => {
    const e48 = asDigits('E48', 3);
    expect(e48).toEqual(E96.filter((_, i) => i % 2 === 0));
    expect(e48.slice(0, 5)).toEqual([100, 105, 110, 115, 121]);
    expect(e48.at(-1)).toBe(953);
    expect(e48).toHaveLength(48);
  });
  it('E192 is round(100·10^(i/192)) except 920 where the formula gives 919 [S; M for the exception]', () => {
    const e192 = asDigits('E192', 3);
    expect(e192).toHaveLength(192);
    const formula = Array.from({ length: 192 }, (_, i) => Math.round(100 * 10 ** (i / 192)));
    const differences = e192.map((v, i) => [i, formula[i], v]).filter(([, f, v]) => f !== v);
    expect(differences).toEqual([[185, 919, 920]]);
  });
  it('E96 is every second E192 value; E12 every second E24; E6 every second E12 [C]', () => {
    expect(asDigits('E192', 3).filter((_, i) => i % 2 === 0)).toEqual(E96);
    expect(E24.filter((_, i) => i % 2 === 0)).toEqual(E12);
    expect(E12.filter((_, i) => i % 2 === 0)).toEqual(E6);
  });
  it('E24 departs from 10^(i/24) at 27, 30, 33, 36, 39, 43, 47, 82 (formula 26, 29, 32, 35, 38, 42, 46, 83) [C; S]', () => {
    const formula = Array.from({ length: 24 }, (_, i) => Math.round(10 * 10 ** (i / 24)));
    const differences = E24.map((v, i) => [formula[i], v]).filter(([f, v]) => f !== v);
    expect(differences).toEqual([
      [26, 27],
      [29, 30],
      [32, 33],
      [35, 36],
      [38, 39],
      [42, 43],
      [46, 47],
      [83, 82],
    ]);
    expect(asDigits('E24', 2)).toEqual(E24);
  });
  it('values are given in one decade as 1.0 … 9.x, exactly as decimal numbers', () => {
    expect(preferredValues('E6')).toEqual([1, 1.5, 2.2, 3.3, 4.7, 6.8]);
    expect(preferredValues('E96').slice(0, 3)).toEqual([1, 1.02, 1.05]);
    expect(E_SERIES.map((s) => preferredValues(s).length)).toEqual([6, 12, 24, 48, 96, 192]);
    expect(E_SERIES_TOLERANCE_PERCENT.E24).toBe(5);
  });
});

describe('nearest preferred value, log rule (REFERENCES §1)', () => {
  it("E24 319 Ω gives 330 Ω (boundary 314.64) [C; S: a library's documentation]", () => {
    expect(nearestPreferredValue(319, 'E24')).toBe(330);
    expect(Math.sqrt(300 * 330)).toBeCloseTo(314.64, 2);
    expect(nearestPreferredValue(314.6, 'E24')).toBe(300);
  });
  it('E96 16 834.2 Ω gives 16.9 kΩ [S]', () => {
    expect(nearestPreferredValue(16834.2, 'E96')).toBe(16900);
  });
  it('E24 104.9 Ω gives 110 Ω by the log rule (boundary 104.881); the linear rule would give 100 Ω [C]', () => {
    expect(nearestPreferredValue(104.9, 'E24')).toBe(110);
    expect(Math.sqrt(100 * 110)).toBeCloseTo(104.881, 3);
    expect(nearestPreferredValue(104.8, 'E24')).toBe(100);
  });
  it('E6 2 700 Ω gives 3 300 Ω by the log rule (boundary 2 694.44); the linear rule would give 2 200 Ω [C]', () => {
    expect(nearestPreferredValue(2700, 'E6')).toBe(3300);
    expect(Math.sqrt(2200 * 3300)).toBeCloseTo(2694.44, 2);
  });
  it('E12 5 000 Ω gives 4 700 Ω (boundary 5 130.3) [C]', () => {
    expect(nearestPreferredValue(5000, 'E12')).toBe(4700);
    expect(Math.sqrt(4700 * 5600)).toBeCloseTo(5130.3, 1);
  });
  it('E96 184 Ω gives nearest 182 Ω, and the next value at or above 184 is 187 Ω [S]', () => {
    expect(nearestPreferredValue(184, 'E96')).toBe(182);
    expect(nextPreferredAtOrAbove(184, 'E96')).toBe(187);
  });
  it('works across decades and for small values [C]', () => {
    expect(nearestPreferredValue(9.6, 'E24')).toBe(10); // boundary √(91·100)/10 = 9.539
    expect(nearestPreferredValue(0.00047, 'E12')).toBe(0.00047);
    expect(nearestPreferredValue(0.33, 'E6')).toBe(0.33);
    expect(nearestPreferredValue(1e6, 'E192')).toBe(1e6);
    expect(nearestPreferredValue(9.2e3, 'E192')).toBe(9200);
    expect(nextPreferredAtOrAbove(4700, 'E12')).toBe(4700);
    expect(nextPreferredAtOrAbove(4701, 'E12')).toBe(5600);
    expect(nextPreferredAtOrAbove(2.2 * 100, 'E6')).toBe(220);
    expect(nextPreferredAtOrAbove(8300, 'E24')).toBe(9100);
    expect(nextPreferredAtOrAbove(9200, 'E24')).toBe(10000);
    expect(nextPreferredAtOrAbove(0.095, 'E6')).toBe(0.1);
  });
  it('membership check', () => {
    expect(isPreferredValue(4700, 'E12')).toBe(true);
    expect(isPreferredValue(4300, 'E12')).toBe(false);
    expect(isPreferredValue(4300, 'E24')).toBe(true);
  });
  it('rejects bad values and unknown series', () => {
    expect(() => nearestPreferredValue(0, 'E24')).toThrow(/Value/);
    expect(() => nearestPreferredValue(-10, 'E24')).toThrow(RangeError);
    expect(() => nearestPreferredValue(Number.NaN, 'E24')).toThrow(RangeError);
    expect(() => nearestPreferredValue(10, 'E3' as never)).toThrow(/series must be one of/);
    expect(() => preferredValues('E7' as never)).toThrow(RangeError);
    expect(() => nextPreferredAtOrAbove(-1, 'E6')).toThrow(/Value/);
  });
});

describe('nearest preferred value properties', () => {
  const value = fc.double({ min: 1e-3, max: 1e9, noNaN: true });
  const series = fc.constantFrom(...E_SERIES);
  const membersAround = (v: number, s: ESeries) => {
    const e = Math.floor(Math.log10(v));
    return [e - 2, e - 1, e, e + 1, e + 2].flatMap((k) => preferredValues(s).map((p) => p * 10 ** k));
  };

  it('the result is a member of the series', () => {
    fc.assert(
      fc.property(value, series, (v, s) => {
        const n = nearestPreferredValue(v, s);
        const mantissa = n / 10 ** Math.floor(Math.log10(n) + 1e-12);
        expect(preferredValues(s).some((p) => Math.abs(p - mantissa) < 1e-9)).toBe(true);
      }),
    );
  });

  it('no other member is closer by the log rule', () => {
    fc.assert(
      fc.property(value, series, (v, s) => {
        const n = nearestPreferredValue(v, s);
        const d = Math.abs(Math.log(v / n));
        for (const m of membersAround(v, s)) expect(d).toBeLessThanOrEqual(Math.abs(Math.log(v / m)) + 1e-12);
      }),
    );
  });

  it('the next value at or above is ≥ the value, and no member lies between them', () => {
    fc.assert(
      fc.property(value, series, (v, s) => {
        const up = nextPreferredAtOrAbove(v, s);
        expect(up).toBeGreaterThanOrEqual(v * (1 - 1e-12));
        for (const m of membersAround(v, s)) expect(m >= v * (1 + 1e-12) && m < up * (1 - 1e-12)).toBe(false);
      }),
    );
  });

  it('a member maps to itself', () => {
    fc.assert(
      fc.property(series, fc.integer({ min: -3, max: 6 }), fc.nat(191), (s, k, i) => {
        const values = preferredValues(s);
        const member = (values[i % values.length] as number) * 10 ** k;
        expect(nearestPreferredValue(member, s) / member).toBeCloseTo(1, 12);
        expect(nextPreferredAtOrAbove(member, s) / member).toBeCloseTo(1, 12);
      }),
    );
  });
});
