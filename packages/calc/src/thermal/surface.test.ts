import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { effectiveHeatTransferCoefficient, emissivityOf, steadySurfaceRiseC, surfaceHeatLossWatts, thermalTimeConstantSeconds, timeToRiseSeconds } from './surface';
import { radiativeHeatTransferCoefficient } from './convection';

describe('heated surface with exact radiation (REFERENCES §7, §12)', () => {
  it('without radiation it is Newton cooling: 1 W over 0.01 m² at h 10 gives 10.0 K [C]', () => {
    expect(steadySurfaceRiseC({ watts: 1, areaM2: 0.01, ambientC: 25, emissivity: 0 })).toBeCloseTo(10, 8);
  });
  it('small rises match the linearised h_rad: 3 W over 0.0225 m² at ε 0.9 is 8.52 K exact against 8.60 K linear at 300 K [C]', () => {
    const exact = steadySurfaceRiseC({ watts: 3, areaM2: 0.0225, ambientC: 25, emissivity: 0.9 });
    // bisection of 3 = 10·0.0225·ΔT + 0.9σ·0.0225·((298.15 + ΔT)⁴ − 298.15⁴) [C]
    expect(exact).toBeCloseTo(8.5215, 3);
    const linear = 3 / (0.0225 * (10 + radiativeHeatTransferCoefficient(0.9, 300)));
    expect(Math.abs(exact / linear - 1)).toBeLessThan(0.015);
  });
  it('large rises do not: 10 W over 0.01 m² at ε 0.9 rises 58.11 K, where the linear h at ambient says 64.9 K [C]', () => {
    expect(steadySurfaceRiseC({ watts: 10, areaM2: 0.01, ambientC: 25, emissivity: 0.9 })).toBeCloseTo(58.1137, 3);
    expect(10 / (0.01 * (10 + radiativeHeatTransferCoefficient(0.9, 298.15)))).toBeCloseTo(64.89, 2);
  });
  it('the loss at the solved rise is the power put in (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 50, noNaN: true }), fc.double({ min: 1e-4, max: 0.1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (w, a, e) => {
        const rise = steadySurfaceRiseC({ watts: w, areaM2: a, ambientC: 20, emissivity: e });
        expect(surfaceHeatLossWatts({ riseC: rise, areaM2: a, ambientC: 20, emissivity: e })).toBeCloseTo(w, 6);
      }),
    );
  });
  it('emissivity by material: bare metal 0.1, coated 0.85, plastic 0.9 [S: handbook tables; M for values]', () => {
    expect(emissivityOf('metal').value).toBe(0.1);
    expect(emissivityOf('metal-coated').value).toBe(0.85);
    expect(emissivityOf('plastic').value).toBe(0.9);
    expect(() => emissivityOf('stone' as never)).toThrow(/Surface material/);
  });
  it('effective h is convection plus radiation at the rise', () => {
    const h = effectiveHeatTransferCoefficient({ riseC: 0.001, areaM2: 0.01, ambientC: 26.85, emissivity: 0.9 });
    expect(h).toBeCloseTo(10 + radiativeHeatTransferCoefficient(0.9, 300), 2);
  });
  it('rejects bad inputs', () => {
    expect(() => steadySurfaceRiseC({ watts: -1, areaM2: 0.01, ambientC: 25, emissivity: 0.9 })).toThrow(/Power/);
    expect(() => steadySurfaceRiseC({ watts: 1, areaM2: 0, ambientC: 25, emissivity: 0.9 })).toThrow(/Surface area/);
    expect(() => steadySurfaceRiseC({ watts: 1, areaM2: 0.01, ambientC: 25, emissivity: 1.5 })).toThrow(/Emissivity/);
    expect(() => steadySurfaceRiseC({ watts: 1, areaM2: 0.01, ambientC: -300, emissivity: 0.5 })).toThrow(/absolute zero/);
    expect(steadySurfaceRiseC({ watts: 0, areaM2: 0.01, ambientC: 25, emissivity: 0.9 })).toBe(0);
  });
});

describe('thermal transient (REFERENCES §12 [S: Incropera ch. 5, lumped capacitance])', () => {
  it('40 g aluminium case, A 0.0048 m², h 15: τ = 0.040 × 897 / (15 × 0.0048) = 498.3 s [C]', () => {
    expect(thermalTimeConstantSeconds({ massKg: 0.04, specificHeat: 897, hWPerM2K: 15, areaM2: 0.0048 })).toBeCloseTo(498.333, 3);
  });
  it('time to a rise: −τ ln(1 − ΔT/ΔT_ss); τ 500 s, steady 40 K, 20 K reached at 500 ln 2 = 346.57 s [C]', () => {
    expect(timeToRiseSeconds({ timeConstantSeconds: 500, steadyRiseC: 40, riseC: 20 })).toBeCloseTo(346.5736, 4);
    expect(timeToRiseSeconds({ timeConstantSeconds: 500, steadyRiseC: 20, riseC: 20 })).toBeNull();
    expect(timeToRiseSeconds({ timeConstantSeconds: 500, steadyRiseC: 20, riseC: 0 })).toBe(0);
    expect(() => thermalTimeConstantSeconds({ massKg: 0, specificHeat: 897, hWPerM2K: 15, areaM2: 0.0048 })).toThrow(/Heated mass/);
  });
});
