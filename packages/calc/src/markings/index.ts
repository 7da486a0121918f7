export { type ESeries, E_SERIES, E_SERIES_TOLERANCE_PERCENT, preferredValues, nearestPreferredValue, nextPreferredAtOrAbove, isPreferredValue } from './e-series';
export { type ResistorScheme, type ResistorMarkingReading, EIA96_MULTIPLIER_EXPONENT, eia96Significand, readResistorMarking, readResistorMarkings, decodeResistorMarking } from './resistor-marking';
export { type CapacitorScheme, type CapacitorMarkingReading, readCapacitorMarking, readCapacitorMarkings, decodeCapacitorMarking } from './capacitor-marking';
export { coarsestSeries } from './ranking';
export {
  type ColourCodeResult,
  type ColourCodeReading,
  COLOUR_DIGITS,
  COLOUR_MULTIPLIER_EXPONENT,
  COLOUR_TOLERANCE_PERCENT,
  COLOUR_TOLERANCE_LETTER,
  COLOUR_TEMPCO_PPM_PER_K,
  decodeColorBands,
  readColorBands,
} from './color-bands';
export { type MarkedComponent, type Tolerance, TOLERANCE_LETTERS, SMALL_CAPACITOR_LETTERS_PF, decodeToleranceLetter, percentTolerance, toleranceRange } from './letter-codes';
export {
  type MarkingKind,
  type MarkingScheme,
  type MarkingReading,
  type MarkingCodeReading,
  type MarkingReport,
  type PreferredValueRow,
  preferredValueRows,
  readMarkingCode,
  explainMarking,
} from './explain';
