/**
 * The USB port side of a charger: input power and current at the port for a charge current into the
 * pack, against the current a port may supply (REFERENCES §5 [S: USB 2.0 §7.2.1; USB BC 1.2; USB Type-C]).
 */
import { requireFraction, requirePositive } from '../shared/validate';

export interface UsbPortLevel {
  amps: number;
  label: string;
}

/** Current a 5 V port supplies by its signalling, lowest first [S]. */
export const USB_PORT_LEVELS: readonly UsbPortLevel[] = [
  { amps: 0.5, label: 'USB 2.0 port after configuration (500 mA)' },
  { amps: 0.9, label: 'USB 3.x port (900 mA)' },
  { amps: 1.5, label: 'BC 1.2 dedicated charging port or Type-C at 1.5 A' },
  { amps: 3.0, label: 'Type-C at 3.0 A' },
];

/** Nominal USB bus voltage (V) [S]. */
export const USB_BUS_VOLTS = 5;

/**
 * Port-side input of a charger: P_in = V_pack · I_charge / η, I_in = P_in / V_bus (REFERENCES §12 [C]:
 * 3.7 V × 1 A / 0.85 / 5 V = 0.87 A), and the lowest standard port level that covers it (null: none does).
 */
export function usbChargeInput(p: { packVolts: number; chargeAmps: number; efficiency: number; busVolts?: number }): {
  watts: number;
  amps: number;
  port: UsbPortLevel | null;
} {
  const v = requirePositive(p.packVolts, 'Pack voltage (V)');
  const i = requirePositive(p.chargeAmps, 'Charge current (A)');
  const eta = requireFraction(requirePositive(p.efficiency, 'Charger efficiency'), 'Charger efficiency');
  const bus = requirePositive(p.busVolts ?? USB_BUS_VOLTS, 'Bus voltage (V)');
  const watts = (v * i) / eta;
  const amps = watts / bus;
  return { watts, amps, port: USB_PORT_LEVELS.find((l) => amps <= l.amps + 1e-12) ?? null };
}
