import { RequireRole } from '@/app/guards';
import { PageHeader } from '@/components/page';
import { AdminTabs } from '@/features/admin/components/admin-tabs';
import { BackupLine } from '@/features/admin/components/backup-line';
import { SessionSettings } from '@/features/admin/components/session-settings';
import { UsersPanel } from '@/features/admin/components/users-panel';

export function Component() {
  return (
    <RequireRole roles={['admin']}>
      <PageHeader eyebrow="Admin" title="Users" />
      <AdminTabs />
      <BackupLine />
      <UsersPanel />
      <div className="mt-6">
        <SessionSettings />
      </div>
    </RequireRole>
  );
}
