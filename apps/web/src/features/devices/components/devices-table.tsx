import { useNavigate } from 'react-router';
import { DEVICE_CATEGORY, type DeviceDto } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import { DataTable, type Column } from '@/components/data-table';
import { StatusBadge } from '@/components/status';
import { paths } from '@/config/paths';
import { formatMoney } from '@/lib/format';
import { labelCapacity } from './claims';

const STATUS_ORDER = { draft: 'Draft', in_review: 'In review', published: 'Published' } as const;

export function DevicesTable({ devices }: { devices: DeviceDto[] }) {
  const navigate = useNavigate();
  const columns: Column<DeviceDto>[] = [
    { id: 'maker', header: 'Maker', value: (d) => d.maker, filter: 'text', className: 'font-medium' },
    { id: 'model', header: 'Model', value: (d) => d.model, filter: 'text' },
    { id: 'category', header: 'Category', value: (d) => DEVICE_CATEGORY.labels[d.category], filter: 'select' },
    {
      id: 'price',
      header: 'Retail price',
      align: 'right',
      value: (d) => d.retailPrice ?? undefined,
      cell: (d) => (d.retailPrice === null ? <span className="text-graphite-400">—</span> : formatMoney(d.retailPrice, d.currency ?? 'USD')),
    },
    { id: 'currency', header: 'Cur.', value: (d) => d.currency ?? '', filter: 'select', className: 'font-mono text-xs text-graphite-600' },
    { id: 'capacity', header: 'Label capacity', value: (d) => d.claimCapacityAh ?? undefined, cell: (d) => labelCapacity(d) ?? <span className="text-graphite-400">—</span>, className: 'num' },
    {
      id: 'status',
      header: 'Teardown',
      value: (d) => (d.latestTeardown ? STATUS_ORDER[d.latestTeardown.status] : 'None yet'),
      filter: 'select',
      cell: (d) =>
        d.latestTeardown ? (
          <span className="inline-flex items-center gap-2">
            <StatusBadge status={d.latestTeardown.status} />
            {d.teardownCount > 1 && <span className="text-xs text-graphite-500">+{d.teardownCount - 1} more</span>}
          </span>
        ) : (
          <Badge>None yet</Badge>
        ),
    },
  ];
  return (
    <DataTable
      caption="Devices"
      rows={devices}
      columns={columns}
      rowId={(d) => String(d.id)}
      onRowClick={(d) => navigate(paths.device(d.id))}
      initialSort={{ id: 'maker' }}
      empty="No devices yet. Add the first one with New device."
      maxHeight="calc(100vh - 12rem)"
    />
  );
}
