import { describe, expect, it } from 'vitest';
import { timeToLevel, timeToTemperature } from './crossing';
import { firstOrderThermal } from './models';
import { analyseThermal } from './thermal-run';

describe('timeToTemperature', () => {
  it('interpolates between the samples around the crossing (worked by hand) [C]', () => {
    // 30 °C at 10 s, 50 °C at 20 s: 40 °C is reached at 10 + (40 − 30)/(50 − 30) × 10 = 15 s.
    const log = { t: [0, 10, 20, 30], temp: [20, 30, 50, 49] };
    expect(timeToTemperature(log, 40)).toBeCloseTo(15, 12);
    expect(timeToTemperature(log, 30)).toBe(10);
    expect(timeToTemperature(log, 15)).toBe(0);
    expect(timeToTemperature(log, 60)).toBeNull();
    // It agrees with the crossing analyseThermal reports.
    expect(analyseThermal(log, { thresholdC: 40 }).timeToThresholdS).toBeCloseTo(15, 12);
  });

  it('measures from the first sample when the log clock does not start at zero [C]', () => {
    expect(timeToTemperature({ t: [100, 110, 120], temp: [20, 30, 40] }, 35)).toBeCloseTo(15, 12);
    expect(timeToLevel({ t: [100, 110, 120], temp: [20, 30, 40] }, 'temp', 35)).toBeCloseTo(115, 12);
  });

  it('finds t = −τ·ln(1 − (T − T0)/ΔT) on a finely sampled first-order response [C]', () => {
    // T(t) = 20 + 30·(1 − e^(−t/240)); 45 °C is reached at t = 240·ln 6 = 430.02 s.
    const t: number[] = [];
    const temp: number[] = [];
    for (let s = 0; s <= 3000; s += 1) {
      t.push(s);
      temp.push(firstOrderThermal(s, { initialC: 20, riseC: 30, tauS: 240 }));
    }
    expect(Math.abs(timeToTemperature({ t, temp }, 45)! - 240 * Math.log(6))).toBeLessThan(0.01);
  });

  it('names the wrong input', () => {
    expect(() => timeToTemperature({ t: [0, 1], v: [1, 2] }, 40)).toThrow(/series\.temp \(temperature\) is required/);
    expect(() => timeToTemperature({ t: [0, 1], temp: [1, 2] }, Number.NaN)).toThrow(/thresholdC/);
    expect(() => timeToLevel({ t: [0, 1], v: [1, 2] }, 'v', Number.NaN)).toThrow(/level/);
    expect(() => timeToTemperature({ t: [0, 0], temp: [1, 2] }, 1)).toThrow(/series\.t\[1\]/);
  });
});
