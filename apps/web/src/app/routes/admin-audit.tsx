import { RequireRole } from '@/app/guards';
import { PageHeader } from '@/components/page';
import { AdminTabs } from '@/features/admin/components/admin-tabs';
import { AuditPanel } from '@/features/admin/components/audit-panel';

export function Component() {
  return (
    <RequireRole roles={['admin']}>
      <PageHeader eyebrow="Admin" title="Audit log" />
      <AdminTabs />
      <AuditPanel />
    </RequireRole>
  );
}
