import { requireFinite, requireNonNegative, requirePositive } from '../shared/validate';

/** IACS annealed copper resistivity at 20 °C (Ω·m) [S: IEC 60028]. */
export const COPPER_RESISTIVITY_IACS = 1.7241e-8;
/** Pure copper resistivity at 293 K (Ω·m) [M: CRC Handbook]; shown as a note, not used by default. */
export const COPPER_RESISTIVITY_PURE = 1.678e-8;
/** Temperature coefficient of 100 % IACS copper at 20 °C (1/K) [S]; pairs with the IACS resistivity. */
export const COPPER_ALPHA_20 = 0.00393;
/** Copper thickness of 1 oz/ft² as used in IPC-2221 calculations (m): 35 µm = 1.378 mil [S]. */
export const COPPER_OZ_THICKNESS_M = 35e-6;
/** One mil (thousandth of an inch) in metres. */
export const METRES_PER_MIL = 25.4e-6;

/** Copper foil thickness for a weight in oz/ft² (m), 1 oz = 35 µm. */
export function ozToMetres(oz: number): number {
  return requirePositive(oz, 'Copper weight (oz/ft²)') * COPPER_OZ_THICKNESS_M;
}

// Defaults: IACS ρ = 1.7241e-8 Ω·m with α = 0.00393 /K (a consistent pair), T = 20 °C.
/** Resistance of a copper trace R = ρ·L / (w·t) · [1 + α·(T − 20 °C)] (Ω), IACS copper unless ρ is given. */
export function copperTraceResistance(p: { lengthM: number; widthM: number; thicknessM: number; temperatureC?: number; resistivityOhmM?: number }): number {
  const length = requireNonNegative(p.lengthM, 'Trace length (m)');
  const width = requirePositive(p.widthM, 'Trace width (m)');
  const thickness = requirePositive(p.thicknessM, 'Copper thickness (m)');
  const t = requireFinite(p.temperatureC ?? 20, 'Temperature (°C)');
  const rho = requirePositive(p.resistivityOhmM ?? COPPER_RESISTIVITY_IACS, 'Resistivity (Ω·m)');
  const factor = 1 + COPPER_ALPHA_20 * (t - 20);
  if (t < -200 || factor <= 0) {
    throw new RangeError(`Temperature (°C) ${t} °C is outside the range of the linear copper model (−200 °C and above).`);
  }
  return ((rho * length) / (width * thickness)) * factor;
}

/** Sheet resistance ρ / t of a copper layer at 20 °C (Ω per square). */
export function copperSheetResistance(thicknessM: number, resistivityOhmM = COPPER_RESISTIVITY_IACS): number {
  return requirePositive(resistivityOhmM, 'Resistivity (Ω·m)') / requirePositive(thicknessM, 'Copper thickness (m)');
}
