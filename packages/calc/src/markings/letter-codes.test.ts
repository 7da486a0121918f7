import { describe, it, expect } from 'vitest';
import { decodeToleranceLetter, percentTolerance, toleranceRange, TOLERANCE_LETTERS } from './letter-codes';

describe('IEC 60062 tolerance letters (REFERENCES §1)', () => {
  it.each([
    ['B', 0.1],
    ['C', 0.25],
    ['D', 0.5],
    ['F', 1],
    ['G', 2],
    ['J', 5],
    ['K', 10],
    ['M', 20],
    ['N', 30],
  ])('%s is ±%d % [S]', (letter, percent) => {
    expect(decodeToleranceLetter(letter, 'resistor')).toMatchObject({ letter, plus: percent, minus: percent, kind: 'percent', text: `±${percent} %` });
  });
  it('Z is +80 / −20 % [S]; capacitor P is +100 / −0 % [S]', () => {
    expect(decodeToleranceLetter('Z', 'capacitor')).toMatchObject({ plus: 80, minus: 20, text: '+80 / −20 %' });
    expect(decodeToleranceLetter('p', 'capacitor')).toMatchObject({ plus: 100, minus: 0, text: '+100 / −0 %' });
  });
  it('W ±0.05 %, L ±0.01 % and resistor P ±0.02 % [M]', () => {
    expect(decodeToleranceLetter('W', 'resistor').plus).toBe(0.05);
    expect(decodeToleranceLetter('L', 'resistor').plus).toBe(0.01);
    expect(decodeToleranceLetter('P', 'resistor')).toMatchObject({ plus: 0.02, minus: 0.02 });
    expect(TOLERANCE_LETTERS.W?.source).toMatch(/\[M/);
  });
  it('capacitors under 10 pF: B, C, D are ±0.1, ±0.25, ±0.5 pF [S]; F is ±1 pF [M]', () => {
    expect(decodeToleranceLetter('B', 'capacitor', 4.7e-12)).toMatchObject({ kind: 'absolute', plus: 0.1e-12, text: '±0.1 pF' });
    expect(decodeToleranceLetter('C', 'capacitor', 4.7e-12).text).toBe('±0.25 pF');
    expect(decodeToleranceLetter('D', 'capacitor', 9.9e-12).text).toBe('±0.5 pF');
    expect(decodeToleranceLetter('F', 'capacitor', 1e-12).source).toMatch(/\[M/);
    // At 10 pF and above the same letters are percentages again, and J stays ±5 % below 10 pF.
    expect(decodeToleranceLetter('C', 'capacitor', 10e-12).text).toBe('±0.25 %');
    expect(decodeToleranceLetter('J', 'capacitor', 4.7e-12).text).toBe('±5 %');
  });
  it('range: 4 700 Ω ±5 % is 4 465–4 935 Ω [C]; 4.7 pF ±0.25 pF is 4.45–4.95 pF [C]', () => {
    const r = toleranceRange(4700, decodeToleranceLetter('J', 'resistor'));
    expect(r.low).toBeCloseTo(4465, 9);
    expect(r.high).toBeCloseTo(4935, 9);
    const c = toleranceRange(4.7e-12, decodeToleranceLetter('C', 'capacitor', 4.7e-12));
    expect(c.low).toBeCloseTo(4.45e-12, 24);
    expect(c.high).toBeCloseTo(4.95e-12, 24);
    expect(percentTolerance(10, '[S]', 'K')).toMatchObject({ letter: 'K', text: '±10 %' });
  });
  it('rejects letters that are not tolerance letters, and anything but one letter', () => {
    expect(() => decodeToleranceLetter('Q', 'resistor')).toThrow(/"Q" is not an IEC 60062 tolerance letter/);
    expect(() => decodeToleranceLetter('JK', 'resistor')).toThrow(/one letter/);
    expect(() => decodeToleranceLetter(5 as never, 'resistor')).toThrow(RangeError);
  });
});
