import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { dutyForTargetTemperatureRise, radiativeHeatTransferCoefficient, surfaceTemperatureRiseC } from './convection';

describe('natural convection ΔT = P/(h·A) (REFERENCES §7)', () => {
  it('1 W over 0.01 m² at h 10 gives 10.0 K [C]', () => {
    expect(surfaceTemperatureRiseC({ watts: 1, areaM2: 0.01, hWPerM2K: 10 })).toBeCloseTo(10, 12);
  });
  it('h defaults to 10 W/m²K (free convection 2–25 W/m²K [S: Çengel])', () => {
    expect(surfaceTemperatureRiseC({ watts: 1, areaM2: 0.01 })).toBeCloseTo(10, 12);
  });
  it('3 W from both faces of a 150 × 75 mm slab (0.0225 m²): 13.333 K at h 10, 26.667 K at h 5, 8.602 K at h 15.5 [C]', () => {
    const areaM2 = 2 * 0.15 * 0.075;
    expect(areaM2).toBeCloseTo(0.0225, 12);
    expect(surfaceTemperatureRiseC({ watts: 3, areaM2 })).toBeCloseTo(13.333, 3);
    expect(surfaceTemperatureRiseC({ watts: 3, areaM2, hWPerM2K: 5 })).toBeCloseTo(26.667, 3);
    expect(surfaceTemperatureRiseC({ watts: 3, areaM2, hWPerM2K: 15.5 })).toBeCloseTo(8.602, 3);
  });
  it('radiation adds h_rad = 4εσT³ = 5.51 W/m²K at ε 0.9 and 300 K [C]', () => {
    expect(radiativeHeatTransferCoefficient(0.9, 300)).toBeCloseTo(5.51, 2);
    expect(10 + radiativeHeatTransferCoefficient(0.9, 300)).toBeCloseTo(15.5, 0);
  });
  it('rejects bad inputs', () => {
    expect(() => surfaceTemperatureRiseC({ watts: 1, areaM2: 0 })).toThrow(/Surface area/);
    expect(() => surfaceTemperatureRiseC({ watts: -1, areaM2: 1 })).toThrow(/Power/);
    expect(() => surfaceTemperatureRiseC({ watts: 1, areaM2: 1, hWPerM2K: 0 })).toThrow(/Heat-transfer coefficient/);
    expect(() => radiativeHeatTransferCoefficient(1.2, 300)).toThrow(/Emissivity/);
    expect(() => radiativeHeatTransferCoefficient(0, 300)).toThrow(/Emissivity/);
    expect(() => radiativeHeatTransferCoefficient(0.9, 0)).toThrow(/Temperature/);
  });
});

describe('duty for a target temperature rise', () => {
  it('holding a 10 K rise on 0.0225 m² at h 10 needs 2.25 W: D = 0.25 of 9 W [C]', () => {
    const r = dutyForTargetTemperatureRise({ peakWatts: 9, areaM2: 0.0225, targetRiseC: 10 });
    expect(r.value).toBeCloseTo(0.25, 12);
    expect(r.warnings).toEqual([]);
    expect(r.assumptions.join(' ')).toMatch(/h = 10 W\/m²K assumed/);
    expect(r.formula).toMatch(/ΔT · h · A/);
    expect(r.inputs.map((i) => i.label)).toEqual(['Peak power', 'Surface area', 'Heat-transfer coefficient', 'Target rise']);
  });
  it('an out-of-reach target clamps to 1 with a warning [C]', () => {
    const r = dutyForTargetTemperatureRise({ peakWatts: 1, areaM2: 0.01, hWPerM2K: 10, targetRiseC: 30 });
    expect(r.value).toBe(1);
    expect(r.warnings[0]).toMatch(/out of reach.*10\.0 °C/);
    expect(r.assumptions.join(' ')).not.toMatch(/assumed \(free/);
  });
  it('round-trips with the surface rise at average power (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 100, noNaN: true }), fc.double({ min: 1e-4, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (peak, area, share) => {
        const fullRise = surfaceTemperatureRiseC({ watts: peak, areaM2: area });
        const d = dutyForTargetTemperatureRise({ peakWatts: peak, areaM2: area, targetRiseC: fullRise * share }).value;
        expect(d).toBeGreaterThanOrEqual(0);
        expect(d).toBeLessThanOrEqual(1);
        expect(surfaceTemperatureRiseC({ watts: peak * d, areaM2: area }) / fullRise).toBeCloseTo(share, 9);
      }),
    );
  });
  it('rejects bad inputs', () => {
    expect(() => dutyForTargetTemperatureRise({ peakWatts: 0, areaM2: 1, targetRiseC: 1 })).toThrow(/Peak power/);
    expect(() => dutyForTargetTemperatureRise({ peakWatts: 1, areaM2: 1, targetRiseC: -1 })).toThrow(/Target temperature rise/);
    expect(() => dutyForTargetTemperatureRise({ peakWatts: 1, areaM2: -1, targetRiseC: 1 })).toThrow(/Surface area/);
    expect(() => dutyForTargetTemperatureRise({ peakWatts: 1, areaM2: 1, hWPerM2K: -1, targetRiseC: 1 })).toThrow(/Heat-transfer/);
  });
});
