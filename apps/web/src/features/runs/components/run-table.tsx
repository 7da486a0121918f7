import { useMemo } from 'react';
import { CircleCheck, TriangleAlert } from 'lucide-react';
import { RUN_KIND, type RunDto } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import { DataTable, type Column } from '@/components/data-table';
import { formatDate, formatQuantity, sig } from '@/lib/format';
import { formatElapsed } from './time-format';

/** The headline result of a run, in a few words with units. */
export function runHeadline(run: RunDto): string {
  const a = run.analysis;
  if (run.kind === 'discharge') return `${formatQuantity(a.ampHours, 'Ah')} · ${formatQuantity(a.wattHours, 'Wh')}`;
  if (run.kind === 'charge') return `${formatQuantity(a.ampHours, 'Ah')} in ${formatElapsed(a.charge?.chargeTimeS)}`;
  if (run.kind === 'thermal' && a.thermal) return `peak ${sig(a.thermal.maxC, 3)} °C · margin ${a.thermal.marginC >= 0 ? '+' : '−'}${sig(Math.abs(a.thermal.marginC), 2)} °C`;
  if (run.kind === 'power-bank' && a.powerBank) return `${formatQuantity(a.wattHours, 'Wh')} out · η ${sig(a.powerBank.efficiency * 100, 3)} %`;
  return '—';
}

/** Percentage against the label, with a badge (never colour alone). */
export function LabelVerdict({ run }: { run: RunDto }) {
  const c = run.comparison;
  const item = c.label ?? c.labelEnergy;
  if (!item) return <span className="text-graphite-400">—</span>;
  return item.warning ? (
    <Badge tone="amber" icon={TriangleAlert} title="Below the warning threshold">
      {sig(item.percent, 3)} %
    </Badge>
  ) : (
    <Badge tone="cell" icon={CircleCheck}>
      {sig(item.percent, 3)} %
    </Badge>
  );
}

/** A sortable list of runs; `withDevice` adds the device and filters (lists across teardowns). */
export function RunTable({ runs, onSelect, selectedId, withDevice = false }: { runs: RunDto[]; onSelect: (run: RunDto) => void; selectedId?: number | undefined; withDevice?: boolean }) {
  const columns = useMemo<Column<RunDto>[]>(
    () => [
      ...(withDevice
        ? [
            {
              id: 'device',
              header: 'Device',
              value: (r: RunDto) => `${r.device.maker} ${r.device.model}`,
              filter: 'text' as const,
              cell: (r: RunDto) => (
                <span>
                  {r.device.maker} {r.device.model}
                  {r.unitLabel && <span className="text-graphite-500"> · {r.unitLabel}</span>}
                </span>
              ),
            },
          ]
        : []),
      {
        id: 'label',
        header: 'Run',
        value: (r) => r.label,
        filter: withDevice ? 'text' : false,
        className: 'min-w-56',
        cell: (r) => (
          <div className="py-0.5">
            <button
              type="button"
              onClick={() => onSelect(r)}
              aria-current={r.id === selectedId ? 'true' : undefined}
              className={`text-left hover:underline ${r.id === selectedId ? 'font-semibold text-copper-800' : 'font-medium text-graphite-900'}`}
            >
              {r.label}
            </button>
            <div className="text-xs text-graphite-500">
              {RUN_KIND.labels[r.kind]} · {formatElapsed(r.durationS)} · {r.samples.toLocaleString('en-GB')} samples
            </div>
          </div>
        ),
      },
      ...(withDevice ? [{ id: 'kind', header: 'Kind', value: (r: RunDto) => RUN_KIND.labels[r.kind], filter: 'select' as const }] : []),
      { id: 'result', header: 'Result', value: (r) => runHeadline(r), sortable: false, cell: (r) => <span className="num whitespace-nowrap">{runHeadline(r)}</span> },
      { id: 'label-pct', header: 'Vs label', value: (r) => r.comparison.label?.percent ?? r.comparison.labelEnergy?.percent, align: 'right', cell: (r) => <LabelVerdict run={r} /> },
      ...(withDevice
        ? [{ id: 'added', header: 'Added', value: (r: RunDto) => r.createdAt, cell: (r: RunDto) => <span className="whitespace-nowrap text-graphite-600">{formatDate(r.createdAt)}</span> }]
        : []),
    ],
    [withDevice, selectedId, onSelect],
  );
  return <DataTable rows={runs} columns={columns} rowId={(r) => String(r.id)} onRowClick={onSelect} caption="Bench runs" maxHeight="22rem" />;
}
