/**
 * The marking decoder of the bench tools: a code or colour bands → value, tolerance, what the
 * code means, and the nearest preferred values, with formula and source for the UI.
 */
import type { Explained } from '../shared/explained';
import { formulaOf, type FormulaKey } from '../figures/formulas';
import { withPrefix } from '../shared/text';
import { readCapacitorMarkings, type CapacitorScheme } from './capacitor-marking';
import { readColorBands } from './color-bands';
import { E_SERIES, E_SERIES_TOLERANCE_PERCENT, isPreferredValue, nearestPreferredValue, type ESeries } from './e-series';
import { decodeToleranceLetter, percentTolerance, toleranceRange, type MarkedComponent, type Tolerance } from './letter-codes';
import { readResistorMarkings, type ResistorScheme } from './resistor-marking';

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

/**
 * One valid reading of a printed code on one kind of part: what readMarkingCode gives the parts list and
 * explainMarking builds the bench decoder's report on.
 */
export interface MarkingCodeReading {
  component: MarkedComponent;
  scheme: MarkingScheme;
  /** The code form in words ("EIA-96 code"). */
  schemeLabel: string;
  /** The code form in a word or two, for a table cell ("EIA-96"). */
  schemeShortLabel: string;
  value: number;
  unit: 'Ω' | 'F';
  tolerance: Tolerance | null;
  /** The reading step by step. */
  meaning: string[];
  /** 1 for the most likely reading of the code on this kind of part, 2 for the next (ranking rule: ranking.ts). */
  rank: number;
  /** The rule that ranks the readings when the code has more than one on this kind of part; null otherwise. */
  rankReason: string | null;
}

export interface MarkingReading extends Explained<number> {
  component: MarkedComponent;
  scheme: MarkingScheme;
  /** The code form in words ("EIA-96 code"). */
  schemeLabel: string;
  schemeShortLabel: string;
  /** The reading step by step. */
  meaning: string[];
  tolerance: Tolerance | null;
  /** 1 for the most likely reading on this kind of part (see MarkingCodeReading). */
  rank: number;
  rankReason: string | null;
  /** Lowest and highest value at the tolerance. */
  range: { low: number; high: number } | null;
  temperatureCoefficientPpmPerK: number | null;
  preferred: PreferredValueRow[];
}

export interface MarkingReport {
  /** Every valid reading, resistor readings first, each kind of part ranked most likely first. */
  readings: MarkingReading[];
  /** True when the code has more than one reading: on a resistor and on a capacitor, or two ways on one part. */
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

const SCHEME_SHORT_LABEL: Record<MarkingScheme, string> = {
  jumper: 'jumper',
  'three-digit': '3-digit',
  'four-digit': '4-digit',
  'letter-and-digit': 'RKM code',
  'eia-96': 'EIA-96',
  picofarads: 'pF',
  'letter-decimal': 'unit letter',
  'value-with-unit': 'with unit',
  'colour-bands': 'colour bands',
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
  rank?: number;
  rankReason?: string | null;
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
    warnings.push(`${withPrefix(p.value, unit)} is in no IEC 60063 series up to E192: check the reading (a rubbed or misread character is common).`);
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
    schemeShortLabel: SCHEME_SHORT_LABEL[p.scheme],
    meaning: p.meaning,
    tolerance: p.tolerance,
    rank: p.rank ?? 1,
    rankReason: p.rankReason ?? null,
    range: p.tolerance ? toleranceRange(p.value, p.tolerance) : null,
    temperatureCoefficientPpmPerK: p.temperatureCoefficientPpmPerK ?? null,
    preferred,
  };
}

function codeReading(
  component: MarkedComponent,
  r: { scheme: MarkingScheme; value: number; toleranceLetter: string | null; meaning: string[]; rank: number; rankReason: string | null },
): MarkingCodeReading {
  const tolerance = r.toleranceLetter ? decodeToleranceLetter(r.toleranceLetter, component, component === 'capacitor' ? r.value : undefined) : null;
  const meaning = [...r.meaning];
  if (tolerance) meaning.push(`"${r.toleranceLetter}" is the tolerance letter: ${tolerance.text}.`);
  return {
    component,
    scheme: r.scheme,
    schemeLabel: SCHEME_LABEL[r.scheme],
    schemeShortLabel: SCHEME_SHORT_LABEL[r.scheme],
    value: r.value,
    unit: component === 'resistor' ? 'Ω' : 'F',
    tolerance,
    meaning,
    rank: r.rank,
    rankReason: r.rankReason,
  };
}

/**
 * Every valid reading of a printed code on a resistor or a capacitor, most likely first, each with the
 * rule (scheme) that gives it, its value (Ω or F) and the tolerance its letter carries. The one decoder
 * of the bench tools and the parts list. Throws a RangeError naming the code when nothing reads.
 */
export function readMarkingCode(code: string, component: MarkedComponent): MarkingCodeReading[] {
  if (component === 'resistor') return readResistorMarkings(code).map((r) => codeReading('resistor', { ...r, value: r.ohms }));
  if (component === 'capacitor') return readCapacitorMarkings(code).map((r) => codeReading('capacitor', { ...r, value: r.farads }));
  throw new RangeError(`A marking is read on a resistor or a capacitor (got "${String(component)}").`);
}

function explained(code: string, r: MarkingCodeReading): MarkingReading {
  const assumptions: string[] = [];
  let formulaKey: FormulaKey;
  if (r.component === 'resistor') {
    if (r.scheme === 'three-digit' && !r.tolerance) assumptions.push('3-digit codes are usually found on ±2 % and ±5 % parts [CP].');
    if (r.scheme === 'four-digit' && !r.tolerance) assumptions.push('4-digit codes are usually found on ±1 % parts [CP].');
    if (r.scheme === 'eia-96') assumptions.push('EIA-96 codes mark values of the E96 series, the ±1 % series of IEC 60063 [S].');
    formulaKey = r.scheme === 'eia-96' ? 'marking.eia96' : r.scheme === 'letter-and-digit' ? 'marking.letterCode' : r.scheme === 'jumper' ? 'marking.jumper' : 'marking.resistor';
  } else {
    formulaKey = r.scheme === 'three-digit' ? 'marking.capacitor' : 'marking.capacitorLetter';
  }
  if (r.rankReason) assumptions.push(`Reading ${r.rank} of this code on a ${r.component}. ${r.rankReason}`);
  return reading({
    component: r.component,
    scheme: r.scheme,
    rank: r.rank,
    rankReason: r.rankReason,
    value: r.value,
    formulaKey,
    meaning: r.meaning,
    tolerance: r.tolerance,
    inputs: [
      { label: 'Marking', value: code.trim() },
      { label: 'Read as', value: r.component },
    ],
    assumptions,
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

/**
 * Decodes a marking (resistor, capacitor or either) or colour bands into every valid reading, ranked, with
 * tolerance, meaning and preferred values.
 */
export function explainMarking(p: { code: string; kind: MarkingKind } | { bands: string[] }): MarkingReport {
  if ('bands' in p) return { readings: [colourReading(p.bands)], ambiguous: false, note: null };
  const { code, kind } = p;
  if (kind !== 'auto' && kind !== 'resistor' && kind !== 'capacitor') {
    throw new RangeError(`Marking kind must be "resistor", "capacitor" or "auto" (got "${String(kind)}").`);
  }
  const components: MarkedComponent[] = kind === 'auto' ? ['resistor', 'capacitor'] : [kind];
  const readings: MarkingReading[] = [];
  const errors: string[] = [];
  const notes: string[] = [];
  for (const component of components) {
    let found: MarkingCodeReading[];
    try {
      found = readMarkingCode(code, component);
    } catch (err) {
      if (!(err instanceof RangeError) || kind !== 'auto') throw err;
      errors.push(err.message);
      continue;
    }
    readings.push(...found.map((r) => explained(code, r)));
    if (found.length > 1) notes.push(`"${code.trim()}" has ${found.length} readings on a ${component}. ${found[0]!.rankReason}`);
  }
  if (readings.length === 0) {
    throw new RangeError(`Marking "${code}" is neither a resistor code nor a capacitor code. ${errors.join(' ')}`);
  }
  const bothParts = new Set(readings.map((r) => r.component)).size > 1;
  if (bothParts) {
    notes.unshift('This code reads differently on a resistor and on a capacitor; the part itself tells which (body colour, package, where it sits in the circuit).');
  }
  return { readings, ambiguous: readings.length > 1, note: notes.length > 0 ? notes.join(' ') : null };
}
