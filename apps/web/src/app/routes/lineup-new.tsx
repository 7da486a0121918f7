import { Link, useNavigate } from 'react-router';
import { toast } from 'sonner';
import { RequireRole } from '@/app/guards';
import { ErrorPanel } from '@/components/error-boundary';
import { PageHeader, Spinner } from '@/components/page';
import { paths } from '@/config/paths';
import { useRates } from '@/features/cost/api/rates';
import { useDevices } from '@/features/devices/api/list-devices';
import { useCreateLineup } from '@/features/lineups/api/create-lineup';
import { useLineupMetrics } from '@/features/lineups/api/metrics';
import { rateCurrencies } from '@/features/lineups/components/display';
import { LineupForm } from '@/features/lineups/components/lineup-form';
import { useSettings } from '@/lib/settings';

export function Component() {
  const navigate = useNavigate();
  const create = useCreateLineup();
  const devices = useDevices();
  const rates = useRates();
  const settings = useSettings();
  const metrics = useLineupMetrics();
  const pending = [devices, rates, settings, metrics].find((q) => q.isPending);
  const failed = [devices, rates, settings, metrics].find((q) => q.isError);
  return (
    <RequireRole roles={['admin', 'engineer', 'sourcing', 'lead']}>
      <PageHeader
        eyebrow={
          <Link to={paths.lineups()} className="hover:text-copper-700">
            Lineups
          </Link>
        }
        title="New lineup"
        subtitle="Pick the devices to compare, the currency to compare them in, the operating mode their runtimes come from, and how much each metric counts in the ranking."
      />
      {failed ? (
        <ErrorPanel error={failed.error} onRetry={() => failed.refetch()} />
      ) : pending ? (
        <Spinner />
      ) : (
        <LineupForm
          devices={devices.data!}
          currencies={rateCurrencies(rates.data?.current ?? null)}
          defaultCurrency={settings.data!.reportingCurrency}
          metrics={metrics.data!}
          submitLabel="Build lineup"
          onCancel={() => navigate(paths.lineups())}
          onSubmit={async (values) => {
            const l = await create.mutateAsync(values);
            toast.success(`Lineup “${l.name}” built.`);
            navigate(paths.lineup(l.id));
          }}
        />
      )}
    </RequireRole>
  );
}
