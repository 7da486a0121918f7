import { RequireRole } from '@/app/guards';
import { PageHeader } from '@/components/page';
import { AdminTabs } from '@/features/admin/components/admin-tabs';
import { OutboxPanel } from '@/features/admin/components/outbox-panel';

export function Component() {
  return (
    <RequireRole roles={['admin']}>
      <PageHeader eyebrow="Admin" title="Outbox" />
      <AdminTabs />
      <OutboxPanel />
    </RequireRole>
  );
}
