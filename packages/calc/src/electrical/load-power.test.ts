import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { loadPower } from './load-power';

describe('loadPower', () => {
  it('two 3.0 Ω elements in parallel at 3.65 V: 4.440833 W each, 8.881667 W, 2.433333 A [C, REFERENCES §3]', () => {
    const r = loadPower({ count: 2, connection: 'parallel', resistanceOhms: 3.0, supplyVolts: 3.65 });
    expect(r.basis).toBe('resistance');
    expect(r.equivalentOhms).toBeCloseTo(1.5, 12);
    expect(r.elementWatts).toBeCloseTo(4.440833, 6);
    expect(r.elementAmps).toBeCloseTo(1.216667, 6);
    expect(r.totalWatts).toBeCloseTo(8.881667, 6);
    expect(r.totalAmps).toBeCloseTo(2.433333, 6);
    expect(r.elementVolts).toBe(3.65);
  });

  it('two 3.0 Ω elements in series at 3.65 V share the voltage [C]', () => {
    const r = loadPower({ count: 2, connection: 'series', resistanceOhms: 3.0, supplyVolts: 3.65 });
    expect(r.equivalentOhms).toBe(6);
    expect(r.elementVolts).toBeCloseTo(1.825, 12);
    expect(r.totalAmps).toBeCloseTo(0.608333, 6);
    expect(r.totalWatts).toBeCloseTo(2.220417, 6);
    expect(r.elementWatts).toBeCloseTo(1.110208, 6);
  });

  it('a load described by element current: a 5 V fan drawing 0.2 A is 1 W and 25 Ω [C]', () => {
    const r = loadPower({ count: 1, connection: 'series', currentAmps: 0.2, supplyVolts: 5 });
    expect(r.basis).toBe('current');
    expect(r.elementOhms).toBeCloseTo(25, 12);
    expect(r.totalWatts).toBeCloseTo(1, 12);
  });

  it('a load described by element power: three 0.5 W LEDs in parallel at 3 V draw 0.5 A [C]', () => {
    const r = loadPower({ count: 3, connection: 'parallel', powerWatts: 0.5, supplyVolts: 3 });
    expect(r.basis).toBe('power');
    expect(r.totalWatts).toBeCloseTo(1.5, 12);
    expect(r.totalAmps).toBeCloseTo(0.5, 12);
  });

  it('resistance wins over current and power when several are given', () => {
    const r = loadPower({ count: 1, connection: 'series', resistanceOhms: 10, currentAmps: 99, powerWatts: 99, supplyVolts: 5 });
    expect(r.basis).toBe('resistance');
    expect(r.totalWatts).toBeCloseTo(2.5, 12);
    const c = loadPower({ count: 1, connection: 'series', currentAmps: 0.5, powerWatts: 99, supplyVolts: 5 });
    expect(c.basis).toBe('current');
  });

  it('total power is count × element power and V·I for either connection (property)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 20 }),
        fc.constantFrom('series' as const, 'parallel' as const),
        fc.double({ min: 0.01, max: 1000, noNaN: true }),
        fc.double({ min: 0.1, max: 400, noNaN: true }),
        (count, connection, ohms, volts) => {
          const r = loadPower({ count, connection, resistanceOhms: ohms, supplyVolts: volts });
          expect(r.totalWatts / (count * r.elementWatts)).toBeCloseTo(1, 9);
          expect(r.totalWatts / (volts * r.totalAmps)).toBeCloseTo(1, 9);
        },
      ),
    );
  });

  it('rejects a load with nothing to compute from, or bad fields, naming the field', () => {
    expect(() => loadPower({ count: 1, connection: 'series', supplyVolts: 5 })).toThrow(/resistance.*current.*power/);
    expect(() => loadPower({ count: 0, connection: 'series', resistanceOhms: 1, supplyVolts: 5 })).toThrow(/Element count/);
    expect(() => loadPower({ count: 1.5, connection: 'series', resistanceOhms: 1, supplyVolts: 5 })).toThrow(RangeError);
    expect(() => loadPower({ count: 1, connection: 'mesh' as never, resistanceOhms: 1, supplyVolts: 5 })).toThrow(/Element connection/);
    expect(() => loadPower({ count: 1, connection: 'series', resistanceOhms: -3, supplyVolts: 5 })).toThrow(/Element resistance/);
    expect(() => loadPower({ count: 1, connection: 'series', currentAmps: 0, supplyVolts: 5 })).toThrow(/Element current/);
    expect(() => loadPower({ count: 1, connection: 'series', powerWatts: -1, supplyVolts: 5 })).toThrow(/Element power/);
    expect(() => loadPower({ count: 1, connection: 'series', resistanceOhms: 3, supplyVolts: 0 })).toThrow(/Supply voltage/);
  });
});
