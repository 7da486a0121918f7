/**
 * When a logged quantity first reaches a level: the first sample at or above
 * it, with the crossing time interpolated linearly between that sample and
 * the one before [C].
 */
import { requireFinite } from '../shared/validate';
import { at, checkSeriesShape, checkSeriesValues, type RunSeries, type ValueColumn } from './series';

/** Time (s, on the log's own clock) at which column first reaches level; null when it never does; t₀ when it starts there. */
export function timeToLevel(series: RunSeries, column: ValueColumn, level: number): number | null {
  const n = checkSeriesShape(series, [column], 'a time-to-level search');
  checkSeriesValues(series);
  requireFinite(level, 'level');
  const t = series.t;
  const y = series[column] as NonNullable<RunSeries[ValueColumn]>;
  for (let k = 0; k < n; k++) {
    const yk = at(y, k);
    if (yk >= level) {
      if (k === 0) return at(t, 0);
      const yp = at(y, k - 1);
      const tp = at(t, k - 1);
      return tp + ((level - yp) / (yk - yp)) * (at(t, k) - tp);
    }
  }
  return null;
}

/** Time at which the logged temperature first reaches thresholdC (°C), measured from the first sample; null when it never does. */
export function timeToTemperature(series: RunSeries, thresholdC: number): number | null {
  requireFinite(thresholdC, 'thresholdC');
  const crossing = timeToLevel(series, 'temp', thresholdC);
  return crossing === null ? null : crossing - at(series.t, 0);
}
