import type { AuditEntry } from '@splitcase/contracts';
import { DataTable, type Column } from '@/components/data-table';
import { ErrorPanel } from '@/components/error-boundary';
import { Spinner } from '@/components/page';
import { formatDateTime } from '@/lib/format';
import { useAudit } from '../api/audit';

const columns: Column<AuditEntry>[] = [
  { id: 'at', header: 'When', value: (a) => a.at, cell: (a) => <span className="num whitespace-nowrap">{formatDateTime(a.at)}</span> },
  { id: 'actor', header: 'Who', value: (a) => a.actor ?? 'system', filter: 'select' },
  { id: 'action', header: 'Action', value: (a) => a.action, filter: 'select', className: 'font-mono text-xs' },
  { id: 'entity', header: 'Record', value: (a) => `${a.entityType} #${a.entityId}`, filter: 'text', className: 'whitespace-nowrap' },
  { id: 'summary', header: 'What changed', value: (a) => a.summary, filter: 'text' },
];

export function AuditPanel() {
  const audit = useAudit();
  if (audit.isPending) return <Spinner />;
  if (audit.isError) return <ErrorPanel error={audit.error} />;
  return <DataTable caption="Audit log" rows={audit.data} columns={columns} rowId={(a) => String(a.id)} initialSort={{ id: 'at', desc: true }} maxHeight="72vh" empty="No changes recorded yet." />;
}
