import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { AIR_TRANSPORT_CLASS_TEXT, airTransportClass, cRate, packEnergyWh, runtimeHours, specificEnergyWhPerKg } from './pack';

describe('pack energy (REFERENCES §4)', () => {
  it('Wh = V_nom · Ah [S]: 3.7 V × 3.0 Ah = 11.10 Wh, 3.6 V × 3.35 Ah = 12.06 Wh, 3.2 V × 3.0 Ah = 9.60 Wh', () => {
    expect(packEnergyWh({ cellNominalVolts: 3.7, cellCapacityAh: 3.0 })).toBeCloseTo(11.1, 9);
    expect(packEnergyWh({ cellNominalVolts: 3.6, cellCapacityAh: 3.35 })).toBeCloseTo(12.06, 9);
    expect(packEnergyWh({ cellNominalVolts: 3.2, cellCapacityAh: 3.0 })).toBeCloseTo(9.6, 9);
  });
  it('one 2.7 Ah 3.7 V cell is 9.99 Wh [C; CP "≈ 10 Wh"]', () => {
    expect(packEnergyWh({ cellNominalVolts: 3.7, cellCapacityAh: 2.7, series: 1, parallel: 1 })).toBeCloseTo(9.99, 9);
  });
  it('series and parallel multiply: 2S3P of 3.6 V 3.0 Ah is 64.8 Wh [C]', () => {
    expect(packEnergyWh({ cellNominalVolts: 3.6, cellCapacityAh: 3.0, series: 2, parallel: 3 })).toBeCloseTo(64.8, 9);
  });
  it('rejects bad cells', () => {
    expect(() => packEnergyWh({ cellNominalVolts: 0, cellCapacityAh: 3 })).toThrow(/Cell nominal voltage/);
    expect(() => packEnergyWh({ cellNominalVolts: 3.7, cellCapacityAh: -1 })).toThrow(/Cell capacity/);
    expect(() => packEnergyWh({ cellNominalVolts: 3.7, cellCapacityAh: 3, series: 1.5 })).toThrow(/Cells in series/);
    expect(() => packEnergyWh({ cellNominalVolts: 3.7, cellCapacityAh: 3, parallel: 0 })).toThrow(/Cells in parallel/);
  });
});

describe('runtime = energy × efficiency × usable fraction ÷ load', () => {
  it('9.99 Wh feeding 8.881667 W lasts 1.124789 h, "a little over one hour" [C; CP REFERENCES §11]', () => {
    const t = runtimeHours({ energyWh: 9.99, loadWatts: 8.881667 });
    expect(t).toBeCloseTo(1.124789, 5);
    expect(t).toBeGreaterThan(1);
    expect(t).toBeLessThan(1.25);
  });
  it('two cells last about two hours [CP REFERENCES §11]', () => {
    const t = runtimeHours({ energyWh: 2 * 9.99, loadWatts: 8.881667 });
    expect(t).toBeCloseTo(2.249578, 5);
  });
  it('efficiency and usable fraction both scale the runtime [C]', () => {
    expect(runtimeHours({ energyWh: 37, loadWatts: 5, efficiency: 0.85 })).toBeCloseTo(6.29, 9);
    expect(runtimeHours({ energyWh: 37, loadWatts: 5, efficiency: 0.85, usableFraction: 0.9 })).toBeCloseTo(5.661, 9);
    expect(runtimeHours({ energyWh: 0, loadWatts: 5 })).toBe(0);
  });
  it('rejects a zero load and efficiency outside (0, 1]', () => {
    expect(() => runtimeHours({ energyWh: 10, loadWatts: 0 })).toThrow(/Load power/);
    expect(() => runtimeHours({ energyWh: 10, loadWatts: 1, efficiency: 0 })).toThrow(/Efficiency/);
    expect(() => runtimeHours({ energyWh: 10, loadWatts: 1, efficiency: 1.1 })).toThrow(/Efficiency/);
    expect(() => runtimeHours({ energyWh: 10, loadWatts: 1, usableFraction: 1.5 })).toThrow(/Usable fraction/);
    expect(() => runtimeHours({ energyWh: -1, loadWatts: 1 })).toThrow(/Energy/);
  });
});

describe('C-rate (REFERENCES §4)', () => {
  it('0.2 C of a 3.0 Ah cell is 0.600 A [S]; C/10 = 0.300 A and C/20 = 0.150 A [S]', () => {
    expect(cRate(0.6, 3.0)).toBeCloseTo(0.2, 12);
    expect(cRate(0.3, 3.0)).toBeCloseTo(0.1, 12);
    expect(cRate(0.15, 3.0)).toBeCloseTo(0.05, 12);
  });
  it('the pocket heater draws 2.433333 A from 2.7 Ah: 0.901235 C [C]', () => {
    expect(cRate(2.433333, 2.7)).toBeCloseTo(0.901234, 5);
  });
  it('rejects zero capacity and negative current', () => {
    expect(() => cRate(1, 0)).toThrow(/Capacity/);
    expect(() => cRate(-1, 1)).toThrow(/Current/);
  });
});

describe('air transport class, "not exceeding" (REFERENCES §4) [S]', () => {
  it('3.7 V × 27 Ah = 99.9 Wh is allowed [C]', () => {
    expect(airTransportClass(packEnergyWh({ cellNominalVolts: 3.7, cellCapacityAh: 27 }))).toBe('up-to-100-wh');
  });
  it('100.0 Wh is still the lowest class; 160.0 Wh is the middle class', () => {
    expect(airTransportClass(100.0)).toBe('up-to-100-wh');
    expect(airTransportClass(100.0000001)).toBe('100-to-160-wh');
    expect(airTransportClass(160.0)).toBe('100-to-160-wh');
    expect(airTransportClass(160.0000001)).toBe('over-160-wh');
  });
  it('14.4 V × 7 Ah = 100.8 Wh needs approval; 11.55 V × 13.9 Ah = 160.545 Wh is forbidden [C]', () => {
    const a = packEnergyWh({ cellNominalVolts: 14.4, cellCapacityAh: 7 });
    expect(a).toBeCloseTo(100.8, 9);
    expect(airTransportClass(a)).toBe('100-to-160-wh');
    const b = packEnergyWh({ cellNominalVolts: 11.55, cellCapacityAh: 13.9 });
    expect(b).toBeCloseTo(160.545, 9);
    expect(airTransportClass(b)).toBe('over-160-wh');
  });
  it('the pocket-heater cell (9.99 Wh) is up-to-100-wh [C]', () => {
    expect(airTransportClass(9.99)).toBe('up-to-100-wh');
  });
  it('every class has its text, and a negative energy is rejected', () => {
    expect(AIR_TRANSPORT_CLASS_TEXT['100-to-160-wh']).toMatch(/approval/);
    expect(() => airTransportClass(-1)).toThrow(/Energy/);
    expect(() => airTransportClass(Number.NaN)).toThrow(RangeError);
  });
  it('the class never goes down as energy rises (property)', () => {
    const order = ['up-to-100-wh', 'over-160-wh'];
    const rank = (c: string) => (c === order[0] ? 0 : c === order[1] ? 2 : 1);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1000, noNaN: true }), fc.double({ min: 0, max: 1000, noNaN: true }), (a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        expect(rank(airTransportClass(lo))).toBeLessThanOrEqual(rank(airTransportClass(hi)));
      }),
    );
  });
});

describe('specific energy (REFERENCES §4)', () => {
  it('3.6 V × 3.0 Ah in 45 g is 240 Wh/kg [S/C]', () => {
    expect(specificEnergyWhPerKg(3.6 * 3.0, 0.045)).toBeCloseTo(240, 9);
  });
  it('3.6 V × 3.35 Ah in 48.5 g is 248.66 Wh/kg [C]', () => {
    expect(specificEnergyWhPerKg(12.06, 0.0485)).toBeCloseTo(248.66, 2);
  });
  it('rejects zero mass', () => {
    expect(() => specificEnergyWhPerKg(10, 0)).toThrow(/Mass/);
  });
});
