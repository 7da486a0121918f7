import { RequireRole } from '@/app/guards';
import { PageHeader } from '@/components/page';
import { AdminTabs } from '@/features/admin/components/admin-tabs';
import { InvitationsPanel } from '@/features/admin/components/invitations-panel';

export function Component() {
  return (
    <RequireRole roles={['admin']}>
      <PageHeader eyebrow="Admin" title="Invitations" />
      <AdminTabs />
      <InvitationsPanel />
    </RequireRole>
  );
}
