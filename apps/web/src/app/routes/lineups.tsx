import { Link } from 'react-router';
import { Plus } from 'lucide-react';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { PageHeader, Spinner } from '@/components/page';
import { paths } from '@/config/paths';
import { useSignedInUser } from '@/lib/session';
import { useLineups } from '@/features/lineups/api/list-lineups';
import { LineupsTable } from '@/features/lineups/components/lineups-table';

/** Lineups: named sets of devices compared side by side (viewers: published lineups only). */
export function Component() {
  const me = useSignedInUser();
  const lineups = useLineups();
  const canCreate = lineups.data?.canCreate ?? false;
  return (
    <>
      <PageHeader
        title="Lineups"
        subtitle={
          me.role === 'viewer'
            ? 'Published comparisons of devices side by side: normalised figures, a Pareto chart and a weighted ranking.'
            : 'Devices compared side by side in one currency: normalised figures from their latest teardowns, a Pareto chart of any two metrics, and a ranking with weights you choose.'
        }
        actions={
          canCreate && (
            <Link to={paths.newLineup()}>
              <Button variant="primary" tabIndex={-1}>
                <Plus className="size-4" aria-hidden /> New lineup
              </Button>
            </Link>
          )
        }
      />
      {lineups.isPending ? (
        <Spinner />
      ) : lineups.isError ? (
        <ErrorPanel error={lineups.error} onRetry={() => lineups.refetch()} />
      ) : (
        <LineupsTable
          lineups={lineups.data.lineups}
          empty={canCreate ? 'No lineups yet. Build the first one with New lineup: pick two or more devices to compare.' : 'No lineup has been published yet.'}
        />
      )}
    </>
  );
}
