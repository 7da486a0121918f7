import { describe, expect, it } from 'vitest';
import { labelEnergyWh, measuredVersusLabelEnergy } from './label';

describe('labelEnergyWh', () => {
  it('takes the label Wh when given, else its Ah at the cell nominal voltage (REFERENCES §5: 10 000 mAh at 3.7 V is 37.00 Wh) [CP; C]', () => {
    expect(labelEnergyWh({ capacityAh: 10 }, 3.7)).toEqual({ wh: expect.closeTo(37, 12), basis: 'label-ah-at-cell-volts' });
    // REFERENCES §4: 3.7 V × 3.0 Ah = 11.10 Wh [S].
    expect(labelEnergyWh({ capacityAh: 3 }, 3.7)!.wh).toBeCloseTo(11.1, 12);
    // A label that states Wh is taken as it is, whatever the cell voltage.
    expect(labelEnergyWh({ capacityAh: 10, capacityWh: 37 }, 3.6)).toEqual({ wh: 37, basis: 'label-wh' });
    expect(labelEnergyWh({ capacityWh: 18.5 }, Number.NaN)).toEqual({ wh: 18.5, basis: 'label-wh' });
  });

  it('is undefined for a label without a capacity, and names a wrong input', () => {
    expect(labelEnergyWh({}, 3.7)).toBeUndefined();
    expect(() => labelEnergyWh({ capacityAh: 0 }, 3.7)).toThrow(/Capacity on the label \(Ah\)/);
    expect(() => labelEnergyWh({ capacityWh: -1 }, 3.7)).toThrow(/Energy on the label \(Wh\)/);
    expect(() => labelEnergyWh({ capacityAh: 5 }, 0)).toThrow(/Cell nominal voltage/);
    expect(() => labelEnergyWh(null as never, 3.7)).toThrow(/label must be an object/);
  });
});

describe('measuredVersusLabelEnergy', () => {
  it('a 2S pack of 5.0 Ah cells labelled 10 000 mAh, measured 4.9 Ah at the terminals, is 98 % of its label, not 49 % [CP: REFERENCES §5; C]', () => {
    // Measured 4.9 Ah × 7.4 V (2 × 3.7 V) = 36.26 Wh; label 10 Ah × 3.7 V = 37 Wh; 36.26 / 37 = 0.98.
    const r = measuredVersusLabelEnergy({ measuredAh: 4.9, packNominalVolts: 7.4, cellNominalVolts: 3.7, label: { capacityAh: 10 } })!;
    expect(r.measuredWh).toBeCloseTo(36.26, 12);
    expect(r.labelWh).toBeCloseTo(37, 12);
    expect(r.ratio).toBeCloseTo(0.98, 12);
    expect(r).toMatchObject({ labelBasis: 'label-ah-at-cell-volts', measuredBasis: 'measured-ah-at-pack-volts', warning: false });
  });

  it('prefers the measured Wh of the run: 35.77 Wh against 37 Wh is 96.676 % [C]', () => {
    const r = measuredVersusLabelEnergy({ measuredWh: 35.77, measuredAh: 4.9, packNominalVolts: 7.4, cellNominalVolts: 3.7, label: { capacityAh: 10 } })!;
    expect(r.ratio).toBeCloseTo(35.77 / 37, 12);
    expect(r.measuredBasis).toBe('measured-wh');
  });

  it('warns below the warning fraction (default 0.9), not at it [C]', () => {
    const at = measuredVersusLabelEnergy({ measuredWh: 9, packNominalVolts: 3.7, cellNominalVolts: 3.7, label: { capacityWh: 10 } })!;
    expect(at.ratio).toBeCloseTo(0.9, 12);
    expect(at.warning).toBe(false);
    expect(measuredVersusLabelEnergy({ measuredWh: 8.99, packNominalVolts: 3.7, cellNominalVolts: 3.7, label: { capacityWh: 10 } })!.warning).toBe(true);
    expect(measuredVersusLabelEnergy({ measuredWh: 8.5, packNominalVolts: 3.7, cellNominalVolts: 3.7, label: { capacityWh: 10 }, warnFraction: 0.8 })!.warning).toBe(false);
  });

  it('is undefined without a label capacity, and names a wrong or missing input', () => {
    expect(measuredVersusLabelEnergy({ measuredWh: 5, packNominalVolts: 3.7, cellNominalVolts: 3.7, label: {} })).toBeUndefined();
    expect(() => measuredVersusLabelEnergy({ packNominalVolts: 3.7, cellNominalVolts: 3.7, label: { capacityAh: 1 } })).toThrow(/measured energy \(Wh\) or the measured capacity/);
    expect(() => measuredVersusLabelEnergy({ measuredAh: 1, packNominalVolts: 0, cellNominalVolts: 3.7, label: { capacityAh: 1 } })).toThrow(/Pack nominal voltage/);
    expect(() => measuredVersusLabelEnergy({ measuredWh: -1, packNominalVolts: 3.7, cellNominalVolts: 3.7, label: { capacityAh: 1 } })).toThrow(/Measured energy \(Wh\)/);
    expect(() => measuredVersusLabelEnergy({ measuredWh: 1, packNominalVolts: 3.7, cellNominalVolts: 3.7, label: { capacityAh: 1 }, warnFraction: 2 })).toThrow(/warnFraction/);
  });
});
