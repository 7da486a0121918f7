/**
 * How a lithium-ion battery ships by air (REFERENCES §12 [S: IATA DGR, Section II of Packing
 * Instructions 965–970; M for edition detail]): the UN number and packing instruction for how it
 * travels, whether Section II applies (cells ≤ 20 Wh and batteries ≤ 100 Wh) and the state-of-charge rule.
 */
import { requireNonNegative } from '../shared/validate';

/** Batteries alone, packed with equipment, or contained in (installed in) equipment. */
export type ShippingArrangement = 'alone' | 'packed-with' | 'contained-in';
export const SHIPPING_ARRANGEMENTS: readonly ShippingArrangement[] = ['alone', 'packed-with', 'contained-in'];

/** Section II limits (Wh) [S]. */
export const SECTION_II_CELL_WH = 20;
export const SECTION_II_BATTERY_WH = 100;

export interface LithiumIonShipping {
  arrangement: ShippingArrangement;
  unNumber: 'UN 3480' | 'UN 3481';
  packingInstruction: 'PI 965' | 'PI 966' | 'PI 967';
  /** Cells ≤ 20 Wh and the battery ≤ 100 Wh. */
  sectionII: boolean;
  /** Highest state of charge allowed, as a fraction of rated capacity; null when the rule sets none. */
  stateOfChargeLimit: number | null;
  /** Each rule applied, in words with its label. */
  rules: string[];
}

const UN: Record<ShippingArrangement, { un: LithiumIonShipping['unNumber']; pi: LithiumIonShipping['packingInstruction']; words: string }> = {
  alone: { un: 'UN 3480', pi: 'PI 965', words: 'lithium-ion batteries alone' },
  'packed-with': { un: 'UN 3481', pi: 'PI 966', words: 'lithium-ion batteries packed with equipment' },
  'contained-in': { un: 'UN 3481', pi: 'PI 967', words: 'lithium-ion batteries contained in equipment' },
};

/** The UN number, packing instruction, Section II test and state-of-charge rule for shipping a lithium-ion battery by air. */
export function lithiumIonShipping(p: { cellWh: number; batteryWh: number; arrangement: ShippingArrangement }): LithiumIonShipping {
  const cellWh = requireNonNegative(p.cellWh, 'Cell energy (Wh)');
  const batteryWh = requireNonNegative(p.batteryWh, 'Battery energy (Wh)');
  if (!SHIPPING_ARRANGEMENTS.includes(p.arrangement)) {
    throw new RangeError(`Shipping arrangement must be one of ${SHIPPING_ARRANGEMENTS.join(', ')} (got "${String(p.arrangement)}").`);
  }
  const { un, pi, words } = UN[p.arrangement];
  const sectionII = cellWh <= SECTION_II_CELL_WH && batteryWh <= SECTION_II_BATTERY_WH;
  const rules = [
    `${un} (${words}), ${pi} [S: IATA DGR].`,
    sectionII
      ? `Section II: cells ≤ ${SECTION_II_CELL_WH} Wh and the battery ≤ ${SECTION_II_BATTERY_WH} Wh [S].`
      : `Not Section II (${cellWh > SECTION_II_CELL_WH ? `a cell is over ${SECTION_II_CELL_WH} Wh` : `the battery is over ${SECTION_II_BATTERY_WH} Wh`}): fully regulated as Class 9 dangerous goods [S].`,
  ];
  let stateOfChargeLimit: number | null = null;
  if (p.arrangement === 'alone') {
    stateOfChargeLimit = 0.3;
    rules.push('State of charge not above 30 % of the rated capacity [S].');
  } else if (p.arrangement === 'packed-with') {
    stateOfChargeLimit = 0.3;
    rules.push('State of charge not above 30 % of the rated capacity, a rule for batteries packed with equipment from 2026 [M].');
  } else {
    rules.push('No state-of-charge limit is set for batteries contained in equipment [M]; the equipment must be protected against switching on.');
  }
  return { arrangement: p.arrangement, unNumber: un, packingInstruction: pi, sectionII, stateOfChargeLimit, rules };
}
