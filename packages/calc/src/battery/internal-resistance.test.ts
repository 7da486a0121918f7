import { describe, expect, it } from 'vitest';
import { internalResistanceDc } from './internal-resistance';

describe('internalResistanceDc', () => {
  it('0.6 A at 3.912 V, then 3.0 A at 3.792 V: 0.120 V / 2.4 A = 50.0 mΩ (REFERENCES §12, DC method) [M: IEC 61960-3; C]', () => {
    const ohms = internalResistanceDc({ lowAmps: 0.6, lowVolts: 3.912, highAmps: 3.0, highVolts: 3.792 });
    expect(ohms).toBeCloseTo(0.05, 12);
    // Heat in the cell P = I²·R: 2.43 A through 50 mΩ is 0.295 W (REFERENCES §12) [C].
    expect(2.43 ** 2 * ohms).toBeCloseTo(0.295, 3);
  });

  it('takes a low current of zero (a step from rest) [C]', () => {
    // U_oc 4.000 V at rest, 3.900 V at 2 A: 0.100 V / 2 A = 50 mΩ.
    expect(internalResistanceDc({ lowAmps: 0, lowVolts: 4.0, highAmps: 2, highVolts: 3.9 })).toBeCloseTo(0.05, 12);
  });

  it('names a reading that cannot give a resistance', () => {
    expect(() => internalResistanceDc({ lowAmps: 3, lowVolts: 3.9, highAmps: 0.6, highVolts: 3.8 })).toThrow(/High current I₂ \(A\) must be above the low current/);
    expect(() => internalResistanceDc({ lowAmps: 0.6, lowVolts: 3.8, highAmps: 3, highVolts: 3.9 })).toThrow(/U₂ \(V\) must be below/);
    expect(() => internalResistanceDc({ lowAmps: -1, lowVolts: 3.9, highAmps: 3, highVolts: 3.8 })).toThrow(/Low current I₁ \(A\) must not be negative/);
    expect(() => internalResistanceDc({ lowAmps: 0.6, lowVolts: Number.NaN, highAmps: 3, highVolts: 3.8 })).toThrow(/U₁ \(V\) must be a finite number/);
    expect(() => internalResistanceDc(undefined as never)).toThrow(/Give the two readings/);
  });
});
