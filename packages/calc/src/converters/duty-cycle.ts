import { requireFraction, requireNonNegative, requirePositive } from '../shared/validate';

function requireEfficiency(efficiency: number): number {
  requirePositive(efficiency, 'Efficiency');
  return requireFraction(efficiency, 'Efficiency');
}

/** Ideal buck duty cycle in continuous conduction: D = Vout / Vin. */
export function buckDutyCycle(vin: number, vout: number): number {
  return buckDutyCycleWithLosses(vin, vout, 1);
}

/** Ideal boost duty cycle in continuous conduction: D = 1 − Vin / Vout. */
export function boostDutyCycle(vin: number, vout: number): number {
  return boostDutyCycleWithLosses(vin, vout, 1);
}

/** Buck duty cycle with losses folded into an efficiency: D = Vout / (Vin · η). */
export function buckDutyCycleWithLosses(vin: number, vout: number, efficiency: number): number {
  requirePositive(vin, 'Input voltage (V)');
  requirePositive(vout, 'Output voltage (V)');
  const eta = requireEfficiency(efficiency);
  const d = vout / (vin * eta);
  if (d > 1) {
    throw new RangeError(`Output voltage (V) ${vout} V cannot be reached by a buck (step-down) stage from ${vin} V` + (eta < 1 ? ` at efficiency ${eta}.` : '.'));
  }
  return d;
}

/** Boost duty cycle with losses folded into an efficiency: D = 1 − Vin · η / Vout. */
export function boostDutyCycleWithLosses(vin: number, vout: number, efficiency: number): number {
  requirePositive(vin, 'Input voltage (V)');
  requirePositive(vout, 'Output voltage (V)');
  const eta = requireEfficiency(efficiency);
  const d = 1 - (vin * eta) / vout;
  if (d < 0) {
    throw new RangeError(`Output voltage (V) ${vout} V is below what a boost (step-up) stage gives from ${vin} V` + (eta < 1 ? ` at efficiency ${eta}.` : '.'));
  }
  return d;
}

/** Power lost in a converter delivering an output power: P_loss = P_out · (1/η − 1) (W). */
export function conversionLossWatts(outputWatts: number, efficiency: number): number {
  requireNonNegative(outputWatts, 'Output power (W)');
  const eta = requireEfficiency(efficiency);
  return outputWatts / eta - outputWatts;
}

/** Input power a converter draws to deliver an output power: P_in = P_out / η (W). */
export function converterInputWatts(outputWatts: number, efficiency: number): number {
  requireNonNegative(outputWatts, 'Output power (W)');
  return outputWatts / requireEfficiency(efficiency);
}
