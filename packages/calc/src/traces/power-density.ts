import { requireNonNegative, requirePositive } from '../shared/validate';

/** Surface power density of a heater, W ÷ area, in W/cm² (area given in m²). */
export function powerDensityWPerCm2(watts: number, areaM2: number): number {
  requireNonNegative(watts, 'Power (W)');
  requirePositive(areaM2, 'Heated area (m²)');
  return watts / (areaM2 * 1e4);
}
