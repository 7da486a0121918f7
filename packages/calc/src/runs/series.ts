/**
 * Columnar bench-run series and their checks.
 *
 * A run is stored as one array per quantity (not one object per sample) so a
 * million-sample log costs a few typed arrays and nothing else.
 */

/** One numeric column of a bench log: a plain array or a Float64Array. */
export type Column = Float64Array | number[];

/** A bench-run log: t in s elapsed from the start, v in V, i in A, p in W, temp in °C. */
export interface RunSeries {
  t: Column;
  v?: Column | undefined;
  i?: Column | undefined;
  p?: Column | undefined;
  temp?: Column | undefined;
}

/** Names of the value columns a series may carry. */
export type ValueColumn = 'v' | 'i' | 'p' | 'temp';

/** Share of the peak current (or power) at or below which the load counts as off. */
export const LOAD_OFF_FRACTION = 0.02;

export const VALUE_COLUMNS: readonly ValueColumn[] = ['v', 'i', 'p', 'temp'];

const COLUMN_WORDS: Record<ValueColumn | 't', string> = {
  t: 'time',
  v: 'voltage',
  i: 'current',
  p: 'power',
  temp: 'temperature',
};

/** Field name used in messages, e.g. "series.v (voltage)". */
export function columnLabel(name: ValueColumn | 't'): string {
  return `series.${name} (${COLUMN_WORDS[name]})`;
}

function isColumn(value: unknown): value is Column {
  return Array.isArray(value) || value instanceof Float64Array;
}

/** Value at index k; the caller guarantees k is in range. */
export function at(column: Column, k: number): number {
  return column[k] as number;
}

/** Throws the message used for a non-finite value. */
export function notFinite(name: ValueColumn | 't', k: number, value: number): never {
  throw new RangeError(`series.${name}[${k}] must be a finite number (got ${String(value)}).`);
}

/** Throws the message used for time that does not increase. */
export function notIncreasing(k: number, prev: number, value: number): never {
  throw new RangeError(`series.t[${k}] must be later than series.t[${k - 1}] (got ${value} after ${prev}); time must increase strictly.`);
}

/**
 * Checks the shape of a series: t present with at least 2 samples, every
 * present column as long as t, the required columns present. Values are not
 * scanned here (see checkSeriesValues). Returns the sample count.
 */
export function checkSeriesShape(series: RunSeries, required: readonly ValueColumn[], purpose: string): number {
  if (series === null || typeof series !== 'object') {
    throw new RangeError('series must be an object with a time column t and value columns.');
  }
  if (!isColumn(series.t)) {
    throw new RangeError(`${columnLabel('t')} is required and must be an array of seconds.`);
  }
  const n = series.t.length;
  if (n < 2) throw new RangeError(`${columnLabel('t')} needs at least 2 samples (got ${n}).`);
  for (const name of VALUE_COLUMNS) {
    const column = series[name];
    if (column === undefined || column === null) {
      if (required.includes(name)) {
        throw new RangeError(`${columnLabel(name)} is required for ${purpose}.`);
      }
      continue;
    }
    if (!isColumn(column)) throw new RangeError(`${columnLabel(name)} must be an array of numbers.`);
    if (column.length !== n) {
      throw new RangeError(`${columnLabel(name)} has ${column.length} values but series.t has ${n}; every column needs one value per sample.`);
    }
  }
  return n;
}

/** Checks that t increases strictly and every present value is finite. One pass per column, no copies. */
export function checkSeriesValues(series: RunSeries): void {
  const { t } = series;
  const n = t.length;
  let prev = at(t, 0);
  if (!Number.isFinite(prev)) notFinite('t', 0, prev);
  for (let k = 1; k < n; k++) {
    const value = at(t, k);
    if (!Number.isFinite(value)) notFinite('t', k, value);
    if (!(value > prev)) notIncreasing(k, prev, value);
    prev = value;
  }
  for (const name of VALUE_COLUMNS) {
    const column = series[name];
    if (!column) continue;
    for (let k = 0; k < n; k++) {
      const value = at(column, k);
      if (!Number.isFinite(value)) notFinite(name, k, value);
    }
  }
}

/** Shape and value checks together; returns the sample count. */
export function checkSeries(series: RunSeries, required: readonly ValueColumn[], purpose: string): number {
  const n = checkSeriesShape(series, required, purpose);
  checkSeriesValues(series);
  return n;
}

/** Checks an optional number option and returns it (or undefined). */
export function optionalFinite(value: number | undefined | null, name: string): number | undefined {
  if (value === undefined || value === null) return undefined;
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number (got ${String(value)}).`);
  }
  return value;
}
