import { describe, it, expect } from 'vitest';
import { explainMarking, preferredValueRows } from './explain';

const one = (p: Parameters<typeof explainMarking>[0]) => {
  const r = explainMarking(p);
  expect(r.readings).toHaveLength(1);
  return r.readings[0]!;
};

describe('marking decoder for the bench tools (REFERENCES §1)', () => {
  it('472 as a resistor is 4.7 kΩ [S], with formula, source and the E24 member 4.7 kΩ', () => {
    const r = one({ code: '472', kind: 'resistor' });
    expect(r).toMatchObject({ value: 4700, unit: 'Ω', component: 'resistor', scheme: 'three-digit', schemeLabel: '3-digit code', tolerance: null, range: null });
    expect(r.formula).toMatch(/10\^last digit/);
    expect(r.source).toMatch(/\[S/);
    expect(r.inputs).toEqual([
      { label: 'Marking', value: '472' },
      { label: 'Read as', value: 'resistor' },
    ]);
    expect(r.preferred.find((p) => p.series === 'E24')).toMatchObject({ nearest: 4700, member: true, deviationPercent: 0 });
    expect(r.warnings).toEqual([]);
  });

  it('68X is 49.9 Ω [S]: an E96 member, nearest E24 value 51 Ω by the log rule [C]', () => {
    const r = one({ code: '68X', kind: 'resistor' });
    expect(r.value).toBeCloseTo(49.9, 12);
    expect(r.scheme).toBe('eia-96');
    expect(r.preferred.find((p) => p.series === 'E96')).toMatchObject({ member: true });
    const e24 = r.preferred.find((p) => p.series === 'E24')!;
    expect(e24.nearest).toBe(51); // boundary √(47·51) = 48.96 < 49.9
    expect(e24.deviationPercent).toBeCloseTo((49.9 / 51 - 1) * 100, 9);
    expect(r.assumptions.join(' ')).toMatch(/E96 series, the ±1 % series/);
  });

  it('104 as a capacitor is 100 nF [S]; 104K adds ±10 % and its range 90–110 nF [S; C]', () => {
    expect(one({ code: '104', kind: 'capacitor' })).toMatchObject({ value: 1e-7, unit: 'F', component: 'capacitor' });
    const k = one({ code: '104K', kind: 'capacitor' });
    expect(k.tolerance).toMatchObject({ letter: 'K', text: '±10 %' });
    expect(k.range!.low).toBeCloseTo(9e-8, 20);
    expect(k.range!.high).toBeCloseTo(1.1e-7, 20);
    expect(k.meaning.at(-1)).toBe('"K" is the tolerance letter: ±10 %.');
  });

  it('4R7 as a capacitor is 4.7 pF, R as the decimal point [S]', () => {
    expect(one({ code: '4R7', kind: 'capacitor' })).toMatchObject({ scheme: 'letter-decimal', formula: expect.stringMatching(/decimal point/) });
  });

  it('yellow-violet-red-gold is 4.7 kΩ ±5 %, 4465–4935 Ω [C]', () => {
    const r = one({ bands: ['yellow', 'violet', 'red', 'gold'] });
    expect(r).toMatchObject({ value: 4700, scheme: 'colour-bands', tolerance: { letter: 'J', text: '±5 %' } });
    expect(r.range!.low).toBeCloseTo(4465, 9);
    expect(r.range!.high).toBeCloseTo(4935, 9);
    expect(r.source).toMatch(/IEC 60062/);
  });

  it('472J reads the tolerance letter J: ±5 % [S]', () => {
    expect(one({ code: '472J', kind: 'resistor' }).tolerance).toMatchObject({ letter: 'J', plus: 5, minus: 5 });
  });

  it('auto: "4R7" reads as 4.7 Ω on a resistor and 4.7 pF on a capacitor, and says so [S]', () => {
    const r = explainMarking({ code: '4R7', kind: 'auto' });
    expect(r.ambiguous).toBe(true);
    expect(r.readings.map((x) => x.component)).toEqual(['resistor', 'capacitor']);
    expect(r.readings[0]!.value).toBeCloseTo(4.7, 12);
    expect(r.readings[1]!.value / 4.7e-12).toBeCloseTo(1, 12);
    expect(r.note).toMatch(/part itself tells which/);
  });

  it('auto: "68X" is only a resistor code and "2n2" only a capacitor code', () => {
    expect(explainMarking({ code: '68X', kind: 'auto' })).toMatchObject({ ambiguous: false, note: null, readings: [{ component: 'resistor' }] });
    expect(explainMarking({ code: '2n2', kind: 'auto' }).readings[0]).toMatchObject({ component: 'capacitor', value: 2.2e-9 });
  });

  it('a jumper has no preferred values; an odd value warns that it is in no series', () => {
    expect(one({ code: '000', kind: 'resistor' })).toMatchObject({ value: 0, preferred: [], formula: expect.stringMatching(/0 Ω link/) });
    const odd = one({ code: '4K6', kind: 'resistor' });
    expect(odd.preferred.some((p) => p.member)).toBe(false);
    expect(odd.warnings[0]).toMatch(/4\.6 kΩ is in no IEC 60063 series up to E192/);
  });

  it('refuses codes that are neither, naming the code; and unknown kinds', () => {
    expect(() => explainMarking({ code: 'XYZ', kind: 'auto' })).toThrow(/Marking "XYZ" is neither a resistor code nor a capacitor code/);
    expect(() => explainMarking({ code: '97A', kind: 'resistor' })).toThrow(/01 to 96/);
    expect(() => explainMarking({ code: '472', kind: 'inductor' as never })).toThrow(/Marking kind/);
  });
});

describe('preferred-value rows', () => {
  it('E6 2 700 Ω gives 3 300 Ω by the log rule, E12 5 000 Ω gives 4 700 Ω [C]', () => {
    expect(preferredValueRows(2700).find((r) => r.series === 'E6')!.nearest).toBe(3300);
    expect(preferredValueRows(5000).find((r) => r.series === 'E12')!.nearest).toBe(4700);
    expect(preferredValueRows(5000).map((r) => r.series)).toEqual(['E6', 'E12', 'E24', 'E48', 'E96', 'E192']);
    expect(preferredValueRows(5000).map((r) => r.tolerancePercent)).toEqual([20, 10, 5, 2, 1, 0.5]);
  });
});
