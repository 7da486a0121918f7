import { requireFinite, requireFraction, requireNonNegative, requirePositive } from '../shared/validate';

export type Connection = 'series' | 'parallel';

/** Checks that a connection string is 'series' or 'parallel'; throws a RangeError naming the input otherwise. */
export function requireConnection(connection: string, name = 'Connection'): Connection {
  if (connection !== 'series' && connection !== 'parallel') {
    throw new RangeError(`${name} must be "series" or "parallel" (got "${String(connection)}").`);
  }
  return connection;
}

/** Power P = V² / R dissipated by a resistance at a voltage (W). */
export function powerFromVoltageAndResistance(volts: number, ohms: number): number {
  requireFinite(volts, 'Voltage (V)');
  requirePositive(ohms, 'Resistance (Ω)');
  return (volts * volts) / ohms;
}

/** Current I = V / R through a resistance at a voltage (A). */
export function currentFromVoltageAndResistance(volts: number, ohms: number): number {
  requireFinite(volts, 'Voltage (V)');
  requirePositive(ohms, 'Resistance (Ω)');
  return volts / ohms;
}

/** Equivalent resistance of resistances joined in series (sum) or in parallel (reciprocal of the sum of reciprocals) (Ω). */
export function combineResistances(ohms: number[], connection: Connection): number {
  requireConnection(connection);
  if (!Array.isArray(ohms) || ohms.length === 0) {
    throw new RangeError('Resistances must list at least one value.');
  }
  ohms.forEach((r, i) => requireNonNegative(r, `Resistance ${i + 1} (Ω)`));
  if (connection === 'series') return ohms.reduce((sum, r) => sum + r, 0);
  // A zero-ohm branch (a link or jumper) shorts the whole parallel group.
  if (ohms.some((r) => r === 0)) return 0;
  return 1 / ohms.reduce((sum, r) => sum + 1 / r, 0);
}

/** Average power of an ideal PWM-switched load: P_avg = D · P_peak (W), duty 0..1. */
export function pwmAveragePower(peakWatts: number, duty: number): number {
  requireNonNegative(peakWatts, 'Peak power (W)');
  requireFraction(duty, 'Duty cycle');
  return peakWatts * duty;
}

/** Duty cycle D = P_target / P_peak that gives a target average power (0..1). */
export function dutyForTargetPower(peakWatts: number, targetWatts: number): number {
  requirePositive(peakWatts, 'Peak power (W)');
  requireNonNegative(targetWatts, 'Target power (W)');
  if (targetWatts > peakWatts) {
    throw new RangeError(`Target power (W) must not exceed the peak power: ${targetWatts} W asked, ${peakWatts} W available at full duty.`);
  }
  return targetWatts / peakWatts;
}

/** RMS voltage of an ideal PWM square wave: V_rms = V · √D (V). */
export function rmsVoltage(volts: number, duty: number): number {
  requireFinite(volts, 'Voltage (V)');
  requireFraction(duty, 'Duty cycle');
  return Math.abs(volts) * Math.sqrt(duty);
}
