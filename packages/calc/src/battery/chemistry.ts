import { requireNonNegative, requirePositive } from '../shared/validate';
import { specificEnergyWhPerKg } from './pack';

export type CellChemistry = 'li-ion' | 'li-po' | 'lifepo4' | 'lto' | 'nimh' | 'alkaline' | 'other';

export const CELL_CHEMISTRIES: readonly CellChemistry[] = ['li-ion', 'li-po', 'lifepo4', 'lto', 'nimh', 'alkaline', 'other'];

/** Lithium chemistries: protection circuits, UN 38.3 and air-transport rules apply. */
export function isLithiumChemistry(chemistry: CellChemistry): boolean {
  return chemistry === 'li-ion' || chemistry === 'li-po' || chemistry === 'lifepo4' || chemistry === 'lto';
}

export interface CellVoltages {
  /** Typical nominal voltage used for Wh ratings (V). */
  nominalV: number;
  /** Range of nominal voltages found on labels (V). */
  nominalRangeV: [number, number];
  /** Constant-voltage charge limit (V); null where the chemistry has none (NiMH: −ΔV termination; alkaline: primary). */
  chargeV: number | null;
  /** Typical discharge cut-off (V). */
  cutoffV: number;
  source: string;
}

/** Typical cell voltages per chemistry (REFERENCES §4). */
export const CELL_VOLTAGES: Record<Exclude<CellChemistry, 'other'>, CellVoltages> = {
  'li-ion': {
    nominalV: 3.7,
    nominalRangeV: [3.6, 3.7],
    chargeV: 4.2,
    cutoffV: 3.0,
    source: "[S: cell makers' application guides; CP] LCO/NMC/NCA 3.6–3.7 V, 4.20 V charge (4.35–4.48 V for high-voltage types), 2.5–3.0 V cut-off",
  },
  'li-po': {
    nominalV: 3.7,
    nominalRangeV: [3.6, 3.8],
    chargeV: 4.2,
    cutoffV: 3.0,
    source: "[S: cell makers' application guides; CP] same cobalt/nickel chemistries as li-ion in a pouch",
  },
  lifepo4: {
    nominalV: 3.2,
    nominalRangeV: [3.2, 3.3],
    chargeV: 3.65,
    cutoffV: 2.5,
    source: "[S: cell makers' application guides; CP] LFP 3.2 V / 3.65 V / 2.5 V (2.0 V when cold)",
  },
  lto: {
    nominalV: 2.4,
    nominalRangeV: [2.3, 2.4],
    chargeV: 2.8,
    cutoffV: 1.5,
    source: '[S] LTO 2.3–2.4 V nominal; [M] about 2.8 V charge, about 1.5 V cut-off',
  },
  nimh: {
    nominalV: 1.2,
    nominalRangeV: [1.2, 1.2],
    chargeV: null,
    cutoffV: 1.0,
    source: '[CP] NiMH 1.2 V nominal, charged at constant current with −ΔV or temperature-slope termination; [M] 1.0 V cut-off',
  },
  alkaline: {
    nominalV: 1.5,
    nominalRangeV: [1.5, 1.5],
    chargeV: null,
    cutoffV: 0.9,
    source: '[CP] alkaline primary cell 1.5 V, not rechargeable; [M] 0.9 V end voltage',
  },
};

function requireChemistry(chemistry: string): CellChemistry {
  if (!(CELL_CHEMISTRIES as readonly string[]).includes(chemistry)) {
    throw new RangeError(`Cell chemistry must be one of ${CELL_CHEMISTRIES.join(', ')} (got "${String(chemistry)}").`);
  }
  return chemistry as CellChemistry;
}

/** Typical nominal, charge and cut-off voltages of a chemistry (V); throws for 'other'. */
export function typicalCellVoltages(chemistry: CellChemistry): CellVoltages {
  const c = requireChemistry(chemistry);
  if (c === 'other') throw new RangeError('Cell chemistry "other" has no typical voltages; enter the cell voltages by hand.');
  return CELL_VOLTAGES[c];
}

/** Constant-voltage charge limit of a chemistry (V); throws where there is none (NiMH, alkaline, other). */
export function chargeVoltage(chemistry: CellChemistry): number {
  const v = typicalCellVoltages(chemistry).chargeV;
  if (v === null) {
    throw new RangeError(`Cell chemistry "${chemistry}" is not charged to a fixed voltage.`);
  }
  return v;
}

/** Highest believable specific energy of a commercial cell by chemistry (Wh/kg), with its source. */
/**
 * Specific energy a pack of the chemistry can believably have: above `limitWhPerKg` a claim is flagged;
 * below `floorWhPerKg` (half the lowest commercial cell figure [CP]: a pack with its wiring and
 * protection stays above it) the pack mass is likely mistyped or includes the enclosure.
 */
export const SPECIFIC_ENERGY_LIMITS: Record<CellChemistry, { limitWhPerKg: number; floorWhPerKg: number; source: string }> = {
  'li-ion': { limitWhPerKg: 300, floorWhPerKg: 50, source: '[CP] flag any commercial Li-ion cell claiming more than about 300 Wh/kg (cells are 100–265 Wh/kg [S])' },
  'li-po': { limitWhPerKg: 300, floorWhPerKg: 50, source: '[CP] same limit as li-ion: flag more than about 300 Wh/kg' },
  lifepo4: { limitWhPerKg: 200, floorWhPerKg: 45, source: '[M] commercial LFP cells reach about 90–200 Wh/kg; flag more than 200 Wh/kg' },
  lto: { limitWhPerKg: 110, floorWhPerKg: 15, source: '[S: encyclopedic data] LTO is 30–110 Wh/kg; flag more than 110 Wh/kg' },
  nimh: { limitWhPerKg: 120, floorWhPerKg: 30, source: '[M] NiMH is about 60–120 Wh/kg; flag more than 120 Wh/kg' },
  alkaline: { limitWhPerKg: 190, floorWhPerKg: 40, source: '[M] alkaline primary cells are about 85–190 Wh/kg; flag more than 190 Wh/kg' },
  other: { limitWhPerKg: 300, floorWhPerKg: 15, source: '[CP] unknown chemistry: the Li-ion limit of about 300 Wh/kg is used as an upper bound' },
};

export interface PlausibilityResult {
  claimedWh: number;
  specificEnergyWhPerKg: number;
  limitWhPerKg: number;
  plausible: boolean;
  source: string;
}

/**
 * Checks a label capacity against the cell mass: the claimed Wh (or Ah × nominal V)
 * divided by the mass must not exceed the chemistry's believable specific energy.
 */
export function labelCapacityPlausibility(p: { claimedWh?: number; claimedAh?: number; nominalV?: number; cellMassKg: number; chemistry: CellChemistry }): PlausibilityResult {
  const chemistry = requireChemistry(p.chemistry);
  let claimedWh: number;
  if (p.claimedWh !== undefined) {
    claimedWh = requireNonNegative(p.claimedWh, 'Claimed energy (Wh)');
  } else if (p.claimedAh !== undefined && p.nominalV !== undefined) {
    claimedWh = requireNonNegative(p.claimedAh, 'Claimed capacity (Ah)') * requirePositive(p.nominalV, 'Nominal voltage (V)');
  } else {
    throw new RangeError('A label claim needs the claimed energy (Wh), or the claimed capacity (Ah) with the nominal voltage (V).');
  }
  const se = specificEnergyWhPerKg(claimedWh, requirePositive(p.cellMassKg, 'Cell mass (kg)'));
  const { limitWhPerKg, source } = SPECIFIC_ENERGY_LIMITS[chemistry];
  return { claimedWh, specificEnergyWhPerKg: se, limitWhPerKg, plausible: se <= limitWhPerKg, source };
}
