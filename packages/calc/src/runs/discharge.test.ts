import { describe, expect, it } from 'vitest';
import { analyseDischarge, analysePowerBank, capacityVersusLabel, detectCutoff } from './discharge';
import { simulateDischarge } from './models';

// REFERENCES §8, Example A [S: composite trapezoidal rule; C]
const exampleA = {
  t: [0, 600, 1200, 1800, 2400],
  i: [2.0, 2.0, 1.9, 1.8, 1.6],
  v: [4.1, 3.9, 3.8, 3.7, 3.5],
};

describe('detectCutoff', () => {
  it('finds the first sample at or below the cut-off voltage [C]', () => {
    expect(detectCutoff(exampleA, { cutoffVolts: 3.75 })).toEqual({ index: 3, t: 1800, volts: 3.7, reason: 'cutoff-voltage' });
    expect(detectCutoff(exampleA, { cutoffVolts: 3.8 })).toEqual({ index: 2, t: 1200, volts: 3.8, reason: 'cutoff-voltage' });
  });

  it('returns null when the cut-off is never reached', () => {
    expect(detectCutoff(exampleA, { cutoffVolts: 3.0 })).toBeNull();
  });

  it('without a cut-off, ends at the last loaded sample before the current stops [C]', () => {
    const s = { t: [0, 60, 120, 180, 240], v: [4.0, 3.8, 3.6, 3.9, 3.95], i: [1, 1, 1, 0.005, 0] };
    // Default floor: 2 % of the 1 A peak = 0.02 A; sample 3 (5 mA) is off, so sample 2 is the end.
    expect(detectCutoff(s)).toEqual({ index: 2, t: 120, volts: 3.6, reason: 'current-stopped' });
    // An explicit floor below 5 mA keeps sample 3 loaded.
    expect(detectCutoff(s, { currentFloorA: 0.001 })).toEqual({ index: 3, t: 180, volts: 3.9, reason: 'current-stopped' });
  });

  it('uses the power column when no current is logged, and the end of the run otherwise', () => {
    const s = { t: [0, 60, 120], v: [4.0, 3.8, 3.9], p: [4, 3.8, 0] };
    expect(detectCutoff(s)).toMatchObject({ index: 1, reason: 'current-stopped' });
    expect(detectCutoff({ t: [0, 60, 120], v: [4.0, 3.8, 3.7] })).toMatchObject({ index: 2, reason: 'end-of-run' });
    expect(detectCutoff(exampleA)).toMatchObject({ index: 4, t: 2400, reason: 'end-of-run' });
  });

  it('rejects bad options and missing voltage', () => {
    expect(() => detectCutoff({ t: [0, 1], i: [1, 1] })).toThrow(/series\.v \(voltage\) is required/);
    expect(() => detectCutoff(exampleA, { cutoffVolts: -1 })).toThrow(/cutoffVolts must be greater than zero/);
    expect(() => detectCutoff(exampleA, { cutoffVolts: Number.NaN })).toThrow(/cutoffVolts must be a finite number/);
    expect(() => detectCutoff(exampleA, { currentFloorA: -0.1 })).toThrow(/currentFloorA must not be negative/);
  });
});

/**
 * A 1 Hz log at 1 A whose voltage falls 3.6 → 3.4 V over 4800 s, with a load step to 3 A at
 * t = 3600 and 3601 s that pulls it 0.1 V lower (R = 0.05 Ω): under a 3.4 V cut-off for 2 s, back
 * above at 3602 s; the cell itself reaches 3.4 V only at 4800 s, 20 min later [C].
 */
function sagAtLoadStep(opts: { stepAmps?: number; stopAt?: number } = {}) {
  const t: number[] = [];
  const v: number[] = [];
  const i: number[] = [];
  for (let k = 0; k <= 4800; k++) {
    const amps = k === opts.stopAt ? 0 : k === 3600 || k === 3601 ? (opts.stepAmps ?? 3) : 1;
    t.push(k);
    i.push(amps);
    v.push(3.6 - (0.2 * k) / 4800 - 0.05 * (amps - 1));
  }
  return { t, v, i };
}

describe('detectCutoff with a debounce', () => {
  it('ignores a 2 s sag below the cut-off at a load step, by default (5 s) [CP: a debounced end-of-discharge voltage; C]', () => {
    const s = sagAtLoadStep();
    // The run ends where the cell reaches 3.4 V at 1 A, 20 min after the sag, not at the sag.
    expect(detectCutoff(s, { cutoffVolts: 3.4 })).toEqual({ index: 4800, t: 4800, volts: expect.closeTo(3.4, 12), reason: 'cutoff-voltage' });
    const r = analyseDischarge(s, { cutoffVolts: 3.4 });
    expect(r.cutoffDebounceSeconds).toBe(5);
    expect(r.ignoredDips).toEqual({ count: 1, firstAtS: 3600, longestS: 2 });
    // (4800 A·s + the step's extra 1 + 2 + 1 A·s) / 3600 [C]
    expect(r.ampHours).toBeCloseTo(4804 / 3600, 12);
  });

  it('ends the run at the sag when it lasts the debounce, or with a debounce of 0 s [C]', () => {
    const s = sagAtLoadStep();
    expect(detectCutoff(s, { cutoffVolts: 3.4, cutoffDebounceSeconds: 2 })).toMatchObject({ index: 3600, reason: 'cutoff-voltage' });
    expect(detectCutoff(s, { cutoffVolts: 3.4, cutoffDebounceSeconds: 0 })).toMatchObject({ index: 3600 });
    expect(detectCutoff(s, { cutoffVolts: 3.4, cutoffDebounceSeconds: 2.5 })).toMatchObject({ index: 4800 });
    const r = analyseDischarge(s, { cutoffVolts: 3.4, cutoffDebounceSeconds: 0 });
    expect(r.ignoredDips).toBeNull();
    expect(r.ampHours).toBeCloseTo(3601 / 3600, 12);
  });

  it('ends the run at a short dip when the load stops during it or the log ends in it', () => {
    // The load cuts out at 3602 s, as an electronic load does at its own cut-off: the sag was the end.
    expect(detectCutoff(sagAtLoadStep({ stopAt: 3602 }), { cutoffVolts: 3.4 })).toMatchObject({ index: 3600, reason: 'cutoff-voltage' });
    // A log that stops 1 s into a dip ends there.
    const short = { t: [0, 1, 2, 3], v: [3.6, 3.5, 3.5, 3.3], i: [1, 1, 1, 1] };
    expect(detectCutoff(short, { cutoffVolts: 3.4 })).toMatchObject({ index: 3, reason: 'cutoff-voltage' });
    // A dip that recovers and never comes back: the cut-off is not reached, and the dip is reported.
    const recovered = { t: [0, 1, 2, 3, 4], v: [3.6, 3.3, 3.5, 3.5, 3.5], i: [1, 3, 1, 1, 1] };
    expect(detectCutoff(recovered, { cutoffVolts: 3.4 })).toBeNull();
    expect(analyseDischarge(recovered, { cutoffVolts: 3.4 }).ignoredDips).toEqual({ count: 1, firstAtS: 1, longestS: 1 });
  });

  it('counts every dip shorter than the debounce, keeping the first and the longest [C]', () => {
    const s = { t: [0, 1, 2, 3, 4, 5, 6, 7, 8], v: [3.6, 3.3, 3.5, 3.3, 3.3, 3.3, 3.5, 3.5, 3.5], i: [1, 3, 1, 3, 3, 3, 1, 1, 1] };
    const r = analyseDischarge(s, { cutoffVolts: 3.4 });
    expect(r.cutoff).toBeNull();
    expect(r.ignoredDips).toEqual({ count: 2, firstAtS: 1, longestS: 3 });
  });

  it('cannot resolve a sag shorter than the logging interval: one low sample in a 20 s log ends the run [C]', () => {
    const s = { t: [0, 20, 40, 60], v: [3.6, 3.3, 3.5, 3.5], i: [1, 3, 1, 1] };
    expect(detectCutoff(s, { cutoffVolts: 3.4 })).toMatchObject({ index: 1, t: 20 });
  });

  it('rejects a negative debounce', () => {
    expect(() => detectCutoff(exampleA, { cutoffVolts: 3.75, cutoffDebounceSeconds: -1 })).toThrow(/cutoffDebounceSeconds must not be negative/);
  });
});

describe('analyseDischarge', () => {
  it('integrates to the cut-off only [C]', () => {
    const r = analyseDischarge(exampleA, { cutoffVolts: 3.75 });
    // Samples 0..3: Ah = 600 s × (4.0 + 3.9 + 3.7) / 2 / 3600 = 0.966667 Ah
    expect(r.ampHours).toBeCloseTo(0.966667, 6);
    // Wh = 600 × ((8.2 + 7.8) + (7.8 + 7.22) + (7.22 + 6.66)) / 2 / 3600 = 3.741667 Wh
    expect(r.wattHours).toBeCloseTo(3.741667, 6);
    expect(r.durationS).toBe(1800);
    expect(r.averageVolts).toBeCloseTo(3.741667 / 0.966667, 5);
    expect(r.endVolts).toBe(3.7);
    expect(r.minVolts).toBe(3.7);
    expect(r.averageCurrentA).toBeCloseTo(1.933333, 6); // 0.966667 Ah × 3600 / 1800 s
    expect(r.averagePowerW).toBeCloseTo(7.483333, 6); // 3.741667 Wh × 3600 / 1800 s
    expect(r.cutoff).toEqual({ index: 3, t: 1800, volts: 3.7, reason: 'cutoff-voltage' });
    expect(r.endIndex).toBe(3);
  });

  it('analyses the whole run when no cut-off is reached (REFERENCES §8 Example A) [S: trapezoidal rule; C]', () => {
    const r = analyseDischarge(exampleA, { cutoffVolts: 3.0 });
    expect(r.cutoff).toBeNull();
    expect(r.ampHours).toBeCloseTo(1.25, 9);
    expect(r.wattHours).toBeCloseTo(4.763333, 6);
    expect(r.averageVolts).toBeCloseTo(3.810667, 6);
    expect(r.timeAverageVolts).toBeCloseTo(3.8, 9);
    expect(r.minVolts).toBe(3.5);
    expect(r.endVolts).toBe(3.5);
    // mean(V²) by trapezoids: V² = 16.81, 15.21, 14.44, 13.69, 12.25; (16.01 + 14.825 + 14.065 + 12.97) / 4
    // = 14.4675 V², not (mean V)² = 3.8² = 14.44 V² (REFERENCES §12) [C].
    expect(r.meanSquareVolts).toBeCloseTo(14.4675, 12);
    // Into a 3.0 Ω element: mean(V²)/R = 4.8225 W on average, where (mean V)²/R would say 4.8133 W [C].
    expect(r.meanSquareVolts / 3).toBeCloseTo(4.8225, 12);
    expect(r.internalResistance).toBeNull();
  });

  it('reports the DC resistance of a current pulse in the log: 0.6 A at 3.912 V → 3.0 A at 3.792 V = 50.0 mΩ (REFERENCES §12) [M: IEC 61960-3; C]', () => {
    // 10 s at 0.6 A, 1 s at 3.0 A, back to 0.6 A; U = 3.942 V − I × 0.05 Ω.
    const t = Array.from({ length: 21 }, (_, k) => k);
    const i = t.map((s) => (s === 10 ? 3.0 : 0.6));
    const v = i.map((a) => 3.942 - 0.05 * a);
    const r = analyseDischarge({ t, v, i });
    expect(r.internalResistance).toMatchObject({ lowAmps: 0.6, highAmps: 3.0, atSeconds: 10, readAtSeconds: 10 });
    expect(r.internalResistance!.ohms).toBeCloseTo(0.05, 12);
    expect(r.internalResistance!.lowVolts).toBeCloseTo(3.912, 12);
    expect(r.internalResistance!.highVolts).toBeCloseTo(3.792, 12);
  });

  it('recovers the energy of the model cell: C × mean OCV = 3 Ah × 3.7725 V = 11.3175 Wh at R = 0 [C]', () => {
    // ∫₀¹ OCV ds = 3 + 0.55·(1/(1 − e^−20) − 0.05) + 0.35/2 + 0.30/4 = 3.7725 V
    const { series } = simulateDischarge({ capacityAh: 3, currentA: 1.5, internalResistanceOhm: 0, cutoffVolts: 3.0, stepS: 10 });
    const r = analyseDischarge(series, { cutoffVolts: 3.0 });
    expect(r.ampHours).toBeCloseTo(3, 2);
    expect(r.wattHours).toBeCloseTo(11.3175, 1);
    expect(Math.abs(r.wattHours - 11.3175)).toBeLessThan(0.03);
  });

  it('works from a power column with voltage (current derived as p/v) [C]', () => {
    const p = exampleA.v.map((v, k) => v * exampleA.i[k]!);
    const r = analyseDischarge({ t: exampleA.t, v: exampleA.v, p });
    expect(r.ampHours).toBeCloseTo(1.25, 9);
    expect(r.wattHours).toBeCloseTo(4.763333, 6);
  });

  it('rejects logs it cannot analyse', () => {
    expect(() => analyseDischarge({ t: [0, 1], v: [4, 4] })).toThrow(/series\.i \(current\) or series\.p \(power\) is required/);
    expect(() => analyseDischarge(exampleA, { cutoffVolts: 4.2 })).toThrow(/cutoffVolts \(4\.2 V\) is already reached at the first sample/);
    expect(() => analyseDischarge({ t: [0, 1, 2], v: [4, 4, 4], i: [1, 0, 0] })).toThrow(/load is off/);
  });
});

describe('analysePowerBank', () => {
  it('gives output Wh, Ah and efficiency: 31.45 Wh out of 37 Wh is 0.85, 6.29 Ah at 5 V (REFERENCES §5) [CP; C]', () => {
    // 5.0 V × 2.0 A for 11 322 s = 31.45 Wh; the cells hold 10 Ah × 3.7 V = 37 Wh.
    const s = { t: [0, 5661, 11322], v: [5, 5, 5], i: [2, 2, 2] };
    const r = analysePowerBank(s, { cellEnergyWh: 37 });
    expect(r.wattHours).toBeCloseTo(31.45, 9);
    expect(r.ampHours).toBeCloseTo(6.29, 9);
    expect(r.ampHoursAt5V).toBeCloseTo(6.29, 9);
    expect(r.averageVolts).toBeCloseTo(5, 12);
    expect(r.efficiency).toBeCloseTo(0.85, 9);
    expect(r.durationS).toBe(11322);
    expect(r.warnings).toEqual([]);
  });

  it('warns when the output exceeds the cell energy', () => {
    const r = analysePowerBank({ t: [0, 3600], v: [5, 5], i: [2, 2] }, { cellEnergyWh: 5 });
    expect(r.efficiency).toBeCloseTo(2, 12);
    expect(r.warnings[0]).toMatch(/exceeds the cell energy/);
  });

  it('rejects a missing cell energy or load column', () => {
    expect(() => analysePowerBank({ t: [0, 1], v: [5, 5], i: [1, 1] }, { cellEnergyWh: 0 })).toThrow(/cellEnergyWh/);
    expect(() => analysePowerBank({ t: [0, 1], v: [5, 5] }, { cellEnergyWh: 10 })).toThrow(/series\.i \(current\) or series\.p \(power\)/);
  });
});

describe('capacityVersusLabel', () => {
  it('gives the percentage and warns below 90 % by default [C]', () => {
    const low = capacityVersusLabel(2.4, 2.7);
    expect(low.percent).toBeCloseTo(88.888889, 5);
    expect(low.warning).toBe(true);
    expect(capacityVersusLabel(2.5, 2.7)).toEqual({ percent: (2.5 / 2.7) * 100, warning: false });
    // Exactly at the warning fraction is not below it.
    expect(capacityVersusLabel(0.9, 1).warning).toBe(false);
    expect(capacityVersusLabel(2.4, 2.7, 0.8).warning).toBe(false);
  });

  it('names the wrong input', () => {
    expect(() => capacityVersusLabel(-1, 2)).toThrow(/measuredAh/);
    expect(() => capacityVersusLabel(1, 0)).toThrow(/claimedAh/);
    expect(() => capacityVersusLabel(1, 2, 1.5)).toThrow(/warnFraction/);
  });
});
