import { describe, expect, it } from 'vitest';
import { detectCurrentPulse } from './pulse';
import { simulateDischarge } from './models';

/** A cell of open-circuit voltage uOc (constant over the log) behind R, at the currents given [C]. */
function log(t: number[], amps: (s: number) => number, opts: { uOc?: number; ohms?: number } = {}) {
  const i = t.map(amps);
  const v = i.map((a) => (opts.uOc ?? 3.942) - (opts.ohms ?? 0.05) * a);
  return { t, v, i };
}
const seconds = (n: number, step = 1) => Array.from({ length: n }, (_, k) => k * step);

describe('detectCurrentPulse', () => {
  it('REFERENCES §12: 10 s at 0.6 A (3.912 V), 1 s at 3.0 A (3.792 V) logged at 1 Hz → 50.0 mΩ [M: IEC 61960-3; C]', () => {
    const p = detectCurrentPulse(log(seconds(30), (s) => (s >= 10 && s < 11 ? 3 : 0.6)))!;
    expect(p.ohms).toBeCloseTo(0.05, 12);
    expect(p).toMatchObject({ lowAmps: 0.6, highAmps: 3, atSeconds: 10, readAtSeconds: 10, lowIndex: 9, readIndex: 10 });
    expect(p.lowVolts).toBeCloseTo(3.912, 12);
    expect(p.highVolts).toBeCloseTo(3.792, 12);
  });

  it('reads U₂ 1 s after the last low sample at 10 Hz, and at the end of a plateau shorter than that [C]', () => {
    // 10 Hz, step at 10.0 s: last low sample 9.9 s, U₂ at 10.9 s. The cell sags on (polarisation
    // 20 mV/s at 3 A), so the 1 s reading gives (3.912 − (3.792 − 0.018)) / 2.4 = 57.5 mΩ [C].
    const t = seconds(300, 0.1).map((s) => Math.round(s * 10) / 10);
    const i = t.map((s) => (s >= 10 && s < 15 ? 3 : 0.6));
    const v = t.map((s, k) => 3.942 - 0.05 * i[k]! - (s >= 10 && s < 15 ? 0.02 * (s - 10) : 0));
    const p = detectCurrentPulse({ t, v, i })!;
    expect(p.atSeconds).toBe(10);
    expect(p.readAtSeconds).toBe(10.9);
    expect(p.ohms).toBeCloseTo((3.912 - (3.792 - 0.018)) / 2.4, 9);
    // A 0.5 s pulse: U₂ is its last sample, at 10.4 s.
    const short = t.map((s) => (s >= 10 && s < 10.5 ? 3 : 0.6));
    const q = detectCurrentPulse({ t, v: short.map((a) => 3.942 - 0.05 * a), i: short })!;
    expect(q.readAtSeconds).toBe(10.4);
    expect(q.ohms).toBeCloseTo(0.05, 9);
  });

  it('does not take the start of a discharge from rest, a slow drift or a voltage that does not fall for a pulse', () => {
    // From rest (0 A) to 1 A: the low level is not a load.
    expect(detectCurrentPulse(log(seconds(20), (s) => (s < 5 ? 0 : 1)))).toBeNull();
    // Constant power: the current creeps up, never steps.
    expect(detectCurrentPulse(log(seconds(600), (s) => 1 + s / 1000))).toBeNull();
    // A step whose voltage rises (a charger connected, say) gives no resistance.
    const t = seconds(20);
    const i = t.map((s) => (s === 10 ? 3 : 0.6));
    expect(detectCurrentPulse({ t, i, v: i.map((a) => 3.8 + 0.01 * a) })).toBeNull();
    // A staircase at 10 Hz, 0.6 A → 1.5 A at 10.0 s → 3.0 A at 10.5 s: 1.5 A does not hold for the 1 s
    // reading, so the first step is no pulse; the second is, from the 1.5 A held for 0.5 s.
    const t10 = seconds(300, 0.1).map((x) => Math.round(x * 10) / 10);
    const stairs = detectCurrentPulse(log(t10, (x) => (x < 10 ? 0.6 : x < 10.5 ? 1.5 : 3)))!;
    expect(stairs).toMatchObject({ lowAmps: 1.5, highAmps: 3, atSeconds: 10.5 });
    // A step from a level that is not steady (it jumped on the sample before) is not a pulse.
    expect(detectCurrentPulse(log(seconds(20), (x) => (x === 9 ? 0.3 : x === 10 ? 3 : 0.6)))).toBeNull();
    // Too small a step for the ratio.
    expect(detectCurrentPulse(log(seconds(20), (s) => (s === 10 ? 0.8 : 0.6)))).toBeNull();
    expect(
      detectCurrentPulse(
        log(seconds(20), (s) => (s === 10 ? 0.8 : 0.6)),
        { minStepRatio: 1.2 },
      )!.ohms,
    ).toBeCloseTo(0.05, 9);
  });

  it('works from a power column (I = P/V) and finds the pulse of the model discharge [C]', () => {
    const s = log(seconds(30), (x) => (x === 10 ? 3 : 0.6));
    const p = s.v.map((volts, k) => volts * s.i[k]!);
    expect(detectCurrentPulse({ t: s.t, v: s.v, p })!.ohms).toBeCloseTo(0.05, 9);
    // The demo model: 60 mΩ cell, 0.54 A (0.2 C of 2.7 Ah), 2.7 A for 1 s at 9000 s, logged at 0.5 s around it.
    const { series } = simulateDischarge({ capacityAh: 2.7, currentA: 0.54, internalResistanceOhm: 0.06, cutoffVolts: 3.0, stepS: 20, pulse: { atS: 9000, currentA: 2.7, durationS: 1 } });
    const found = detectCurrentPulse(series)!;
    expect(found.atSeconds).toBe(9000);
    expect(found.readAtSeconds).toBe(9000.5);
    // The model's OCV falls a little over the 1 s, so R reads a hair above 60 mΩ.
    expect(found.ohms).toBeCloseTo(0.06, 4);
  });

  it('rejects logs and options it cannot use, naming them', () => {
    expect(() => detectCurrentPulse({ t: [0, 1], i: [1, 1] })).toThrow(/series\.v \(voltage\) is required/);
    expect(() => detectCurrentPulse({ t: [0, 1], v: [4, 4] })).toThrow(/series\.i \(current\) or series\.p \(power\) is required/);
    const s = log(seconds(5), () => 1);
    expect(() => detectCurrentPulse(s, { minStepRatio: 1 })).toThrow(/minStepRatio must be above 1/);
    expect(() => detectCurrentPulse(s, { readAfterS: -1 })).toThrow(/readAfterS must not be negative/);
    expect(() => detectCurrentPulse(s, { levelTolerance: 0 })).toThrow(/levelTolerance/);
  });
});
