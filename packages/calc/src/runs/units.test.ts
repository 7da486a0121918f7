import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { convertColumnInPlace, runUnitConversion, toStoredUnit } from './units';

describe('bench-log column units', () => {
  it('converts time units to seconds: 1 min = 60 s, 1 h = 3600 s, 1 ms = 0.001 s [S: NIST SP 811, Appendix B]', () => {
    expect(toStoredUnit('time', 'min', 1)).toBe(60);
    expect(toStoredUnit('time', 'h', 1)).toBe(3600);
    expect(toStoredUnit('time', 'ms', 1500)).toBeCloseTo(1.5, 12);
    expect(toStoredUnit('time', 's', 12.5)).toBe(12.5);
  });

  it('converts milli-units to base units [S: NIST SP 811, SI prefixes]', () => {
    expect(toStoredUnit('voltage', 'mV', 3700)).toBeCloseTo(3.7, 12);
    expect(toStoredUnit('current', 'mA', 600)).toBeCloseTo(0.6, 12);
    expect(toStoredUnit('power', 'mW', 2500)).toBeCloseTo(2.5, 12);
    expect(toStoredUnit('voltage', 'V', 4.2)).toBe(4.2);
  });

  it('converts °F to °C by t/°C = (t/°F − 32)/1.8: 32 °F = 0 °C, 212 °F = 100 °C, −40 °F = −40 °C, 98.6 °F = 37 °C [S: NIST SP 811 §B.9]', () => {
    expect(toStoredUnit('temperature', '°F', 32)).toBeCloseTo(0, 12);
    expect(toStoredUnit('temperature', '°F', 212)).toBeCloseTo(100, 12);
    expect(toStoredUnit('temperature', '°F', -40)).toBeCloseTo(-40, 12);
    expect(toStoredUnit('temperature', '°F', 98.6)).toBeCloseTo(37, 12);
    expect(toStoredUnit('temperature', '°C', 55)).toBe(55);
  });

  it('converts a column in place, element by element, and leaves stored units untouched (property) [C]', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 50 }), (values) => {
        const column = Float64Array.from(values);
        const same = convertColumnInPlace(column, 'temperature', '°F');
        expect(same).toBe(column);
        values.forEach((v, k) => expect(column[k]).toBeCloseTo((v - 32) / 1.8, 6));
        const volts = Float64Array.from(values);
        expect(convertColumnInPlace(volts, 'voltage', 'V')).toEqual(Float64Array.from(values));
      }),
    );
  });

  it('names the unit it does not know', () => {
    expect(() => runUnitConversion('voltage', 'kV')).toThrow(/A voltage column can be in mV, V \(got "kV"\)/);
    expect(() => runUnitConversion('nope' as never, 'V')).toThrow(/Unknown quantity/);
    expect(runUnitConversion('current', 'mA').storedUnit).toBe('A');
  });
});
