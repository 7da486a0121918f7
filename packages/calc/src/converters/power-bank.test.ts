import { describe, it, expect } from 'vitest';
import { powerBankOutputAh } from './power-bank';
import { packEnergyWh } from '../battery/pack';

describe('power-bank output at 5 V (REFERENCES §5) [CP]', () => {
  it('10 000 mAh at 3.7 V and η 0.85: 37.00 Wh in, 31.45 Wh out, 6 290 mAh at 5 V [C]', () => {
    const ein = packEnergyWh({ cellNominalVolts: 3.7, cellCapacityAh: 10 });
    expect(ein).toBeCloseTo(37, 9);
    const ah = powerBankOutputAh({ energyWh: ein, outputVolts: 5, efficiency: 0.85 });
    expect(ah * 5).toBeCloseTo(31.45, 9);
    expect(ah * 1000).toBeCloseTo(6290, 6);
  });
  it('20 000 mAh at η 0.85 gives 62.90 Wh and 12 580 mAh [C]', () => {
    const ah = powerBankOutputAh({ energyWh: 3.7 * 20, outputVolts: 5, efficiency: 0.85 });
    expect(ah * 5).toBeCloseTo(62.9, 9);
    expect(ah * 1000).toBeCloseTo(12580, 6);
  });
  it('a 5 V 1 A output is 5 W [CP, REFERENCES §11]: 31.45 Wh out lasts 6.29 h at 1 A [C]', () => {
    expect(powerBankOutputAh({ energyWh: 37, outputVolts: 5, efficiency: 0.85 }) / 1).toBeCloseTo(6.29, 9);
  });
  it('rejects bad inputs', () => {
    expect(() => powerBankOutputAh({ energyWh: 37, outputVolts: 0, efficiency: 0.85 })).toThrow(/Output voltage/);
    expect(() => powerBankOutputAh({ energyWh: 37, outputVolts: 5, efficiency: 1.5 })).toThrow(/Efficiency/);
    expect(() => powerBankOutputAh({ energyWh: 37, outputVolts: 5, efficiency: 0 })).toThrow(/Efficiency/);
    expect(() => powerBankOutputAh({ energyWh: -1, outputVolts: 5, efficiency: 0.85 })).toThrow(/Energy/);
  });
});
