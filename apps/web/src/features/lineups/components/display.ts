// Display rules of the lineup pages: rounding for the eye only; every value comes from the API.
import { LINEUP_MODE_RULE, type ComparisonMetricDto, type ComparisonRowDto, type LineupModeChoice } from '@splitcase/contracts';
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

/** The mode rule a lineup compares, in words: its contract label, or the name asked for ("A mode by name: “High”"). */
export function modeChoiceText(m: LineupModeChoice): string {
  if (m.rule === 'named') return `${LINEUP_MODE_RULE.labels.named}: “${m.name ?? ''}”`;
  return LINEUP_MODE_RULE.labels[m.rule];
}

/** Two mode choices that ask for the same mode (a name is compared as typed, spaces trimmed). */
export const sameModeChoice = (a: LineupModeChoice, b: LineupModeChoice) => a.rule === b.rule && (a.rule !== 'named' || (a.name ?? '').trim() === (b.name ?? '').trim());

/**
 * Where a row's runtime comes from: the mode the server chose (name and reason), "No modes
 * recorded" when the runtime is the main load's at its recorded duty, or why there is none.
 */
export type RowMode = { kind: 'mode'; name: string; reason: string } | { kind: 'no-modes'; text: string } | { kind: 'missing'; reason: string };
export function rowMode(r: Pick<ComparisonRowDto, 'mode' | 'teardown' | 'metrics' | 'missing'>): RowMode {
  if (r.mode) return { kind: 'mode', name: r.mode.name, reason: r.mode.reason };
  const runtime = r.metrics.runtimeH;
  // The server gives a runtime without a mode only when the teardown records no modes.
  if (r.teardown && runtime !== null && runtime !== undefined) return { kind: 'no-modes', text: 'No modes recorded: the main load at its recorded duty' };
  return { kind: 'missing', reason: r.missing.runtimeH ?? (r.teardown ? 'No runtime for this device.' : 'No teardown yet.') };
}

/** "High — the most power at the main load", "No modes recorded: …", or "— (why)": for print and plain text. */
export function rowModeText(r: Pick<ComparisonRowDto, 'mode' | 'teardown' | 'metrics' | 'missing'>): string {
  const m = rowMode(r);
  return m.kind === 'mode' ? `${m.name} — ${m.reason}` : m.kind === 'no-modes' ? m.text : `— (${m.reason})`;
}

/** The labels of the weighted metrics a row lacks ("Runtime, Should-cost"); null when it lacks none. */
export function lackedMetricsText(r: Pick<ComparisonRowDto, 'incompleteMetrics'>, metrics: Pick<ComparisonMetricDto, 'key' | 'label'>[]): string | null {
  if (!r.incompleteMetrics.length) return null;
  return r.incompleteMetrics.map((k) => metrics.find((m) => m.key === k)?.label ?? k).join(', ');
}
