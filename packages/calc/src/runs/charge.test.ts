import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyseCharge } from './charge';
import { createSeededRandom, simulateCharge } from './models';

/** Seeded normal deviates for test noise. */
function normal(seed: number): () => number {
  const u = createSeededRandom(seed);
  return () => Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());
}

/**
 * Synthetic CC-CV log with a known transition time tx [C]: before tx the
 * current is 1.5 A and the voltage climbs as 3.6 + 0.6·(t/tx)^1.5; from tx the
 * voltage holds 4.2 V and the current decays as 1.5·e^(−(t − tx)/τ).
 */
function ccCv(tx: number, tauS: number, opts: { stepS?: number; seed?: number; voltsSd?: number; ampsSd?: number } = {}) {
  const stepS = opts.stepS ?? 10;
  const rand = normal(opts.seed ?? 1);
  const n = Math.ceil((tx + 4 * tauS) / stepS);
  const t: number[] = [];
  const v: number[] = [];
  const i: number[] = [];
  for (let k = 0; k < n; k++) {
    const tk = k * stepS;
    const cc = tk < tx;
    t.push(tk);
    v.push((cc ? 3.6 + 0.6 * (tk / tx) ** 1.5 : 4.2) + (opts.voltsSd ?? 0) * rand());
    i.push((cc ? 1.5 : 1.5 * Math.exp(-(tk - tx) / tauS)) + (opts.ampsSd ?? 0) * rand());
  }
  return { t, v, i, stepS };
}

describe('analyseCharge', () => {
  it('works a small log by hand [C]', () => {
    const s = {
      t: [0, 60, 120, 180, 240, 300, 360, 420, 480, 540],
      v: [3.8, 3.9, 4.0, 4.1, 4.2, 4.2, 4.2, 4.2, 4.2, 4.2],
      i: [1, 1, 1, 1, 0.8, 0.6, 0.4, 0.2, 0.1, 0.05],
    };
    const r = analyseCharge(s, { cvVolts: 4.2, terminationFraction: 0.1 });
    // First sample within 0.01 V of 4.2 V is index 4, and the current falls there (0.8 < 1 − 0.005).
    expect(r.transitionIndex).toBe(4);
    expect(r.cc).toEqual({ startS: 0, endS: 240, currentA: 1 });
    // Termination 0.1 × 1 A = 0.1 A: first reached at index 8 (t = 480 s).
    expect(r.terminationCurrentA).toBeCloseTo(0.1, 12);
    expect(r.terminated).toBe(true);
    expect(r.cv).toEqual({ startS: 240, endS: 480, volts: 4.2 });
    expect(r.chargeTimeS).toBe(480);
    // Ah over 0..480 s: 60/2 × (2 + 2 + 2 + 1.8 + 1.4 + 1.0 + 0.6 + 0.3) = 333 A·s = 0.0925 Ah
    expect(r.ampHours).toBeCloseTo(0.0925, 12);
    // P = 3.8, 3.9, 4.0, 4.1, 3.36, 2.52, 1.68, 0.84, 0.42 W;
    // Wh = 30 × (7.7 + 7.9 + 8.1 + 7.46 + 5.88 + 4.2 + 2.52 + 1.26) / 3600 = 1350.6 W·s = 0.375167 Wh
    expect(r.wattHours).toBeCloseTo(0.375167, 6);
    expect(r.endIndex).toBe(8);
    // Without a given CV voltage the plateau is estimated at 4.2 V and the result is the same.
    const estimated = analyseCharge(s, { terminationFraction: 0.1 });
    expect(estimated.plateauVolts).toBeCloseTo(4.2, 12);
    expect(estimated.transitionIndex).toBe(4);
  });

  it('finds a known transition within ±1 sample, on and between samples, without noise [C]', () => {
    for (const tx of [3000, 3004, 3005, 3009.9, 5432.1]) {
      const s = ccCv(tx, 900);
      const r = analyseCharge(s, { cvVolts: 4.2 });
      expect(Math.abs(s.t[r.transitionIndex!]! - tx)).toBeLessThanOrEqual(s.stepS);
      expect(r.cc.currentA).toBeCloseTo(1.5, 12);
    }
  });

  it('finds a known transition within ±1 sample with small noise (property) [C]', () => {
    fc.assert(
      fc.property(fc.double({ min: 2000, max: 6000, noNaN: true }), fc.double({ min: 300, max: 900, noNaN: true }), fc.integer({ min: 1, max: 1_000_000 }), fc.boolean(), (tx, tau, seed, giveCv) => {
        // Noise: 2 mV on the voltage, 2 mA (0.13 %) on the current.
        const s = ccCv(tx, tau, { seed, voltsSd: 0.002, ampsSd: 0.002 });
        const r = analyseCharge(s, giveCv ? { cvVolts: 4.2 } : {});
        expect(r.transitionIndex).not.toBeNull();
        expect(Math.abs(s.t[r.transitionIndex!]! - tx)).toBeLessThanOrEqual(s.stepS);
      }),
      { numRuns: 150 },
    );
  });

  it('finds the CV start of the simulated model charge within ±1 sample, with and without noise [C]', () => {
    for (const noise of [undefined, { seed: 7, voltsSd: 0.002, ampsSd: 0.003 }]) {
      const sim = simulateCharge({
        capacityAh: 3,
        ccCurrentA: 1.5,
        cvVolts: 4.2,
        terminationA: 0.15,
        internalResistanceOhm: 0.05,
        stepS: 10,
        noise,
      });
      const r = analyseCharge(sim.series, { terminationFraction: 0.1 });
      expect(Math.abs(r.transitionIndex! - sim.transitionIndex!)).toBeLessThanOrEqual(1);
      expect(r.cv!.volts).toBeCloseTo(4.2, 2);
      // From empty to a 0.1 C taper the model takes in nearly all of its 3 Ah [C].
      expect(r.ampHours).toBeGreaterThan(2.9);
      expect(r.ampHours).toBeLessThan(3.01);
    }
  });

  it('terminates at 0.05 C of the rated capacity: 0.150 A for a 3.0 Ah cell, not 5 % of the CC current (REFERENCES §4) [S; C]', () => {
    // CC 1.5 A, then I = 1.5·e^(−(t − 3000)/900): 0.150 A at 3000 + 900·ln 10 = 5072.3 s, where 5 % of
    // the CC current (0.075 A) would be reached only at 3000 + 900·ln 20 = 5696.2 s [C].
    const s = ccCv(3000, 900);
    const r = analyseCharge(s, { cvVolts: 4.2, ratedCapacityAh: 3 });
    expect(r.terminationCurrentA).toBeCloseTo(0.15, 12);
    expect(r.terminationBasis).toBe('rated-capacity');
    expect(r.terminated).toBe(true);
    expect(Math.abs(r.chargeTimeS - (3000 + 900 * Math.log(10)))).toBeLessThanOrEqual(s.stepS);
    // C/10 of 3.0 Ah = 0.300 A (REFERENCES §4) [S].
    expect(analyseCharge(s, { cvVolts: 4.2, ratedCapacityAh: 3, terminationFraction: 0.1 }).terminationCurrentA).toBeCloseTo(0.3, 12);
    // Without a rating, the fraction is of the CC current, as before.
    const cc = analyseCharge(s, { cvVolts: 4.2 });
    expect(cc.terminationBasis).toBe('cc-current');
    expect(cc.terminationCurrentA).toBeCloseTo(0.075, 12);
    expect(Math.abs(cc.chargeTimeS - (3000 + 900 * Math.log(20)))).toBeLessThanOrEqual(s.stepS);
  });

  it('refuses a termination current at or above the constant current, and a bad rating', () => {
    // 0.05 C of 40 Ah is 2 A, above the 1.5 A the charger gives.
    expect(() => analyseCharge(ccCv(3000, 900), { cvVolts: 4.2, ratedCapacityAh: 40 })).toThrow(/terminationFraction: 0\.05 C of the rated 40 Ah is 2 A, not below the constant current of 1\.5 A/);
    expect(() => analyseCharge(ccCv(3000, 900), { ratedCapacityAh: 0 })).toThrow(/ratedCapacityAh must be greater than zero/);
  });

  it('reports no CV phase when the voltage never reaches the plateau, and an unterminated charge', () => {
    const s = { t: [0, 60, 120, 180], v: [3.7, 3.8, 3.9, 4.0], i: [1, 1, 1, 1] };
    const r = analyseCharge(s, { cvVolts: 4.2 });
    expect(r.transitionIndex).toBeNull();
    expect(r.cv).toBeNull();
    expect(r.terminated).toBe(false);
    expect(r.cc).toEqual({ startS: 0, endS: 180, currentA: 1 });
    expect(r.chargeTimeS).toBe(180);
  });

  it('takes a single fall at the end of the log as the taper, and finds no CV phase when the current never falls', () => {
    const s = { t: [0, 60, 120, 180, 240], v: [3.9, 4.0, 4.1, 4.2, 4.0], i: [1, 1, 1, 1, 0] };
    const r = analyseCharge(s, { cvVolts: 4.2 });
    // Only one sample below the CC level, at the end of the log: it counts as the fall.
    expect(r.transitionIndex).toBe(3);
    const flat = analyseCharge({ t: [0, 60, 120], v: [4.0, 4.2, 4.2], i: [1, 1, 1] }, { cvVolts: 4.2 });
    expect(flat.transitionIndex).toBeNull();
    expect(flat.cv).toBeNull();
  });

  it('rejects logs it cannot analyse, naming the field', () => {
    expect(() => analyseCharge({ t: [0, 1], v: [4, 4] })).toThrow(/series\.i \(current\) is required/);
    expect(() => analyseCharge({ t: [0, 1, 2], v: [3.9, 4.0, 4.2], i: [-1, -1, -0.5] }, { cvVolts: 4.2 })).toThrow(/series\.i \(current\) must be positive while charging/);
    expect(() => analyseCharge({ t: [0, 1], v: [4, 4], i: [1, 1] }, { cvVolts: 0 })).toThrow(/cvVolts/);
    expect(() => analyseCharge({ t: [0, 1], v: [4, 4], i: [1, 1] }, { terminationFraction: 2 })).toThrow(/terminationFraction/);
    expect(() => analyseCharge({ t: [0, 1], v: [4, 4], i: [1, 1] }, { voltageToleranceV: 0 })).toThrow(/voltageToleranceV/);
    expect(() => analyseCharge({ t: [0, 1], v: [4, 4], i: [1, 1] }, { currentToleranceFraction: -1 })).toThrow(/currentToleranceFraction/);
  });
});
