import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { ipc2221MaxCurrent, ipc2221MinWidth, ipc2221RangeWarnings, ipc2221ThicknessMil } from './ipc2221';
import { METRES_PER_MIL, ozToMetres } from './copper';

const oz1 = ozToMetres(1);
const mil = (n: number) => n * METRES_PER_MIL;

describe('IPC-2221 current capacity (REFERENCES §2) [S: IPC-2221 curve fit]', () => {
  it('1 oz copper enters as 1.378 mil [S: published IPC-2221 calculators]', () => {
    expect(ipc2221ThicknessMil(oz1)).toBeCloseTo(1.378, 12);
    expect(ipc2221ThicknessMil(ozToMetres(2))).toBeCloseTo(2.756, 12);
    expect(() => ipc2221ThicknessMil(0)).toThrow(/Copper thickness/);
  });
  it('10 mil, 1 oz, ΔT 10 °C (A = 13.78 mil²): 0.8855 A external, 0.4428 A internal [C]', () => {
    expect(ipc2221MaxCurrent({ widthM: mil(10), thicknessM: oz1, temperatureRiseC: 10, layer: 'external' })).toBeCloseTo(0.8855, 4);
    expect(ipc2221MaxCurrent({ widthM: mil(10), thicknessM: oz1, temperatureRiseC: 10, layer: 'internal' })).toBeCloseTo(0.4428, 4);
  });
  it('20 mil external, 1 oz, ΔT 20 °C: 1.9856 A [C]', () => {
    expect(ipc2221MaxCurrent({ widthM: mil(20), thicknessM: oz1, temperatureRiseC: 20, layer: 'external' })).toBeCloseTo(1.9856, 4);
  });
});

describe('IPC-2221 minimum width (REFERENCES §2)', () => {
  it('1 A, 1 oz, ΔT 10 °C: 11.826 mil (0.3004 mm) external, 30.764 mil (0.7814 mm) internal [C]', () => {
    const ext = ipc2221MinWidth({ currentA: 1, thicknessM: oz1, temperatureRiseC: 10, layer: 'external' });
    expect(ext / METRES_PER_MIL).toBeCloseTo(11.826, 3);
    expect(ext * 1e3).toBeCloseTo(0.3004, 4);
    const int = ipc2221MinWidth({ currentA: 1, thicknessM: oz1, temperatureRiseC: 10, layer: 'internal' });
    expect(int / METRES_PER_MIL).toBeCloseTo(30.764, 3);
    expect(int * 1e3).toBeCloseTo(0.7814, 4);
  });
  it('the area for 1 A at ΔT 10 °C external is 16.296 mil² [C]', () => {
    const w = ipc2221MinWidth({ currentA: 1, thicknessM: oz1, temperatureRiseC: 10, layer: 'external' });
    expect((w / METRES_PER_MIL) * ipc2221ThicknessMil(oz1)).toBeCloseTo(16.296, 3);
  });
  it('2 A, 1 oz, ΔT 20 °C external: 20.200 mil [C]', () => {
    expect(ipc2221MinWidth({ currentA: 2, thicknessM: oz1, temperatureRiseC: 20, layer: 'external' }) / METRES_PER_MIL).toBeCloseTo(20.2, 3);
  });
  it('zero current needs zero width [C]', () => {
    expect(ipc2221MinWidth({ currentA: 0, thicknessM: oz1, temperatureRiseC: 10, layer: 'external' })).toBe(0);
  });
  it('width and current round-trip (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 35, noNaN: true }),
        fc.double({ min: 10, max: 100, noNaN: true }),
        fc.constantFrom('external' as const, 'internal' as const),
        fc.constantFrom(0.5, 1, 2, 3),
        (current, rise, layer, oz) => {
          const thicknessM = ozToMetres(oz);
          const w = ipc2221MinWidth({ currentA: current, thicknessM, temperatureRiseC: rise, layer });
          expect(ipc2221MaxCurrent({ widthM: w, thicknessM, temperatureRiseC: rise, layer }) / current).toBeCloseTo(1, 9);
        },
      ),
    );
  });
  it('internal traces need wider copper than external ones (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 35, noNaN: true }), (current) => {
        const p = { currentA: current, thicknessM: oz1, temperatureRiseC: 10 };
        expect(ipc2221MinWidth({ ...p, layer: 'internal' })).toBeGreaterThan(ipc2221MinWidth({ ...p, layer: 'external' }));
      }),
    );
  });
});

describe('IPC-2221 validity range and invalid input', () => {
  it('warns outside 35 A, 400 mil and ΔT 10–100 °C [M]', () => {
    expect(ipc2221RangeWarnings({ currentA: 1, widthM: mil(10), temperatureRiseC: 10 })).toEqual([]);
    const w = ipc2221RangeWarnings({ currentA: 40, widthM: mil(500), temperatureRiseC: 5 });
    expect(w).toHaveLength(3);
    expect(w[0]).toMatch(/35 A/);
    expect(w[1]).toMatch(/400 mil/);
    expect(w[2]).toMatch(/10–100 °C/);
    expect(ipc2221RangeWarnings({ temperatureRiseC: 120 })).toHaveLength(1);
  });
  it('rejects bad input naming the field', () => {
    expect(() => ipc2221MaxCurrent({ widthM: 0, thicknessM: oz1, temperatureRiseC: 10, layer: 'external' })).toThrow(/Trace width/);
    expect(() => ipc2221MaxCurrent({ widthM: mil(10), thicknessM: oz1, temperatureRiseC: 0, layer: 'external' })).toThrow(/temperature rise/);
    expect(() => ipc2221MaxCurrent({ widthM: mil(10), thicknessM: oz1, temperatureRiseC: 10, layer: 'top' as never })).toThrow(/Trace layer/);
    expect(() => ipc2221MinWidth({ currentA: -1, thicknessM: oz1, temperatureRiseC: 10, layer: 'external' })).toThrow(/Current/);
    expect(() => ipc2221MinWidth({ currentA: 1, thicknessM: 0, temperatureRiseC: 10, layer: 'internal' })).toThrow(/Copper thickness/);
  });
});
