/**
 * The marking decoder of the bench tools: a code or colour bands → value, tolerance, what the
 * code means, and the nearest preferred values, with formula and source for the UI.
 */
import type { Explained } from '../shared/explained';
import { formulaOf, type FormulaKey } from '../figures/formulas';
import { withPrefix } from '../shared/text';
import { readCapacitorMarking, type CapacitorScheme } from './capacitor-marking';
import { readColorBands } from './color-bands';
import { E_SERIES, E_SERIES_TOLERANCE_PERCENT, isPreferredValue, nearestPreferredValue, type ESeries } from './e-series';
import { decodeToleranceLetter, percentTolerance, toleranceRange, type MarkedComponent, type Tolerance } from './letter-codes';
import { readResistorMarking, type ResistorScheme } from './resistor-marking';

export type MarkingKind = MarkedComponent | 'auto';
export type MarkingScheme = ResistorScheme | CapacitorScheme | 'colour-bands';

/** Where a value sits against one IEC 60063 series. */
export interface PreferredValueRow {
  series: ESeries;
  /** Tolerance the series is meant for (±%). */
  tolerancePercent: number;
  /** Nearest member by the log rule, in the value's unit. */
  nearest: number;
  /** (value / nearest − 1) × 100. */
  deviationPercent: number;
  /** The value is a member of the series. */
  member: boolean;
}

export interface MarkingReading extends Explained<number> {
  component: MarkedComponent;
  scheme: MarkingScheme;
  /** The code form in words ("EIA-96 code"). */
  schemeLabel: string;
  /** The reading step by step. */
  meaning: string[];
  tolerance: Tolerance | null;
  /** Lowest and highest value at the tolerance. */
  range: { low: number; high: number } | null;
  temperatureCoefficientPpmPerK: number | null;
  preferred: PreferredValueRow[];
}

export interface MarkingReport {
  readings: MarkingReading[];
  /** True when the code reads as both a resistor and a capacitor. */
  ambiguous: boolean;
  note: string | null;
}

const SCHEME_LABEL: Record<MarkingScheme, string> = {
  jumper: '0 Ω jumper',
  'three-digit': '3-digit code',
  'four-digit': '4-digit code',
  'letter-and-digit': 'Letter-and-digit code (IEC 60062)',
  'eia-96': 'EIA-96 code',
  picofarads: 'Value in picofarads',
  'letter-decimal': 'Letter as the decimal point',
  'value-with-unit': 'Value with its unit',
  'colour-bands': 'Colour bands (IEC 60062)',
};

const PREFERRED_SOURCE = formulaOf('marking.nearestPreferred');

/** Nearest member of each IEC 60063 series (E6 … E192) by the log rule, with the deviation and membership. */
export function preferredValueRows(value: number): PreferredValueRow[] {
  return E_SERIES.map((series) => {
    const nearest = nearestPreferredValue(value, series);
    return {
      series,
      tolerancePercent: E_SERIES_TOLERANCE_PERCENT[series],
      nearest,
      deviationPercent: (value / nearest - 1) * 100,
      member: isPreferredValue(value, series),
    };
  });
}

function reading(p: {
  component: MarkedComponent;
  scheme: MarkingScheme;
  value: number;
  formulaKey: FormulaKey;
  meaning: string[];
  tolerance: Tolerance | null;
  temperatureCoefficientPpmPerK?: number | undefined;
  inputs: Explained['inputs'];
  assumptions?: string[];
}): MarkingReading {
  const unit = p.component === 'resistor' ? 'Ω' : 'F';
  const { formula, source } = formulaOf(p.formulaKey);
  const warnings: string[] = [];
  const preferred = p.value > 0 ? preferredValueRows(p.value) : [];
  if (p.value > 0 && !preferred.some((r) => r.member)) {
    warnings.push(
      `${withPrefix(p.value, unit)} is in no IEC 60063 series up to E192: check the reading (a rubbed or misread character is common).`,
    );
  }
  const assumptions = [...(p.assumptions ?? [])];
  if (preferred.length > 0) {
    assumptions.push(`Nearest preferred values by the log rule (smallest |ln(x / v)|) ${PREFERRED_SOURCE.source}.`);
  }
  return {
    value: p.value,
    unit,
    formula,
    source,
    inputs: p.inputs,
    assumptions,
    warnings,
    component: p.component,
    scheme: p.scheme,
    schemeLabel: SCHEME_LABEL[p.scheme],
    meaning: p.meaning,
    tolerance: p.tolerance,
    range: p.tolerance ? toleranceRange(p.value, p.tolerance) : null,
    temperatureCoefficientPpmPerK: p.temperatureCoefficientPpmPerK ?? null,
    preferred,
  };
}

function resistorReading(code: string): MarkingReading {
  const r = readResistorMarking(code);
  const tolerance = r.toleranceLetter ? decodeToleranceLetter(r.toleranceLetter, 'resistor') : null;
  const meaning = [...r.meaning];
  if (tolerance) meaning.push(`"${r.toleranceLetter}" is the tolerance letter: ${tolerance.text}.`);
  const assumptions: string[] = [];
  if (r.scheme === 'three-digit' && !tolerance) assumptions.push('3-digit codes are usually found on ±2 % and ±5 % parts [CP].');
  if (r.scheme === 'four-digit' && !tolerance) assumptions.push('4-digit codes are usually found on ±1 % parts [CP].');
  if (r.scheme === 'eia-96') assumptions.push('EIA-96 codes mark values of the E96 series, the ±1 % series of IEC 60063 [S].');
  if (r.scheme === 'eia-96' && /^\d{2}R$/.test(r.valueCode)) {
    assumptions.push('Two digits followed by R are read as EIA-96 (R = × 0.01), as the code tables do.');
  }
  const formulaKey: FormulaKey =
    r.scheme === 'eia-96' ? 'marking.eia96' : r.scheme === 'letter-and-digit' ? 'marking.letterCode' : r.scheme === 'jumper' ? 'marking.jumper' : 'marking.resistor';
  return reading({
    component: 'resistor',
    scheme: r.scheme,
    value: r.ohms,
    formulaKey,
    meaning,
    tolerance,
    inputs: [
      { label: 'Marking', value: code.trim() },
      { label: 'Read as', value: 'resistor' },
    ],
    assumptions,
  });
}

function capacitorReading(code: string): MarkingReading {
  const c = readCapacitorMarking(code);
  const tolerance = c.toleranceLetter ? decodeToleranceLetter(c.toleranceLetter, 'capacitor', c.farads) : null;
  const meaning = [...c.meaning];
  if (tolerance) meaning.push(`"${c.toleranceLetter}" is the tolerance letter: ${tolerance.text}.`);
  return reading({
    component: 'capacitor',
    scheme: c.scheme,
    value: c.farads,
    formulaKey: c.scheme === 'three-digit' ? 'marking.capacitor' : 'marking.capacitorLetter',
    meaning,
    tolerance,
    inputs: [
      { label: 'Marking', value: code.trim() },
      { label: 'Read as', value: 'capacitor' },
    ],
  });
}

function colourReading(bands: string[]): MarkingReading {
  const r = readColorBands(bands);
  const tolerance =
    r.tolerancePercent === undefined
      ? null
      : percentTolerance(r.tolerancePercent, bands.length === 3 ? '[S: IEC 60062] no tolerance band: ±20 % (M)' : '[S: IEC 60062 summary pages] tolerance colours', r.toleranceLetter);
  return reading({
    component: 'resistor',
    scheme: 'colour-bands',
    value: r.ohms,
    formulaKey: 'marking.colourBands',
    meaning: r.meaning,
    tolerance,
    temperatureCoefficientPpmPerK: r.temperatureCoefficientPpmPerK,
    inputs: [{ label: 'Bands', value: r.bands.join(', ') }],
    assumptions: bands.length >= 4 ? ['Bands read from the end away from the tolerance band (the tolerance band is often set apart or wider).'] : [],
  });
}

/** Decodes a marking (resistor, capacitor or either) or colour bands into readings with tolerance, meaning and preferred values. */
export function explainMarking(p: { code: string; kind: MarkingKind } | { bands: string[] }): MarkingReport {
  if ('bands' in p) return { readings: [colourReading(p.bands)], ambiguous: false, note: null };
  const { code, kind } = p;
  if (kind === 'resistor') return { readings: [resistorReading(code)], ambiguous: false, note: null };
  if (kind === 'capacitor') return { readings: [capacitorReading(code)], ambiguous: false, note: null };
  if (kind !== 'auto') throw new RangeError(`Marking kind must be "resistor", "capacitor" or "auto" (got "${String(kind)}").`);
  const readings: MarkingReading[] = [];
  const errors: string[] = [];
  for (const read of [resistorReading, capacitorReading]) {
    try {
      readings.push(read(code));
    } catch (err) {
      if (!(err instanceof RangeError)) throw err;
      errors.push(err.message);
    }
  }
  if (readings.length === 0) {
    throw new RangeError(`Marking "${code}" is neither a resistor code nor a capacitor code. ${errors.join(' ')}`);
  }
  const ambiguous = readings.length > 1;
  return {
    readings,
    ambiguous,
    note: ambiguous
      ? 'This code reads differently on a resistor and on a capacitor; the part itself tells which (body colour, package, where it sits in the circuit).'
      : null,
  };
}
