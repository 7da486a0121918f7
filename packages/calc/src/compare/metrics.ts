/**
 * Normalised metrics of a device for a lineup, and weighted scores across
 * the lineup. A metric whose inputs are missing is null, never 0.
 */
import { requireFinite, requireInteger, requireNonNegative, requirePositive } from '../shared/validate';

export type MetricKey =
  | 'retailPrice'
  | 'packWh'
  | 'capacityVsLabel'
  | 'runtimeH'
  | 'whPerCurrency'
  | 'whPerKg'
  | 'heaterWPerCm2'
  | 'shouldCost'
  | 'impliedMargin'
  | 'findingsCritical'
  | 'findingsMajor'
  | 'findingsMinor'
  | 'findingsNote';

export interface MetricInfo {
  label: string;
  unit: string;
  better: 'high' | 'low';
}

/** What each metric means, its unit ("currency" = the lineup's reporting currency) and which way is better. */
export const METRICS: Readonly<Record<MetricKey, MetricInfo>> = {
  retailPrice: { label: 'Retail price', unit: 'currency', better: 'low' },
  packWh: { label: 'Pack energy', unit: 'Wh', better: 'high' },
  capacityVsLabel: { label: 'Measured capacity vs label', unit: 'fraction', better: 'high' },
  runtimeH: { label: 'Runtime', unit: 'h', better: 'high' },
  whPerCurrency: { label: 'Energy per unit of price', unit: 'Wh per currency unit', better: 'high' },
  whPerKg: { label: 'Pack specific energy', unit: 'Wh/kg', better: 'high' },
  heaterWPerCm2: { label: 'Heater power density', unit: 'W/cm²', better: 'high' },
  shouldCost: { label: 'Should-cost', unit: 'currency', better: 'low' },
  impliedMargin: { label: 'Implied margin', unit: 'fraction', better: 'high' },
  findingsCritical: { label: 'Critical findings', unit: 'count', better: 'low' },
  findingsMajor: { label: 'Major findings', unit: 'count', better: 'low' },
  findingsMinor: { label: 'Minor findings', unit: 'count', better: 'low' },
  findingsNote: { label: 'Notes', unit: 'count', better: 'low' },
};

export const METRIC_KEYS = Object.keys(METRICS) as MetricKey[];

export interface DeviceFigures {
  /** Retail price in the reporting currency. */
  retailPrice?: number | null;
  packWh?: number | null;
  /** Energy measured in the latest discharge run and the label energy (Wh), compared in Wh (labels quote mAh at the cell voltage). */
  measuredWh?: number | null;
  labelWh?: number | null;
  runtimeH?: number | null;
  packMassKg?: number | null;
  heaterWatts?: number | null;
  heatedAreaM2?: number | null;
  /** Landed should-cost in the reporting currency. */
  shouldCost?: number | null;
  impliedMarginFraction?: number | null;
  findingsBySeverity: { note: number; minor: number; major: number; critical: number };
}

export type DeviceMetrics = Record<MetricKey, number | null>;

const present = (x: number | null | undefined): x is number => x !== undefined && x !== null;

/**
 * Normalised metrics of one device: Wh per currency unit = packWh / retailPrice,
 * Wh/kg = packWh / packMassKg, W/cm² = heaterWatts / (heatedAreaM2 × 10⁴),
 * capacity vs label = measuredWh / labelWh (a fraction, in Wh), finding counts by severity.
 */
export function comparisonMetrics(device: DeviceFigures): DeviceMetrics {
  if (device === null || typeof device !== 'object') throw new RangeError('device must be an object of figures.');
  const opt = (name: keyof DeviceFigures, check: (v: number, n: string) => number) => {
    const v = device[name] as number | null | undefined;
    return present(v) ? check(v, name) : null;
  };
  const retailPrice = opt('retailPrice', requirePositive);
  const packWh = opt('packWh', requireNonNegative);
  const measuredWh = opt('measuredWh', requireNonNegative);
  const labelWh = opt('labelWh', requirePositive);
  const runtimeH = opt('runtimeH', requireNonNegative);
  const packMassKg = opt('packMassKg', requirePositive);
  const heaterWatts = opt('heaterWatts', requireNonNegative);
  const heatedAreaM2 = opt('heatedAreaM2', requirePositive);
  const shouldCost = opt('shouldCost', requireNonNegative);
  const impliedMargin = opt('impliedMarginFraction', requireFinite);
  if (impliedMargin !== null && impliedMargin > 1) {
    throw new RangeError(`impliedMarginFraction must not exceed 1 (got ${impliedMargin}).`);
  }
  const f = device.findingsBySeverity;
  if (f === null || typeof f !== 'object') {
    throw new RangeError('findingsBySeverity must give counts for note, minor, major and critical.');
  }
  const count = (key: 'note' | 'minor' | 'major' | 'critical') => requireInteger(f[key], `findingsBySeverity.${key}`, 0);
  return {
    retailPrice,
    packWh,
    capacityVsLabel: measuredWh !== null && labelWh !== null ? measuredWh / labelWh : null,
    runtimeH,
    whPerCurrency: packWh !== null && retailPrice !== null ? packWh / retailPrice : null,
    whPerKg: packWh !== null && packMassKg !== null ? packWh / packMassKg : null,
    heaterWPerCm2: heaterWatts !== null && heatedAreaM2 !== null ? heaterWatts / (heatedAreaM2 * 1e4) : null,
    shouldCost,
    impliedMargin,
    findingsCritical: count('critical'),
    findingsMajor: count('major'),
    findingsMinor: count('minor'),
    findingsNote: count('note'),
  };
}

export interface ScoredRow {
  id: string;
  /** 0..100, or null when the row has none of the weighted metrics. */
  score: number | null;
  /** 1 = best; ties broken by id. */
  rank: number;
  /** Normalised value 0..1 (1 = best in the lineup) of each weighted metric the row has. */
  normalised: Partial<Record<MetricKey, number>>;
  /** The row has every weighted metric; incomplete rows rank after the complete ones. */
  complete: boolean;
  /** Weighted metrics the row lacks. */
  missing: MetricKey[];
}

/**
 * Scores 0..100: each weighted metric is min-max normalised across the rows
 * that have it (1 = best, respecting METRICS[key].better; 1 for all when the
 * values are equal); a row's score is the weighted mean over the metrics it
 * has, the weights renormalised over those. Rows with every weighted metric
 * rank first (by score, ties by id); rows missing one rank after them, so a
 * missing metric is never rewarded (issue 10 §2.9).
 */
export function weightedScores(rows: { id: string; metrics: Partial<Record<string, number | null>> }[], weights: Record<string, number>): ScoredRow[] {
  if (!Array.isArray(rows)) throw new RangeError('rows must be a list of { id, metrics }.');
  if (weights === null || typeof weights !== 'object') throw new RangeError('weights must map metric names to numbers.');
  const used: [MetricKey, number][] = [];
  for (const [key, w] of Object.entries(weights)) {
    if (!(key in METRICS)) throw new RangeError(`weights.${key}: unknown metric; use one of ${METRIC_KEYS.join(', ')}.`);
    requireNonNegative(w, `weights.${key}`);
    if (w > 0) used.push([key as MetricKey, w]);
  }
  if (used.length === 0) throw new RangeError('weights: give at least one metric a weight above zero.');

  const seen = new Set<string>();
  rows.forEach((row, k) => {
    if (row === null || typeof row !== 'object' || typeof row.id !== 'string' || row.id === '') {
      throw new RangeError(`rows[${k}].id must be non-empty text.`);
    }
    if (seen.has(row.id)) throw new RangeError(`rows[${k}].id "${row.id}" appears more than once.`);
    seen.add(row.id);
    if (row.metrics === null || typeof row.metrics !== 'object') throw new RangeError(`rows[${k}].metrics must be an object.`);
    for (const [key] of used) {
      const v = row.metrics[key];
      if (present(v)) requireFinite(v, `rows[${k}].metrics.${key}`);
    }
  });

  const ranges = new Map<MetricKey, { min: number; max: number }>();
  for (const [key] of used) {
    let min = Infinity;
    let max = -Infinity;
    for (const row of rows) {
      const v = row.metrics[key];
      if (present(v)) {
        min = Math.min(min, v);
        max = Math.max(max, v);
      }
    }
    ranges.set(key, { min, max });
  }

  const scored = rows.map((row) => {
    const normalised: Partial<Record<MetricKey, number>> = {};
    const missing: MetricKey[] = [];
    let sum = 0;
    let weightSum = 0;
    for (const [key, w] of used) {
      const v = row.metrics[key];
      if (!present(v)) {
        missing.push(key);
        continue;
      }
      const { min, max } = ranges.get(key)!;
      const n = max === min ? 1 : METRICS[key].better === 'high' ? (v - min) / (max - min) : (max - v) / (max - min);
      normalised[key] = n;
      sum += w * n;
      weightSum += w;
    }
    // Clamped: rounding can push a perfect row a hair past 100.
    const score = weightSum > 0 ? Math.min(100, Math.max(0, (100 * sum) / weightSum)) : null;
    return { id: row.id, score, normalised, complete: missing.length === 0, missing };
  });
  scored.sort((a, b) => {
    if (a.complete !== b.complete) return a.complete ? -1 : 1;
    if (a.score === null || b.score === null) {
      if (a.score !== b.score) return a.score === null ? 1 : -1;
    } else if (a.score !== b.score) {
      return b.score - a.score;
    }
    return a.id < b.id ? -1 : a.id > b.id ? 1 : 0;
  });
  return scored.map((row, k) => ({ ...row, rank: k + 1 }));
}
