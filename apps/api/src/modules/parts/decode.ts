// Decoded values of resistor and capacitor markings: calc's readMarkingCode, the same decoder as the
// bench tools' marking decoder, so a part reads exactly as the marking does there.
import { readMarkingCode } from '@splitcase/calc';
import type { DecodedReadingDto, PartCategory } from '@splitcase/contracts';

export interface DecodedMarking {
  /** The first-ranked reading (Ω for resistors, F for capacitors). */
  value: number | null;
  unit: 'Ω' | 'F' | null;
  /** Every valid reading, most likely first (empty when not decoded). */
  readings: DecodedReadingDto[];
  /** Why a resistor/capacitor marking gave no value; null when decoded or when the part is neither. */
  note: string | null;
}

type PartLike = { category: PartCategory; designators?: string | null; description: string; marking?: string | null };

const NOTHING: DecodedMarking = { value: null, unit: null, readings: [], note: null };

const firstDesignator = (designators?: string | null) =>
  (designators ?? '')
    .trim()
    .split(/[\s,;]+/)[0]
    ?.toUpperCase() ?? '';

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

/**
 * Decode the marking of a resistor or capacitor line. A marking that does not read as a code is kept
 * with no value and the decoder's message; anything that is not a two-terminal passive (an IC, a
 * connector…) is left alone.
 */
export function decodePartMarking(part: PartLike): DecodedMarking {
  const marking = (part.marking ?? '').trim();
  const kind = passiveKind(part);
  if (!marking || !kind) return NOTHING;
  try {
    const readings = readMarkingCode(marking, kind).map((r): DecodedReadingDto => ({
      rank: r.rank,
      value: r.value,
      unit: r.unit,
      scheme: r.scheme,
      schemeLabel: r.schemeLabel,
      schemeShortLabel: r.schemeShortLabel,
      tolerance: r.tolerance,
      rankReason: r.rankReason,
    }));
    const first = readings[0]!;
    return { value: first.value, unit: first.unit, readings, note: null };
  } catch (err) {
    if (!(err instanceof RangeError)) throw err;
    return { ...NOTHING, note: `${err.message} Kept as read.` };
  }
}
