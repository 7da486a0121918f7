import { requireFraction, requireInteger, requireNonNegative, requirePositive } from '../shared/validate';

export type AirTransportClass = 'up-to-100-wh' | '100-to-160-wh' | 'over-160-wh';

/** Nominal energy of a pack: E = V_cell · Ah_cell · series · parallel (Wh). */
export function packEnergyWh(p: { cellNominalVolts: number; cellCapacityAh: number; series?: number; parallel?: number }): number {
  const v = requirePositive(p.cellNominalVolts, 'Cell nominal voltage (V)');
  const ah = requireNonNegative(p.cellCapacityAh, 'Cell capacity (Ah)');
  const s = requireInteger(p.series ?? 1, 'Cells in series');
  const n = requireInteger(p.parallel ?? 1, 'Cells in parallel');
  return v * ah * s * n;
}

/** Runtime t = E · η · usable fraction ÷ P_load (h); efficiency and usable fraction default to 1. */
export function runtimeHours(p: { energyWh: number; loadWatts: number; efficiency?: number; usableFraction?: number }): number {
  const e = requireNonNegative(p.energyWh, 'Energy (Wh)');
  const load = requirePositive(p.loadWatts, 'Load power (W)');
  const eta = requirePositive(p.efficiency ?? 1, 'Efficiency');
  requireFraction(eta, 'Efficiency');
  const usable = requireFraction(p.usableFraction ?? 1, 'Usable fraction');
  return (e * eta * usable) / load;
}

/** C-rate n = I / C_rated (1/h, written "C"). */
export function cRate(currentAmps: number, capacityAh: number): number {
  requireNonNegative(currentAmps, 'Current (A)');
  requirePositive(capacityAh, 'Capacity (Ah)');
  return currentAmps / capacityAh;
}

/** IATA/ICAO lithium-ion class by watt-hour rating, "not exceeding" boundaries at 100 Wh and 160 Wh. */
export function airTransportClass(wattHours: number): AirTransportClass {
  requireNonNegative(wattHours, 'Energy (Wh)');
  if (wattHours <= 100) return 'up-to-100-wh';
  if (wattHours <= 160) return '100-to-160-wh';
  return 'over-160-wh';
}

/** Plain words for each air-transport class, for warnings and reports. */
export const AIR_TRANSPORT_CLASS_TEXT: Record<AirTransportClass, string> = {
  'up-to-100-wh': 'Not exceeding 100 Wh: allowed in passenger baggage; spares and power banks in carry-on only, terminals protected.',
  '100-to-160-wh': 'Over 100 Wh, not exceeding 160 Wh: airline approval needed, at most 2 spares, carry-on only.',
  'over-160-wh': 'Over 160 Wh: forbidden in passenger baggage; ships as dangerous goods (UN 38.3 test summary required).',
};

/** The same classes for a battery installed in equipment (a heater, a light) carried by a passenger [S: IATA DGR]. */
export const AIR_TRANSPORT_CLASS_TEXT_INSTALLED: Record<AirTransportClass, string> = {
  'up-to-100-wh': 'Not exceeding 100 Wh: equipment with the battery installed is allowed in carry-on and checked baggage, switched off and protected against switching on.',
  '100-to-160-wh': 'Over 100 Wh, not exceeding 160 Wh, installed in equipment: airline approval needed before travel.',
  'over-160-wh': 'Over 160 Wh: forbidden in passenger baggage, installed or not; ships as dangerous goods (UN 38.3 test summary required).',
};

/** Specific energy = Wh ÷ kg (Wh/kg). */
export function specificEnergyWhPerKg(wattHours: number, massKg: number): number {
  requireNonNegative(wattHours, 'Energy (Wh)');
  requirePositive(massKg, 'Mass (kg)');
  return wattHours / massKg;
}
