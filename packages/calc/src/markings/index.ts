export {
  type ESeries,
  E_SERIES,
  E_SERIES_TOLERANCE_PERCENT,
  preferredValues,
  nearestPreferredValue,
  nextPreferredAtOrAbove,
  isPreferredValue,
} from './e-series';
export { EIA96_MULTIPLIER_EXPONENT, eia96Significand, decodeResistorMarking } from './resistor-marking';
export { decodeCapacitorMarking } from './capacitor-marking';
export {
  type ColourCodeResult,
  COLOUR_DIGITS,
  COLOUR_MULTIPLIER_EXPONENT,
  COLOUR_TOLERANCE_PERCENT,
  COLOUR_TEMPCO_PPM_PER_K,
  decodeColorBands,
} from './color-bands';
