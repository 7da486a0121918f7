import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { convertCurrency, normaliseCurrency, rateFor } from './currency';

// REFERENCES §9: illustrative ECB-style rates, units per 1 EUR [S: ECB rate page; C].
const table = { base: 'EUR', rates: { USD: 1.0856, CNY: 7.85, GBP: 0.8567 } };

describe('convertCurrency', () => {
  it('gives the §9 cross rates [S: ECB convention; C]', () => {
    expect(convertCurrency(1, 'USD', 'CNY', table)).toBeCloseTo(7.231024, 6);
    expect(convertCurrency(100, 'USD', 'CNY', table)).toBeCloseTo(723.1024, 4);
    expect(convertCurrency(1, 'CNY', 'USD', table)).toBeCloseTo(0.138293, 6);
    expect(convertCurrency(1, 'GBP', 'USD', table)).toBeCloseTo(1.267188, 6);
    expect(convertCurrency(250, 'USD', 'EUR', table)).toBeCloseTo(230.2874, 4);
  });

  it('treats the base as rate 1 whether listed or not [S: EUR is not listed in the ECB file]', () => {
    expect(convertCurrency(10, 'EUR', 'USD', table)).toBeCloseTo(10.856, 12);
    const listed = { base: 'EUR', rates: { ...table.rates, EUR: 1 } };
    expect(convertCurrency(10, 'EUR', 'USD', listed)).toBeCloseTo(10.856, 12);
    expect(() => convertCurrency(10, 'EUR', 'USD', { base: 'EUR', rates: { EUR: 1.1, USD: 1.0856 } })).toThrow(/base currency EUR must have rate 1/);
  });

  it('accepts codes in any case and with spaces, and needs no rate to stay in one currency', () => {
    expect(convertCurrency(1, ' usd', 'cny ', table)).toBeCloseTo(7.231024, 6);
    expect(convertCurrency(1, 'USD', 'CNY', { base: 'eur', rates: { usd: 1.0856, cny: 7.85 } })).toBeCloseTo(7.231024, 6);
    expect(convertCurrency(42, 'JPY', 'JPY', table)).toBe(42);
  });

  it('round-trips and is consistent through any intermediate currency (property) [C]', () => {
    const codes = ['EUR', 'USD', 'CNY', 'GBP'] as const;
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.constantFrom(...codes), fc.constantFrom(...codes), fc.constantFrom(...codes), (amount, a, b, c) => {
        const direct = convertCurrency(amount, a, c, table);
        const viaB = convertCurrency(convertCurrency(amount, a, b, table), b, c, table);
        expect(Math.abs(viaB - direct)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(direct)));
        const back = convertCurrency(direct, c, a, table);
        expect(Math.abs(back - amount)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(amount)));
      }),
    );
  });

  it('names an unknown currency, a bad code and a bad rate', () => {
    expect(() => convertCurrency(1, 'USD', 'JPY', table)).toThrow(/to: no exchange rate for JPY in the rate table \(base EUR\)/);
    expect(() => convertCurrency(1, 'XYZ', 'USD', table)).toThrow(/from: no exchange rate for XYZ/);
    expect(() => convertCurrency(1, 'US', 'EUR', table)).toThrow(/from must be a three-letter currency code/);
    expect(() => convertCurrency(Number.NaN, 'USD', 'EUR', table)).toThrow(/amount/);
    expect(() => convertCurrency(1, 'USD', 'EUR', { base: 'EUR', rates: { USD: 0 } })).toThrow(/rates\.rates\.USD must be greater than zero/);
    expect(() => convertCurrency(1, 'USD', 'EUR', { base: 'EUR', rates: { USD: Number.NaN } })).toThrow(/rates\.rates\.USD must be a finite number/);
    expect(() => convertCurrency(1, 'USD', 'EUR', null as never)).toThrow(/rate table/);
    expect(() => convertCurrency(1, 'USD', 'EUR', { base: 'euro', rates: {} })).toThrow(/rates\.base/);
  });
});

describe('rateFor and normaliseCurrency', () => {
  it('looks up a rate and names the field on failure', () => {
    expect(rateFor(table, 'gbp')).toBe(0.8567);
    expect(rateFor(table, 'EUR')).toBe(1);
    expect(() => rateFor(table, 'JPY', 'lines[2].price.currency')).toThrow(/^lines\[2\]\.price\.currency: no exchange rate for JPY/);
    expect(normaliseCurrency(' chf ')).toBe('CHF');
    expect(() => normaliseCurrency(7 as never, 'retail.currency')).toThrow(/retail\.currency must be a three-letter currency code/);
  });
});
