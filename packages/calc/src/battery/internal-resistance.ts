/**
 * Cell internal resistance by the DC method [M: IEC 61960-3, clause on internal resistance]:
 * discharge at a low current I₁ (0.2 It) and read U₁, step to a high current I₂ (1.0 It) and read U₂
 * after 1 s; R_dc = (U₁ − U₂) / (I₂ − I₁). REFERENCES §12.
 */
import { requireNonNegative, requirePositive } from '../shared/validate';

/** Two steady readings of one cell or pack: the low-current one (I₁, U₁) and the high-current one (I₂, U₂). */
export interface DcResistanceReadings {
  lowAmps: number;
  lowVolts: number;
  highAmps: number;
  highVolts: number;
}

/** DC internal resistance R = (U₁ − U₂) / (I₂ − I₁) from a low and a high current reading (Ω). */
export function internalResistanceDc(r: DcResistanceReadings): number {
  if (r === null || typeof r !== 'object') throw new RangeError('Give the two readings: lowAmps, lowVolts, highAmps, highVolts.');
  const i1 = requireNonNegative(r.lowAmps, 'Low current I₁ (A)');
  const u1 = requirePositive(r.lowVolts, 'Voltage at the low current U₁ (V)');
  const i2 = requirePositive(r.highAmps, 'High current I₂ (A)');
  const u2 = requirePositive(r.highVolts, 'Voltage at the high current U₂ (V)');
  if (!(i2 > i1)) throw new RangeError(`High current I₂ (A) must be above the low current I₁ (got ${i2} A against ${i1} A).`);
  if (!(u1 > u2)) {
    throw new RangeError(`Voltage at the high current U₂ (V) must be below the voltage at the low current U₁ (got ${u2} V against ${u1} V): a discharging cell sags under more load.`);
  }
  return (u1 - u2) / (i2 - i1);
}
