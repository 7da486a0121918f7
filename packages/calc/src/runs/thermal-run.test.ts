import { describe, expect, it } from 'vitest';
import { analyseThermal } from './thermal-run';
import { firstOrderThermal, simulateHeater } from './models';

describe('analyseThermal — steady state', () => {
  // First-order response T(t) = 20 + 30·(1 − e^(−t/300)) [C], logged every second with 0.1 °C noise.
  const tau = 300;
  const { series } = simulateHeater({
    watts: 3,
    tauS: tau,
    rthKPerW: 10,
    ambientC: 20,
    durationS: 12 * tau,
    stepS: 1,
    noise: { seed: 3, tempSd: 0.1 },
  });

  it('reports the steady temperature within 0.1 °C of T0 + ΔT = 50 °C [C]', () => {
    const r = analyseThermal(series);
    expect(r.steadyState.reached).toBe(true);
    expect(Math.abs(r.steadyState.temperatureC! - 50)).toBeLessThan(0.1);
  });

  it('declares the plateau only after 3–5 τ (slope ≤ 0.1 °C/min over 300 s, held 150 s) [C]', () => {
    // Slope of the response: (ΔT/τ)·e^(−t/τ) = 6 °C/min·e^(−t/τ) falls to 0.1 °C/min at t = τ·ln 60 ≈ 4.1 τ.
    const r = analyseThermal(series);
    const fromTau = r.steadyState.fromS! / tau;
    expect(fromTau).toBeGreaterThanOrEqual(3);
    expect(fromTau).toBeLessThanOrEqual(5);
    expect(r.steadyState.declaredAtS! / tau).toBeGreaterThanOrEqual(3);
    expect(r.steadyState.declaredAtS! / tau).toBeLessThanOrEqual(6);
    expect(r.steadyState.toS).toBe(12 * tau);
    expect(r.steadyState.criterion).toMatch(/0\.1 °C\/min over a 300 s window/);
  });

  it('declares later with a tighter slope tolerance [C]', () => {
    const loose = analyseThermal(series);
    const tight = analyseThermal(series, { slopeToleranceCPerMin: 0.02 });
    // 0.02 °C/min is reached near τ·ln 300 ≈ 5.7 τ.
    expect(tight.steadyState.fromS!).toBeGreaterThan(loose.steadyState.fromS!);
    expect(Math.abs(tight.steadyState.temperatureC! - 50)).toBeLessThan(0.1);
  });

  it('finds no plateau on a steady ramp of 1 °C/min', () => {
    const t = Array.from({ length: 3601 }, (_, k) => k);
    const temp = t.map((s) => 20 + s / 60);
    const r = analyseThermal({ t, temp });
    expect(r.steadyState).toMatchObject({ reached: false, temperatureC: null, fromS: null, toS: null, declaredAtS: null });
  });

  it('ends the plateau where the surface starts to cool', () => {
    // Heats with τ = 120 s for 1 800 s, then cools with the same τ.
    const t: number[] = [];
    const temp: number[] = [];
    for (let s = 0; s <= 3600; s += 2) {
      t.push(s);
      const peak = firstOrderThermal(1800, { initialC: 25, riseC: 20, tauS: 120 });
      temp.push(s <= 1800 ? firstOrderThermal(s, { initialC: 25, riseC: 20, tauS: 120 }) : 25 + (peak - 25) * Math.exp(-(s - 1800) / 120));
    }
    const r = analyseThermal({ t, temp });
    expect(r.steadyState.reached).toBe(true);
    expect(r.steadyState.toS!).toBeGreaterThan(1800);
    expect(r.steadyState.toS!).toBeLessThan(2100);
    expect(Math.abs(r.steadyState.temperatureC! - 45)).toBeLessThan(0.1);
  });

  it('cannot judge a plateau when samples are further apart than half the window', () => {
    const t = [0, 400, 800, 1200, 1600, 2000];
    const r = analyseThermal({ t, temp: [30, 30, 30, 30, 30, 30] });
    expect(r.steadyState.reached).toBe(false);
    // With a longer window the same flat log is a plateau.
    expect(analyseThermal({ t, temp: [30, 30, 30, 30, 30, 30] }, { windowS: 800, holdS: 0 }).steadyState).toMatchObject({
      reached: true,
      temperatureC: 30,
      fromS: 0,
    });
  });
});

describe('analyseThermal — peak, threshold and margin', () => {
  const log = { t: [0, 10, 20, 30], temp: [20, 30, 50, 49] };

  it('finds the peak and interpolates the time to a threshold [C]', () => {
    const r = analyseThermal(log, { thresholdC: 40 });
    expect(r.maxC).toBe(50);
    expect(r.maxAtS).toBe(20);
    // Between 30 °C at 10 s and 50 °C at 20 s: 10 + (40 − 30)/(50 − 30) × 10 = 15 s
    expect(r.timeToThresholdS).toBeCloseTo(15, 12);
    expect(analyseThermal(log, { thresholdC: 30 }).timeToThresholdS).toBe(10);
    expect(analyseThermal(log, { thresholdC: 15 }).timeToThresholdS).toBe(0);
    expect(analyseThermal(log, { thresholdC: 60 }).timeToThresholdS).toBeNull();
    expect(analyseThermal(log).timeToThresholdS).toBeNull();
  });

  it('gives the margin to a burn threshold: 48 °C (10 min, ISO 13732-1 [M]) − 50 °C = −2 °C', () => {
    const r = analyseThermal(log, { burnThresholdC: 48, material: 'plastic', contactSeconds: 600 });
    expect(r.marginC).toBe(-2);
    expect(r.burnThreshold).toEqual({ temperatureC: 48, material: 'plastic', contactSeconds: 600 });
    const plain = analyseThermal(log, { burnThresholdC: 51 });
    expect(plain.marginC).toBe(1);
    expect(plain.burnThreshold).toEqual({ temperatureC: 51, material: null, contactSeconds: null });
    expect(analyseThermal(log).marginC).toBeNull();
    expect(analyseThermal(log).burnThreshold).toBeNull();
  });

  it('names the wrong input', () => {
    expect(() => analyseThermal({ t: [0, 1], v: [1, 2] })).toThrow(/series\.temp \(temperature\) is required/);
    expect(() => analyseThermal(log, { thresholdC: Number.NaN })).toThrow(/thresholdC/);
    expect(() => analyseThermal(log, { contactSeconds: 0 })).toThrow(/contactSeconds/);
    expect(() => analyseThermal(log, { windowS: -5 })).toThrow(/windowS/);
    expect(() => analyseThermal(log, { slopeToleranceCPerMin: 0 })).toThrow(/slopeToleranceCPerMin/);
    expect(() => analyseThermal(log, { holdS: -1 })).toThrow(/holdS must not be negative/);
    expect(() => analyseThermal(log, { material: 3 as never })).toThrow(/material must be text/);
  });
});
