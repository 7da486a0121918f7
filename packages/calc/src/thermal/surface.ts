/**
 * One model of a heated surface, used by the teardown figures and the bench tools alike: heat leaves
 * by free convection (h·A·ΔT) and by radiation, exact in T⁴ (εσA(T_s⁴ − T_a⁴), REFERENCES §12), with
 * the emissivity of the surface material; the lumped thermal transient (τ = m·c / (h·A)).
 */
import { requireFinite, requireFraction, requireNonNegative, requirePositive } from '../shared/validate';
import { DEFAULT_CONVECTION_H, STEFAN_BOLTZMANN } from './convection';
import { SURFACE_MATERIALS, type SurfaceMaterial } from './touch';

export interface MaterialConstant {
  value: number;
  source: string;
}

/**
 * Emissivity by surface material (REFERENCES §12 [S: handbook tables, e.g. Incropera Table A.11; M for
 * the exact values]): bare aluminium 0.04–0.10 (0.1 taken, the upper end, so the estimate errs cool
 * least), anodised or painted 0.8–0.9, plastics and paint 0.85–0.95, glass about 0.9 [M], wood about 0.9 [M].
 */
export const SURFACE_EMISSIVITY: Readonly<Record<SurfaceMaterial, MaterialConstant>> = {
  metal: { value: 0.1, source: 'bare or polished aluminium 0.04–0.10 [S: handbook tables; M for the value]' },
  'metal-coated': { value: 0.85, source: 'anodised or painted metal 0.8–0.9 [S: handbook tables; M for the value]' },
  glass: { value: 0.9, source: 'glass and ceramics about 0.9 [M]' },
  plastic: { value: 0.9, source: 'plastics and paint 0.85–0.95 [S: handbook tables; M for the value]' },
  wood: { value: 0.9, source: 'wood about 0.9 [M]' },
};

/**
 * Specific heat of the heated mass, taken as the surface material (REFERENCES §12 [S: handbook tables]):
 * aluminium 897 J/(kg·K) [S]; ABS about 1 400 [M]; glass about 840 [M]; wood about 1 700 [M].
 */
export const SPECIFIC_HEAT: Readonly<Record<SurfaceMaterial, MaterialConstant>> = {
  metal: { value: 897, source: 'aluminium 897 J/(kg·K) [S: handbook tables]' },
  'metal-coated': { value: 897, source: 'aluminium 897 J/(kg·K) [S: handbook tables]' },
  glass: { value: 840, source: 'glass about 840 J/(kg·K) [M]' },
  plastic: { value: 1400, source: 'ABS about 1 400 J/(kg·K) [M]' },
  wood: { value: 1700, source: 'wood about 1 700 J/(kg·K) [M]' },
};

function requireMaterial(material: SurfaceMaterial): SurfaceMaterial {
  if (!SURFACE_MATERIALS.includes(material)) {
    throw new RangeError(`Surface material must be one of ${SURFACE_MATERIALS.join(', ')} (got "${String(material)}").`);
  }
  return material;
}

/** Emissivity of a surface material, with its source. */
export function emissivityOf(material: SurfaceMaterial): MaterialConstant {
  return SURFACE_EMISSIVITY[requireMaterial(material)];
}

export interface SurfaceLoss {
  /** Area that sheds the heat (m²). */
  areaM2: number;
  /** Ambient (°C). */
  ambientC: number;
  emissivity: number;
  /** Convection coefficient (W/m²K); default 10. */
  hConvection?: number;
}

function readLoss(p: SurfaceLoss) {
  const area = requirePositive(p.areaM2, 'Surface area (m²)');
  const ambientK = requireFinite(p.ambientC, 'Ambient temperature (°C)') + 273.15;
  if (ambientK <= 0) throw new RangeError('Ambient temperature (°C) must be above absolute zero.');
  const eps = requireFraction(requireNonNegative(p.emissivity, 'Emissivity'), 'Emissivity');
  const h = requirePositive(p.hConvection ?? DEFAULT_CONVECTION_H, 'Heat-transfer coefficient (W/m²K)');
  return { area, ambientK, eps, h };
}

/** Heat a surface at ambient + rise sheds: h·A·ΔT + εσA(T_s⁴ − T_a⁴) (W). */
export function surfaceHeatLossWatts(p: SurfaceLoss & { riseC: number }): number {
  const { area, ambientK, eps, h } = readLoss(p);
  const rise = requireNonNegative(p.riseC, 'Temperature rise (°C)');
  return h * area * rise + eps * STEFAN_BOLTZMANN * area * ((ambientK + rise) ** 4 - ambientK ** 4);
}

/**
 * Steady surface rise above ambient for a heat input (K): the root of
 * P = h·A·ΔT + εσA((T_a + ΔT)⁴ − T_a⁴), found by bisection (the loss rises monotonically with ΔT).
 */
export function steadySurfaceRiseC(p: SurfaceLoss & { watts: number }): number {
  const watts = requireNonNegative(p.watts, 'Power (W)');
  readLoss(p);
  if (watts === 0) return 0;
  let lo = 0;
  // Convection alone bounds the rise from above.
  let hi = watts / ((p.hConvection ?? DEFAULT_CONVECTION_H) * p.areaM2);
  for (let k = 0; k < 200 && hi - lo > 1e-10 * Math.max(1, hi); k++) {
    const mid = (lo + hi) / 2;
    if (surfaceHeatLossWatts({ ...p, riseC: mid }) > watts) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2;
}

/** Effective heat-transfer coefficient at a steady state, P / (A·ΔT) (W/m²K): convection plus exact radiation. */
export function effectiveHeatTransferCoefficient(p: SurfaceLoss & { riseC: number }): number {
  const rise = requirePositive(p.riseC, 'Temperature rise (°C)');
  return surfaceHeatLossWatts(p) / (p.areaM2 * rise);
}

/** Lumped-capacitance time constant τ = m·c / (h·A) (s) (REFERENCES §12 [S: Incropera ch. 5], valid for Bi < 0.1). */
export function thermalTimeConstantSeconds(p: { massKg: number; specificHeat: number; hWPerM2K: number; areaM2: number }): number {
  const m = requirePositive(p.massKg, 'Heated mass (kg)');
  const c = requirePositive(p.specificHeat, 'Specific heat (J/(kg·K))');
  const h = requirePositive(p.hWPerM2K, 'Heat-transfer coefficient (W/m²K)');
  const a = requirePositive(p.areaM2, 'Surface area (m²)');
  return (m * c) / (h * a);
}

/**
 * Time from ambient to a temperature on the first-order rise T(t) = T_a + ΔT_ss·(1 − e^(−t/τ)):
 * t = −τ · ln(1 − ΔT/ΔT_ss) (s); null when the steady rise never reaches ΔT.
 */
export function timeToRiseSeconds(p: { timeConstantSeconds: number; steadyRiseC: number; riseC: number }): number | null {
  const tau = requirePositive(p.timeConstantSeconds, 'Time constant (s)');
  const ss = requireNonNegative(p.steadyRiseC, 'Steady temperature rise (°C)');
  const target = requireNonNegative(p.riseC, 'Temperature rise (°C)');
  if (target === 0) return 0;
  if (ss <= target) return null;
  return -tau * Math.log(1 - target / ss);
}
