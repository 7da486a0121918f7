// REFERENCES §11: facts of the trade a bench teardown of a pocket heater typically shows, used as
// sanity checks. Every check here is common practice [CP]; the exact values are in the area tests [C].
import { describe, it, expect } from 'vitest';
import { boostDutyCycle, buckDutyCycle, chargeVoltage, combineResistances, packEnergyWh, powerFromVoltageAndResistance, runtimeHours, runtimeReport } from './index';

describe('facts of the trade [CP]', () => {
  it('a heater element of about 3 Ω across a cell at about 3.65 V dissipates about 4.4–4.5 W [CP]', () => {
    const p = powerFromVoltageAndResistance(3.65, 3);
    expect(p).toBeGreaterThanOrEqual(4.4);
    expect(p).toBeLessThanOrEqual(4.5);
  });

  it('two such elements in parallel dissipate about 9 W [CP]', () => {
    const p = powerFromVoltageAndResistance(3.65, combineResistances([3, 3], 'parallel'));
    expect(p).toBeGreaterThan(8.5);
    expect(p).toBeLessThan(9.5);
  });

  it('a single 2.7 Ah cell at about 3.7 V is about 10 Wh [CP]', () => {
    expect(packEnergyWh({ cellNominalVolts: 3.7, cellCapacityAh: 2.7 })).toBeCloseTo(10, 0);
  });

  it('feeding about 9 W it lasts a little over one hour: 1.11 h [CP]', () => {
    const t = runtimeHours({ energyWh: packEnergyWh({ cellNominalVolts: 3.7, cellCapacityAh: 2.7 }), loadWatts: 9 });
    expect(t).toBeCloseTo(1.11, 9);
    expect(t).toBeGreaterThan(1);
    expect(t).toBeLessThan(1.25);
  });

  it('two cells last about two hours [CP]', () => {
    const t = runtimeReport({ cellNominalVolts: 3.7, cellCapacityAh: 2.7, parallel: 2, load: { kind: 'power', watts: 9 } }).figures.find((f) => f.key === 'runtime')!.value as number;
    expect(t).toBeGreaterThan(2);
    expect(t).toBeLessThan(2.5);
  });

  it('lithium-ion cells of cobalt/nickel chemistries charge to 4.2 V maximum [CP]', () => {
    expect(chargeVoltage('li-ion')).toBe(4.2);
    expect(chargeVoltage('li-po')).toBe(4.2);
  });

  it('a 5 V USB input charges the cell through a buck (step-down); a 5 V output needs a boost (step-up) [CP]', () => {
    const charge = buckDutyCycle(5, 4.2);
    expect(charge).toBeGreaterThan(0);
    expect(charge).toBeLessThan(1);
    expect(() => buckDutyCycle(3.7, 5)).toThrow(RangeError);
    const output = boostDutyCycle(3.7, 5);
    expect(output).toBeGreaterThan(0);
    expect(() => boostDutyCycle(5, 4.2)).toThrow(RangeError);
  });

  it('a USB power-bank output of 5 V at 1 A is 5 W [CP]', () => {
    expect(powerFromVoltageAndResistance(5, 5 / 1)).toBe(5);
  });
});
