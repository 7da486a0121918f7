import { requireFinite, requirePositive } from '../shared/validate';

/**
 * Surfaces a hand touches: bare (polished or machined) metal, coated metal (painted or anodised),
 * ceramics / glass / stone, plastics, wood. Coating matters for radiation, not for the burn threshold
 * (ISO 13732-1 lists uncoated and coated metal together [M]).
 */
export type SurfaceMaterial = 'metal' | 'metal-coated' | 'glass' | 'plastic' | 'wood';

export const SURFACE_MATERIALS: readonly SurfaceMaterial[] = ['metal', 'metal-coated', 'glass', 'plastic', 'wood'];

/** Metal, bare or coated: the metal column of the threshold tables. */
export const isMetalSurface = (m: SurfaceMaterial) => m === 'metal' || m === 'metal-coated';

export interface BurnThresholdRow {
  /** The listed contact duration; the row applies to contacts up to this long (s). */
  seconds: number;
  /** Uncoated and coated metal. */
  metalC: number;
  /** Ceramics, glass and stone. */
  glassC: number;
  plasticC: number;
  woodC: number;
  source: string;
}

/**
 * Burn thresholds by listed contact duration, shortest first (REFERENCES §6). Under 10 s the value
 * depends on metal / non-metal (ECMA-287 [S]; glass and wood take the non-metal value [M]); at 1 min
 * it depends on the material (ISO 13732-1 [M]: metal 51, ceramics/glass/stone 56, plastics 60, wood
 * 60 °C); from 10 min on it is the same for every material.
 */
export const BURN_THRESHOLDS: readonly BurnThresholdRow[] = [
  { seconds: 1, metalC: 65, glassC: 85, plasticC: 85, woodC: 85, source: 'ECMA-287 [S]: touch under 1 s, 65 °C metal, 85 °C non-metal' },
  { seconds: 10, metalC: 55, glassC: 65, plasticC: 65, woodC: 65, source: 'ECMA-287 [S]: touch under 10 s, 55 °C metal, 65 °C non-metal' },
  {
    seconds: 60,
    metalC: 51,
    glassC: 56,
    plasticC: 60,
    woodC: 60,
    source: 'ISO 13732-1 [M]: 1 min contact, 51 °C metal (coated or not), 56 °C ceramics/glass/stone, 60 °C plastics, 60 °C wood',
  },
  { seconds: 600, metalC: 48, glassC: 48, plasticC: 48, woodC: 48, source: 'ISO 13732-1 [M]: 10 min contact, 48 °C for every material' },
  { seconds: 8 * 3600, metalC: 43, glassC: 43, plasticC: 43, woodC: 43, source: 'ISO 13732-1 [M]; ECMA-287 [S]: 8 h or longer, 43 °C' },
];

const COLUMN: Record<SurfaceMaterial, 'metalC' | 'glassC' | 'plasticC' | 'woodC'> = {
  metal: 'metalC',
  'metal-coated': 'metalC',
  glass: 'glassC',
  plastic: 'plasticC',
  wood: 'woodC',
};

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
  return { thresholdC: row[COLUMN[material]], listedSeconds: row.seconds, source: row.source };
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
