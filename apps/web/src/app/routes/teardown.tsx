import { Suspense } from 'react';
import { Link, NavLink, useParams } from 'react-router';
import { Printer } from 'lucide-react';
import { DEVICE_CATEGORY } from '@splitcase/contracts';
import { ErrorPanel, WidgetBoundary } from '@/components/error-boundary';
import { Spinner } from '@/components/page';
import { StatusBadge } from '@/components/status';
import { paths, type TeardownSection } from '@/config/paths';
import { formatDate } from '@/lib/format';
import { FiguresPanel } from '@/features/figures/components/figures-panel';
import { useTeardown } from '@/features/teardowns/api/get-teardown';
import { ReviewActions } from '@/features/teardowns/components/review-actions';
import { SECTIONS } from '../teardown-sections';

/** The teardown workspace: header, section rail, the section being edited, and the figures panel beside it. */
export function Component() {
  const params = useParams();
  const id = Number(params.id);
  const sectionId = (params.section ?? 'overview') as TeardownSection;
  const teardown = useTeardown(id);
  if (!Number.isInteger(id) || id <= 0) return <ErrorPanel error={new Error('This address does not name a teardown.')} />;
  if (teardown.isPending) return <Spinner />;
  if (teardown.isError) return <ErrorPanel error={teardown.error} onRetry={() => teardown.refetch()} />;
  const t = teardown.data;
  const section = SECTIONS.find((s) => s.id === sectionId);
  if (!section) return <ErrorPanel error={new Error(`There is no section "${sectionId}" in a teardown.`)} />;
  const Section = section.Component;
  return (
    <div>
      <header className="mb-5 flex flex-wrap items-start justify-between gap-4">
        <div className="min-w-0">
          <div className="mb-1 text-xs font-medium uppercase tracking-wider text-graphite-500">
            <Link to={paths.devices()} className="hover:text-copper-700">
              Devices
            </Link>{' '}
            /{' '}
            <Link to={paths.device(t.device.id)} className="hover:text-copper-700">
              {t.device.maker} {t.device.model}
            </Link>
          </div>
          <h1 className="text-2xl font-semibold tracking-tight">
            {t.device.maker} {t.device.model}
            {t.unitLabel && <span className="ml-2 text-lg font-normal text-graphite-500">· {t.unitLabel}</span>}
          </h1>
          <div className="mt-1 flex flex-wrap items-center gap-2 text-sm text-graphite-600">
            <StatusBadge status={t.status} />
            <span>{DEVICE_CATEGORY.labels[t.device.category]}</span>
            <span aria-hidden>·</span>
            <span>
              opened by {t.engineer.name} on {formatDate(t.date)}
            </span>
          </div>
        </div>
        <div className="no-print flex flex-wrap items-center gap-2">
          <Link
            to={paths.teardownReport(t.id)}
            className="inline-flex h-9 items-center gap-2 rounded-md bg-white px-3.5 text-sm font-medium text-graphite-900 ring-1 ring-inset ring-graphite-200 hover:bg-graphite-50 hover:ring-graphite-300"
          >
            <Printer className="size-4" aria-hidden /> Print report
          </Link>
          <ReviewActions teardown={t} />
        </div>
      </header>
      <div className="grid gap-6 xl:grid-cols-[10rem_minmax(0,1fr)_20rem] lg:grid-cols-[10rem_minmax(0,1fr)]">
        <nav aria-label="Teardown sections" className="no-print">
          <ul className="sticky top-4 space-y-0.5">
            {SECTIONS.map((s) => (
              <li key={s.id}>
                <NavLink
                  to={paths.teardown(t.id, s.id)}
                  end
                  className={({ isActive }) =>
                    `flex h-9 items-center gap-2 rounded-md px-2.5 text-sm ${isActive ? 'bg-white font-medium text-graphite-950 shadow-card ring-1 ring-graphite-150' : 'text-graphite-600 hover:bg-graphite-100'}`
                  }
                >
                  <s.icon className="size-4 text-graphite-400" aria-hidden />
                  {s.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <div className={`min-w-0 ${section.withFigures ? '' : 'xl:col-span-2'}`}>
          <WidgetBoundary name={section.id} key={section.id}>
            <Suspense fallback={<Spinner />}>
              <Section teardown={t} />
            </Suspense>
          </WidgetBoundary>
        </div>
        {section.withFigures && (
          <div className="min-w-0 lg:col-start-2 xl:col-start-auto">
            <div className="xl:sticky xl:top-4">
              <WidgetBoundary name="figures">
                <FiguresPanel teardownId={t.id} canEdit={t.permissions.edit} />
              </WidgetBoundary>
            </div>
          </div>
        )}
      </div>
    </div>
  );
}
