import { requireNonNegative, requirePositive } from '../shared/validate';

/** Resistance of a pack of S × P cells of internal resistance R_cell: R_cell · S / P (Ω) [C]. */
export function packResistanceOhms(p: { cellOhms: number; series: number; parallel: number }): number {
  return (requireNonNegative(p.cellOhms, 'Cell internal resistance (Ω)') * requirePositive(p.series, 'Cells in series')) / requirePositive(p.parallel, 'Cells in parallel');
}

/** Terminal voltage under load U = U_oc − I·R (V) (REFERENCES §12 [C]). */
export function loadedTerminalVolts(p: { openCircuitVolts: number; currentAmps: number; resistanceOhms: number }): number {
  return requirePositive(p.openCircuitVolts, 'Open-circuit voltage (V)') - requireNonNegative(p.currentAmps, 'Current (A)') * requireNonNegative(p.resistanceOhms, 'Internal resistance (Ω)');
}

/**
 * A resistive load of R_load fed straight from a source of U_oc and internal resistance R_int:
 * I = U_oc / (R_load + R_int), U = I · R_load, P_load = I² · R_load, P_int = I² · R_int [C].
 */
export function resistiveLoadOnSource(p: { openCircuitVolts: number; loadOhms: number; sourceOhms: number }): {
  amps: number;
  terminalVolts: number;
  loadWatts: number;
  sourceWatts: number;
} {
  const u = requirePositive(p.openCircuitVolts, 'Open-circuit voltage (V)');
  const rl = requirePositive(p.loadOhms, 'Load resistance (Ω)');
  const rs = requireNonNegative(p.sourceOhms, 'Internal resistance (Ω)');
  const amps = u / (rl + rs);
  return { amps, terminalVolts: amps * rl, loadWatts: amps * amps * rl, sourceWatts: amps * amps * rs };
}
