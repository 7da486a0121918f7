import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { combineResistances, currentFromVoltageAndResistance, dutyForTargetPower, powerFromVoltageAndResistance, pwmAveragePower, requireConnection, rmsVoltage } from './ohms-law';

const resistance = fc.double({ min: 1e-3, max: 1e6, noNaN: true });

describe("Ohm's and Joule's laws (REFERENCES §3)", () => {
  it('3.0 Ω element at 3.65 V draws 1.216667 A and dissipates 4.440833 W [C]', () => {
    expect(currentFromVoltageAndResistance(3.65, 3.0)).toBeCloseTo(1.216667, 6);
    expect(powerFromVoltageAndResistance(3.65, 3.0)).toBeCloseTo(4.440833, 6);
    // 44.408 J in 10 s [C]
    expect(powerFromVoltageAndResistance(3.65, 3.0) * 10).toBeCloseTo(44.408, 3);
  });

  it('two 3.0 Ω elements in parallel make 1.5 Ω: 2.433333 A and 8.881667 W [C]', () => {
    const r = combineResistances([3.0, 3.0], 'parallel');
    expect(r).toBeCloseTo(1.5, 12);
    expect(currentFromVoltageAndResistance(3.65, r)).toBeCloseTo(2.433333, 6);
    expect(powerFromVoltageAndResistance(3.65, r)).toBeCloseTo(8.881667, 6);
  });

  it('series resistances add [C]', () => {
    expect(combineResistances([3.0, 3.0], 'series')).toBe(6);
    expect(combineResistances([10, 22, 47], 'series')).toBe(79);
    expect(combineResistances([4.7], 'parallel')).toBeCloseTo(4.7, 12);
  });

  it('a zero-ohm branch shorts a parallel group, and adds nothing in series [C]', () => {
    expect(combineResistances([0, 10], 'parallel')).toBe(0);
    expect(combineResistances([0, 10], 'series')).toBe(10);
  });

  it('a negative voltage gives the same power and a negative current [C]', () => {
    expect(powerFromVoltageAndResistance(-3.65, 3.0)).toBeCloseTo(4.440833, 6);
    expect(currentFromVoltageAndResistance(-3.65, 3.0)).toBeCloseTo(-1.216667, 6);
  });
});

describe('PWM (REFERENCES §3)', () => {
  const p1 = powerFromVoltageAndResistance(3.65, 3.0);
  it('D = 0.6 on one element gives 2.664500 W and V_rms 2.827278 V [C]', () => {
    expect(pwmAveragePower(p1, 0.6)).toBeCloseTo(2.6645, 6);
    expect(rmsVoltage(3.65, 0.6)).toBeCloseTo(2.827278, 6);
  });
  it('D = 0.25 on one element gives 1.110208 W [C]', () => {
    expect(pwmAveragePower(p1, 0.25)).toBeCloseTo(1.110208, 6);
  });
  it('D = 0.5 on the parallel pair gives 4.440833 W [C]', () => {
    expect(pwmAveragePower(powerFromVoltageAndResistance(3.65, 1.5), 0.5)).toBeCloseTo(4.440833, 6);
  });
  it('duty for a target power inverts the average power [C]', () => {
    expect(dutyForTargetPower(8.881667, 4.4408335)).toBeCloseTo(0.5, 9);
    expect(dutyForTargetPower(10, 0)).toBe(0);
    expect(dutyForTargetPower(10, 10)).toBe(1);
  });
  it('V_rms of a negative rail is still positive [C]', () => {
    expect(rmsVoltage(-5, 0.25)).toBeCloseTo(2.5, 12);
  });
});

describe('properties', () => {
  it('parallel combination is at most the smallest resistance', () => {
    fc.assert(
      fc.property(fc.array(resistance, { minLength: 1, maxLength: 12 }), (rs) => {
        const r = combineResistances(rs, 'parallel');
        expect(r).toBeLessThanOrEqual(Math.min(...rs) * (1 + 1e-12));
        expect(r).toBeGreaterThan(0);
      }),
    );
  });

  it('series combination is at least the largest resistance', () => {
    fc.assert(
      fc.property(fc.array(resistance, { minLength: 1, maxLength: 12 }), (rs) => {
        expect(combineResistances(rs, 'series')).toBeGreaterThanOrEqual(Math.max(...rs));
      }),
    );
  });

  it('n equal resistances: series is n·R and parallel is R/n', () => {
    fc.assert(
      fc.property(resistance, fc.integer({ min: 1, max: 50 }), (r, n) => {
        const rs = Array.from({ length: n }, () => r);
        expect(combineResistances(rs, 'series') / (n * r)).toBeCloseTo(1, 9);
        expect(combineResistances(rs, 'parallel') / (r / n)).toBeCloseTo(1, 9);
      }),
    );
  });

  it('duty for a target power is within 0..1 and round-trips through pwmAveragePower', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e4, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (peak, share) => {
        const target = peak * share;
        const d = dutyForTargetPower(peak, target);
        expect(d).toBeGreaterThanOrEqual(0);
        expect(d).toBeLessThanOrEqual(1);
        expect(pwmAveragePower(peak, d)).toBeCloseTo(target, 6);
      }),
    );
  });

  it('P = V·I for any voltage and resistance', () => {
    fc.assert(
      fc.property(fc.double({ min: -1000, max: 1000, noNaN: true }), resistance, (v, r) => {
        const p = powerFromVoltageAndResistance(v, r);
        const i = currentFromVoltageAndResistance(v, r);
        expect(p).toBeCloseTo(v * i, 6);
      }),
    );
  });
});

describe('invalid input', () => {
  it('rejects non-positive or non-finite resistance', () => {
    expect(() => powerFromVoltageAndResistance(3.7, -1)).toThrow(RangeError);
    expect(() => powerFromVoltageAndResistance(3.7, 0)).toThrow(/Resistance/);
    expect(() => currentFromVoltageAndResistance(Number.NaN, 3)).toThrow(/Voltage/);
    expect(() => currentFromVoltageAndResistance(3.7, Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });
  it('rejects an empty list, negative members and an unknown connection', () => {
    expect(() => combineResistances([], 'series')).toThrow(/at least one/);
    expect(() => combineResistances([1, -2], 'parallel')).toThrow(/Resistance 2/);
    expect(() => combineResistances([1, 2], 'diagonal' as never)).toThrow(/series.*parallel/);
    expect(() => requireConnection('star', 'Element connection')).toThrow(/Element connection/);
  });
  it('rejects duty outside 0..1 and negative peak power', () => {
    expect(() => pwmAveragePower(5, 1.2)).toThrow(/Duty cycle/);
    expect(() => pwmAveragePower(5, -0.1)).toThrow(RangeError);
    expect(() => pwmAveragePower(-5, 0.5)).toThrow(/Peak power/);
    expect(() => rmsVoltage(5, 2)).toThrow(/Duty cycle/);
  });
  it('rejects a target above the peak, and a zero peak', () => {
    expect(() => dutyForTargetPower(5, 6)).toThrow(/must not exceed/);
    expect(() => dutyForTargetPower(0, 0)).toThrow(/Peak power/);
    expect(() => dutyForTargetPower(5, -1)).toThrow(/Target power/);
  });
});
