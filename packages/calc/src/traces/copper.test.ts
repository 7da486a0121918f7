import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { ipc2221ThicknessMil } from './ipc2221';
import { COPPER_ALPHA_20, COPPER_RESISTIVITY_IACS, COPPER_RESISTIVITY_PURE, METRES_PER_MIL, copperSheetResistance, copperTraceResistance, ozToMetres } from './copper';

const trace = { lengthM: 0.1, widthM: 0.254e-3, thicknessM: 35e-6 };

describe('copper constants (REFERENCES §2)', () => {
  it('IACS ρ = 1.7241e-8 Ω·m [S: IEC 60028], i.e. 58.0 MS/m; α₂₀ = 0.00393 /K [S]; CRC pure Cu 1.678e-8 [M]', () => {
    expect(COPPER_RESISTIVITY_IACS).toBe(1.7241e-8);
    expect(1 / COPPER_RESISTIVITY_IACS / 1e6).toBeCloseTo(58.0, 1);
    expect(COPPER_ALPHA_20).toBe(0.00393);
    expect(COPPER_RESISTIVITY_PURE).toBe(1.678e-8);
  });
  it('1 oz/ft² = 35 µm = 1.378 mil [S]', () => {
    expect(ozToMetres(1)).toBeCloseTo(35e-6, 15);
    expect(ozToMetres(1) / METRES_PER_MIL).toBeCloseTo(1.378, 3);
    expect(ozToMetres(2)).toBeCloseTo(70e-6, 15);
    expect(() => ozToMetres(0)).toThrow(/Copper weight/);
  });
  it('sheet resistance of 35 µm copper: 0.4926 mΩ/□ (IACS), 0.4794 mΩ/□ (CRC) [C]', () => {
    expect(copperSheetResistance(35e-6) * 1e3).toBeCloseTo(0.4926, 4);
    expect(copperSheetResistance(35e-6, COPPER_RESISTIVITY_PURE) * 1e3).toBeCloseTo(0.4794, 4);
    expect(() => copperSheetResistance(0)).toThrow(/Copper thickness/);
  });
});

describe('trace resistance R = ρL/(w·t)·[1 + α(T − 20)] (REFERENCES §2)', () => {
  it('100 mm × 0.254 mm × 35 µm at 20 °C: 0.19394 Ω IACS, 0.18875 Ω CRC [C]', () => {
    expect(copperTraceResistance(trace)).toBeCloseTo(0.19394, 5);
    expect(copperTraceResistance({ ...trace, resistivityOhmM: COPPER_RESISTIVITY_PURE })).toBeCloseTo(0.18875, 5);
  });
  it('the same trace at 60 °C: 0.22443 Ω IACS, 0.21842 Ω CRC (×1.1572) [C]', () => {
    // 0.193937 Ω × 1.1572 = 0.224424 Ω; the listed 0.22443 is 0.19394 × 1.1572, rounded twice.
    expect(copperTraceResistance({ ...trace, temperatureC: 60 })).toBeCloseTo(0.22443, 4);
    expect(copperTraceResistance({ ...trace, temperatureC: 60 })).toBeCloseTo(0.224424, 6);
    expect(copperTraceResistance({ ...trace, temperatureC: 60, resistivityOhmM: COPPER_RESISTIVITY_PURE })).toBeCloseTo(0.21842, 5);
    expect(copperTraceResistance({ ...trace, temperatureC: 60 }) / copperTraceResistance(trace)).toBeCloseTo(1.1572, 4);
  });
  it('resistance scales with length and inversely with width (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-4, max: 10, noNaN: true }), fc.double({ min: 1e-5, max: 0.01, noNaN: true }), (l, w) => {
        const r = copperTraceResistance({ lengthM: l, widthM: w, thicknessM: 35e-6 });
        expect(copperTraceResistance({ lengthM: 2 * l, widthM: w, thicknessM: 35e-6 }) / r).toBeCloseTo(2, 9);
        expect(copperTraceResistance({ lengthM: l, widthM: 2 * w, thicknessM: 35e-6 }) / r).toBeCloseTo(0.5, 9);
      }),
    );
  });
  it('rejects bad dimensions and temperatures beyond the linear model', () => {
    expect(() => copperTraceResistance({ ...trace, widthM: 0 })).toThrow(/Trace width/);
    expect(() => copperTraceResistance({ ...trace, thicknessM: -1 })).toThrow(/Copper thickness/);
    expect(() => copperTraceResistance({ ...trace, lengthM: -0.1 })).toThrow(/Trace length/);
    expect(() => copperTraceResistance({ ...trace, temperatureC: -250 })).toThrow(/Temperature/);
    expect(() => copperTraceResistance({ ...trace, temperatureC: Number.NaN })).toThrow(/Temperature/);
    expect(() => copperTraceResistance({ ...trace, resistivityOhmM: 0 })).toThrow(/Resistivity/);
  });
});

describe('unit round trips (property)', () => {
  it('oz/ft² → m → mil → oz/ft² returns the copper weight (1 oz = 35 µm = 1.378 mil [S])', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.25, max: 10, noNaN: true }), (oz) => {
        const metres = ozToMetres(oz);
        expect(metres / 35e-6).toBeCloseTo(oz, 12);
        expect(ipc2221ThicknessMil(metres) / 1.378).toBeCloseTo(oz, 12);
      }),
    );
  });
  it('m → mil → m is the identity (1 mil = 25.4 µm, exact by definition)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-7, max: 1, noNaN: true }), (m) => {
        expect(((m / METRES_PER_MIL) * METRES_PER_MIL) / m).toBeCloseTo(1, 14);
      }),
    );
    expect(METRES_PER_MIL).toBe(25.4e-6);
  });
});
