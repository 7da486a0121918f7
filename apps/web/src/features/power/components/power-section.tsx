import type { TeardownDto } from '@splitcase/contracts';
import { ErrorPanel } from '@/components/error-boundary';
import { Spinner } from '@/components/page';
import { PublishedEditNotice, useEditGate } from '@/components/published-edit';
import { usePower } from '../api/power';
import { ConvertersCard } from './converters-card';
import { HOT_SURFACE_CAUTION } from '@splitcase/contracts';
import { Caution } from '@/components/caution';
import { LithiumCaution } from '@/components/safety';
import { LoadsCard } from './loads-card';
import { ModesCard } from './modes-card';
import { PackCard } from './pack-card';

/** The power system of a teardown: the pack, its loads and converters, and its operating modes. The figures panel derives the numbers. */
export function PowerSection({ teardown }: { teardown: TeardownDto }) {
  const power = usePower(teardown.id);
  const gate = useEditGate(teardown);
  if (power.isPending) return <Spinner />;
  if (power.isError) return <ErrorPanel error={power.error} onRetry={() => power.refetch()} />;
  const { pack, loads, converters, modes } = power.data;
  return (
    <div className="space-y-4">
      <PublishedEditNotice gate={gate} />
      <LithiumCaution cell={pack ? { chemistry: pack.chemistry, lithium: pack.lithium } : null} />
      <PackCard key={pack?.updatedAt ?? 'none'} teardownId={teardown.id} pack={pack} gate={gate} />
      {loads.some((l) => l.kind === 'heater') && <Caution title="Hot surfaces">{HOT_SURFACE_CAUTION}</Caution>}
      <LoadsCard teardownId={teardown.id} loads={loads} converters={converters} gate={gate} />
      <ConvertersCard teardownId={teardown.id} converters={converters} gate={gate} />
      <ModesCard teardownId={teardown.id} loads={loads} modes={modes} gate={gate} />
    </div>
  );
}
