// Every valid reading of a marking, ranked, with the rule that gives it (issue 10, defects 2 and 3).
// Values: REFERENCES.md §1. The order of the readings is this decoder's ranking rule (DEVELOPERS.md,
// "Marking decoder"), labelled [CP]; each value is labelled with the source of its scheme.
import { describe, it, expect } from 'vitest';
import { decodeCapacitorMarking } from './capacitor-marking';
import { explainMarking, readMarkingCode } from './explain';
import { decodeResistorMarking } from './resistor-marking';

const readings = (code: string, component: 'resistor' | 'capacitor') =>
  explainMarking({ code, kind: component }).readings.map((r) => ({ scheme: r.scheme, value: r.value, tolerance: r.tolerance?.text ?? null, rank: r.rank }));

const close = (a: number, b: number) => expect(a / b).toBeCloseTo(1, 12);

describe('two digits and R are R-notation first, EIA-96 second (defect 2)', () => {
  it.each([
    // [S: IEC 60062 letter-and-digit code, R = decimal point] first; [S: EIA-96 table; C] second
    ['10R', 10, 1.24],
    ['47R', 47, 3.01],
    ['12R', 12, 1.3],
    ['68R', 68, 4.99],
  ])('"%s" is %d Ω (R-notation) [S], then %d Ω as EIA-96 [S; C]', (code, rNotation, eia96) => {
    expect(decodeResistorMarking(code)).toBe(rNotation);
    const r = readings(code, 'resistor');
    expect(r.map((x) => [x.scheme, x.rank])).toEqual([
      ['letter-and-digit', 1],
      ['eia-96', 2],
    ]);
    close(r[0]!.value, rNotation);
    close(r[1]!.value, eia96);
  });

  it('says which rule ranks them, on each reading and in the note [CP: ranking rule]', () => {
    const report = explainMarking({ code: '10R', kind: 'resistor' });
    expect(report.ambiguous).toBe(true);
    expect(report.readings[0]!.rankReason).toMatch(/R-notation.*then.*EIA-96/);
    expect(report.readings[1]!.rankReason).toBe(report.readings[0]!.rankReason);
    expect(report.note).toMatch(/"10R" has 2 readings on a resistor/);
    expect(report.readings[1]!.assumptions.join(' ')).not.toMatch(/read as EIA-96 .* as the code tables do/);
  });

  it('an EIA-96 index outside 01–96 leaves the R-notation reading alone ("97R" = 97 Ω) [S]', () => {
    expect(readings('97R', 'resistor')).toEqual([{ scheme: 'letter-and-digit', value: 97, tolerance: null, rank: 1 }]);
  });

  it('"01R" gives 1 Ω both ways: one reading, which says so [S; C]', () => {
    const r = explainMarking({ code: '01R', kind: 'resistor' });
    expect(r.readings).toHaveLength(1);
    expect(r.readings[0]).toMatchObject({ value: 1, scheme: 'letter-and-digit', rankReason: null });
    expect(r.readings[0]!.meaning.at(-1)).toMatch(/EIA-96 code .* same value/);
    expect(r.ambiguous).toBe(false);
  });
});

describe('a tolerance letter that is also a multiplier: "102K" (defect 2)', () => {
  it('"102K" on a resistor: 1 kΩ ±10 % first (E6), then 102 kΩ (only E96) [S: IEC 60062 letters and letter-and-digit code; CP: ranking]', () => {
    expect(readings('102K', 'resistor')).toEqual([
      { scheme: 'three-digit', value: 1000, tolerance: '±10 %', rank: 1 },
      { scheme: 'letter-and-digit', value: 102000, tolerance: null, rank: 2 },
    ]);
    expect(decodeResistorMarking('102K')).toBe(1000);
    expect(explainMarking({ code: '102K', kind: 'resistor' }).readings[0]!.rankReason).toMatch(/E6.*E96/);
  });

  it('"100K": both values are E6, so the letter as the multiplier goes first (100 kΩ), then 10 Ω ±10 % [S; CP: ranking]', () => {
    expect(readings('100K', 'resistor')).toEqual([
      { scheme: 'letter-and-digit', value: 100000, tolerance: null, rank: 1 },
      { scheme: 'three-digit', value: 10, tolerance: '±10 %', rank: 2 },
    ]);
  });

  it('"1002K": 10 kΩ ±10 % (4-digit code) first, then 1.002 MΩ (in no series) [S; CP: ranking]', () => {
    const r = readings('1002K', 'resistor');
    expect(r.map((x) => x.scheme)).toEqual(['four-digit', 'letter-and-digit']);
    expect(r[0]).toMatchObject({ value: 10000, tolerance: '±10 %' });
    close(r[1]!.value, 1.002e6);
  });

  it('"102K" with either part: two resistor readings, then the capacitor reading 1 nF ±10 % [S]', () => {
    const report = explainMarking({ code: '102K', kind: 'auto' });
    expect(report.readings.map((r) => [r.component, r.rank])).toEqual([
      ['resistor', 1],
      ['resistor', 2],
      ['capacitor', 1],
    ]);
    close(report.readings[2]!.value, 1e-9);
    expect(report.readings[2]!.tolerance?.text).toBe('±10 %');
    expect(report.ambiguous).toBe(true);
    expect(report.note).toMatch(/part itself tells which/);
  });

  it('"10K" and "4K7" are letter-and-digit codes with one reading: 10 kΩ and 4.7 kΩ [S: IEC 60062]', () => {
    expect(readings('10K', 'resistor')).toEqual([{ scheme: 'letter-and-digit', value: 10000, tolerance: null, rank: 1 }]);
    expect(readings('4K7', 'resistor')).toEqual([{ scheme: 'letter-and-digit', value: 4700, tolerance: null, rank: 1 }]);
  });
});

describe('capacitor tolerance letters N and P (defect 3) [S: IEC 60062, N ±30 %, capacitor P +100/−0 %]', () => {
  it('"104P" is 100 nF +100/−0 %, then 104 pF as a value with p as the unit', () => {
    expect(decodeCapacitorMarking('104P')).toBe(1e-7);
    const r = explainMarking({ code: '104P', kind: 'capacitor' }).readings;
    expect(r[0]).toMatchObject({ scheme: 'three-digit', value: 1e-7, rank: 1, tolerance: { letter: 'P', plus: 100, minus: 0, text: '+100 / −0 %' } });
    expect(r[0]!.range!.low).toBeCloseTo(1e-7, 20);
    expect(r[0]!.range!.high).toBeCloseTo(2e-7, 20);
    expect(r[1]).toMatchObject({ scheme: 'letter-decimal', rank: 2, tolerance: null });
    close(r[1]!.value, 104e-12);
  });

  it('"104N" is 100 nF ±30 % (70–130 nF) [C], then 104 nF', () => {
    expect(decodeCapacitorMarking('104N')).toBe(1e-7);
    const r = explainMarking({ code: '104N', kind: 'capacitor' }).readings;
    expect(r[0]).toMatchObject({ scheme: 'three-digit', value: 1e-7, tolerance: { letter: 'N', plus: 30, minus: 30, text: '±30 %' } });
    expect(r[0]!.range!.low).toBeCloseTo(7e-8, 20);
    expect(r[0]!.range!.high).toBeCloseTo(1.3e-7, 20);
    close(r[1]!.value, 104e-9);
  });

  it('"100n" and "220p" stay 100 nF and 220 pF first (both readings E6: the unit letter goes first) [CP: ranking]', () => {
    const n = readings('100n', 'capacitor');
    expect(n.map((x) => x.scheme)).toEqual(['letter-decimal', 'three-digit']);
    close(n[0]!.value, 1e-7);
    expect(n[1]).toMatchObject({ tolerance: '±30 %' });
    close(n[1]!.value, 10e-12);
    close(decodeCapacitorMarking('220p'), 220e-12);
  });
});

describe('readMarkingCode: the one decoder the bench tools and the parts list share', () => {
  it('gives value, unit, scheme, label and tolerance for each reading, ranked', () => {
    const r = readMarkingCode('102K', 'resistor');
    expect(r.map((x) => ({ rank: x.rank, value: x.value, unit: x.unit, scheme: x.scheme, label: x.schemeLabel, short: x.schemeShortLabel, tol: x.tolerance?.text ?? null }))).toEqual([
      { rank: 1, value: 1000, unit: 'Ω', scheme: 'three-digit', label: '3-digit code', short: '3-digit', tol: '±10 %' },
      { rank: 2, value: 102000, unit: 'Ω', scheme: 'letter-and-digit', label: 'Letter-and-digit code (IEC 60062)', short: 'RKM code', tol: null },
    ]);
  });

  it('ignores spaces inside the marking ("4K7 J", "0.1 uF") as typed off a part', () => {
    expect(readMarkingCode('4K7 J', 'resistor')[0]).toMatchObject({ value: 4700, tolerance: { letter: 'J' } });
    expect(readMarkingCode('0.1 uF', 'capacitor')[0]!.value).toBeCloseTo(1e-7, 20);
  });

  it('throws a RangeError naming the code when nothing reads', () => {
    expect(() => readMarkingCode('K7Q', 'resistor')).toThrow(/Resistor marking "K7Q" is not a resistor code/);
    expect(() => readMarkingCode('4m7', 'capacitor')).toThrow(/Capacitor marking "4m7" is not a capacitor code/);
    expect(() => readMarkingCode('99X', 'resistor')).toThrow(/01 to 96/);
    expect(() => readMarkingCode('472', 'inductor' as never)).toThrow(/resistor or a capacitor/);
  });
});

describe('REFERENCES §1 examples read one way only (no alternative where the code has one reading)', () => {
  it.each([
    // [S: instrument manual, distributor page]
    ['472', 4700],
    ['100', 10],
    ['4R7', 4.7],
    ['R10', 0.1],
    ['1002', 10000],
    ['4991', 4990],
    ['12R0', 12],
    ['R047', 0.047],
    // EIA-96 [S; C]
    ['01C', 10000],
    ['39D', 249000],
    ['68X', 49.9],
    ['44A', 280],
    ['01Z', 0.1],
    ['96F', 97.6e6],
  ])('resistor "%s" is %d Ω, one reading', (code, ohms) => {
    const r = readMarkingCode(code, 'resistor');
    expect(r).toHaveLength(1);
    close(r[0]!.value, ohms);
    expect(r[0]!.rankReason).toBeNull();
  });

  it.each([
    // [S] capacitor 3-digit code in pF; 339 uses the 9 = × 0.1 rule [M]
    ['104', 100000],
    ['473', 47000],
    ['222', 2200],
    ['101', 100],
    ['105', 1e6],
    ['4R7', 4.7],
    ['339', 3.3],
  ])('capacitor "%s" is %d pF, one reading', (code, pF) => {
    const r = readMarkingCode(code, 'capacitor');
    expect(r).toHaveLength(1);
    close(r[0]!.value, pF * 1e-12);
  });
});
