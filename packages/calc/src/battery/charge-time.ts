import { requireFraction, requirePositive } from '../shared/validate';

export interface ChargeTimeEstimate {
  /** Constant-current phase (h). */
  ccHours: number;
  /** Constant-voltage taper (h). */
  cvHours: number;
  totalHours: number;
  /** Current at which the taper is taken to end (A). */
  terminationA: number;
}

/**
 * Rough CC-CV charge-time ESTIMATE of an empty cell or pack.
 * Model: the constant-current phase puts in ccFraction of the capacity (default 0.8 [CP]) at the
 * charge current I; the constant-voltage phase is approximated by a current decaying exponentially
 * from I to the termination current I_t (default C/20 = 0.05 C [S, cell-specific]) while it puts in the
 * remaining (1 − ccFraction) of the capacity, so τ = Q_rest / (I − I_t) and t_cv = τ · ln(I / I_t).
 * If I is at or below I_t the whole capacity is taken at constant current.
 * Charger and cell losses are ignored: real times are longer.
 */
export function chargeTimeEstimate(p: { capacityAh: number; chargeCurrentA: number; ccFraction?: number; terminationC?: number }): ChargeTimeEstimate {
  const capacity = requirePositive(p.capacityAh, 'Capacity (Ah)');
  const current = requirePositive(p.chargeCurrentA, 'Charge current (A)');
  const ccFraction = requireFraction(p.ccFraction ?? 0.8, 'Constant-current fraction');
  const terminationC = requirePositive(p.terminationC ?? 0.05, 'Termination current (C)');
  const terminationA = terminationC * capacity;
  if (current <= terminationA || ccFraction === 1) {
    const hours = capacity / current;
    return { ccHours: hours, cvHours: 0, totalHours: hours, terminationA };
  }
  const ccHours = (ccFraction * capacity) / current;
  const rest = (1 - ccFraction) * capacity;
  const tau = rest / (current - terminationA);
  const cvHours = tau * Math.log(current / terminationA);
  return { ccHours, cvHours, totalHours: ccHours + cvHours, terminationA };
}

/** Rough CC-CV charge time of an empty cell or pack (h); see chargeTimeEstimate for the model. */
export function chargeTimeHours(p: { capacityAh: number; chargeCurrentA: number; ccFraction?: number; terminationC?: number }): number {
  return chargeTimeEstimate(p).totalHours;
}
