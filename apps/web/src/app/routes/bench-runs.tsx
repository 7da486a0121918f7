import { PageHeader } from '@/components/page';
import { paths } from '@/config/paths';
import { useMe } from '@/lib/session';
import { CapacityWarningSetting } from '@/features/runs/components/capacity-warning-setting';
import { RunsOverview } from '@/features/runs/components/runs-overview';

/** Bench runs across devices: overlay the same test on several units, and the capacity warning setting. */
export function Component() {
  const me = useMe().data;
  return (
    <div>
      <PageHeader
        eyebrow="Bench tools"
        title="Bench runs"
        subtitle="Discharge, charge, thermal and power-bank logs from every teardown you can open. Pick up to four to plot on one time axis; each run's own figures are in its teardown."
      />
      <div className="grid gap-5 xl:grid-cols-[minmax(0,1fr)_20rem]">
        <RunsOverview teardownLink={(r) => paths.teardownRun(r.teardownId, r.id)} />
        <div>
          <CapacityWarningSetting canEdit={me?.role === 'admin'} />
        </div>
      </div>
    </div>
  );
}
