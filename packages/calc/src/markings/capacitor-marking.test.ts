import { describe, it, expect } from 'vitest';
import { decodeCapacitorMarking } from './capacitor-marking';

const pF = (code: string) => decodeCapacitorMarking(code) * 1e12;

describe('capacitor 3-digit code in pF (REFERENCES §1) [S]', () => {
  it('104 is 100 000 pF = 100 nF = 0.1 µF', () => {
    expect(decodeCapacitorMarking('104')).toBe(1e-7);
    expect(pF('104')).toBeCloseTo(100000, 6);
  });
  it.each([
    ['473', 47000],
    ['222', 2200],
    ['101', 100],
    ['105', 1e6],
    ['4R7', 4.7],
    ['339', 3.3],
  ])('%s is %d pF [S]', (code, value) => {
    expect(pF(code)).toBeCloseTo(value, 6);
  });
  it('a last digit of 8 means ×0.01 and 9 means ×0.1 [M]', () => {
    expect(pF('478')).toBeCloseTo(0.47, 9);
    expect(pF('109')).toBeCloseTo(1.0, 9);
  });
  it('105 is 1 µF in farads exactly as written', () => {
    expect(decodeCapacitorMarking('105')).toBe(1e-6);
  });
  it('a trailing tolerance letter is accepted and ignored ("104K") [S: letters]', () => {
    expect(decodeCapacitorMarking('104K')).toBe(1e-7);
    expect(decodeCapacitorMarking('473j')).toBe(4.7e-8);
  });
});

describe('letter-as-decimal and unit forms [CP]', () => {
  it.each([
    ['4p7', 4.7],
    ['2n2', 2200],
    ['4n7', 4700],
    ['4u7', 4.7e6],
    ['4µ7', 4.7e6],
    ['100n', 100000],
    ['10uF', 1e7],
    ['0.1u', 100000],
    ['2.2nF', 2200],
    ['p47', 0.47],
    ['47', 47],
    ['1', 1],
  ])('%s is %d pF', (code, value) => {
    expect(pF(code) / value).toBeCloseTo(1, 9);
  });
});

describe('invalid capacitor markings', () => {
  it.each(['', '1047', '107', 'abc', 'n', '4m7', '10x', '104Q'])('"%s" throws a RangeError', (code) => {
    expect(() => decodeCapacitorMarking(code)).toThrow(RangeError);
  });
  it('names the code in the message', () => {
    expect(() => decodeCapacitorMarking('4m7')).toThrow(/Capacitor marking "4m7"/);
    expect(() => decodeCapacitorMarking('107')).toThrow(/last digit of 7/);
    expect(() => decodeCapacitorMarking(42 as never)).toThrow(/empty/);
  });
});
