// Charts of one run or an overlay of up to four: voltage, current, power and temperature against
// time, from the server's downsampled series. Hover for a read-out of every run at that time; drag
// across a chart to zoom (the window is fetched again at up to full resolution). Each chart has its
// data table. Loaded lazily: the chart library is large.
import { useMemo, useState, type ReactNode } from 'react';
import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { ZoomOut } from 'lucide-react';
import type { RunDto, RunSeries } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { DataTable, type Column } from '@/components/data-table';
import { ErrorPanel } from '@/components/error-boundary';
import { Input } from '@/components/field';
import { Spinner } from '@/components/page';
import { sig } from '@/lib/format';
import { useLiveState } from '@/lib/use-live-state';
import { useRunSeries, type SeriesWindow } from '../api/run-series';
import { formatClock, niceTimeTicks, timeAxisUnit } from './time-format';

/** Okabe–Ito colours (tailwind series-*) and a dash pattern each, so runs differ by more than colour. */
export const RUN_STYLES = [
  { text: 'text-series-blue', bg: 'bg-series-blue', dash: undefined, dashName: 'solid' },
  { text: 'text-series-vermilion', bg: 'bg-series-vermilion', dash: '7 3', dashName: 'dashed' },
  { text: 'text-series-green', bg: 'bg-series-green', dash: '2 2', dashName: 'dotted' },
  { text: 'text-series-orange', bg: 'bg-series-orange', dash: '9 3 2 3', dashName: 'dash-dot' },
] as const;

type TraceKey = 'v' | 'i' | 'p' | 'temp';
const QUANTITIES: { key: TraceKey; label: string; unit: string }[] = [
  { key: 'v', label: 'Voltage', unit: 'V' },
  { key: 'i', label: 'Current', unit: 'A' },
  { key: 'p', label: 'Power', unit: 'W' },
  { key: 'temp', label: 'Temperature', unit: '°C' },
];

type Trace = { t: number[]; y: number[] };
type Row = { t: number } & Record<string, number | undefined>;

/** Value of a trace nearest to time t (binary search). */
function nearest(trace: Trace | undefined, t: number): { t: number; y: number } | null {
  if (!trace || trace.t.length === 0) return null;
  let lo = 0;
  let hi = trace.t.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (trace.t[mid]! <= t) lo = mid;
    else hi = mid;
  }
  const k = Math.abs(trace.t[lo]! - t) <= Math.abs(trace.t[hi]! - t) ? lo : hi;
  return { t: trace.t[k]!, y: trace.y[k]! };
}

/** One row per distinct time across the runs; each run's value in its own key (r0, r1…). */
function mergeTraces(traces: (Trace | undefined)[]): Row[] {
  const byTime = new Map<number, Row>();
  traces.forEach((trace, idx) => {
    if (!trace) return;
    for (let k = 0; k < trace.t.length; k++) {
      const t = trace.t[k]!;
      let row = byTime.get(t);
      if (!row) {
        row = { t };
        byTime.set(t, row);
      }
      row[`r${idx}`] = trace.y[k]!;
    }
  });
  return [...byTime.values()].sort((a, b) => a.t - b.t);
}

const valueText = (y: number, unit: string) => `${sig(y, 4)} ${unit}`;

/** The line style of a run: its colour and its dash pattern. */
function Swatch({ idx }: { idx: number }) {
  const style = RUN_STYLES[idx]!;
  return (
    <svg width="24" height="6" aria-hidden className={`shrink-0 ${style.text}`}>
      <line x1="0" y1="3" x2="24" y2="3" stroke="currentColor" strokeWidth="2" strokeDasharray={style.dash} />
    </svg>
  );
}

/** Round ticks covering [min, max]: steps of 1, 2, 2.5 or 5 × 10ⁿ. */
function niceTicks(min: number, max: number, target = 5): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return [];
  if (max - min < 1e-12) {
    const pad = Math.abs(min) * 0.05 || 1;
    return niceTicks(min - pad, max + pad, target);
  }
  const raw = (max - min) / target;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * magnitude >= raw) ?? 10) * magnitude;
  const first = Math.floor(min / step) * step;
  const ticks: number[] = [];
  for (let x = first; x < max + step - step * 1e-9; x += step) ticks.push(Number(x.toPrecision(12)));
  return ticks;
}

function ReadOut({ active, label, runs, traces, unit }: { active?: boolean; label?: number | string; runs: RunDto[]; traces: (Trace | undefined)[]; unit: string }) {
  if (!active || label === undefined) return null;
  const t = Number(label);
  return (
    <div className="rounded-md border border-graphite-150 bg-white px-3 py-2 text-xs shadow-pop">
      <p className="num mb-1 font-semibold text-graphite-800">t = {formatClock(t)}</p>
      <ul className="space-y-0.5">
        {runs.map((r, idx) => {
          const point = nearest(traces[idx], t);
          return (
            <li key={r.id} className="flex items-center gap-2">
              <Swatch idx={idx} />
              <span className="max-w-48 truncate text-graphite-600">{runs.length > 1 ? `${r.device.maker} ${r.device.model}` : r.label}</span>
              <span className="num ml-auto font-medium text-graphite-950">{point ? valueText(point.y, unit) : '—'}</span>
            </li>
          );
        })}
      </ul>
    </div>
  );
}

/** Lines and bands marking what the analysis found, for the first run. */
function markersFor(run: RunDto, key: TraceKey): ReactNode[] {
  const a = run.analysis;
  const out: ReactNode[] = [];
  // For a horizontal line, insideBottom… puts the text above the line and insideTop… below it.
  const label = (value: string, position: 'insideTopRight' | 'insideTopLeft' | 'insideBottomRight' = 'insideTopRight') => ({ value, position, fontSize: 11, fill: 'currentColor' });
  if (key === 'v' && a.discharge) {
    if (a.discharge.cutoffVolts) out.push(<ReferenceLine key="cutoff-v" y={a.discharge.cutoffVolts} className="text-graphite-400" stroke="currentColor" strokeDasharray="4 3" label={label(`cut-off ${sig(a.discharge.cutoffVolts, 3)} V`, 'insideBottomRight')} />);
    if (a.discharge.cutoff) out.push(<ReferenceLine key="cutoff-t" x={a.discharge.analysedToS} className="text-graphite-500" stroke="currentColor" label={label('end of totals', 'insideTopRight')} />);
  }
  if (a.charge) {
    if (a.charge.transitionS !== null && (key === 'v' || key === 'i')) out.push(<ReferenceLine key="cv" x={a.charge.transitionS} className="text-graphite-500" stroke="currentColor" strokeDasharray="4 3" label={label('CC → CV', 'insideTopRight')} />);
    if (key === 'i') out.push(<ReferenceLine key="term" y={a.charge.terminationCurrentA} className="text-graphite-400" stroke="currentColor" strokeDasharray="4 3" label={label(`termination ${sig(a.charge.terminationCurrentA, 3)} A`, 'insideBottomRight')} />);
  }
  if (key === 'temp' && a.thermal) {
    const th = a.thermal;
    if (th.steadyState.reached && th.steadyState.fromS !== null && th.steadyState.toS !== null) {
      out.push(<ReferenceArea key="steady" x1={th.steadyState.fromS} x2={th.steadyState.toS} className="text-cell-400" fill="currentColor" fillOpacity={0.08} label={label('steady state', 'insideBottomRight')} />);
    }
    out.push(<ReferenceLine key="burn" y={th.burnThreshold.temperatureC} className="text-brick-600" stroke="currentColor" strokeDasharray="5 3" label={label(`burn threshold ${th.burnThreshold.temperatureC} °C`, 'insideBottomRight')} />);
    if (th.thresholdC !== null) out.push(<ReferenceLine key="threshold" y={th.thresholdC} className="text-graphite-400" stroke="currentColor" strokeDasharray="2 3" label={label(`${sig(th.thresholdC, 3)} °C`, 'insideTopRight')} />);
  }
  return out;
}

interface TableRow {
  id: string;
  run: string;
  t: number;
  y: number;
}

function ChartTable({ runs, traces, label, unit }: { runs: RunDto[]; traces: (Trace | undefined)[]; label: string; unit: string }) {
  const [open, setOpen] = useState(false);
  const count = traces.reduce((n, tr) => n + (tr?.t.length ?? 0), 0);
  const rows = useMemo<TableRow[]>(() => {
    if (!open) return [];
    const out: TableRow[] = [];
    traces.forEach((tr, idx) => {
      if (!tr) return;
      const name = runs.length > 1 ? `${runs[idx]!.device.maker} ${runs[idx]!.device.model} · ${runs[idx]!.label}` : runs[idx]!.label;
      for (let k = 0; k < tr.t.length; k++) out.push({ id: `${idx}-${k}`, run: name, t: tr.t[k]!, y: tr.y[k]! });
    });
    return out;
  }, [open, traces, runs]);
  const columns = useMemo<Column<TableRow>[]>(
    () => [
      ...(runs.length > 1 ? [{ id: 'run', header: 'Run', value: (r: TableRow) => r.run, filter: 'select' as const }] : []),
      { id: 't', header: 'Time (s)', value: (r) => r.t, align: 'right', cell: (r) => sig(r.t, 6) },
      { id: 'clock', header: 'Time (h:mm:ss)', value: (r) => r.t, align: 'right', cell: (r) => formatClock(r.t), sortable: false },
      { id: 'y', header: `${label} (${unit})`, value: (r) => r.y, align: 'right', cell: (r) => sig(r.y, 5) },
    ],
    [runs.length, label, unit],
  );
  return (
    <details className="mt-1 text-sm" onToggle={(e) => setOpen((e.target as HTMLDetailsElement).open)}>
      <summary className="cursor-pointer select-none text-xs font-medium text-copper-700">
        Data table: {label.toLowerCase()}, {count.toLocaleString('en-GB')} plotted points
      </summary>
      {open && (
        <div className="mt-2">
          <DataTable rows={rows} columns={columns} rowId={(r) => r.id} caption={`${label} against time, plotted points`} maxHeight="18rem" />
        </div>
      )}
    </details>
  );
}

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
    for (const tr of traces) for (const y of tr?.y ?? []) {
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
function WindowForm({ domain, onZoom }: { domain: [number, number]; onZoom: (w: SeriesWindow) => void }) {
  const axis = timeAxisUnit(domain[1] - domain[0]);
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const [error, setError] = useState<string | null>(null);
  return (
    <form
      className="flex flex-wrap items-end gap-2 text-xs"
      onSubmit={(e) => {
        e.preventDefault();
        const f = Number(from.replace(',', '.'));
        const t = Number(to.replace(',', '.'));
        if (!Number.isFinite(f) || !Number.isFinite(t) || from === '' || to === '' || t <= f || f < 0) {
          setError(`Give a start and a later end, in ${axis.unit}.`);
          return;
        }
        setError(null);
        onZoom({ from: f * axis.divisor, to: t * axis.divisor });
      }}
    >
      <label className="w-24 space-y-0.5">
        <span className="block text-graphite-500">From ({axis.unit})</span>
        <Input className="h-8" inputMode="decimal" value={from} onChange={(e) => setFrom(e.target.value)} aria-invalid={Boolean(error)} />
      </label>
      <label className="w-24 space-y-0.5">
        <span className="block text-graphite-500">To ({axis.unit})</span>
        <Input className="h-8" inputMode="decimal" value={to} onChange={(e) => setTo(e.target.value)} aria-invalid={Boolean(error)} />
      </label>
      <Button type="submit" size="sm">
        Show window
      </Button>
      {error && (
        <span role="alert" className="text-brick-700">
          {error}
        </span>
      )}
    </form>
  );
}

/** Charts of the given runs (the first one's analysis markers are drawn). */
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
