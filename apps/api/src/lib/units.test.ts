import { describe, expect, it } from 'vitest';
import { parseQuantities, parseQuantity } from './units';

// Conversions follow the SI prefixes (BIPM SI Brochure, 9th ed., Table 7) [S]; resistor and
// capacitor "R/k/n" letter-as-decimal-point codes follow IEC 60062 [S].
describe('parseQuantity', () => {
  it.each([
    ['2700 mAh', 'capacity', 2.7, 'Ah'],
    ['3.65V', 'voltage', 3.65, 'V'],
    ['350 mA', 'current', 0.35, 'A'],
    ['35 µm', 'length', 35e-6, 'm'],
    ['35 um', 'length', 35e-6, 'm'],
    ['0.25 mm', 'length', 0.00025, 'm'],
    ['10 Wh', 'energy', 10, 'Wh'],
    ['4.7 kΩ', 'resistance', 4700, 'Ω'],
    ['3 ohm', 'resistance', 3, 'Ω'],
    ['100 nF', 'capacitance', 1e-7, 'F'],
    ['46 g', 'mass', 0.046, 'kg'],
    ['45 °C', 'temperature', 45, '°C'],
    ['113 °F', 'temperature', 45, '°C'],
    ['27 cm²', 'area', 0.0027, 'm²'],
    ['27 cm2', 'area', 0.0027, 'm²'],
    ['10 min', 'time', 600, 's'],
    ['60 %', 'fraction', 0.6, ''],
    ['0.6', 'fraction', 0.6, ''],
  ] as const)('%s as %s → %d %s', (text, kind, value, unit) => {
    const q = parseQuantity(text, kind);
    expect(q.value).toBeCloseTo(value, 12);
    expect(q.unit).toBe(unit);
    expect(q.entered).toBe(text);
  });

  it.each([
    ['3R0', 3],
    ['4R7', 4.7],
    ['R010', 0.01],
    ['4k7', 4700],
    ['2M2', 2.2e6],
  ])('reads the R/k/M code %s as %d Ω (IEC 60062 [S])', (text, ohms) => {
    expect(parseQuantity(text, 'resistance').value).toBeCloseTo(ohms, 12);
  });

  it.each([
    ['4n7', 4.7e-9],
    ['2p2', 2.2e-12],
  ])('reads the capacitor code %s (IEC 60062 [S])', (text, farads) => {
    expect(parseQuantity(text, 'capacitance').value).toBeCloseTo(farads, 20);
  });

  it('refuses a unit of the wrong kind, nonsense and blanks with a readable message', () => {
    expect(() => parseQuantity('3 V', 'current')).toThrow(/current/);
    expect(() => parseQuantity('banana', 'voltage')).toThrow(/voltage/);
    expect(() => parseQuantity('', 'voltage')).toThrow(/Required/);
    expect(() => parseQuantity('2.5', 'count')).toThrow(/whole/);
  });
});

describe('parseQuantities', () => {
  it('names every bad field and returns SI values with the typed text', () => {
    const ok = parseQuantities({ a: '2700 mAh', b: 3.7, c: null }, { a: 'capacity', b: 'voltage', c: 'mass' });
    expect(ok.values).toEqual({ a: 2.7, b: 3.7, c: null });
    expect(ok.entered).toEqual({ a: '2700 mAh' });
    try {
      parseQuantities({ a: '3 V', b: 'x' }, { a: 'current', b: 'voltage' });
      expect.unreachable();
    } catch (err) {
      expect((err as { fields: Record<string, string> }).fields).toEqual({ a: expect.stringContaining('current'), b: expect.stringContaining('voltage') });
    }
  });
});
