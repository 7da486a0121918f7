import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { HEATER_TOOL_FIELDS as H, MEASUREMENT_FIELDS as M, RUNTIME_TOOL_FIELDS as R } from '@splitcase/contracts';
import { readToolField, readToolFields } from './inputs';

// SI prefixes: BIPM SI Brochure, 9th ed., Table 7 [S]; 1 oz/ft² copper = 35 µm in IPC-2221 work [S].
describe('bench-tool inputs', () => {
  it('reads copper weight as thickness: "1 oz" = 35 µm, "2 oz/ft²" = 70 µm, "0.5oz" = 17.5 µm [S]', () => {
    const t = (raw: string) => readToolField(raw, H.thickness, 'copper-thickness');
    expect(t('1 oz')).toEqual({ entered: '1 oz', value: 35e-6, unit: 'm' });
    expect(t('2 oz/ft²').value).toBeCloseTo(70e-6, 15);
    expect(t('0.5oz').value).toBeCloseTo(17.5e-6, 15);
    expect(t('0,5 oz').value).toBeCloseTo(17.5e-6, 15);
    expect(t('35 µm').value).toBeCloseTo(35e-6, 15);
    expect(t('1.378 mil').value).toBeCloseTo(35.0012e-6, 10);
    expect(() => t('1 lb')).toThrow(/copper thickness such as "35 µm" or a copper weight such as "1 oz"/);
    // µm, mm or oz: a bare number needs its unit.
    expect(() => t('35')).toThrow('Copper thickness: add a unit, e.g. 35 µm');
  });

  it('reads a temperature rise as a difference: "10 °C" and "10 K" are both 10', () => {
    const rise = (raw: string | number) => readToolField(raw, H.temperatureRise, 'temperature-rise');
    expect(rise('10 °C').value).toBe(10);
    expect(rise('10 K').value).toBe(10);
    expect(rise('20').value).toBe(20);
    expect(rise('7,5 K').value).toBe(7.5);
    expect(rise(15).value).toBe(15);
    expect(() => rise('hot')).toThrow(/temperature rise such as "10 °C"/);
  });

  it('collects every bad field and keeps what did parse', () => {
    const r = readToolFields(
      { a: '2700 mAh', b: '-3 V', c: 'x', d: '', e: '150 %', f: '2.5', g: '0.9' },
      {
        a: { field: R.cellCapacity, check: 'positive' },
        b: { field: R.cellNominalVoltage, check: 'positive' },
        c: { field: R.supplyVoltage, check: 'positive' },
        d: { field: R.cellNominalVoltage, check: 'positive', required: true },
        e: { field: R.efficiency, check: 'fraction' },
        f: { field: R.series, check: 'at-least-one' },
        g: { field: R.duty, check: 'fraction' },
      },
    );
    expect(r.values).toEqual({ a: 2.7 });
    expect(r.parsed.a).toEqual({ entered: '2700 mAh', value: 2.7, unit: 'Ah' });
    expect(r.parsed.b).toEqual({ entered: '-3 V', value: -3, unit: 'V' });
    expect(r.errors).toEqual({
      b: 'Cell nominal voltage: must be greater than zero',
      c: expect.stringMatching(/voltage/),
      d: 'Required',
      e: 'Converter efficiency: enter a fraction above 0 % and at most 100 %, such as 90 %',
      f: 'Cells in series: enter a whole number',
      g: 'PWM duty: add a unit, e.g. 60 % (a plain 0.9 would be read as 0.9 %)',
    });
  });

  it('unit round trips: x mAh → x/1000 Ah, x µm → x·10⁻⁶ m, x kΩ → x·10³ Ω, x % → x/100 (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 1e6, noNaN: true }), (x) => {
        const text = Number(x.toPrecision(6));
        expect(readToolField(`${text} mAh`, R.cellCapacity).value / (text / 1000)).toBeCloseTo(1, 10);
        expect(readToolField(`${text} mah`, R.cellCapacity).value / (text / 1000)).toBeCloseTo(1, 10);
        expect(readToolField(`${text} µm`, M.length).value / (text * 1e-6)).toBeCloseTo(1, 10);
        expect(readToolField(`${text} kΩ`, R.loadResistance).value / (text * 1e3)).toBeCloseTo(1, 10);
        expect(readToolField(`${text} %`, R.efficiency).value / (text / 100)).toBeCloseTo(1, 10);
        // A JSON number is taken in the stored unit as it is.
        expect(readToolField(text, R.loadPower).value).toBe(text);
      }),
      { numRuns: 200 },
    );
  });
});
