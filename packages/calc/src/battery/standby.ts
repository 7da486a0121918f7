import { requireFraction, requireNonNegative, requirePositive } from '../shared/validate';

/** Li-ion self-discharge, about 2–3 % of capacity a month at room temperature [CP; M for the figure]: 2.5 % taken. */
export const LI_ION_SELF_DISCHARGE_PER_MONTH = 0.025;
/** Hours in an average month (365.25 × 24 / 12 ≈ 730 h, REFERENCES §12 [C]). */
export const HOURS_PER_MONTH = 730;

/**
 * Months from full to empty in standby: C / (s·C + I_q × 730 h) (REFERENCES §12 [C]); s the
 * self-discharge as a fraction of capacity per month, I_q the quiescent current.
 */
export function standbyMonths(p: { capacityAh: number; selfDischargePerMonth: number; quiescentAmps: number }): number {
  const c = requirePositive(p.capacityAh, 'Capacity (Ah)');
  const s = requireFraction(p.selfDischargePerMonth, 'Self-discharge per month');
  const iq = requireNonNegative(p.quiescentAmps, 'Quiescent current (A)');
  const perMonth = s * c + iq * HOURS_PER_MONTH;
  if (perMonth <= 0) throw new RangeError('Standby needs a self-discharge or a quiescent current above zero.');
  return c / perMonth;
}
