import { describe, it, expect } from 'vitest';
import { decodeCapacitorMarking, readCapacitorMarking } from './capacitor-marking';

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

describe('the reading in words and the tolerance letter', () => {
  it('"104K": 10 × 10⁴ pF = 100 nF, tolerance letter K [S]', () => {
    const r = readCapacitorMarking('104K');
    expect(r).toMatchObject({ farads: 1e-7, scheme: 'three-digit', toleranceLetter: 'K' });
    expect(r.meaning.join(' ')).toMatch(/"10" are the significant digits.*× 10000.*100000 pF = 100 nF/);
  });
  it('"339": 33 × 0.1 pF = 3.3 pF, the 9 rule marked [M]', () => {
    const r = readCapacitorMarking('339');
    expect(r.farads).toBeCloseTo(3.3e-12, 24);
    expect(r.meaning[0]).toMatch(/× 0\.1 \[M\]/);
  });
  it('"4n7" is 4.7 nF with n as the decimal point; "4R7" is 4.7 pF; "0.1u" a value with its unit; "47" pF [S; CP]', () => {
    expect(readCapacitorMarking('4n7')).toMatchObject({ scheme: 'letter-decimal', toleranceLetter: null });
    expect(readCapacitorMarking('4n7').meaning.join(' ')).toMatch(/means nF.*4\.7 nF/);
    expect(readCapacitorMarking('4R7').meaning[0]).toMatch(/"R".*pF on a capacitor/);
    expect(readCapacitorMarking('0.1u')).toMatchObject({ scheme: 'value-with-unit' });
    expect(readCapacitorMarking('4u7').meaning[1]).toBe('4.7 µF = 4700 nF.');
    expect(readCapacitorMarking('2n2').meaning[1]).toBe('2.2 nF = 2200 pF.');
    expect(readCapacitorMarking('47')).toMatchObject({ scheme: 'picofarads', farads: 47e-12 });
  });
});
