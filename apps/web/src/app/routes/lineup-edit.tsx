import { Link, useNavigate, useParams } from 'react-router';
import { toast } from 'sonner';
import { RequireRole } from '@/app/guards';
import { ErrorPanel } from '@/components/error-boundary';
import { PageHeader, Spinner } from '@/components/page';
import { paths } from '@/config/paths';
import { useRates } from '@/features/cost/api/rates';
import { useDevices } from '@/features/devices/api/list-devices';
import { useLineup } from '@/features/lineups/api/get-lineup';
import { useLineupMetrics } from '@/features/lineups/api/metrics';
import { useUpdateLineup } from '@/features/lineups/api/update-lineup';
import { rateCurrencies } from '@/features/lineups/components/display';
import { LineupForm } from '@/features/lineups/components/lineup-form';
import { useSettings } from '@/lib/settings';

export function Component() {
  const id = Number(useParams().id);
  const navigate = useNavigate();
  const lineup = useLineup(id);
  const update = useUpdateLineup();
  const devices = useDevices();
  const rates = useRates();
  const settings = useSettings();
  const metrics = useLineupMetrics(lineup.data?.currency);
  const queries = [lineup, devices, rates, settings, metrics];
  const pending = queries.find((q) => q.isPending);
  const failed = queries.find((q) => q.isError);
  const l = lineup.data;
  return (
    <RequireRole roles={['admin', 'engineer', 'sourcing', 'lead']}>
      <PageHeader
        eyebrow={
          <Link to={paths.lineups()} className="hover:text-copper-700">
            Lineups
          </Link>
        }
        title={l ? `Edit “${l.name}”` : 'Edit lineup'}
        subtitle="Change the devices, the currency, the mode compared or the weights. The comparison is worked out again from the latest teardowns."
      />
      {failed ? (
        <ErrorPanel error={failed.error} onRetry={() => failed.refetch()} />
      ) : pending ? (
        <Spinner />
      ) : !l!.permissions.edit ? (
        <ErrorPanel error={new Error('This lineup is published: a lead or an admin changes it.')} />
      ) : (
        <LineupForm
          initial={l}
          devices={devices.data!}
          currencies={rateCurrencies(rates.data?.current ?? null)}
          defaultCurrency={settings.data!.reportingCurrency}
          metrics={metrics.data!}
          submitLabel="Save lineup"
          onCancel={() => navigate(paths.lineup(id))}
          onSubmit={async (values) => {
            await update.mutateAsync({ id, version: l!.version, ...values, description: values.description ?? null });
            toast.success('Lineup saved.');
            navigate(paths.lineup(id));
          }}
        />
      )}
    </RequireRole>
  );
}
