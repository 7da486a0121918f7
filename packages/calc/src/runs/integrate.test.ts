import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import integrate from 'integrate-adaptive-simpson';
import { integrateRun, integrateSeries } from './integrate';

// REFERENCES §8, Example A [S: composite trapezoidal rule, numpy docs; C]
const exampleA = {
  t: [0, 600, 1200, 1800, 2400],
  i: [2.0, 2.0, 1.9, 1.8, 1.6],
  v: [4.1, 3.9, 3.8, 3.7, 3.5],
};
// REFERENCES §8, Example B (uneven steps) [S: composite trapezoidal rule; C]
const exampleB = {
  t: [0, 60, 180, 420, 900],
  i: [1.0, 0.98, 0.95, 0.9, 0.8],
  v: [4.15, 4.05, 3.98, 3.9, 3.8],
};
const toSamples = (s: { t: number[]; v: number[]; i: number[] }) => s.t.map((t, k) => ({ t, v: s.v[k]!, i: s.i[k]! }));

describe('integrateRun', () => {
  it('matches REFERENCES §8 Example A [S: trapezoidal rule; C]', () => {
    const r = integrateRun(toSamples(exampleA));
    expect(r.ampHours).toBeCloseTo(1.25, 6);
    expect(r.wattHours).toBeCloseTo(4.763333, 6);
    expect(r.durationS).toBe(2400);
    expect(r.averageVolts).toBeCloseTo(3.810667, 6); // Wh / Ah, as §8 states it
    expect(r.timeAverageVolts).toBeCloseTo(3.8, 9); // ∫V dt / duration = 9120 V·s / 2400 s [C]
  });

  it('integrates V·I per sample, not mean V × mean I (§8: the wrong way gives 4.760833 Wh) [C]', () => {
    const r = integrateRun(toSamples(exampleA));
    expect(Math.abs(r.wattHours - 4.760833)).toBeGreaterThan(0.002);
  });

  it('matches REFERENCES §8 Example B with uneven steps [S: trapezoidal rule; C]', () => {
    const r = integrateRun(toSamples(exampleB));
    expect(r.ampHours).toBeCloseTo(0.223667, 6);
    expect(r.wattHours).toBeCloseTo(0.876525, 6);
    expect(r.durationS).toBe(900);
  });

  it('agrees with adaptive Simpson quadrature on a finely sampled smooth V·I curve [S: integrate-adaptive-simpson]', () => {
    const T = 3600;
    const volts = (t: number) => 4.15 - 0.55 * (t / T) - 0.08 * Math.sin((3 * Math.PI * t) / T);
    const amps = (t: number) => 1.5 + 0.3 * Math.cos((2 * Math.PI * t) / T) + 0.2 * (t / T) ** 2;
    const n = 36_001;
    const samples = Array.from({ length: n }, (_, k) => {
      const t = (k * T) / (n - 1);
      return { t, v: volts(t), i: amps(t) };
    });
    const r = integrateRun(samples);
    const refWh = integrate((t) => volts(t) * amps(t), 0, T, 1e-10) / 3600;
    const refAh = integrate(amps, 0, T, 1e-10) / 3600;
    const refVolts = integrate(volts, 0, T, 1e-10) / T;
    // Trapezoid error is O(h²): with h = 0.1 s it is far below 1e-9 relative.
    expect(Math.abs(r.wattHours - refWh) / refWh).toBeLessThan(1e-9);
    expect(Math.abs(r.ampHours - refAh) / refAh).toBeLessThan(1e-9);
    expect(Math.abs(r.timeAverageVolts - refVolts) / refVolts).toBeLessThan(1e-9);
  });

  it('is exact for a constant load and additive over adjacent stretches (property) [C]', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 0, max: 1_000_000 }), { minLength: 3, maxLength: 40 }),
        fc.double({ min: 0.5, max: 20, noNaN: true }),
        fc.double({ min: 0.01, max: 10, noNaN: true }),
        (times, volts, amps) => {
          const t = [...times].sort((a, b) => a - b).map((k) => k / 10);
          const samples = t.map((tk) => ({ t: tk, v: volts, i: amps }));
          const whole = integrateRun(samples);
          const duration = t[t.length - 1]! - t[0]!;
          expect(whole.ampHours).toBeCloseTo((amps * duration) / 3600, 6);
          expect(whole.wattHours).toBeCloseTo((volts * amps * duration) / 3600, 6);
          expect(whole.averageVolts).toBeCloseTo(volts, 9);
          const mid = Math.floor(t.length / 2);
          const a = integrateRun(samples.slice(0, mid + 1));
          const b = integrateRun(samples.slice(mid));
          expect(a.wattHours + b.wattHours).toBeCloseTo(whole.wattHours, 6);
        },
      ),
    );
  });

  it('names the reading that is wrong', () => {
    expect(() => integrateRun([{ t: 0, v: 4, i: 1 }])).toThrow(/at least 2 readings/);
    expect(() => integrateRun('x' as never)).toThrow(RangeError);
    expect(() => integrateRun([{ t: 0, v: 4, i: 1 }, null as never])).toThrow(/samples\[1\]/);
    expect(() =>
      integrateRun([
        { t: 0, v: 4, i: 1 },
        { t: 10, v: 4, i: 1 },
        { t: 10, v: 4, i: 1 },
      ]),
    ).toThrow(/samples\[2\]\.t must be later than samples\[1\]\.t/);
    expect(() =>
      integrateRun([
        { t: 0, v: 4, i: 1 },
        { t: 1, v: Number.NaN, i: 1 },
      ]),
    ).toThrow(/samples\[1\]\.v/);
  });
});

describe('integrateSeries', () => {
  it('gives the same totals on columnar arrays, typed or plain [C]', () => {
    const plain = integrateSeries(exampleA);
    const typed = integrateSeries({
      t: Float64Array.from(exampleA.t),
      v: Float64Array.from(exampleA.v),
      i: Float64Array.from(exampleA.i),
    });
    for (const r of [plain, typed]) {
      expect(r.ampHours).toBeCloseTo(1.25, 9);
      expect(r.wattHours).toBeCloseTo(4.763333, 6);
      expect(r.averageVolts).toBeCloseTo(3.810667, 6);
      // ∫V² dt / duration by trapezoids: (16.01 + 14.825 + 14.065 + 12.97) × 600 / 2400 = 14.4675 V² [C]
      expect(r.meanSquareVolts).toBeCloseTo(14.4675, 12);
      expect(r.samples).toBe(5);
    }
    // Without a voltage column there is no mean V².
    expect(integrateSeries({ t: exampleA.t, i: exampleA.i }).meanSquareVolts).toBeNull();
  });

  it('uses v·i when both are present and ignores a p column then [C]', () => {
    const r = integrateSeries({ ...exampleA, p: [0, 0, 0, 0, 0] });
    expect(r.wattHours).toBeCloseTo(4.763333, 6);
  });

  it('uses p when there is no current, and derives current as p/v [C]', () => {
    const p = exampleA.v.map((v, k) => v * exampleA.i[k]!);
    const r = integrateSeries({ t: exampleA.t, v: exampleA.v, p });
    expect(r.wattHours).toBeCloseTo(4.763333, 6);
    expect(r.ampHours).toBeCloseTo(1.25, 9);
    const powerOnly = integrateSeries({ t: exampleA.t, p });
    expect(powerOnly.wattHours).toBeCloseTo(4.763333, 6);
    expect(powerOnly.ampHours).toBeNull();
    expect(powerOnly.averageVolts).toBeNull();
    expect(powerOnly.timeAverageVolts).toBeNull();
  });

  it('gives charge without energy from a current-only log, and the time-weighted mean with no charge moved [C]', () => {
    const r = integrateSeries({ t: exampleA.t, i: exampleA.i });
    expect(r.ampHours).toBeCloseTo(1.25, 9);
    expect(r.wattHours).toBeNull();
    const rest = integrateSeries({ t: [0, 10, 20], v: [4, 4.1, 4.2], i: [0, 0, 0] });
    expect(rest.averageVolts).toBeCloseTo(4.1, 12);
  });

  it('matches the closed form ∫I₀e^(−t/τ)dt = I₀τ(1 − e^(−T/τ)) within the trapezoid error bound [C]', () => {
    // I₀ = 2 A, τ = 1800 s, T = 7200 s, h = 1 s. Exact: 2 × 1800 × (1 − e^−4) / 3600 = 0.981684 Ah.
    // Trapezoid error = (T·h²/12)·max|I''| = 7200/12 × 2/1800² = 3.7e−4 A·s at most [C].
    const n = 7201;
    const t = new Float64Array(n);
    const i = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      t[k] = k;
      i[k] = 2 * Math.exp(-k / 1800);
    }
    const r = integrateSeries({ t, i });
    const exact = (2 * 1800 * (1 - Math.exp(-4))) / 3600;
    expect(exact).toBeCloseTo(0.981684, 6);
    expect(Math.abs(r.ampHours! - exact) * 3600).toBeLessThan(3.7e-4);
    expect(r.ampHours!).toBeGreaterThan(exact); // a convex curve: the trapezoid over-estimates
  });

  it('handles 1,000,000 samples of a known linear load [C]', () => {
    const n = 1_000_000;
    const t = new Float64Array(n);
    const v = new Float64Array(n);
    const i = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      t[k] = k * 0.01;
      v[k] = 4;
      i[k] = 1 + k / (n - 1); // 1 A → 2 A linearly: trapezoid is exact
    }
    const r = integrateSeries({ t, v, i });
    const duration = (n - 1) * 0.01;
    expect(r.ampHours).toBeCloseTo((1.5 * duration) / 3600, 9);
    expect(r.wattHours).toBeCloseTo((6 * duration) / 3600, 9);
    expect(r.samples).toBe(n);
  });

  it('rejects bad series with the column and index named', () => {
    expect(() => integrateSeries({ t: [0, 1], v: [4, 4] })).toThrow(/series\.i \(current\) or series\.p \(power\) is required/);
    expect(() => integrateSeries({ t: [0], i: [1] })).toThrow(/at least 2 samples/);
    expect(() => integrateSeries({ t: [0, 1, 2], i: [1, 1] })).toThrow(/series\.i \(current\) has 2 values but series\.t has 3/);
    expect(() => integrateSeries({ t: [0, 2, 1], i: [1, 1, 1] })).toThrow(/series\.t\[2\] must be later than series\.t\[1\]/);
    expect(() => integrateSeries({ t: [0, Number.NaN], i: [1, 1] })).toThrow(/series\.t\[1\] must be a finite number/);
    expect(() => integrateSeries({ t: [0, 1], i: [1, Infinity] })).toThrow(/series\.i\[1\]/);
    expect(() => integrateSeries({ t: [0, 1], p: [1, Number.NaN] })).toThrow(/series\.p\[1\]/);
    expect(() => integrateSeries({ t: [0, 1], v: [4, Number.NaN], i: [1, 1] })).toThrow(/series\.v\[1\]/);
    expect(() => integrateSeries({ t: [0, 1], v: [4, 0], p: [1, 1] })).toThrow(/series\.v\[1\] must be above 0 V/);
    expect(() => integrateSeries({ t: 'nope' } as never)).toThrow(/series\.t \(time\) is required/);
    expect(() => integrateSeries(null as never)).toThrow(/series must be an object/);
    expect(() => integrateSeries({ t: [0, 1], i: 'x' } as never)).toThrow(/series\.i \(current\) must be an array/);
  });
});
