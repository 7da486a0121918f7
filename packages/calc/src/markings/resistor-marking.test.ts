import { describe, it, expect } from 'vitest';
import { decodeResistorMarking, eia96Significand } from './resistor-marking';

describe('SMD resistor codes (REFERENCES §1) [S: instrument manual, distributor page]', () => {
  it.each([
    ['472', 4700],
    ['100', 10],
    ['4R7', 4.7],
    ['R10', 0.1],
    ['1002', 10000],
    ['4991', 4990],
    ['12R0', 12],
    ['R047', 0.047],
  ])('%s is %d Ω [S]', (code, ohms) => {
    expect(decodeResistorMarking(code)).toBeCloseTo(ohms, 9);
  });
  it('"100" is 10 Ω, not 100 Ω [S]', () => {
    expect(decodeResistorMarking('100')).toBe(10);
  });
  it('R010 is 0.010 Ω [C]', () => {
    expect(decodeResistorMarking('R010')).toBeCloseTo(0.01, 12);
  });
  it('"0" and "000" are jumpers, 0 Ω [M]', () => {
    expect(decodeResistorMarking('0')).toBe(0);
    expect(decodeResistorMarking('000')).toBe(0);
    expect(decodeResistorMarking('0000')).toBe(0);
  });
  it('ignores case and surrounding spaces', () => {
    expect(decodeResistorMarking(' 4r7 ')).toBeCloseTo(4.7, 12);
  });
});

describe('EIA-96 codes (REFERENCES §1)', () => {
  it.each([
    ['01C', 10000, 'C'],
    ['39D', 249000, 'S'],
    ['68X', 49.9, 'S'],
    ['44A', 280, 'C'],
    ['12R', 1.3, 'C'],
    ['01Z', 0.1, 'C'],
    ['96F', 97.6e6, 'C'],
  ])('%s is %d Ω [%s]', (code, ohms) => {
    expect(decodeResistorMarking(code) / ohms).toBeCloseTo(1, 12);
  });
  it('Y equals R, S equals X and H equals B [S]', () => {
    expect(decodeResistorMarking('12Y')).toBe(decodeResistorMarking('12R'));
    expect(decodeResistorMarking('68S')).toBe(decodeResistorMarking('68X'));
    expect(decodeResistorMarking('01H')).toBe(decodeResistorMarking('01B'));
    expect(decodeResistorMarking('01E')).toBe(1e6);
  });
  it('index 24 is 174 and 25 is 178 (one web summary is off by one) [C]', () => {
    expect(eia96Significand(24)).toBe(174);
    expect(eia96Significand(25)).toBe(178);
    expect(eia96Significand(1)).toBe(100);
    expect(eia96Significand(96)).toBe(976);
  });
});

describe('invalid resistor markings', () => {
  it.each(['', '   ', 'ABC', '12345', 'R', '4K7', '00A', '97A', '1R2R', '12Q'])('"%s" throws a RangeError', (code) => {
    expect(() => decodeResistorMarking(code)).toThrow(RangeError);
  });
  it('messages name the code and say what is accepted', () => {
    expect(() => decodeResistorMarking('4K7')).toThrow(/Resistor marking "4K7".*EIA-96/);
    expect(() => decodeResistorMarking('97A')).toThrow(/01 to 96/);
    expect(() => eia96Significand(0)).toThrow(/EIA-96 index/);
    expect(() => decodeResistorMarking(undefined as never)).toThrow(/empty/);
  });
});
