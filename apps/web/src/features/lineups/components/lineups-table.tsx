import { useNavigate } from 'react-router';
import { LINEUP_STATUS, type LineupDto } from '@splitcase/contracts';
import { DataTable, type Column } from '@/components/data-table';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/format';
import { LineupStatusBadge } from './lineup-status';

export function LineupsTable({ lineups, empty }: { lineups: LineupDto[]; empty: string }) {
  const navigate = useNavigate();
  const columns: Column<LineupDto>[] = [
    { id: 'name', header: 'Lineup', value: (l) => l.name, filter: 'text', className: 'font-medium' },
    {
      id: 'devices',
      header: 'Devices',
      value: (l) => l.devices.map((d) => `${d.maker} ${d.model}`).join(', '),
      filter: 'text',
      cell: (l) => (
        <span className="block max-w-xl truncate text-graphite-700" title={l.devices.map((d) => `${d.maker} ${d.model}`).join('\n')}>
          <span className="num mr-1.5 font-medium text-graphite-950">{l.devices.length}</span>
          {l.devices.map((d) => d.model).join(' · ')}
          {l.hiddenDevices > 0 && <span className="text-graphite-500"> · {l.hiddenDevices} not published yet</span>}
        </span>
      ),
    },
    { id: 'currency', header: 'Currency', value: (l) => l.currency, filter: 'select', className: 'font-mono text-xs text-graphite-600' },
    { id: 'status', header: 'Status', value: (l) => LINEUP_STATUS.labels[l.status], filter: 'select', cell: (l) => <LineupStatusBadge status={l.status} /> },
    { id: 'by', header: 'Built by', value: (l) => l.createdBy?.name ?? '—', filter: 'select' },
    { id: 'updated', header: 'Changed', value: (l) => l.updatedAt, cell: (l) => <span className="num">{formatDate(l.updatedAt)}</span> },
  ];
  return (
    <DataTable
      caption="Lineups"
      rows={lineups}
      columns={columns}
      rowId={(l) => String(l.id)}
      onRowClick={(l) => navigate(paths.lineup(l.id))}
      initialSort={{ id: 'updated', desc: true }}
      empty={empty}
      maxHeight="calc(100vh - 12rem)"
    />
  );
}
