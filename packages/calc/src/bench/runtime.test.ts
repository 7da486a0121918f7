import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { runtimeReport, type RuntimeInput } from './runtime';

const fig = (r: ReturnType<typeof runtimeReport>, key: string) => {
  const f = r.figures.find((x) => x.key === key);
  if (!f) throw new Error(`no figure ${key}`);
  return f;
};
const cell = { cellNominalVolts: 3.7, cellCapacityAh: 2.7 };

describe('runtime calculator (REFERENCES §4, §11)', () => {
  it('a 2.7 Ah 3.7 V cell at 9 W: 9.99 Wh, 1.11 h, "a little over one hour" [CP; C]', () => {
    const r = runtimeReport({ ...cell, load: { kind: 'power', watts: 9 } });
    expect(fig(r, 'packEnergy').value as number).toBeCloseTo(9.99, 9);
    expect(fig(r, 'runtime').value as number).toBeCloseTo(1.11, 9);
    expect(fig(r, 'runtime')).toMatchObject({ unit: 'h', formula: expect.stringMatching(/t = E · η · u \/ P/), source: expect.stringMatching(/\[C\]/) });
    expect(fig(r, 'runtime').assumptions.join(' ')).toMatch(/Efficiency 1 assumed.*upper bound/);
    expect(fig(r, 'runtime').assumptions.join(' ')).toMatch(/usable fraction 1/);
    // 9 W / 3.7 V = 2.432432 A from 2.7 Ah: 0.900901 C [C]
    expect(fig(r, 'cRate').value as number).toBeCloseTo(0.900901, 6);
    expect(fig(r, 'transportClass')).toMatchObject({ value: 'up-to-100-wh', warnings: [] });
    expect(r.figures.map((f) => f.key)).toEqual(['packEnergy', 'runtime', 'cRate', 'transportClass']);
  });

  it('two cells in parallel last about two hours: 2.22 h [CP; C]', () => {
    expect(fig(runtimeReport({ ...cell, parallel: 2, load: { kind: 'power', watts: 9 } }), 'runtime').value as number).toBeCloseTo(2.22, 9);
  });

  it('two 3.0 Ω elements in parallel (1.5 Ω) across the cell at 3.65 V: 8.881667 W, 1.124789 h, 0.901235 C [C]', () => {
    const r = runtimeReport({ ...cell, load: { kind: 'resistance', ohms: 1.5, supplyVolts: 3.65 } });
    expect(fig(r, 'loadPower').value as number).toBeCloseTo(8.881667, 6);
    expect(fig(r, 'runtime').value as number).toBeCloseTo(1.124789, 5);
    // Fed straight from the cell: I = V / R = 2.433333 A [C]
    expect(fig(r, 'cRate').value as number).toBeCloseTo(0.901235, 5);
    expect(fig(r, 'runtime').assumptions.join(' ')).toMatch(/fed directly from the pack/);
    expect(fig(r, 'cRate').assumptions[0]).toMatch(/\(V \/ R\)/);
  });

  it('PWM at D = 0.5 on the pair averages 4.440833 W and doubles the runtime [C]', () => {
    const r = runtimeReport({ ...cell, duty: 0.5, load: { kind: 'resistance', ohms: 1.5, supplyVolts: 3.65 } });
    expect(fig(r, 'averagePower').value as number).toBeCloseTo(4.440833, 6);
    expect(fig(r, 'runtime').value as number).toBeCloseTo(2.249578, 5);
    expect(fig(r, 'cRate').label).toBe('C-rate while the load is on');
  });

  it('a power bank: 10 000 mAh at 3.7 V, η 0.85, 5 W USB (5 V × 1 A [CP]) lasts 6.29 h [C]', () => {
    const r = runtimeReport({ cellNominalVolts: 3.7, cellCapacityAh: 10, efficiency: 0.85, load: { kind: 'resistance', ohms: 5, supplyVolts: 5 } });
    expect(fig(r, 'loadPower').value as number).toBeCloseTo(5, 12);
    expect(fig(r, 'runtime').value as number).toBeCloseTo(6.29, 9);
    // Through the boost: I = 5 W / (0.85 · 3.7 V) = 1.589825 A; 0.158983 C [C]
    expect(fig(r, 'cRate').value as number).toBeCloseTo(0.158983, 6);
  });

  it('a load at 5 V on a 3.7 V cell with no efficiency asks for one', () => {
    const r = runtimeReport({ cellNominalVolts: 3.7, cellCapacityAh: 10, load: { kind: 'resistance', ohms: 5, supplyVolts: 5 } });
    expect(fig(r, 'loadPower').warnings[0]).toMatch(/a converter sits between them; give its efficiency/);
  });

  it('usable fraction scales the runtime: 37 Wh, η 0.85, u 0.9, 5 W → 5.661 h [C]', () => {
    const r = runtimeReport({ cellNominalVolts: 3.7, cellCapacityAh: 10, efficiency: 0.85, usableFraction: 0.9, load: { kind: 'power', watts: 5 } });
    expect(fig(r, 'runtime').value as number).toBeCloseTo(5.661, 9);
  });

  it('a current drawn from the pack: 1 A from 3.7 V 2.7 Ah is 3.7 W and 2.7 h; efficiency is not applied, with a note [C]', () => {
    const r = runtimeReport({ ...cell, efficiency: 0.8, load: { kind: 'current', amps: 1 } });
    expect(fig(r, 'loadPower').value as number).toBeCloseTo(3.7, 12);
    expect(fig(r, 'loadPower').warnings[0]).toMatch(/Efficiency is not applied/);
    expect(fig(r, 'runtime').value as number).toBeCloseTo(2.7, 12);
    expect(fig(r, 'cRate').value as number).toBeCloseTo(1 / 2.7, 12);
  });

  it('C-rate: 0.2 C of a 3.0 Ah cell is 0.600 A [S]; above 1 C warns', () => {
    expect(fig(runtimeReport({ cellNominalVolts: 3.6, cellCapacityAh: 3, load: { kind: 'current', amps: 0.6 } }), 'cRate').value as number).toBeCloseTo(0.2, 12);
    const hard = runtimeReport({ cellNominalVolts: 3.6, cellCapacityAh: 3, load: { kind: 'current', amps: 6 } });
    expect(fig(hard, 'cRate').warnings[0]).toMatch(/2 C is a heavy discharge/);
  });

  it.each([
    [3.7, 27, 1, 'up-to-100-wh', 99.9],
    [3.6, 7, 4, '100-to-160-wh', 100.8],
    [3.85, 13.9, 3, 'over-160-wh', 160.545],
  ] as const)('%d V × %d Ah × %dS is class %s (%d Wh) [S: IATA DGR; C]', (v, ah, s, cls, wh) => {
    const r = runtimeReport({ cellNominalVolts: v, cellCapacityAh: ah, series: s, load: { kind: 'power', watts: 10 } });
    expect(fig(r, 'packEnergy').value as number).toBeCloseTo(wh, 9);
    expect(fig(r, 'transportClass').value).toBe(cls);
    expect(fig(r, 'transportClass').warnings.length).toBe(cls === 'up-to-100-wh' ? 0 : 1);
  });

  it('no transport class for NiMH or alkaline cells', () => {
    const r = runtimeReport({ cellNominalVolts: 1.2, cellCapacityAh: 2, series: 4, chemistry: 'nimh', load: { kind: 'power', watts: 2 } });
    expect(r.figures.some((f) => f.key === 'transportClass')).toBe(false);
  });

  it('with a cell mass: 3.6 V 3.35 Ah 48.5 g is 248.66 Wh/kg, plausible [C]; 3.6 V 3.0 Ah 45 g is 240 Wh/kg [S/C]', () => {
    const r = runtimeReport({ cellNominalVolts: 3.6, cellCapacityAh: 3.35, cellMassKg: 0.0485, load: { kind: 'power', watts: 5 } });
    expect(fig(r, 'specificEnergy').value as number).toBeCloseTo(248.66, 2);
    expect(fig(r, 'plausibility')).toMatchObject({ value: 'plausible', warnings: [] });
    const r2 = runtimeReport({ cellNominalVolts: 3.6, cellCapacityAh: 3.0, cellMassKg: 0.045, load: { kind: 'power', watts: 5 } });
    expect(fig(r2, 'specificEnergy').value as number).toBeCloseTo(240, 9);
  });

  it('a 9 900 mAh label on a 45 g cell is 814 Wh/kg: implausible above 300 Wh/kg [CP]', () => {
    const r = runtimeReport({ cellNominalVolts: 3.7, cellCapacityAh: 9.9, cellMassKg: 0.045, load: { kind: 'power', watts: 5 } });
    expect(fig(r, 'specificEnergy').value as number).toBeCloseTo(814, 0);
    expect(fig(r, 'plausibility').value).toBe('implausible');
    expect(fig(r, 'plausibility').warnings[0]).toMatch(/814 Wh\/kg is above the 300 Wh\/kg a commercial li-ion cell reaches/);
    expect(r.warnings).toContain(fig(r, 'plausibility').warnings[0]);
  });

  it('runtime × average power = usable energy × efficiency (property) [C]', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 5, noNaN: true }),
        fc.double({ min: 0.1, max: 50, noNaN: true }),
        fc.double({ min: 0.1, max: 100, noNaN: true }),
        fc.double({ min: 0.5, max: 1, noNaN: true }),
        fc.double({ min: 0.1, max: 1, noNaN: true }),
        (v, ah, w, eta, d) => {
          const r = runtimeReport({ cellNominalVolts: v, cellCapacityAh: ah, efficiency: eta, duty: d, load: { kind: 'power', watts: w } });
          expect(((fig(r, 'runtime').value as number) * w * d) / (v * ah * eta)).toBeCloseTo(1, 9);
        },
      ),
    );
  });

  it('refuses impossible inputs with a RangeError naming them', () => {
    const ok: RuntimeInput = { ...cell, load: { kind: 'power', watts: 9 } };
    expect(() => runtimeReport({ ...ok, cellCapacityAh: 0 })).toThrow(/Cell capacity/);
    expect(() => runtimeReport({ ...ok, series: 1.5 })).toThrow(/Cells in series/);
    expect(() => runtimeReport({ ...ok, efficiency: 1.2 })).toThrow(/Efficiency/);
    expect(() => runtimeReport({ ...ok, duty: 0 })).toThrow(/Duty cycle/);
    expect(() => runtimeReport({ ...ok, usableFraction: 2 })).toThrow(/Usable fraction/);
    expect(() => runtimeReport({ ...ok, load: { kind: 'power', watts: 0 } })).toThrow(/Load power/);
    expect(() => runtimeReport({ ...ok, load: { kind: 'resistance', ohms: 3, supplyVolts: 0 } })).toThrow(/Supply voltage/);
    expect(() => runtimeReport({ ...ok, load: { kind: 'current', amps: -1 } })).toThrow(/Load current/);
    expect(() => runtimeReport({ ...ok, load: { kind: 'magic' } as never })).toThrow(/The load needs/);
    expect(() => runtimeReport({ ...ok, cellMassKg: 0 })).toThrow(/Cell mass/);
  });
});
