import { requireFraction, requireNonNegative, requirePositive } from '../shared/validate';

/** Capacity a power bank delivers at its output voltage: Ah_out = E_cells · η / V_out (Ah). */
export function powerBankOutputAh(p: { energyWh: number; outputVolts: number; efficiency: number }): number {
  const e = requireNonNegative(p.energyWh, 'Energy (Wh)');
  const v = requirePositive(p.outputVolts, 'Output voltage (V)');
  requirePositive(p.efficiency, 'Efficiency');
  const eta = requireFraction(p.efficiency, 'Efficiency');
  return (e * eta) / v;
}
