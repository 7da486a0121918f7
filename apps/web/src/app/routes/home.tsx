import { ROLE_LABELS } from '@splitcase/contracts';
import { ErrorPanel } from '@/components/error-boundary';
import { Spinner } from '@/components/page';
import { formatDate } from '@/lib/format';
import { useSignedInUser } from '@/lib/session';
import { useHome } from '@/features/home/api/get-home';
import { AdminMain, AdminSide } from '@/features/home/components/admin-blocks';
import { EngineerMain } from '@/features/home/components/engineer-blocks';
import { LeadMain, LeadSide } from '@/features/home/components/lead-blocks';
import { NeedsPanel } from '@/features/home/components/needs-panel';
import { RecentFindings, RecentPublished } from '@/features/home/components/recent-blocks';
import { SourcingMain, SourcingSide } from '@/features/home/components/sourcing-blocks';

/**
 * Home: what needs me first, then my role's work (tables on the left, its short lists on the
 * right), then what is new across the workspace.
 */
export function Component() {
  const me = useSignedInUser();
  const home = useHome();
  return (
    <div className="max-w-6xl">
      <header className="mb-4 flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-2xl font-semibold tracking-tight text-graphite-950">Hello, {me.name.split(' ')[0]}</h1>
        <p className="text-xs font-medium uppercase tracking-wider text-graphite-500">
          {ROLE_LABELS[me.role]} · {formatDate(new Date().toISOString())}
        </p>
      </header>
      {home.isPending ? (
        <Spinner />
      ) : home.isError ? (
        <ErrorPanel error={home.error} onRetry={() => home.refetch()} />
      ) : (
        <div className="space-y-4">
          <NeedsPanel needs={home.data.needs} role={home.data.role} />
          <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,7fr)_minmax(0,5fr)]">
            <div className="space-y-4" data-testid="home-main">
              {home.data.engineer && <EngineerMain data={home.data.engineer} />}
              {home.data.lead && <LeadMain data={home.data.lead} />}
              {home.data.sourcing && <SourcingMain data={home.data.sourcing} />}
              {home.data.admin && <AdminMain data={home.data.admin} />}
              <RecentPublished recent={home.data.recent} />
            </div>
            <div className="space-y-4" data-testid="home-side">
              {home.data.lead && <LeadSide data={home.data.lead} />}
              {home.data.sourcing && <SourcingSide data={home.data.sourcing} />}
              {home.data.admin && <AdminSide data={home.data.admin} />}
              <RecentFindings recent={home.data.recent} />
            </div>
          </div>
        </div>
      )}
    </div>
  );
}
