import { describe, it, expect } from 'vitest';
import { COLOUR_TOLERANCE_LETTER, decodeColorBands, readColorBands } from './color-bands';

describe('IEC 60062 colour code (REFERENCES §1)', () => {
  it('yellow-violet-red-gold is 4 700 Ω ±5 % (4 465–4 935 Ω) [C]', () => {
    const r = decodeColorBands(['yellow', 'violet', 'red', 'gold']);
    expect(r).toEqual({ ohms: 4700, tolerancePercent: 5 });
    expect(r.ohms * (1 - r.tolerancePercent! / 100)).toBeCloseTo(4465, 9);
    expect(r.ohms * (1 + r.tolerancePercent! / 100)).toBeCloseTo(4935, 9);
  });
  it('brown-black-black-red-brown is 10 000 Ω ±1 % (9 900–10 100 Ω) [C]', () => {
    const r = decodeColorBands(['brown', 'black', 'black', 'red', 'brown']);
    expect(r).toEqual({ ohms: 10000, tolerancePercent: 1 });
  });
  it('green-blue-gold-gold is 5.6 Ω ±5 % (5.32–5.88 Ω) [C]', () => {
    const r = decodeColorBands(['green', 'blue', 'gold', 'gold']);
    expect(r.ohms).toBe(5.6);
    expect(r.tolerancePercent).toBe(5);
    expect(r.ohms * 0.95).toBeCloseTo(5.32, 12);
    expect(r.ohms * 1.05).toBeCloseTo(5.88, 12);
  });
  it('orange-orange-silver-silver is 0.33 Ω ±10 % [C]', () => {
    expect(decodeColorBands(['orange', 'orange', 'silver', 'silver'])).toEqual({ ohms: 0.33, tolerancePercent: 10 });
  });
  it('brown-black-orange with no tolerance band is 10 kΩ ±20 % [C]', () => {
    expect(decodeColorBands(['brown', 'black', 'orange'])).toEqual({ ohms: 10000, tolerancePercent: 20 });
  });
  it('pink multiplies by 0.001 [S]', () => {
    expect(decodeColorBands(['brown', 'black', 'pink', 'gold']).ohms).toBeCloseTo(0.01, 12);
  });
  it('tolerance bands: brown 1, red 2, orange 0.05, yellow 0.02, green 0.5, blue 0.25, violet 0.1, grey 0.01 [S; W, L M]', () => {
    const tol = (c: string) => decodeColorBands(['brown', 'black', 'black', 'brown', c]).tolerancePercent;
    expect(['brown', 'red', 'orange', 'yellow', 'green', 'blue', 'violet', 'grey', 'gold', 'silver'].map(tol)).toEqual([1, 2, 0.05, 0.02, 0.5, 0.25, 0.1, 0.01, 5, 10]);
  });
  it('6 bands add the temperature coefficient: brown-black-black-red-brown-brown is 10 kΩ ±1 % 100 ppm/K [C; M for tempco colours]', () => {
    expect(decodeColorBands(['brown', 'black', 'black', 'red', 'brown', 'brown'])).toEqual({
      ohms: 10000,
      tolerancePercent: 1,
      temperatureCoefficientPpmPerK: 100,
    });
    expect(decodeColorBands(['red', 'red', 'black', 'black', 'brown', 'red']).temperatureCoefficientPpmPerK).toBe(50);
  });
  it('white multiplier and every digit colour decode [C]', () => {
    expect(decodeColorBands(['white', 'grey', 'white', 'gold']).ohms).toBe(98e9);
    expect(decodeColorBands(['red', 'orange', 'yellow', 'black', 'brown']).ohms).toBe(234);
    expect(decodeColorBands(['green', 'blue', 'violet', 'black', 'brown']).ohms).toBe(567);
  });
  it('accepts "gray" and any letter case', () => {
    expect(decodeColorBands(['Gray', 'RED', 'black', 'gold']).ohms).toBe(82);
  });
  it('a single black band is a 0 Ω link [CP]', () => {
    expect(decodeColorBands(['black'])).toEqual({ ohms: 0 });
  });
});

describe('invalid colour codes', () => {
  it('rejects wrong band counts', () => {
    expect(() => decodeColorBands([])).toThrow(/at least one band/);
    expect(() => decodeColorBands(['red'])).toThrow(/single band/);
    expect(() => decodeColorBands(['red', 'red'])).toThrow(/3, 4, 5 or 6 bands \(got 2\)/);
    expect(() => decodeColorBands(['red', 'red', 'red', 'red', 'red', 'red', 'red'])).toThrow(/got 7/);
  });
  it('rejects unknown colours and colours in the wrong place, naming the band', () => {
    expect(() => decodeColorBands(['purple', 'red', 'red', 'gold'])).toThrow(/Band 1 \(digit\) cannot be "purple"/);
    expect(() => decodeColorBands(['gold', 'red', 'red', 'gold'])).toThrow(/Band 1 \(digit\)/);
    expect(() => decodeColorBands(['red', 'red', 'teal', 'gold'])).toThrow(/Band 3 \(multiplier\)/);
    expect(() => decodeColorBands(['red', 'red', 'red', 'black'])).toThrow(/Band 4 \(tolerance\)/);
    expect(() => decodeColorBands(['red', 'red', 'red', 'red', 'brown', 'white'])).toThrow(/Band 6 \(temperature coefficient\)/);
    expect(() => decodeColorBands(['red', '', 'red', 'gold'])).toThrow(/Band 2 is empty/);
    expect(() => decodeColorBands('red' as never)).toThrow(RangeError);
  });
});

describe('the colour code band by band', () => {
  it('yellow-violet-red-gold: digits 4 7, × 100 = 4700 Ω, gold ±5 % (J) [C; S: IEC 60062]', () => {
    const r = readColorBands(['Yellow', 'violet', 'red', 'gold']);
    expect(r).toMatchObject({ ohms: 4700, tolerancePercent: 5, toleranceLetter: 'J', bands: ['yellow', 'violet', 'red', 'gold'] });
    expect(r.meaning).toEqual(['Bands 1–2 (yellow, violet) are the digits 4 7.', 'Band 3 (red) is the multiplier × 100: 47 × 100 = 4700 Ω.', 'Band 4 (gold) is the tolerance ±5 % (J).']);
  });
  it('brown-black-orange has no tolerance band: ±20 % (M) [C; S]', () => {
    const r = readColorBands(['brown', 'black', 'orange']);
    expect(r).toMatchObject({ ohms: 10000, tolerancePercent: 20, toleranceLetter: 'M' });
    expect(r.meaning.at(-1)).toMatch(/No tolerance band: ±20 %/);
  });
  it('6 bands name the temperature coefficient; one black band is a 0 Ω link [M; CP]', () => {
    const r = readColorBands(['brown', 'black', 'black', 'red', 'brown', 'red']);
    expect(r.meaning.at(-1)).toBe('Band 6 (red) is the temperature coefficient 50 ppm/K.');
    expect(readColorBands(['black'])).toMatchObject({ ohms: 0, toleranceLetter: null });
  });
  it('each tolerance colour has its IEC 60062 letter (brown F, red G, green D, blue C, violet B, gold J, silver K) [S]', () => {
    expect(COLOUR_TOLERANCE_LETTER).toMatchObject({ brown: 'F', red: 'G', green: 'D', blue: 'C', violet: 'B', gold: 'J', silver: 'K' });
  });
});
