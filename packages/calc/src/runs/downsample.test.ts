import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { downsample, lttbIndices } from './downsample';

describe('lttbIndices', () => {
  it('keeps everything when the series is short enough', () => {
    expect(lttbIndices([0, 1, 2], [5, 6, 7], 3)).toEqual([0, 1, 2]);
    expect(lttbIndices([0, 1], [5, 6], 10)).toEqual([0, 1]);
  });

  it('keeps first and last, stays within maxPoints, and increases (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 2, maxLength: 400 }), fc.integer({ min: 3, max: 120 }), (y, maxPoints) => {
        const t = y.map((_, k) => k * 0.5);
        const kept = lttbIndices(t, y, maxPoints);
        expect(kept.length).toBe(Math.min(y.length, maxPoints));
        expect(kept[0]).toBe(0);
        expect(kept[kept.length - 1]).toBe(y.length - 1);
        for (let k = 1; k < kept.length; k++) expect(kept[k]!).toBeGreaterThan(kept[k - 1]!);
      }),
    );
  });

  it('keeps a one-sample spike in a 1,000,000-point log [S: Steinarsson 2013, LTTB]', () => {
    const n = 1_000_000;
    const t = new Float64Array(n);
    const y = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      t[k] = k;
      y[k] = 3.7 + 0.01 * Math.sin(k / 5000);
    }
    y[654_321] = 9;
    const kept = lttbIndices(t, y, 1000);
    expect(kept.length).toBe(1000);
    expect(kept).toContain(654_321);
    expect(kept[0]).toBe(0);
    expect(kept[999]).toBe(n - 1);
  });

  it('picks the point making the largest triangle (worked by hand) [C]', () => {
    // 5 points into 3: one middle bucket {1, 2, 3}; the next bucket is point 4 (4, 0).
    // Triangle with (0, 0) and (4, 0): areas ∝ |y| → 1, 5, 2, so index 2 is kept.
    expect(lttbIndices([0, 1, 2, 3, 4], [0, 1, 5, 2, 0], 3)).toEqual([0, 2, 4]);
  });

  it('rejects a maxPoints below 3', () => {
    expect(() => lttbIndices([0, 1, 2], [1, 2, 3], 2)).toThrow(/maxPoints/);
    expect(() => lttbIndices([0, 1, 2], [1, 2, 3], 2.5)).toThrow(/maxPoints/);
  });
});

describe('downsample', () => {
  it('gives one trace per value column present, with its own times', () => {
    const n = 1000;
    const t = Array.from({ length: n }, (_, k) => k);
    const v = t.map((s) => 4.2 - s / 1000);
    const i = t.map((s) => (s === 500 ? 3 : 1));
    const out = downsample({ t, v, i }, 50);
    expect(Object.keys(out).sort()).toEqual(['i', 'v']);
    expect(out.v!.t.length).toBe(50);
    expect(out.v!.y.length).toBe(50);
    expect(out.i!.t).toContain(500);
    expect(Math.max(...out.i!.y)).toBe(3);
    expect(out.v!.t[0]).toBe(0);
    expect(out.v!.t[49]).toBe(999);
  });

  it('checks the series and maxPoints', () => {
    expect(() => downsample({ t: [0, 0], v: [1, 1] }, 10)).toThrow(/series\.t\[1\]/);
    expect(() => downsample({ t: [0, 1], v: [1, 1] }, 0)).toThrow(/maxPoints/);
  });
});
