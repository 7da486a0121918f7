// The pieces of the run charts: line styles, merging the runs' traces, the hover read-out, the
// analysis markers and the data table under each chart.
import { useMemo, useState, type ReactNode } from 'react';
import { ReferenceArea, ReferenceLine } from 'recharts';
import type { RunDto } from '@splitcase/contracts';
import { DataTable, type Column } from '@/components/data-table';
import { sig } from '@/lib/format';
import { formatClock } from './time-format';

export const RUN_STYLES = [
  { text: 'text-series-blue', bg: 'bg-series-blue', dash: undefined, dashName: 'solid' },
  { text: 'text-series-vermilion', bg: 'bg-series-vermilion', dash: '7 3', dashName: 'dashed' },
  { text: 'text-series-green', bg: 'bg-series-green', dash: '2 2', dashName: 'dotted' },
  { text: 'text-series-orange', bg: 'bg-series-orange', dash: '9 3 2 3', dashName: 'dash-dot' },
] as const;

export type TraceKey = 'v' | 'i' | 'p' | 'temp';
export const QUANTITIES: { key: TraceKey; label: string; unit: string }[] = [
  { key: 'v', label: 'Voltage', unit: 'V' },
  { key: 'i', label: 'Current', unit: 'A' },
  { key: 'p', label: 'Power', unit: 'W' },
  { key: 'temp', label: 'Temperature', unit: '°C' },
];

export type Trace = { t: number[]; y: number[] };
export type Row = { t: number } & Record<string, number | undefined>;

/** Value of a trace nearest to time t (binary search). */
export function nearest(trace: Trace | undefined, t: number): { t: number; y: number } | null {
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
export function mergeTraces(traces: (Trace | undefined)[]): Row[] {
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

export const valueText = (y: number, unit: string) => `${sig(y, 4)} ${unit}`;

/** The line style of a run: its colour and its dash pattern. */
export function Swatch({ idx }: { idx: number }) {
  const style = RUN_STYLES[idx]!;
  return (
    <svg width="24" height="6" aria-hidden className={`shrink-0 ${style.text}`}>
      <line x1="0" y1="3" x2="24" y2="3" stroke="currentColor" strokeWidth="2" strokeDasharray={style.dash} />
    </svg>
  );
}

/** Round ticks covering [min, max]: steps of 1, 2, 2.5 or 5 × 10ⁿ. */
export function niceTicks(min: number, max: number, target = 5): number[] {
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

export function ReadOut({ active, label, runs, traces, unit }: { active?: boolean; label?: number | string; runs: RunDto[]; traces: (Trace | undefined)[]; unit: string }) {
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
export function markersFor(run: RunDto, key: TraceKey): ReactNode[] {
  const a = run.analysis;
  const out: ReactNode[] = [];
  // For a horizontal line, insideBottom… puts the text above the line and insideTop… below it.
  const label = (value: string, position: 'insideTopRight' | 'insideTopLeft' | 'insideBottomRight' = 'insideTopRight') => ({ value, position, fontSize: 11, fill: 'currentColor' });
  if (key === 'v' && a.discharge) {
    if (a.discharge.cutoffVolts)
      out.push(
        <ReferenceLine
          key="cutoff-v"
          y={a.discharge.cutoffVolts}
          className="text-graphite-400"
          stroke="currentColor"
          strokeDasharray="4 3"
          label={label(`cut-off ${sig(a.discharge.cutoffVolts, 3)} V`, 'insideBottomRight')}
        />,
      );
    if (a.discharge.cutoff) out.push(<ReferenceLine key="cutoff-t" x={a.discharge.analysedToS} className="text-graphite-500" stroke="currentColor" label={label('end of totals', 'insideTopRight')} />);
  }
  if (a.charge) {
    if (a.charge.transitionS !== null && (key === 'v' || key === 'i'))
      out.push(<ReferenceLine key="cv" x={a.charge.transitionS} className="text-graphite-500" stroke="currentColor" strokeDasharray="4 3" label={label('CC → CV', 'insideTopRight')} />);
    if (key === 'i')
      out.push(
        <ReferenceLine
          key="term"
          y={a.charge.terminationCurrentA}
          className="text-graphite-400"
          stroke="currentColor"
          strokeDasharray="4 3"
          label={label(`termination ${sig(a.charge.terminationCurrentA, 3)} A`, 'insideBottomRight')}
        />,
      );
  }
  if (key === 'temp' && a.thermal) {
    const th = a.thermal;
    if (th.steadyState.reached && th.steadyState.fromS !== null && th.steadyState.toS !== null) {
      out.push(
        <ReferenceArea
          key="steady"
          x1={th.steadyState.fromS}
          x2={th.steadyState.toS}
          className="text-cell-400"
          fill="currentColor"
          fillOpacity={0.08}
          label={label('steady state', 'insideBottomRight')}
        />,
      );
    }
    out.push(
      <ReferenceLine
        key="burn"
        y={th.burnThreshold.temperatureC}
        className="text-brick-600"
        stroke="currentColor"
        strokeDasharray="5 3"
        label={label(`burn threshold ${th.burnThreshold.temperatureC} °C`, 'insideBottomRight')}
      />,
    );
    if (th.thresholdC !== null)
      out.push(
        <ReferenceLine key="threshold" y={th.thresholdC} className="text-graphite-400" stroke="currentColor" strokeDasharray="2 3" label={label(`${sig(th.thresholdC, 3)} °C`, 'insideTopRight')} />,
      );
  }
  return out;
}

interface TableRow {
  id: string;
  run: string;
  t: number;
  y: number;
}

export function ChartTable({ runs, traces, label, unit }: { runs: RunDto[]; traces: (Trace | undefined)[]; label: string; unit: string }) {
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
