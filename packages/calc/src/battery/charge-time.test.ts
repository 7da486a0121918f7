import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { chargeTimeEstimate, chargeTimeHours } from './charge-time';

describe('CC-CV charge-time estimate', () => {
  it('3.0 Ah at 1.5 A (0.5 C): CC 1.6 h to 80 % [CP], CV taper to C/20 = 0.150 A [S] 1.023371 h [C]', () => {
    const e = chargeTimeEstimate({ capacityAh: 3.0, chargeCurrentA: 1.5 });
    expect(e.terminationA).toBeCloseTo(0.15, 12);
    expect(e.ccHours).toBeCloseTo(1.6, 12);
    // τ = 0.6 / (1.5 − 0.15) = 0.444444 h; t = τ·ln(10) [C]
    expect(e.cvHours).toBeCloseTo(1.023371, 6);
    expect(e.totalHours).toBeCloseTo(2.623371, 6);
  });
  it('termination at C/10 = 0.300 A [S] shortens the taper [C]', () => {
    const t = chargeTimeHours({ capacityAh: 3.0, chargeCurrentA: 1.5, terminationC: 0.1 });
    // τ = 0.6 / 1.2 = 0.5 h; t_cv = 0.5·ln(5) = 0.804719 h
    expect(t).toBeCloseTo(1.6 + 0.804719, 6);
  });
  it('the exponential taper delivers exactly the remaining charge (model check) [C]', () => {
    const e = chargeTimeEstimate({ capacityAh: 2.7, chargeCurrentA: 1, ccFraction: 0.7 });
    const tau = e.cvHours / Math.log(1 / e.terminationA);
    expect(tau * (1 - e.terminationA)).toBeCloseTo(0.3 * 2.7, 12);
  });
  it('a trickle at or below the termination current, or ccFraction 1, is all constant current [C]', () => {
    const trickle = chargeTimeEstimate({ capacityAh: 3, chargeCurrentA: 0.1 });
    expect(trickle.cvHours).toBe(0);
    expect(trickle.ccHours).toBeCloseTo(30, 12);
    expect(trickle.totalHours).toBeCloseTo(30, 12);
    expect(chargeTimeHours({ capacityAh: 3, chargeCurrentA: 1, ccFraction: 1 })).toBe(3);
  });
  it('is never shorter than capacity ÷ current × ccFraction and rises as current falls (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 100, noNaN: true }), fc.double({ min: 0.06, max: 3, noNaN: true }), (cap, c) => {
        const t = chargeTimeHours({ capacityAh: cap, chargeCurrentA: c * cap });
        expect(t).toBeGreaterThanOrEqual((0.8 * cap) / (c * cap) - 1e-12);
        expect(chargeTimeHours({ capacityAh: cap, chargeCurrentA: 0.9 * c * cap })).toBeGreaterThan(t);
      }),
    );
  });
  it('rejects bad inputs', () => {
    expect(() => chargeTimeHours({ capacityAh: 0, chargeCurrentA: 1 })).toThrow(/Capacity/);
    expect(() => chargeTimeHours({ capacityAh: 3, chargeCurrentA: -1 })).toThrow(/Charge current/);
    expect(() => chargeTimeHours({ capacityAh: 3, chargeCurrentA: 1, ccFraction: 1.2 })).toThrow(/Constant-current fraction/);
    expect(() => chargeTimeHours({ capacityAh: 3, chargeCurrentA: 1, terminationC: 0 })).toThrow(/Termination current/);
  });
});
