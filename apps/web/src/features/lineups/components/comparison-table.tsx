import { Link } from 'react-router';
import { CircleAlert } from 'lucide-react';
import { DEVICE_CATEGORY, type ComparisonDto, type ComparisonRowDto } from '@splitcase/contracts';
import { DataTable, type Column } from '@/components/data-table';
import { StatusBadge } from '@/components/status';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/format';
import { coverageText, lackedMetricsText, metricText, rowMode, rowModeText, scoreText, shortHeader } from './display';

/** A missing value: "—" with the reason on hover (and for screen readers), never a zero. */
export function Missing({ reason }: { reason: string }) {
  return (
    <span title={reason} className="relative cursor-help text-graphite-400 underline decoration-graphite-300 decoration-dotted underline-offset-2" data-missing>
      —<span className="sr-only"> (missing: {reason})</span>
    </span>
  );
}

/**
 * The normalised comparison: one row per device, one column per metric with its unit, sortable.
 * Hover a value to see where it comes from, a "—" to see why it is missing.
 */
export function ComparisonTable({ comparison }: { comparison: ComparisonDto }) {
  const metricColumns: Column<ComparisonRowDto>[] = comparison.metrics
    .filter((m) => m.applies)
    .map((m) => ({
      id: m.key,
      header: shortHeader(m),
      align: 'right',
      value: (r) => r.metrics[m.key] ?? undefined,
      cell: (r) => {
        const v = r.metrics[m.key];
        if (v === null || v === undefined) return <Missing reason={r.missing[m.key] ?? 'Not recorded.'} />;
        return (
          <span title={r.sources[m.key]} className="whitespace-nowrap">
            {metricText(v, m)}
          </span>
        );
      },
    }));
  const columns: Column<ComparisonRowDto>[] = [
    { id: 'rank', header: 'Rank', align: 'right', value: (r) => r.rank, cell: (r) => <span className="font-semibold">{r.rank}</span> },
    {
      id: 'device',
      header: 'Device',
      value: (r) => r.device.label,
      cell: (r) => (
        <span className="block min-w-44">
          <Link to={paths.device(r.deviceId)} className="font-medium text-graphite-950 hover:text-copper-700 hover:underline">
            {r.device.label}
          </Link>
          <span className="block text-xs text-graphite-500">{DEVICE_CATEGORY.labels[r.device.category]}</span>
        </span>
      ),
    },
    {
      id: 'teardown',
      header: 'Figures from',
      value: (r) => r.teardown?.date,
      cell: (r) =>
        r.teardown ? (
          <span className="block whitespace-nowrap text-xs">
            <Link to={paths.teardown(r.teardown.id)} className="text-copper-700 hover:underline">
              Teardown #{r.teardown.id}
            </Link>
            <span className="ml-1 text-graphite-500">{formatDate(r.teardown.date)}</span>
            <span className="mt-0.5 block">
              <StatusBadge status={r.teardown.status} />
            </span>
          </span>
        ) : (
          <Missing reason={r.missing.packWh ?? 'No teardown yet.'} />
        ),
    },
    {
      id: 'mode',
      header: 'Runtime from mode',
      value: (r) => rowModeText(r),
      cell: (r) => {
        const m = rowMode(r);
        if (m.kind === 'mode')
          return (
            <span className="block min-w-36 text-xs" data-testid="row-mode">
              <span className="font-medium text-graphite-950">{m.name}</span> <span className="text-graphite-600">— {m.reason}</span>
            </span>
          );
        if (m.kind === 'no-modes')
          return (
            <span className="block min-w-36 text-xs text-graphite-600" data-testid="row-mode">
              No modes recorded <span className="block">(the main load at its recorded duty)</span>
            </span>
          );
        return (
          <span className="block min-w-36 text-xs text-graphite-600" data-testid="row-mode">
            {m.reason}
          </span>
        );
      },
    },
    {
      id: 'score',
      header: 'Score',
      align: 'right',
      value: (r) => r.score ?? undefined,
      cell: (r) => {
        const lacks = lackedMetricsText(r, comparison.metrics);
        const partial = coverageText(r.coverage);
        const incomplete = lacks && (
          <span className="mt-0.5 flex items-start justify-end gap-1 whitespace-normal text-left text-xs font-normal text-amber-800" data-testid="row-incomplete">
            <CircleAlert className="mt-px size-3.5 shrink-0" aria-hidden />
            <span>Incomplete, lacks {lacks}</span>
          </span>
        );
        if (r.score === null)
          return (
            <span className="block min-w-36">
              <Missing reason="None of the weighted metrics is known for this device." />
              {incomplete}
            </span>
          );
        return (
          <span className="block min-w-36 font-semibold text-copper-800" title={partial ? `Scored ${partial}` : 'Scored on every weighted metric'}>
            {scoreText(r.score)}
            {incomplete}
          </span>
        );
      },
    },
    ...metricColumns,
  ];
  return (
    <DataTable
      caption="Normalised comparison"
      rows={comparison.rows}
      columns={columns}
      rowId={(r) => String(r.deviceId)}
      initialSort={{ id: 'rank' }}
      dense
      empty="No device of this lineup is visible to you yet."
    />
  );
}
