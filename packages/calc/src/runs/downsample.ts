/**
 * Chart-sized copies of long runs by largest-triangle-three-buckets (LTTB):
 * the first and last points are kept; every bucket between keeps the point
 * that makes the largest triangle with the point kept before it and the mean
 * of the next bucket, so peaks and knees survive [S: Steinarsson, "Downsampling
 * Time Series for Visual Representation", 2013].
 */
import { requireInteger } from '../shared/validate';
import { at, checkSeries, VALUE_COLUMNS, type Column, type RunSeries, type ValueColumn } from './series';

/** One downsampled trace: x (s) and y values of the points kept. */
export interface DownsampledTrace {
  t: number[];
  y: number[];
}

/** Indices kept by LTTB for y against t (at most maxPoints, ascending, first and last included). */
export function lttbIndices(t: Column, y: Column, maxPoints: number): number[] {
  requireInteger(maxPoints, 'maxPoints', 3);
  const n = t.length;
  if (n <= maxPoints) return Array.from({ length: n }, (_, k) => k);
  const kept: number[] = [0];
  const every = (n - 2) / (maxPoints - 2);
  let prev = 0;
  for (let b = 0; b < maxPoints - 2; b++) {
    const start = Math.floor(b * every) + 1;
    const end = Math.floor((b + 1) * every) + 1; // exclusive
    const nextStart = end;
    const nextEnd = Math.min(Math.floor((b + 2) * every) + 1, n);
    let meanT = 0;
    let meanY = 0;
    for (let k = nextStart; k < nextEnd; k++) {
      meanT += at(t, k);
      meanY += at(y, k);
    }
    const count = nextEnd - nextStart;
    meanT /= count;
    meanY /= count;
    const pt = at(t, prev);
    const py = at(y, prev);
    let best = start;
    let bestArea = -1;
    for (let k = start; k < end; k++) {
      const area = Math.abs((pt - meanT) * (at(y, k) - py) - (pt - at(t, k)) * (meanY - py));
      if (area > bestArea) {
        bestArea = area;
        best = k;
      }
    }
    kept.push(best);
    prev = best;
  }
  kept.push(n - 1);
  return kept;
}

/** At most maxPoints points per value column (LTTB, first and last kept), each as its own {t, y} trace. */
export function downsample(series: RunSeries, maxPoints: number): Partial<Record<ValueColumn, DownsampledTrace>> {
  checkSeries(series, [], 'a chart');
  requireInteger(maxPoints, 'maxPoints', 3);
  const out: Partial<Record<ValueColumn, DownsampledTrace>> = {};
  for (const name of VALUE_COLUMNS) {
    const y = series[name];
    if (!y) continue;
    const kept = lttbIndices(series.t, y, maxPoints);
    out[name] = { t: kept.map((k) => at(series.t, k)), y: kept.map((k) => at(y, k)) };
  }
  return out;
}
