import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { createSeededRandom, firstOrderThermal, lithiumIonOcv, MAX_SIMULATED_SAMPLES, simulateCharge, simulateDischarge, simulateHeater } from './models';

describe('createSeededRandom', () => {
  it('repeats for a seed, differs between seeds, and stays in [0, 1)', () => {
    const a = createSeededRandom(42);
    const b = createSeededRandom(42);
    const c = createSeededRandom(43);
    const seqA = Array.from({ length: 1000 }, a);
    const seqB = Array.from({ length: 1000 }, b);
    const seqC = Array.from({ length: 1000 }, c);
    expect(seqA).toEqual(seqB);
    expect(seqA).not.toEqual(seqC);
    for (const x of seqA) {
      expect(x).toBeGreaterThanOrEqual(0);
      expect(x).toBeLessThan(1);
    }
    // Mean of 1000 uniform draws is 0.5 ± 0.05 (about 5 standard errors) [C].
    expect(Math.abs(seqA.reduce((s, x) => s + x, 0) / 1000 - 0.5)).toBeLessThan(0.05);
    expect(() => createSeededRandom(Number.NaN)).toThrow(/seed/);
  });
});

describe('lithiumIonOcv (approximation [M])', () => {
  it('runs from 3.0 V empty to 4.2 V full (REFERENCES §4: 4.20 V charge, 2.5–3.0 V cut-off) [S]', () => {
    expect(lithiumIonOcv(0)).toBeCloseTo(3.0, 12);
    expect(lithiumIonOcv(1)).toBeCloseTo(4.2, 12);
    // Mid-charge sits near the 3.6–3.7 V nominal voltage (REFERENCES §4) [S]
    expect(lithiumIonOcv(0.5)).toBeGreaterThan(3.6);
    expect(lithiumIonOcv(0.5)).toBeLessThan(3.85);
  });

  it('is strictly increasing (property) [C]', () => {
    fc.assert(
      // On a 1e-6 grid of states of charge (finer steps fall below double precision near 4.2 V).
      fc.property(fc.integer({ min: 0, max: 1_000_000 }), fc.integer({ min: 0, max: 1_000_000 }), (a, b) => {
        fc.pre(a < b);
        expect(lithiumIonOcv(b / 1e6)).toBeGreaterThan(lithiumIonOcv(a / 1e6));
      }),
    );
  });

  it('rejects a state of charge outside 0..1', () => {
    expect(() => lithiumIonOcv(1.2)).toThrow(/soc/);
  });
});

describe('firstOrderThermal', () => {
  it('reaches 63.2 % of the rise at t = τ and 95.0 % at 3 τ [C]', () => {
    const p = { initialC: 20, riseC: 30, tauS: 300 };
    expect(firstOrderThermal(0, p)).toBe(20);
    expect(firstOrderThermal(300, p)).toBeCloseTo(20 + 30 * 0.63212056, 6);
    expect(firstOrderThermal(900, p)).toBeCloseTo(20 + 30 * 0.95021293, 6);
    expect(() => firstOrderThermal(-1, p)).toThrow(/tS/);
    expect(() => firstOrderThermal(1, { ...p, tauS: 0 })).toThrow(/tauS/);
  });
});

describe('simulateDischarge', () => {
  it('holds the power constant in constant-power mode and stops at the cut-off [C]', () => {
    const { series, endReason } = simulateDischarge({
      capacityAh: 2.7,
      powerW: 9,
      internalResistanceOhm: 0.06,
      cutoffVolts: 3.0,
      stepS: 5,
    });
    expect(endReason).toBe('cutoff');
    for (const p of series.p) expect(p).toBeCloseTo(9, 9);
    expect(series.v[series.v.length - 1]!).toBeLessThanOrEqual(3.0);
    // REFERENCES §11 [CP]: one 2.7 Ah cell feeding about 9 W lasts a little over one hour at most.
    const hours = series.t[series.t.length - 1]! / 3600;
    expect(hours).toBeGreaterThan(0.9);
    expect(hours).toBeLessThan(1.2);
  });

  it('empties the cell when the cut-off is below the empty voltage, and is reproducible with noise', () => {
    const ideal = simulateDischarge({ capacityAh: 1, powerW: 3.7, internalResistanceOhm: 0, cutoffVolts: 2.5, stepS: 30 });
    expect(ideal.endReason).toBe('empty');
    const noisy = () =>
      simulateDischarge({
        capacityAh: 1,
        currentA: 1,
        internalResistanceOhm: 0.05,
        cutoffVolts: 3.0,
        stepS: 30,
        noise: { seed: 9, voltsSd: 0.003, ampsSd: 0.002 },
      });
    expect(noisy().series).toEqual(noisy().series);
  });

  it('stops at once when the power asked for is beyond what the cell can give', () => {
    // OCV 4.2 V with 1 Ω: the most it can deliver is 4.2²/4 = 4.41 W.
    const { series, endReason } = simulateDischarge({ capacityAh: 1, powerW: 10, internalResistanceOhm: 1, cutoffVolts: 3, stepS: 10 });
    expect(endReason).toBe('cutoff');
    expect(series.t.length).toBe(1);
  });

  it('steps to the pulse current for its duration, logged every 0.5 s from 10 s before to 10 s after [C]', () => {
    const plain = simulateDischarge({ capacityAh: 2.7, currentA: 0.54, internalResistanceOhm: 0.06, cutoffVolts: 3.0, stepS: 20 });
    const { series, endReason } = simulateDischarge({
      capacityAh: 2.7,
      currentA: 0.54,
      internalResistanceOhm: 0.06,
      cutoffVolts: 3.0,
      stepS: 20,
      pulse: { atS: 9000, currentA: 2.7, durationS: 1 },
    });
    expect(endReason).toBe('cutoff');
    const at = (s: number) => series.t.indexOf(s);
    // 8980 s and 8990 s are on the 20 s grid and in the window; the window runs 8990 → 9011 s in 0.5 s steps.
    expect(series.t.slice(at(8980), at(8980) + 4)).toEqual([8980, 8990, 8990.5, 8991]);
    expect(series.t.slice(at(9010.5), at(9010.5) + 3)).toEqual([9010.5, 9011, 9020]);
    expect(series.i[at(8999.5)]).toBe(0.54);
    expect(series.i[at(9000)]).toBe(2.7);
    expect(series.i[at(9000.5)]).toBe(2.7);
    expect(series.i[at(9001)]).toBe(0.54);
    // U = OCV − I·R: the step from 0.54 A to 2.7 A drops the voltage by 2.16 A × 0.06 Ω = 0.1296 V, less the
    // OCV fall over 0.5 s (under 0.1 mV) [C].
    expect(series.v[at(8999.5)]! - series.v[at(9000)]!).toBeCloseTo(0.1296, 4);
    // The extra 2.16 A for 1 s takes 0.6 mAh, so the run ends at most a sample earlier than without the pulse.
    expect(Math.abs(series.t.at(-1)! - plain.series.t.at(-1)!)).toBeLessThanOrEqual(20);
    // Outside the window the samples are those of the run without the pulse.
    expect(series.t.slice(0, 100)).toEqual(plain.series.t.slice(0, 100));
  });

  it('names a wrong pulse', () => {
    const base = { capacityAh: 1, internalResistanceOhm: 0.05, cutoffVolts: 3, stepS: 10, currentA: 0.2 };
    expect(() => simulateDischarge({ ...base, pulse: { atS: -1, currentA: 1, durationS: 1 } })).toThrow(/pulse\.atS/);
    expect(() => simulateDischarge({ ...base, pulse: { atS: 60, currentA: 0, durationS: 1 } })).toThrow(/pulse\.currentA/);
    expect(() => simulateDischarge({ ...base, pulse: { atS: 60, currentA: 1, durationS: 0 } })).toThrow(/pulse\.durationS/);
    expect(() => simulateDischarge({ ...base, pulse: { atS: 60, currentA: 1, durationS: 1, stepS: 20 } })).toThrow(/pulse\.stepS \(20 s\) must not be longer/);
    expect(() => simulateDischarge({ ...base, pulse: { atS: 60, currentA: 1, durationS: 1, leadS: -1 } })).toThrow(/pulse\.leadS/);
    // A pulse from the first sample: the window starts at 0 s.
    const { series } = simulateDischarge({ ...base, pulse: { atS: 0, currentA: 1, durationS: 1 } });
    expect(series.t.slice(0, 3)).toEqual([0, 0.5, 1]);
    expect(series.i.slice(0, 3)).toEqual([1, 1, 0.2]);
  });

  it('names the wrong input', () => {
    const base = { capacityAh: 1, internalResistanceOhm: 0.05, cutoffVolts: 3, stepS: 10 };
    expect(() => simulateDischarge(base)).toThrow(/exactly one of currentA or powerW/);
    expect(() => simulateDischarge({ ...base, currentA: 1, powerW: 3 })).toThrow(/exactly one/);
    expect(() => simulateDischarge({ ...base, currentA: -1 })).toThrow(/currentA/);
    expect(() => simulateDischarge({ ...base, powerW: 0 })).toThrow(/powerW/);
    expect(() => simulateDischarge({ ...base, currentA: 1, stepS: 1e-6 })).toThrow(new RegExp(`more than ${MAX_SIMULATED_SAMPLES} samples`));
    expect(() => simulateDischarge({ ...base, currentA: 1, noise: { seed: 1, voltsSd: -1 } })).toThrow(/noise\.voltsSd/);
  });
});

describe('simulateCharge', () => {
  it('charges at constant current, then holds the CV voltage until the termination current [C]', () => {
    const { series, transitionIndex } = simulateCharge({
      capacityAh: 3,
      ccCurrentA: 1.5,
      cvVolts: 4.2,
      terminationA: 0.15,
      internalResistanceOhm: 0.05,
      stepS: 10,
    });
    const k = transitionIndex!;
    expect(series.i.slice(0, k).every((i) => i === 1.5)).toBe(true);
    expect(series.v.slice(k).every((v) => v === 4.2)).toBe(true);
    expect(series.i[series.i.length - 1]!).toBeLessThanOrEqual(0.15);
    // CC at 0.5 C for most of the charge: the CC phase lasts under 2 h [C].
    expect(series.t[k]!).toBeLessThan(7200);
  });

  it('names the wrong input', () => {
    const base = { capacityAh: 3, ccCurrentA: 1.5, cvVolts: 4.2, terminationA: 0.15, internalResistanceOhm: 0.05, stepS: 10 };
    expect(() => simulateCharge({ ...base, cvVolts: 4.35 })).toThrow(/cvVolts \(4\.35 V\) must not exceed/);
    expect(() => simulateCharge({ ...base, terminationA: 2 })).toThrow(/terminationA \(2 A\) must be below ccCurrentA/);
    expect(() => simulateCharge({ ...base, initialSoc: 1 })).toThrow(/initialSoc/);
    expect(() => simulateCharge({ ...base, internalResistanceOhm: 0 })).toThrow(/internalResistanceOhm/);
  });
});

describe('simulateHeater', () => {
  it('samples the first-order response up to the duration [C]', () => {
    const { series } = simulateHeater({ watts: 4.44, tauS: 200, rthKPerW: 5, ambientC: 22, durationS: 2000, stepS: 10 });
    expect(series.t.length).toBe(201);
    expect(series.t[200]).toBe(2000);
    expect(series.temp[0]).toBe(22);
    // ΔT∞ = 4.44 W × 5 K/W = 22.2 K; at 10 τ the rise is complete to 1e-3 K [C].
    expect(series.temp[200]!).toBeCloseTo(44.2, 2);
    expect(series.p.every((p) => p === 4.44)).toBe(true);
    expect(() => simulateHeater({ watts: 1, tauS: 200, rthKPerW: 0, ambientC: 22, durationS: 100, stepS: 1 })).toThrow(/rthKPerW/);
  });
});
