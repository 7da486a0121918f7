import { PageHeader } from '@/components/page';
import { paths } from '@/config/paths';
import { useMe } from '@/lib/session';
import { CapacityWarningSetting } from '@/features/runs/components/capacity-warning-setting';
import { CutoffDebounceSetting } from '@/features/runs/components/cutoff-debounce-setting';
import { RunsOverview } from '@/features/runs/components/runs-overview';

/** Bench runs across devices: overlay the same test on several units, the capacity warning and cut-off debounce settings. */
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
        <div className="space-y-5">
          <CapacityWarningSetting canEdit={me?.role === 'admin'} />
          <CutoffDebounceSetting canEdit={me?.role === 'admin'} />
        </div>
      </div>
    </div>
  );
}
