import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { heaterTraceReport } from './heater-trace';
import { COPPER_RESISTIVITY_IACS } from '../traces/copper';

const fig = (r: ReturnType<typeof heaterTraceReport>, key: string) => {
  const f = r.figures.find((x) => x.key === key);
  if (!f) throw new Error(`no figure ${key}`);
  return f;
};
const TEN_MIL = 0.254e-3;
const OZ = 35e-6;

describe('heater-trace calculator (REFERENCES §2)', () => {
  it('100 mm × 0.254 mm × 35 µm at 20 °C is 0.19394 Ω IACS, with the CRC 0.18875 Ω as a note [C]', () => {
    const r = heaterTraceReport({ lengthM: 0.1, widthM: TEN_MIL, thicknessM: OZ, layer: 'external' });
    const res = fig(r, 'resistance');
    expect(res.value as number).toBeCloseTo(0.19394, 5);
    expect(res.unit).toBe('Ω');
    expect(res.formula).toBe('R = ρ·L / (w·t) · [1 + α·(T − 20 °C)]');
    expect(res.source).toMatch(/IEC 60028/);
    expect(res.assumptions.join(' ')).toMatch(/1\.678 × 10⁻⁸ Ω·m \[M\], would give 188\.8 mΩ/);
    expect(res.assumptions).toContain('Trace temperature 20 °C assumed.');
    expect(res.inputs).toContainEqual({ label: 'Resistivity ρ₂₀', value: COPPER_RESISTIVITY_IACS, unit: 'Ω·m' });
    // Without a supply or current there is no power, width or density — only the rating.
    expect(r.figures.map((f) => f.key)).toEqual(['resistance', 'maxCurrent']);
  });

  it('the same trace at 60 °C is 0.22443 Ω IACS (× 1.1572) [C]', () => {
    const r = heaterTraceReport({ lengthM: 0.1, widthM: TEN_MIL, thicknessM: OZ, temperatureC: 60, layer: 'external' });
    expect(fig(r, 'resistance').value as number).toBeCloseTo(0.22443, 4);
    expect(fig(r, 'resistance').label).toBe('Trace resistance at 60 °C');
  });

  it('1 oz, 10 mil, ΔT 10 °C: 0.8855 A external, 0.4428 A internal [S: IPC-2221 fit; C]', () => {
    const ext = heaterTraceReport({ lengthM: 0.1, widthM: TEN_MIL, thicknessM: OZ, temperatureRiseC: 10, layer: 'external' });
    expect(fig(ext, 'maxCurrent').value as number).toBeCloseTo(0.8855, 4);
    expect(fig(ext, 'maxCurrent').warnings).toEqual([]);
    const int = heaterTraceReport({ lengthM: 0.1, widthM: TEN_MIL, thicknessM: OZ, temperatureRiseC: 10, layer: 'internal' });
    expect(fig(int, 'maxCurrent').value as number).toBeCloseTo(0.4428, 4);
  });

  it('a 20 mil external trace at ΔT 20 °C carries 1.9856 A [C]', () => {
    const r = heaterTraceReport({ lengthM: 0.1, widthM: 2 * TEN_MIL, thicknessM: OZ, temperatureRiseC: 20, layer: 'external' });
    expect(fig(r, 'maxCurrent').value as number).toBeCloseTo(1.9856, 4);
  });

  it('1 A at ΔT 10 °C on 1 oz needs 11.826 mil (0.3004 mm) external, 30.764 mil internal [C]', () => {
    const ext = heaterTraceReport({ lengthM: 0.1, widthM: TEN_MIL, thicknessM: OZ, currentA: 1, layer: 'external' });
    expect((fig(ext, 'minWidth').value as number) / 25.4e-6).toBeCloseTo(11.826, 3);
    expect((fig(ext, 'minWidth').value as number) * 1e3).toBeCloseTo(0.3004, 4);
    expect(fig(ext, 'maxCurrent').assumptions[0]).toMatch(/Allowed rise 10 °C assumed/);
    const int = heaterTraceReport({ lengthM: 0.1, widthM: TEN_MIL, thicknessM: OZ, currentA: 1, layer: 'internal' });
    expect((fig(int, 'minWidth').value as number) / 25.4e-6).toBeCloseTo(30.764, 3);
  });

  it('2 A at ΔT 20 °C external needs 20.200 mil [C]', () => {
    const r = heaterTraceReport({ lengthM: 0.1, widthM: TEN_MIL, thicknessM: OZ, currentA: 2, temperatureRiseC: 20, layer: 'external' });
    expect((fig(r, 'minWidth').value as number) / 25.4e-6).toBeCloseTo(20.2, 3);
  });

  describe('a 3.0 Ω heater trace at 3.65 V (REFERENCES §3)', () => {
    // Length for exactly 3.0 Ω at 20 °C: L = R·w·t / ρ.
    const lengthM = (3 * TEN_MIL * OZ) / COPPER_RESISTIVITY_IACS;
    const r = heaterTraceReport({ lengthM, widthM: TEN_MIL, thicknessM: OZ, supplyVolts: 3.65, layer: 'external', areaM2: 0.04 * 0.06 });

    it('draws 1.216667 A and dissipates 4.440833 W [C]', () => {
      expect(fig(r, 'resistance').value as number).toBeCloseTo(3, 12);
      expect(fig(r, 'current').value as number).toBeCloseTo(1.216667, 6);
      expect(fig(r, 'power').value as number).toBeCloseTo(4.440833, 6);
      expect(fig(r, 'power').formula).toBe('P = V² / R');
    });
    it('is above its 0.8855 A IPC-2221 rating at ΔT 10 °C, and says so calmly [C]', () => {
      expect(fig(r, 'maxCurrent').warnings.join(' ')).toMatch(/1\.217 A is above the 885\.5 mA this trace carries at a 10 °C rise/);
      expect((fig(r, 'minWidth').value as number) / 25.4e-6).toBeGreaterThan(10);
      expect(fig(r, 'minWidth').label).toBe('IPC-2221 minimum width for 1.22 A');
    });
    it('over 40 mm × 60 mm (24 cm²) is 0.185035 W/cm² [C]', () => {
      expect(fig(r, 'powerDensity').value as number).toBeCloseTo(4.440833 / 24, 6);
      expect(fig(r, 'powerDensity').unit).toBe('W/cm²');
    });
    it('estimates a steady rise from both faces by convection (h 10 W/m²K) and exact radiation (ε 0.9 plastic): 54.19 °C, with a burn warning [C; M: ISO 13732-1]', () => {
      // bisection of 4.440833 = 10 · 0.0048 · ΔT + 0.9σ · 0.0048 · ((298.15 + ΔT)⁴ − 298.15⁴) [C] (issue 10 §2.14: one model)
      const s = fig(r, 'surfaceRise');
      expect(s.value as number).toBeCloseTo(54.1919, 3);
      expect(s.warnings[0]).toMatch(/above the 60 °C burn threshold for 1 min of contact with plastic/);
      expect(r.warnings.length).toBeGreaterThanOrEqual(2);
    });
  });

  it('3 W from both faces of a 150 × 75 mm slab (2 × 0.01125 = 0.0225 m²) at h 10 plus radiation rises 8.52 K [C] (13.333 K by convection alone, REFERENCES §7): no burn warning', () => {
    // P = I²·R: choose I for exactly 3 W through a 3.0 Ω trace.
    const lengthM = (3 * TEN_MIL * OZ) / COPPER_RESISTIVITY_IACS;
    const r = heaterTraceReport({ lengthM, widthM: TEN_MIL, thicknessM: OZ, currentA: 1, layer: 'external', areaM2: 0.15 * 0.075 });
    expect(fig(r, 'power').value as number).toBeCloseTo(3, 9);
    expect(fig(r, 'power').formula).toBe('P = I² · R');
    expect(fig(r, 'voltage').value as number).toBeCloseTo(3, 9);
    expect(fig(r, 'surfaceRise').value as number).toBeCloseTo(8.5215, 3);
    expect(fig(r, 'surfaceRise').warnings).toEqual([]);
  });

  it('a long-contact surface between 43 and 48 °C warns about 8 h contact [M: ISO 13732-1]', () => {
    const lengthM = (3 * TEN_MIL * OZ) / COPPER_RESISTIVITY_IACS;
    // 6.4 W from both faces of 0.0100 m² with convection and radiation: rise about 20 K, surface about 45 °C [C].
    const r = heaterTraceReport({ lengthM, widthM: TEN_MIL, thicknessM: OZ, currentA: Math.sqrt(6.4 / 3), layer: 'external', areaM2: 0.01 });
    expect(fig(r, 'surfaceRise').warnings[0]).toMatch(/above the 43 °C burn threshold for 8 h or more/);
  });

  it('warns outside the IPC-2221 fit range and when the given current disagrees with the supply', () => {
    const wide = heaterTraceReport({ lengthM: 0.1, widthM: 12e-3, thicknessM: OZ, temperatureRiseC: 5, layer: 'external' });
    expect(fig(wide, 'maxCurrent').warnings.join(' ')).toMatch(/Width 472 mil is above the 400 mil/);
    expect(fig(wide, 'maxCurrent').warnings.join(' ')).toMatch(/Temperature rise 5 °C is outside the 10–100 °C/);
    const r = heaterTraceReport({ lengthM: 0.1, widthM: TEN_MIL, thicknessM: OZ, supplyVolts: 0.1, currentA: 2, layer: 'external' });
    expect(fig(r, 'current').warnings[0]).toMatch(/differs from the 515\.6 mA the supply drives/);
    expect(fig(r, 'minWidth').inputs[0]).toEqual({ label: 'Current', value: 2, unit: 'A' });
    const big = heaterTraceReport({ lengthM: 0.1, widthM: TEN_MIL, thicknessM: OZ, currentA: 40, layer: 'external' });
    expect(fig(big, 'minWidth').warnings.join(' ')).toMatch(/Current 40 A is above the 35 A/);
  });

  it('warns when the heated area is smaller than the copper itself', () => {
    const r = heaterTraceReport({ lengthM: 0.1, widthM: TEN_MIL, thicknessM: OZ, supplyVolts: 0.1, layer: 'external', areaM2: 1e-6 });
    expect(fig(r, 'powerDensity').warnings[0]).toMatch(/smaller than the trace's own copper/);
  });

  it('power scales with V² and resistance with length (property) [C]', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 2, noNaN: true }), fc.double({ min: 0.1, max: 24, noNaN: true }), (l, v) => {
        const a = heaterTraceReport({ lengthM: l, widthM: TEN_MIL, thicknessM: OZ, supplyVolts: v, layer: 'external' });
        const b = heaterTraceReport({ lengthM: 2 * l, widthM: TEN_MIL, thicknessM: OZ, supplyVolts: 2 * v, layer: 'external' });
        expect((fig(b, 'resistance').value as number) / (fig(a, 'resistance').value as number)).toBeCloseTo(2, 9);
        expect((fig(b, 'power').value as number) / (fig(a, 'power').value as number)).toBeCloseTo(2, 9);
      }),
    );
  });

  it('refuses impossible inputs with a RangeError naming them', () => {
    const base = { lengthM: 0.1, widthM: TEN_MIL, thicknessM: OZ, layer: 'external' as const };
    expect(() => heaterTraceReport({ ...base, lengthM: 0 })).toThrow(/Trace length/);
    expect(() => heaterTraceReport({ ...base, temperatureC: -250 })).toThrow(/outside the range of the linear copper model/);
    expect(() => heaterTraceReport({ ...base, supplyVolts: -1 })).toThrow(/Supply voltage/);
    expect(() => heaterTraceReport({ ...base, currentA: 0 })).toThrow(/Current/);
    expect(() => heaterTraceReport({ ...base, areaM2: 0 })).toThrow(/Heated area/);
    expect(() => heaterTraceReport({ ...base, temperatureRiseC: 0 })).toThrow(/Allowed temperature rise/);
    expect(() => heaterTraceReport({ ...base, layer: 'middle' as never })).toThrow(/Trace layer/);
  });
});
