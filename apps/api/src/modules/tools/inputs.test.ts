import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readToolField, readToolFields } from './inputs';

// SI prefixes: BIPM SI Brochure, 9th ed., Table 7 [S]; 1 oz/ft² copper = 35 µm in IPC-2221 work [S].
describe('bench-tool inputs', () => {
  it('reads copper weight as thickness: "1 oz" = 35 µm, "2 oz/ft²" = 70 µm, "0.5oz" = 17.5 µm [S]', () => {
    expect(readToolField('1 oz', 'copper-thickness')).toEqual({ entered: '1 oz', value: 35e-6, unit: 'm' });
    expect(readToolField('2 oz/ft²', 'copper-thickness').value).toBeCloseTo(70e-6, 15);
    expect(readToolField('0.5oz', 'copper-thickness').value).toBeCloseTo(17.5e-6, 15);
    expect(readToolField('35 µm', 'copper-thickness').value).toBeCloseTo(35e-6, 15);
    expect(readToolField('1.378 mil', 'copper-thickness').value).toBeCloseTo(35.0012e-6, 10);
    expect(() => readToolField('1 lb', 'copper-thickness')).toThrow(/copper thickness such as "35 µm" or a copper weight such as "1 oz"/);
  });

  it('reads a temperature rise as a difference: "10 °C" and "10 K" are both 10', () => {
    expect(readToolField('10 °C', 'temperature-rise').value).toBe(10);
    expect(readToolField('10 K', 'temperature-rise').value).toBe(10);
    expect(readToolField('20', 'temperature-rise').value).toBe(20);
    expect(readToolField(15, 'temperature-rise').value).toBe(15);
    expect(() => readToolField('hot', 'temperature-rise')).toThrow(/temperature rise such as "10 °C"/);
  });

  it('collects every bad field and keeps what did parse', () => {
    const r = readToolFields(
      { a: '2700 mAh', b: '-3 V', c: 'x', d: '', e: '150 %', f: '2.5' },
      {
        a: { kind: 'capacity', check: 'positive' },
        b: { kind: 'voltage', check: 'positive' },
        c: { kind: 'voltage', check: 'positive' },
        d: { kind: 'voltage', check: 'positive', required: true },
        e: { kind: 'fraction', check: 'fraction' },
        f: { kind: 'count', check: 'at-least-one' },
      },
    );
    expect(r.values).toEqual({ a: 2.7 });
    expect(r.parsed.a).toEqual({ entered: '2700 mAh', value: 2.7, unit: 'Ah' });
    expect(r.parsed.b).toEqual({ entered: '-3 V', value: -3, unit: 'V' });
    expect(r.errors).toEqual({
      b: 'Must be greater than zero',
      c: expect.stringMatching(/voltage/),
      d: 'Required',
      e: expect.stringMatching(/fraction above 0 and at most 1/),
      f: 'Enter a whole number',
    });
  });

  it('unit round trips: x mAh → x/1000 Ah, x µm → x·10⁻⁶ m, x kΩ → x·10³ Ω, x % → x/100 (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 1e6, noNaN: true }), (x) => {
        const text = Number(x.toPrecision(6));
        expect(readToolField(`${text} mAh`, 'capacity').value / (text / 1000)).toBeCloseTo(1, 10);
        expect(readToolField(`${text} µm`, 'length').value / (text * 1e-6)).toBeCloseTo(1, 10);
        expect(readToolField(`${text} kΩ`, 'resistance').value / (text * 1e3)).toBeCloseTo(1, 10);
        expect(readToolField(`${text} %`, 'fraction').value / (text / 100)).toBeCloseTo(1, 10);
        // A plain number is taken in the stored unit as it is.
        expect(readToolField(text, 'power').value).toBe(text);
      }),
      { numRuns: 200 },
    );
  });
});
