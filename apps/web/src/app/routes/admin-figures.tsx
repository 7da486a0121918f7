import { RequireRole } from '@/app/guards';
import { PageHeader } from '@/components/page';
import { AdminTabs } from '@/features/admin/components/admin-tabs';
import { FigureSettingsPanel } from '@/features/admin/components/figure-settings-panel';

/** The workspace settings behind the touch-temperature and runtime figures. */
export function Component() {
  return (
    <RequireRole roles={['admin']}>
      <PageHeader
        eyebrow="Admin"
        title="Figures & safety"
        subtitle="How long skin is assumed to stay on a heated surface, by device category, and how much of a pack's rated energy a runtime counts on when no discharge run measured it."
      />
      <AdminTabs />
      <FigureSettingsPanel />
    </RequireRole>
  );
}
