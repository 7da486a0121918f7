import { describe, it, expect } from 'vitest';
import { standbyMonths } from './standby';
import { loadedTerminalVolts, packResistanceOhms, resistiveLoadOnSource } from './loaded';

describe('standby (REFERENCES §12 [CP; M for figures])', () => {
  it('5 µA is 3.65 mAh a month [C]; 2.7 Ah at 2.5 %/month plus 5 µA lasts 2.7 / (0.0675 + 0.00365) = 37.95 months [C]', () => {
    expect(5e-6 * 730).toBeCloseTo(0.00365, 9);
    expect(standbyMonths({ capacityAh: 2.7, selfDischargePerMonth: 0.025, quiescentAmps: 5e-6 })).toBeCloseTo(2.7 / 0.07115, 6);
  });
  it('needs a drain', () => {
    expect(() => standbyMonths({ capacityAh: 2.7, selfDischargePerMonth: 0, quiescentAmps: 0 })).toThrow(/above zero/);
    expect(() => standbyMonths({ capacityAh: 0, selfDischargePerMonth: 0.02, quiescentAmps: 0 })).toThrow(/Capacity/);
  });
});

describe('internal resistance in use (REFERENCES §12 [C])', () => {
  it('2S2P of 50 mΩ cells is 50 mΩ; 2.43 A through 50 mΩ drops 0.1215 V', () => {
    expect(packResistanceOhms({ cellOhms: 0.05, series: 2, parallel: 2 })).toBeCloseTo(0.05, 12);
    expect(loadedTerminalVolts({ openCircuitVolts: 3.7, currentAmps: 2.43, resistanceOhms: 0.05 })).toBeCloseTo(3.5785, 9);
  });
  it('1.5 Ω on a 3.7 V source of 50 mΩ: 2.387097 A, 3.580645 V, 8.547347 W in the load and 0.284912 W in the source', () => {
    const r = resistiveLoadOnSource({ openCircuitVolts: 3.7, loadOhms: 1.5, sourceOhms: 0.05 });
    expect(r.amps).toBeCloseTo(2.387097, 6);
    expect(r.terminalVolts).toBeCloseTo(3.580645, 6);
    expect(r.loadWatts).toBeCloseTo(8.547347, 6);
    expect(r.sourceWatts).toBeCloseTo(0.284912, 6);
    expect(() => resistiveLoadOnSource({ openCircuitVolts: 3.7, loadOhms: 0, sourceOhms: 0.05 })).toThrow(/Load resistance/);
  });
});
