// Decoded values of resistor and capacitor markings, through the calculation core.
import { decodeCapacitorMarking, decodeResistorMarking } from '@splitcase/calc';
import type { PartCategory } from '@splitcase/contracts';

export interface DecodedMarking {
  value: number | null;
  unit: 'Ω' | 'F' | null;
  /** Why a resistor/capacitor marking gave no value; null when decoded or when the part is neither. */
  note: string | null;
}

type PartLike = { category: PartCategory; designators?: string | null; description: string; marking?: string | null };

const firstDesignator = (designators?: string | null) => (designators ?? '').trim().split(/[\s,;]+/)[0]?.toUpperCase() ?? '';

/** What kind of two-terminal passive a line is, from its designator (R…, C…) or its description. */
export function passiveKind(part: Omit<PartLike, 'marking'>): 'resistor' | 'capacitor' | null {
  if (part.category !== 'passive') return null;
  const d = firstDesignator(part.designators);
  if (/^(R|RN|RS|RT)\d/.test(d)) return 'resistor';
  if (/^(C|CE|CT)\d/.test(d)) return 'capacitor';
  if (/\b(resistor|shunt|res)\b/i.test(part.description)) return 'resistor';
  if (/\b(capacitor|cap|mlcc)\b/i.test(part.description)) return 'capacitor';
  return null;
}

/** Resistor codes: 3/4 digits, R as the decimal point, EIA-96 (two digits and a multiplier letter). */
export const looksLikeResistorCode = (m: string) => /^\d{3,4}$/.test(m) || (/^\d*[Rr]\d*$/.test(m) && /\d/.test(m)) || /^\d{2}[ZYRXSABHCDEFzyrxsabhcdef]$/.test(m) || /^0$/.test(m);
/** Capacitor codes: 3 digits (pF) with an optional tolerance letter, or p/n/u/R as the decimal point. */
export const looksLikeCapacitorCode = (m: string) => /^\d{3}[BCDFGJKMZbcdfgjkmz]?$/.test(m) || (/^\d*[pnuµμRr]\d*[Ff]?$/.test(m) && /\d/.test(m)) || /^\d+(\.\d+)?\s*[pnuµμ][Ff]?$/.test(m);

/**
 * Decode the marking of a resistor or capacitor line. A marking that does not read as a code is kept
 * with no value and a note; anything that is not a two-terminal passive (an IC, a connector…) is left alone.
 */
export function decodePartMarking(part: PartLike): DecodedMarking {
  const marking = (part.marking ?? '').trim();
  const kind = passiveKind(part);
  if (!marking || !kind) return { value: null, unit: null, note: null };
  const compact = marking.replace(/\s+/g, '');
  if (kind === 'resistor') {
    if (!looksLikeResistorCode(compact)) return { value: null, unit: null, note: `"${marking}" is not a resistor code (472, 4R7, R010, 4991 or EIA-96 68X); kept as read.` };
    try {
      return { value: decodeResistorMarking(compact), unit: 'Ω', note: null };
    } catch (err) {
      return { value: null, unit: null, note: `${(err as Error).message} Kept as read.` };
    }
  }
  if (!looksLikeCapacitorCode(compact)) return { value: null, unit: null, note: `"${marking}" is not a capacitor code (104, 4n7, 2p2); kept as read.` };
  try {
    return { value: decodeCapacitorMarking(compact), unit: 'F', note: null };
  } catch (err) {
    return { value: null, unit: null, note: `${(err as Error).message} Kept as read.` };
  }
}
