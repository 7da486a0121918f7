import type { Explained } from '../shared/explained';
import { requireFraction, requireNonNegative, requirePositive } from '../shared/validate';

/** Assumed heat-transfer coefficient when none is given: 10 W/m²K, inside the 2–25 W/m²K of free convection in air [S: Çengel]. */
export const DEFAULT_CONVECTION_H = 10;

/** Stefan–Boltzmann constant (W/m²K⁴). */
export const STEFAN_BOLTZMANN = 5.670374419e-8;

const H_ASSUMPTION = 'Heat-transfer coefficient h = 10 W/m²K assumed (free convection in air is 2–25 W/m²K; radiation adds about 5.5 W/m²K).';

/** Steady surface temperature rise ΔT = P / (h · A) (°C, i.e. K); h defaults to 10 W/m²K. */
export function surfaceTemperatureRiseC(p: { watts: number; areaM2: number; hWPerM2K?: number }): number {
  const watts = requireNonNegative(p.watts, 'Power (W)');
  const area = requirePositive(p.areaM2, 'Surface area (m²)');
  const h = requirePositive(p.hWPerM2K ?? DEFAULT_CONVECTION_H, 'Heat-transfer coefficient (W/m²K)');
  return watts / (h * area);
}

/** Linearised radiative heat-transfer coefficient h_rad = 4 · ε · σ · T³ (W/m²K), T in kelvin. */
export function radiativeHeatTransferCoefficient(emissivity: number, temperatureK: number): number {
  requirePositive(emissivity, 'Emissivity');
  requireFraction(emissivity, 'Emissivity');
  const t = requirePositive(temperatureK, 'Temperature (K)');
  return 4 * emissivity * STEFAN_BOLTZMANN * t ** 3;
}

/**
 * PWM duty that holds a target steady surface rise: D = ΔT · h · A / P_peak, clamped to 0..1;
 * when even full duty falls short the result is 1 with a warning.
 */
export function dutyForTargetTemperatureRise(p: { peakWatts: number; areaM2: number; hWPerM2K?: number; targetRiseC: number }): Explained<number> {
  const peak = requirePositive(p.peakWatts, 'Peak power (W)');
  const area = requirePositive(p.areaM2, 'Surface area (m²)');
  const h = requirePositive(p.hWPerM2K ?? DEFAULT_CONVECTION_H, 'Heat-transfer coefficient (W/m²K)');
  const target = requireNonNegative(p.targetRiseC, 'Target temperature rise (°C)');
  const neededWatts = target * h * area;
  const raw = neededWatts / peak;
  const warnings: string[] = [];
  if (raw > 1) {
    const reachable = peak / (h * area);
    warnings.push(`The target rise of ${target} °C is out of reach: at full power the surface rises only about ${reachable.toFixed(1)} °C. Duty set to 1.`);
  }
  return {
    value: Math.min(1, raw),
    unit: '',
    formula: 'D = ΔT · h · A / P_peak (clamped to 0…1)',
    source: 'Newton cooling, steady state [C]',
    inputs: [
      { label: 'Peak power', value: peak, unit: 'W' },
      { label: 'Surface area', value: area, unit: 'm²' },
      { label: 'Heat-transfer coefficient', value: h, unit: 'W/m²K' },
      { label: 'Target rise', value: target, unit: '°C' },
    ],
    assumptions: [...(p.hWPerM2K === undefined ? [H_ASSUMPTION] : []), 'Steady state: the PWM period is much shorter than the thermal time constant, so the average power sets the temperature.'],
    warnings,
  };
}
