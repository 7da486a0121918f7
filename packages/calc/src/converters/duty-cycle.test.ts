import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { boostDutyCycle, boostDutyCycleWithLosses, buckDutyCycle, buckDutyCycleWithLosses, conversionLossWatts, converterInputWatts } from './duty-cycle';

describe('duty cycle in continuous conduction (REFERENCES §5)', () => {
  it('buck 3.7 → 1.8 V: 0.486486, or 0.540541 with η 0.9 [C; S: Erickson & Maksimović]', () => {
    expect(buckDutyCycle(3.7, 1.8)).toBeCloseTo(0.486486, 6);
    expect(buckDutyCycleWithLosses(3.7, 1.8, 0.9)).toBeCloseTo(0.540541, 6);
  });
  it('buck 5 → 3.3 V: 0.66 [C]', () => {
    expect(buckDutyCycle(5, 3.3)).toBeCloseTo(0.66, 12);
  });
  it('boost 3.7 → 5 V: 0.26, or 0.334 with η 0.9 [C; S; M for the lossy form]', () => {
    expect(boostDutyCycle(3.7, 5)).toBeCloseTo(0.26, 12);
    expect(boostDutyCycleWithLosses(3.7, 5, 0.9)).toBeCloseTo(0.334, 12);
  });
  it('boost 3.2 → 5 V: 0.36; boost 4.2 → 5 V: 0.16 [C]', () => {
    expect(boostDutyCycle(3.2, 5)).toBeCloseTo(0.36, 12);
    expect(boostDutyCycle(4.2, 5)).toBeCloseTo(0.16, 12);
  });
  it('equal voltages: buck D = 1, boost D = 0 [C]', () => {
    expect(buckDutyCycle(5, 5)).toBe(1);
    expect(boostDutyCycle(5, 5)).toBe(0);
  });
  it('ideal duty is within 0..1 and inverts the conversion ratio (property)', () => {
    const v = fc.double({ min: 0.1, max: 100, noNaN: true });
    fc.assert(
      fc.property(v, v, (a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        const dBuck = buckDutyCycle(hi, lo);
        const dBoost = boostDutyCycle(lo, hi);
        for (const d of [dBuck, dBoost]) {
          expect(d).toBeGreaterThanOrEqual(0);
          expect(d).toBeLessThanOrEqual(1);
        }
        expect(hi * dBuck).toBeCloseTo(lo, 9); // Vout = D·Vin
        if (dBoost < 0.999) expect(lo / (1 - dBoost) / hi).toBeCloseTo(1, 6); // Vout = Vin/(1 − D)
      }),
    );
  });
  it('losses raise the duty cycle of both (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.7, max: 0.99, noNaN: true }), (eta) => {
        expect(buckDutyCycleWithLosses(5, 3.3, eta)).toBeGreaterThan(buckDutyCycle(5, 3.3));
        expect(boostDutyCycleWithLosses(3.7, 5, eta)).toBeGreaterThan(boostDutyCycle(3.7, 5));
      }),
    );
  });
  it('rejects impossible conversions and bad inputs', () => {
    expect(() => buckDutyCycle(3.7, 5)).toThrow(/buck \(step-down\)/);
    expect(() => buckDutyCycleWithLosses(3.4, 3.3, 0.9)).toThrow(/at efficiency 0.9/);
    expect(() => boostDutyCycle(5, 3.7)).toThrow(/boost \(step-up\)/);
    expect(() => boostDutyCycleWithLosses(5, 4, 0.9)).toThrow(/at efficiency 0.9/);
    expect(() => buckDutyCycle(0, 1)).toThrow(/Input voltage/);
    expect(() => boostDutyCycle(3.7, -5)).toThrow(/Output voltage/);
    expect(() => buckDutyCycleWithLosses(5, 3.3, 1.2)).toThrow(/Efficiency/);
    expect(() => boostDutyCycleWithLosses(3.7, 5, 0)).toThrow(/Efficiency/);
  });
});

describe('conversion losses', () => {
  it('5 W out at η 0.9 loses 0.555556 W and draws 5.555556 W [C]', () => {
    expect(conversionLossWatts(5, 0.9)).toBeCloseTo(0.555556, 6);
    expect(converterInputWatts(5, 0.9)).toBeCloseTo(5.555556, 6);
    expect(conversionLossWatts(5, 1)).toBe(0);
  });
  it('input = output + loss (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1000, noNaN: true }), fc.double({ min: 0.05, max: 1, noNaN: true }), (p, eta) => {
        expect(converterInputWatts(p, eta)).toBeCloseTo(p + conversionLossWatts(p, eta), 6);
      }),
    );
  });
  it('rejects negative power and efficiency outside (0, 1]', () => {
    expect(() => conversionLossWatts(-1, 0.9)).toThrow(/Output power/);
    expect(() => conversionLossWatts(1, 0)).toThrow(/Efficiency/);
    expect(() => converterInputWatts(1, 1.01)).toThrow(/Efficiency/);
  });
});
