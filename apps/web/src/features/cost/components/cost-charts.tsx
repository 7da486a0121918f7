// The cost charts (recharts, loaded on demand): parts by category, and a waterfall from parts
// to the retail price. Each chart has its data table; every number comes from the API.
import { Bar, BarChart, CartesianGrid, Cell, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { PART_CATEGORY, type CostRollUpDto, type WaterfallBarDto } from '@splitcase/contracts';
import { formatPercent } from '@/lib/format';
import { CHART_COLOURS, money, ratesOf, seriesVar, SWATCH, type SeriesName } from './display';

const axisTick = { fontSize: 11, fill: 'var(--chart-axis)' };

function waterfallSeries(b: WaterfallBarDto): SeriesName {
  if (b.kind !== 'step') return 'black';
  if (b.key === 'impliedMargin') return b.value < 0 ? 'vermilion' : 'green';
  if (b.key === 'platform' || b.key === 'retailer') return 'orange';
  if (b.key === 'salesTax') return 'purple';
  return 'blue';
}

const LEGEND: { series: SeriesName; label: string }[] = [
  { series: 'blue', label: 'Cost added' },
  { series: 'black', label: 'Subtotal' },
  { series: 'green', label: 'Maker margin' },
  { series: 'vermilion', label: 'Loss' },
  { series: 'orange', label: 'Channel share' },
  { series: 'purple', label: 'Sales tax' },
];

function Swatch({ series }: { series: SeriesName }) {
  return <span aria-hidden className={`inline-block size-2.5 shrink-0 rounded-sm ${SWATCH[series]}`} />;
}

export default function CostCharts({ cost }: { cost: CostRollUpDto }) {
  const cur = cost.currency;
  const categories = cost.byCategory.filter((c) => c.total > 0);
  // One series (extended cost), one colour: the categories are read off the axis, not from colours.
  const categoryData = categories.map((c) => ({ label: PART_CATEGORY.labels[c.category], total: c.total }));
  const waterfall = cost.waterfall.map((b) => ({ ...b, range: [b.start, b.end] as [number, number], series: waterfallSeries(b) }));
  const tooltipMoney = (v: unknown) => (Array.isArray(v) ? `${money(v[0] as number, cur)} → ${money(v[1] as number, cur)}` : money(v as number, cur));

  return (
    <div className={`grid gap-4 2xl:grid-cols-2 ${CHART_COLOURS}`}>
      {/* Subtotals per category are price detail (a category of one line is its price): not in the totals view. */}
      {cost.priceView === 'detail' && (
        <figure className="rounded-lg border border-graphite-150 bg-white p-4 shadow-card" aria-labelledby="cost-by-category">
          <figcaption id="cost-by-category" className="mb-2 text-sm font-semibold text-graphite-900">
            Parts by category{' '}
            <span className="font-normal text-graphite-500">
              · {cur} per unit at {cost.volume.toLocaleString('en-GB')} units, {ratesOf(cost.rateDate)}
            </span>
          </figcaption>
          {categoryData.length === 0 ? (
            <p className="py-8 text-center text-sm text-graphite-500">No priced parts yet: the chart fills in as lines get prices.</p>
          ) : (
            <div style={{ height: `${Math.max(8, categoryData.length * 1.9 + 2)}rem` }} data-testid="chart-by-category">
              <ResponsiveContainer width="100%" height="100%">
                <BarChart data={categoryData} layout="vertical" margin={{ left: 8, right: 16, top: 4, bottom: 4 }}>
                  <CartesianGrid horizontal={false} stroke="var(--chart-grid)" />
                  <XAxis type="number" tick={axisTick} tickFormatter={(v: number) => money(v, cur)} />
                  <YAxis type="category" dataKey="label" width={150} interval={0} tick={axisTick} />
                  <Tooltip formatter={(v) => [tooltipMoney(v), 'Extended cost']} />
                  <Bar dataKey="total" fill={seriesVar('blue')} isAnimationActive={false} />
                </BarChart>
              </ResponsiveContainer>
            </div>
          )}
          <table className="mt-3 w-full text-sm" aria-label="Parts by category, data">
            <thead>
              <tr className="border-b border-graphite-150 text-left text-xs uppercase tracking-wide text-graphite-500">
                <th className="py-1 font-semibold">Category</th>
                <th className="py-1 text-right font-semibold">Lines</th>
                <th className="py-1 text-right font-semibold">Extended ({cur})</th>
                <th className="py-1 text-right font-semibold">Share</th>
              </tr>
            </thead>
            <tbody>
              {cost.byCategory.map((c) => {
                return (
                  <tr key={c.category} className="border-b border-graphite-100 last:border-0">
                    <td className="py-1">{PART_CATEGORY.labels[c.category]}</td>
                    <td className="num py-1 text-right">{c.lines}</td>
                    <td className="num py-1 text-right">{money(c.total, cur)}</td>
                    <td className="num py-1 text-right">{formatPercent(c.share)}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </figure>
      )}

      <figure className="rounded-lg border border-graphite-150 bg-white p-4 shadow-card" aria-labelledby="cost-waterfall">
        <figcaption id="cost-waterfall" className="mb-2 text-sm font-semibold text-graphite-900">
          From parts to retail price{' '}
          <span className="font-normal text-graphite-500">
            · {cur} per unit, {ratesOf(cost.rateDate)}
          </span>
        </figcaption>
        <div className="h-80" data-testid="chart-waterfall">
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={waterfall} margin={{ left: 8, right: 8, top: 4, bottom: 8 }}>
              <CartesianGrid vertical={false} stroke="var(--chart-grid)" />
              <XAxis dataKey="label" interval={0} angle={-40} textAnchor="end" tick={axisTick} height={78} />
              <YAxis tick={axisTick} tickFormatter={(v: number) => money(v, cur)} width={72} />
              <Tooltip formatter={(v) => [tooltipMoney(v), 'From → to']} />
              <Bar dataKey="range" isAnimationActive={false}>
                {waterfall.map((b) => (
                  <Cell key={b.key} fill={seriesVar(b.series)} />
                ))}
              </Bar>
            </BarChart>
          </ResponsiveContainer>
        </div>
        <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-xs text-graphite-600" aria-label="Legend">
          {LEGEND.filter((l) => waterfall.some((b) => b.series === l.series)).map((l) => (
            <li key={l.series} className="inline-flex items-center gap-1.5">
              <Swatch series={l.series} /> {l.label}
            </li>
          ))}
        </ul>
        {cost.impliedMargin && !cost.impliedMargin.complete && <p className="mt-2 text-xs text-graphite-600">Stops at landed cost: the implied margin is incomplete ({cost.impliedMargin.reason})</p>}
        <table className="mt-3 w-full text-sm" aria-label="From parts to retail price, data">
          <thead>
            <tr className="border-b border-graphite-150 text-left text-xs uppercase tracking-wide text-graphite-500">
              <th className="py-1 font-semibold">Step</th>
              <th className="py-1 text-right font-semibold">Amount ({cur})</th>
              <th className="py-1 text-right font-semibold">Running total</th>
            </tr>
          </thead>
          <tbody>
            {waterfall.map((b) => (
              <tr key={b.key} className={`border-b border-graphite-100 last:border-0 ${b.kind !== 'step' ? 'font-semibold' : ''}`}>
                <td className="py-1">
                  <span className="inline-flex items-center gap-2">
                    <Swatch series={b.series} />
                    {b.label}
                  </span>
                </td>
                <td className="num py-1 text-right">{b.kind === 'step' ? money(b.value, cur) : ''}</td>
                <td className="num py-1 text-right">{money(b.end, cur)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </figure>
    </div>
  );
}
