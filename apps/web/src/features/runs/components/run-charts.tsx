// Charts of one run or an overlay of up to four: voltage, current, power and temperature against
// time, from the server's downsampled series. Hover for a read-out of every run at that time; drag
// across a chart to zoom (the window is fetched again at up to full resolution). Each chart has its
// data table. Loaded lazily: the chart library is large.
import { useMemo, useState } from 'react';
import { CartesianGrid, Line, LineChart, ReferenceArea, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { ZoomOut } from 'lucide-react';
import type { RunDto, RunSeries } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Spinner } from '@/components/page';
import { sig } from '@/lib/format';
import { useLiveState } from '@/lib/use-live-state';
import { useRunSeries, type SeriesWindow } from '../api/run-series';
import { ChartTable, markersFor, mergeTraces, niceTicks, QUANTITIES, ReadOut, RUN_STYLES, Swatch, type Trace } from './chart-parts';
import { formatClock, niceTimeTicks, timeAxisUnit } from './time-format';
import { WindowForm } from './window-form';

/** Okabe–Ito colours (tailwind series-*) and a dash pattern each, so runs differ by more than colour. */
function QuantityChart({
  q,
  runs,
  traces,
  domain,
  onZoom,
  syncId,
}: {
  q: (typeof QUANTITIES)[number];
  runs: RunDto[];
  traces: (Trace | undefined)[];
  domain: [number, number];
  onZoom: (w: SeriesWindow) => void;
  syncId: string;
}) {
  const rows = useMemo(() => mergeTraces(traces), [traces]);
  const yTicks = useMemo(() => {
    let lo = Infinity;
    let hi = -Infinity;
    for (const tr of traces)
      for (const y of tr?.y ?? []) {
        if (y < lo) lo = y;
        if (y > hi) hi = y;
      }
    return niceTicks(lo, hi);
  }, [traces]);
  // Live state: the handlers read the selection as it is now, not as of the last render.
  const [drag, setDrag, currentDrag] = useLiveState<{ from: number; to: number } | null>(null);
  const axis = timeAxisUnit(domain[1] - domain[0]);
  const labelOf = (state: { activeLabel?: string | number }) => (state.activeLabel === undefined ? null : Number(state.activeLabel));
  return (
    <figure className="space-y-1" aria-label={`${q.label} against time`}>
      <figcaption className="text-xs font-semibold uppercase tracking-wide text-graphite-500">
        {q.label} ({q.unit})
      </figcaption>
      <div className="h-56 select-none text-graphite-500">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart
            data={rows}
            syncId={syncId}
            syncMethod="value"
            margin={{ top: 8, right: 16, bottom: 16, left: 4 }}
            onMouseDown={(s) => {
              const t = labelOf(s);
              if (t !== null) setDrag({ from: t, to: t });
            }}
            onMouseMove={(s) => {
              const t = labelOf(s);
              const d = currentDrag();
              if (d && t !== null) setDrag({ ...d, to: t });
            }}
            onMouseUp={() => {
              const d = currentDrag();
              if (d && Math.abs(d.to - d.from) > 0) onZoom({ from: Math.min(d.from, d.to), to: Math.max(d.from, d.to) });
              setDrag(null);
            }}
            onMouseLeave={() => setDrag(null)}
          >
            <CartesianGrid stroke="currentColor" strokeOpacity={0.15} vertical={false} />
            <XAxis
              type="number"
              dataKey="t"
              domain={domain}
              ticks={niceTimeTicks(domain[0], domain[1], axis.divisor)}
              allowDataOverflow
              stroke="currentColor"
              tick={{ fontSize: 11, fill: 'currentColor' }}
              tickFormatter={(t: number) => sig(t / axis.divisor, 3)}
              label={{ value: `Time (${axis.unit})`, position: 'insideBottom', offset: -10, fontSize: 11, fill: 'currentColor' }}
            />
            <YAxis
              domain={yTicks.length ? [yTicks[0]!, yTicks[yTicks.length - 1]!] : ['auto', 'auto']}
              ticks={yTicks.length ? yTicks : undefined}
              allowDataOverflow
              stroke="currentColor"
              width={52}
              tick={{ fontSize: 11, fill: 'currentColor' }}
              tickFormatter={(y: number) => sig(y, 3)}
              label={{ value: q.unit, angle: -90, position: 'insideLeft', fontSize: 11, fill: 'currentColor' }}
            />
            <Tooltip isAnimationActive={false} content={(props) => <ReadOut active={props.active} label={props.label as number | undefined} runs={runs} traces={traces} unit={q.unit} />} />
            {runs.map((r, idx) =>
              traces[idx] ? (
                <Line
                  key={r.id}
                  dataKey={`r${idx}`}
                  name={r.label}
                  type="linear"
                  dot={false}
                  activeDot={{ r: 3 }}
                  connectNulls
                  isAnimationActive={false}
                  stroke="currentColor"
                  strokeWidth={1.6}
                  strokeDasharray={RUN_STYLES[idx]!.dash}
                  className={RUN_STYLES[idx]!.text}
                />
              ) : null,
            )}
            {runs[0] && markersFor(runs[0], q.key)}
            {drag && drag.from !== drag.to && <ReferenceArea x1={drag.from} x2={drag.to} className="text-copper-500" fill="currentColor" fillOpacity={0.12} />}
          </LineChart>
        </ResponsiveContainer>
      </div>
      <ChartTable runs={runs} traces={traces} label={q.label} unit={q.unit} />
    </figure>
  );
}

/** Window controls in the time unit of the axis, for keyboard users and exact windows. */
export function RunCharts({ runs }: { runs: RunDto[] }) {
  const [window, setWindow] = useState<SeriesWindow | null>(null);
  const ids = runs.map((r) => r.id);
  const maxPoints = runs.length > 1 ? 1500 : 2000;
  const queries = useRunSeries(ids, maxPoints, window);
  const pending = queries.some((q) => q.isPending);
  const failed = queries.find((q) => q.isError);
  const series = queries.map((q) => q.data) as (RunSeries | undefined)[];
  const fetching = queries.some((q) => q.isFetching);

  const fullTo = Math.max(...runs.map((r) => r.durationS), 1);
  const domain: [number, number] = window ? [window.from, window.to] : [0, Math.max(fullTo, ...series.map((s) => s?.range.toS ?? 0))];
  // A thermal run leads with its temperature.
  const order = runs[0]?.kind === 'thermal' ? [...QUANTITIES].sort((a, b) => Number(b.key === 'temp') - Number(a.key === 'temp')) : QUANTITIES;
  const shown = order.filter((q) => {
    if (!series.some((s) => s?.traces[q.key])) return false;
    // Power is drawn only where a run logged power without current (otherwise it is V × I, already shown).
    if (q.key === 'p') return series.some((s) => s?.traces.p && !s.traces.i);
    return true;
  });

  if (failed) return <ErrorPanel error={failed.error} onRetry={() => failed.refetch()} />;
  if (pending) return <Spinner label="Loading the series…" />;

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-2 text-xs text-graphite-600">
        <p aria-live="polite">
          {window ? `Window ${formatClock(domain[0])} – ${formatClock(domain[1])}` : `Whole run, ${formatClock(0)} – ${formatClock(domain[1])}`}
          {' · '}
          {(() => {
            const plotted = Math.max(0, ...QUANTITIES.map((q) => series.reduce((n, s) => n + (s?.traces[q.key]?.t.length ?? 0), 0)));
            const samples = series.reduce((n, s) => n + (s?.samplesInWindow ?? 0), 0);
            return plotted >= samples
              ? `every one of ${samples.toLocaleString('en-GB')} samples plotted`
              : `${plotted.toLocaleString('en-GB')} of ${samples.toLocaleString('en-GB')} samples plotted per quantity (LTTB downsampling on the server; zoom in for full resolution)`;
          })()}
          {fetching && ' · updating…'}
        </p>
        <div className="flex items-center gap-2">
          <span className="text-graphite-500">Drag across a chart to zoom.</span>
          {window && (
            <>
              <Button
                size="sm"
                variant="ghost"
                onClick={() => {
                  const span = window.to - window.from;
                  const from = Math.max(0, window.from - span / 2);
                  const to = Math.min(domain[1] + span, window.to + span / 2);
                  setWindow(from <= 0 && to >= fullTo ? null : { from, to });
                }}
              >
                <ZoomOut className="size-4" aria-hidden /> Zoom out
              </Button>
              <Button size="sm" onClick={() => setWindow(null)}>
                Whole run
              </Button>
            </>
          )}
        </div>
      </div>
      {runs.length > 1 && (
        <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs" aria-label="Runs in the overlay">
          {runs.map((r, idx) => (
            <li key={r.id} className="flex items-center gap-2">
              <Swatch idx={idx} />
              <span className="font-medium text-graphite-800">
                {r.device.maker} {r.device.model}
              </span>
              <span className="text-graphite-500">{r.label}</span>
            </li>
          ))}
        </ul>
      )}
      {shown.map((q) => (
        <QuantityChart key={q.key} q={q} runs={runs} traces={series.map((s) => s?.traces[q.key])} domain={domain} onZoom={setWindow} syncId={`runs-${ids.join('-')}`} />
      ))}
      {shown.length === 0 && <p className="text-sm text-graphite-500">These runs have no quantity in common to plot.</p>}
      <WindowForm domain={domain} onZoom={setWindow} />
    </div>
  );
}

export default RunCharts;
