// Display rules of the cost pages: rounding for the eye only; every figure comes from the API.
import { formatDate, formatMoney } from '@/lib/format';

/** Money with two decimals from 1 up, three significant digits below (a resistor at 0.00042). */
export function money(amount: number | null | undefined, currency: string): string {
  if (amount === null || amount === undefined || !Number.isFinite(amount)) return '—';
  const abs = Math.abs(amount);
  const digits = abs >= 1 || abs === 0 ? 2 : Math.min(6, Math.max(2, 2 - Math.floor(Math.log10(abs))));
  return formatMoney(amount, currency, digits);
}

/** The same rounding as money() without the currency sign, for table columns whose header names the currency. */
export function amount(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '—';
  const abs = Math.abs(x);
  const digits = abs >= 1 || abs === 0 ? 2 : Math.min(6, Math.max(2, 2 - Math.floor(Math.log10(abs))));
  return x.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });
}

/** A number as typed back into an input (no float noise such as 2.7000000000000006). */
export const plain = (x: number) => String(Number(x.toPrecision(10)));

/** A share (0.027) as a percentage for an input ("2.7"). */
export const toPercentText = (fraction: number) => plain(fraction * 100);

/** "rates of 27 Nov 2026" — shown beside every converted figure. */
export const ratesOf = (date: string | null) => (date ? `rates of ${formatDate(date)}` : 'no rate table');

/** Okabe–Ito series tokens (tailwind.config.ts), in a fixed order for categories. */
export const SERIES = ['blue', 'orange', 'green', 'sky', 'vermilion', 'purple', 'yellow', 'black'] as const;
export type SeriesName = (typeof SERIES)[number];
export const seriesVar = (s: SeriesName) => `var(--series-${s})`;
/**
 * Put on a chart's wrapper: the series and axis colours as CSS variables taken from the theme
 * tokens, for the SVG fills recharts draws (the classes are written out so Tailwind emits them).
 */
export const CHART_COLOURS =
  '[--series-blue:theme(colors.series.blue)] [--series-orange:theme(colors.series.orange)] [--series-green:theme(colors.series.green)] [--series-sky:theme(colors.series.sky)] ' +
  '[--series-vermilion:theme(colors.series.vermilion)] [--series-purple:theme(colors.series.purple)] [--series-yellow:theme(colors.series.yellow)] [--series-black:theme(colors.series.black)] ' +
  '[--chart-axis:theme(colors.graphite.600)] [--chart-grid:theme(colors.graphite.150)]';
/** Swatch classes written out in full so the stylesheet carries each colour. */
export const SWATCH: Record<SeriesName, string> = {
  blue: 'bg-series-blue',
  orange: 'bg-series-orange',
  green: 'bg-series-green',
  sky: 'bg-series-sky',
  vermilion: 'bg-series-vermilion',
  purple: 'bg-series-purple',
  yellow: 'bg-series-yellow',
  black: 'bg-series-black',
};
