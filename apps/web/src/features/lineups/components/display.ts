// Display rules of the lineup pages: rounding for the eye only; every value comes from the API.
import type { ComparisonMetricDto } from '@splitcase/contracts';
import { formatMoney, formatPercent, formatQuantity } from '@/lib/format';

/** A metric value with its unit; null (missing) as "—". */
export function metricText(value: number | null | undefined, metric: Pick<ComparisonMetricDto, 'format' | 'unit'>): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  switch (metric.format) {
    case 'money':
      return formatMoney(value, metric.unit, 2);
    case 'percent':
      return formatPercent(value, 1);
    case 'count':
      return String(value);
    default:
      return formatQuantity(value, metric.unit);
  }
}

/** The header of a metric column: its label and unit ("Pack energy, Wh"); counts need no unit. */
export const metricHeader = (m: Pick<ComparisonMetricDto, 'label' | 'unit' | 'format'>) => (m.format === 'count' ? m.label : `${m.label}, ${m.unit}`);
/** The same with the short label, for narrow table headers ("Price, USD"). */
export const shortHeader = (m: Pick<ComparisonMetricDto, 'short' | 'unit' | 'format'>) => (m.format === 'count' ? m.short : `${m.short}, ${m.unit}`);

/** "higher is better" / "lower is better". */
export const betterText = (m: Pick<ComparisonMetricDto, 'better'>) => (m.better === 'high' ? 'higher is better' : 'lower is better');

/** A score 0..100 for the ranking ("—" when the device has none of the weighted metrics). */
export const scoreText = (score: number | null) => (score === null ? '—' : score.toFixed(1));

/** Okabe–Ito series tokens (tailwind.config.ts) the lineup chart uses. */
export type SeriesName = 'blue' | 'vermilion' | 'black';
export const seriesVar = (s: SeriesName) => `var(--series-${s})`;
/**
 * Put on the chart's wrapper: series and axis colours as CSS variables taken from the theme tokens,
 * for the SVG fills recharts draws (the classes are written out so Tailwind emits them).
 */
export const CHART_COLOURS =
  '[--series-blue:theme(colors.series.blue)] [--series-vermilion:theme(colors.series.vermilion)] [--series-black:theme(colors.series.black)] ' +
  '[--chart-axis:theme(colors.graphite.600)] [--chart-grid:theme(colors.graphite.150)]';

/** Currencies a rate table converts: its base and every listed rate. */
export const rateCurrencies = (table: { base: string; rates: Record<string, number> } | null): string[] => (table ? [table.base, ...Object.keys(table.rates)] : []);

/** "on 1 of 10 weighted metrics (8 % of the weight)" when a score rests on part of the weights; null when on all. */
export function coverageText(c: { known: number; weighted: number; weightShare: number }): string | null {
  if (c.known >= c.weighted) return null;
  return `on ${c.known} of ${c.weighted} weighted metrics (${Math.round(c.weightShare * 100)} % of the weight)`;
}
