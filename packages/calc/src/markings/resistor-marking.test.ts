import { describe, it, expect } from 'vitest';
import { decodeResistorMarking, eia96Significand, readResistorMarking, readResistorMarkings } from './resistor-marking';

/** The EIA-96 reading of a code ("12R" is R-notation first, EIA-96 second). */
const eia96 = (code: string) => readResistorMarkings(code).find((r) => r.scheme === 'eia-96')!.ohms;

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
    expect(eia96(code) / ohms).toBeCloseTo(1, 12);
  });
  it('Y equals R, S equals X and H equals B [S]', () => {
    expect(decodeResistorMarking('12Y')).toBe(eia96('12R'));
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
  it.each(['', '   ', 'ABC', '12345', 'R', 'K', '00A', '97A', '1R2R', '12Q', '4K7R', '68XJ', '4R7Q', 'J'])('"%s" throws a RangeError', (code) => {
    expect(() => decodeResistorMarking(code)).toThrow(RangeError);
  });
  it('messages name the code and say what is accepted', () => {
    expect(() => decodeResistorMarking('4Q7')).toThrow(/Resistor marking "4Q7".*EIA-96/);
    expect(() => decodeResistorMarking('97A')).toThrow(/01 to 96/);
    expect(() => eia96Significand(0)).toThrow(/EIA-96 index/);
    expect(() => decodeResistorMarking(undefined as never)).toThrow(/empty/);
  });
});

describe('IEC 60062 letter-and-digit code: R, K or M as the decimal point [S: IEC 60062; M for K and M on SMD parts]', () => {
  it.each([
    ['4K7', 4700],
    ['2M2', 2.2e6],
    ['K47', 470],
    ['47K', 47000],
    ['1M0', 1e6],
    ['100K', 100000],
    ['0R1', 0.1],
  ])('%s is %d Ω', (code, ohms) => {
    expect(decodeResistorMarking(code) / ohms).toBeCloseTo(1, 12);
  });
  it('lower-case k reads like K (as typed at the bench)', () => {
    expect(decodeResistorMarking('4k7')).toBe(4700);
  });
});

describe('trailing IEC 60062 tolerance letter [S: IEC 60062 letters]', () => {
  it('"472J" is 4.7 kΩ with letter J; "4K7F" is 4.7 kΩ with letter F; "1002F" is 10.0 kΩ with F', () => {
    expect(readResistorMarking('472J')).toMatchObject({ ohms: 4700, scheme: 'three-digit', toleranceLetter: 'J', valueCode: '472' });
    expect(readResistorMarking('4K7F')).toMatchObject({ ohms: 4700, scheme: 'letter-and-digit', toleranceLetter: 'F' });
    expect(readResistorMarking('1002F')).toMatchObject({ ohms: 10000, scheme: 'four-digit', toleranceLetter: 'F' });
    expect(readResistorMarking('4R7K')).toMatchObject({ ohms: 4.7, toleranceLetter: 'K' });
  });
  it('a code that reads whole keeps its letter as part of the value ("47K" is 47 kΩ, not 47 ±10 %)', () => {
    expect(readResistorMarking('47K')).toMatchObject({ ohms: 47000, toleranceLetter: null });
  });
});

describe('the reading in words', () => {
  it('"472": digits 47, × 100 = 4.7 kΩ [S]', () => {
    const r = readResistorMarking('472');
    expect(r.scheme).toBe('three-digit');
    expect(r.meaning.join(' ')).toMatch(/"47" are the significant digits.*× 100.*47 × 100 = 4\.7 kΩ/);
  });
  it('"68X": index 68 → 499, X = × 0.1, 49.9 Ω [S]', () => {
    const r = readResistorMarking('68X');
    expect(r.scheme).toBe('eia-96');
    expect(r.meaning).toEqual(['EIA-96 code: "68" is the index into the E96 list, value 499.', '"X" is the multiplier × 0.1.', '499 × 0.1 = 49.9 Ω.']);
  });
  it('"4R7": R is the decimal point, 4.7 Ω [S]; "000" is a jumper [M]', () => {
    expect(readResistorMarking('4R7').meaning.join(' ')).toMatch(/"R" stands for the decimal point.*4\.7 Ω/);
    expect(readResistorMarking('000')).toMatchObject({ ohms: 0, scheme: 'jumper' });
    expect(readResistorMarking('4K7').meaning).toEqual(['Letter-and-digit code: "K" stands for the decimal point and means kΩ.', '4.7 kΩ = 4700 Ω.']);
  });
});
