import { describe, it, expect } from 'vitest';
import { powerDensityWPerCm2 } from './power-density';

describe('heater power density', () => {
  it('8.881667 W over 40 mm × 60 mm (24 cm²) is 0.370069 W/cm² [C]', () => {
    expect(powerDensityWPerCm2(8.881667, 0.04 * 0.06)).toBeCloseTo(0.370069, 6);
  });
  it('1 W over 0.01 m² is 0.01 W/cm² [C]', () => {
    expect(powerDensityWPerCm2(1, 0.01)).toBeCloseTo(0.01, 12);
  });
  it('rejects zero area and negative power', () => {
    expect(() => powerDensityWPerCm2(1, 0)).toThrow(/Heated area/);
    expect(() => powerDensityWPerCm2(-1, 1)).toThrow(/Power/);
  });
});
