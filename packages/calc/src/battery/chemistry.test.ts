import { describe, it, expect } from 'vitest';
import { CELL_CHEMISTRIES, SPECIFIC_ENERGY_LIMITS, chargeVoltage, isLithiumChemistry, labelCapacityPlausibility, typicalCellVoltages } from './chemistry';

describe('typical cell voltages (REFERENCES §4)', () => {
  it('li-ion 3.6–3.7 V nominal, 4.2 V charge [S; CP]', () => {
    const v = typicalCellVoltages('li-ion');
    expect(v.nominalRangeV).toEqual([3.6, 3.7]);
    expect(v.chargeV).toBe(4.2);
    expect(chargeVoltage('li-ion')).toBe(4.2);
    expect(chargeVoltage('li-po')).toBe(4.2);
  });
  it('LFP 3.2 V nominal, 3.65 V charge, 2.5 V cut-off [S; CP]', () => {
    const v = typicalCellVoltages('lifepo4');
    expect(v.nominalV).toBe(3.2);
    expect(v.chargeV).toBe(3.65);
    expect(v.cutoffV).toBe(2.5);
  });
  it('LTO 2.3–2.4 V nominal [S], about 2.8 V charge [M]', () => {
    expect(typicalCellVoltages('lto').nominalRangeV).toEqual([2.3, 2.4]);
    expect(chargeVoltage('lto')).toBe(2.8);
  });
  it('NiMH and alkaline have no fixed charge voltage; other has no table entry', () => {
    expect(typicalCellVoltages('nimh').nominalV).toBe(1.2);
    expect(() => chargeVoltage('nimh')).toThrow(/not charged to a fixed voltage/);
    expect(() => chargeVoltage('alkaline')).toThrow(RangeError);
    expect(() => typicalCellVoltages('other')).toThrow(/other/);
    expect(() => typicalCellVoltages('lead-acid' as never)).toThrow(/Cell chemistry must be one of/);
  });
  it('lithium chemistries are recognised', () => {
    expect(CELL_CHEMISTRIES.filter(isLithiumChemistry)).toEqual(['li-ion', 'li-po', 'lifepo4', 'lto']);
  });
});

describe('label capacity plausibility (REFERENCES §4)', () => {
  it('a 3.6 V, 3.35 Ah, 48.5 g cell (248.66 Wh/kg) is plausible for li-ion, limit 300 Wh/kg [C; CP]', () => {
    const r = labelCapacityPlausibility({ claimedAh: 3.35, nominalV: 3.6, cellMassKg: 0.0485, chemistry: 'li-ion' });
    expect(r.specificEnergyWhPerKg).toBeCloseTo(248.66, 2);
    expect(r.limitWhPerKg).toBe(300);
    expect(r.plausible).toBe(true);
  });
  it('an 18650-size 45 g cell labelled 9 900 mAh at 3.7 V (814 Wh/kg) is not [C; CP]', () => {
    const r = labelCapacityPlausibility({ claimedAh: 9.9, nominalV: 3.7, cellMassKg: 0.045, chemistry: 'li-ion' });
    expect(r.claimedWh).toBeCloseTo(36.63, 9);
    expect(r.specificEnergyWhPerKg).toBeCloseTo(814, 0);
    expect(r.plausible).toBe(false);
  });
  it('exactly the limit is still plausible; LTO is limited at 110 Wh/kg [S]', () => {
    expect(labelCapacityPlausibility({ claimedWh: 30, cellMassKg: 0.1, chemistry: 'li-ion' }).plausible).toBe(true);
    const lto = labelCapacityPlausibility({ claimedWh: 12, cellMassKg: 0.1, chemistry: 'lto' });
    expect(lto.limitWhPerKg).toBe(110);
    expect(lto.plausible).toBe(false);
  });
  it('LFP limit is lower than li-ion [M]', () => {
    expect(SPECIFIC_ENERGY_LIMITS.lifepo4.limitWhPerKg).toBeLessThan(SPECIFIC_ENERGY_LIMITS['li-ion'].limitWhPerKg);
    expect(SPECIFIC_ENERGY_LIMITS.lto.limitWhPerKg).toBeLessThan(SPECIFIC_ENERGY_LIMITS.lifepo4.limitWhPerKg);
  });
  it('rejects a missing claim, zero mass and an unknown chemistry', () => {
    expect(() => labelCapacityPlausibility({ claimedAh: 3, cellMassKg: 0.05, chemistry: 'li-ion' })).toThrow(/claimed energy/);
    expect(() => labelCapacityPlausibility({ claimedWh: 10, cellMassKg: 0, chemistry: 'li-ion' })).toThrow(/Cell mass/);
    expect(() => labelCapacityPlausibility({ claimedWh: 10, cellMassKg: 0.05, chemistry: 'zinc' as never })).toThrow(/Cell chemistry/);
    expect(() => labelCapacityPlausibility({ claimedWh: -1, cellMassKg: 0.05, chemistry: 'li-ion' })).toThrow(/Claimed energy/);
  });
});
