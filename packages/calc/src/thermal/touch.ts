import { requireFinite, requirePositive } from '../shared/validate';

export type SurfaceMaterial = 'metal' | 'glass' | 'plastic';

export const SURFACE_MATERIALS: readonly SurfaceMaterial[] = ['metal', 'glass', 'plastic'];

export interface BurnThresholdRow {
  /** The listed contact duration; the row applies to contacts up to this long (s). */
  seconds: number;
  metalC: number;
  /** Glass and plastic. */
  nonMetalC: number;
  source: string;
}

/**
 * Burn thresholds by listed contact duration, shortest first. Under 10 s the value depends on the material
 * (ECMA-287 [S]); from 1 min on it is the same for every material (ISO 13732-1 [M]). Glass takes the
 * non-metal value [M].
 */
export const BURN_THRESHOLDS: readonly BurnThresholdRow[] = [
  { seconds: 1, metalC: 65, nonMetalC: 85, source: 'ECMA-287 [S]: touch under 1 s, 65 °C metal, 85 °C non-metal' },
  { seconds: 10, metalC: 55, nonMetalC: 65, source: 'ECMA-287 [S]: touch under 10 s, 55 °C metal, 65 °C non-metal' },
  { seconds: 60, metalC: 51, nonMetalC: 51, source: 'ISO 13732-1 [M]: 1 min contact, 51 °C for every material' },
  { seconds: 600, metalC: 48, nonMetalC: 48, source: 'ISO 13732-1 [M]: 10 min contact, 48 °C for every material' },
  { seconds: 8 * 3600, metalC: 43, nonMetalC: 43, source: 'ISO 13732-1 [M]; ECMA-287 [S]: 8 h or longer, 43 °C' },
];

function requireMaterial(material: string): SurfaceMaterial {
  if (!(SURFACE_MATERIALS as readonly string[]).includes(material)) {
    throw new RangeError(`Surface material must be one of ${SURFACE_MATERIALS.join(', ')} (got "${String(material)}").`);
  }
  return material as SurfaceMaterial;
}

/** Burn threshold with the listed duration it was taken from and its source. */
export function burnThresholdDetail(p: { material: SurfaceMaterial; contactSeconds: number }): {
  thresholdC: number;
  listedSeconds: number;
  source: string;
} {
  const material = requireMaterial(p.material);
  const t = requirePositive(p.contactSeconds, 'Contact time (s)');
  // Between listed durations take the next longer one (the conservative choice); beyond 8 h stay at 8 h.
  const row = BURN_THRESHOLDS.find((r) => t <= r.seconds) ?? (BURN_THRESHOLDS.at(-1) as BurnThresholdRow);
  return { thresholdC: material === 'metal' ? row.metalC : row.nonMetalC, listedSeconds: row.seconds, source: row.source };
}

/** Surface temperature at which contact for the given time can burn (°C), next-longer-duration rule (ISO 13732-1 style). */
export function burnThresholdC(p: { material: SurfaceMaterial; contactSeconds: number }): number {
  return burnThresholdDetail(p).thresholdC;
}

/** Margin to the burn threshold: threshold − surface temperature (°C); below zero the surface can burn. */
export function touchMarginC(p: { surfaceC: number; material: SurfaceMaterial; contactSeconds: number }): number {
  const surface = requireFinite(p.surfaceC, 'Surface temperature (°C)');
  return burnThresholdC(p) - surface;
}
