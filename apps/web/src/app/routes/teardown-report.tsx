// The printable teardown report: a lab-report layout composed from the features' own read
// endpoints (teardown, photos with pins, parts and cost, power system, figures, bench runs,
// findings). On screen it is a clean preview with a print button; in print the toolbar goes and
// the page margins carry the title, the review status and the page numbers.
import { useEffect, type ReactNode } from 'react';
import { Link, useParams } from 'react-router';
import { ArrowLeft, Printer } from 'lucide-react';
import { TEARDOWN_STATUS, type TeardownDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { ApiError } from '@/lib/api-client';
import { Spinner } from '@/components/page';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/format';
import { useSignedInUser } from '@/lib/session';
import { useCost } from '@/features/cost/api/get-cost';
import { useFigures } from '@/features/figures/api/get-figures';
import { useFindings } from '@/features/findings/api/list-findings';
import { useParts } from '@/features/parts/api/parts';
import { usePhotos } from '@/features/photos/api/get-photos';
import { PinnedPhoto } from '@/features/photos/components/pinned-photo';
import { usePower } from '@/features/power/api/power';
import { useTeardownRuns } from '@/features/runs/api/teardown-runs';
import { useTeardown } from '@/features/teardowns/api/get-teardown';
import { ReportBom } from '@/features/teardown-report/components/report-bom';
import { ReportFigures } from '@/features/teardown-report/components/report-figures';
import { ReportFindings } from '@/features/teardown-report/components/report-findings';
import { ReportHeader } from '@/features/teardown-report/components/report-header';
import { ReportSection, SectionError } from '@/features/teardown-report/components/report-layout';
import { ReportPhotos } from '@/features/teardown-report/components/report-photos';
import { ReportPower } from '@/features/teardown-report/components/report-power';
import { ReportRuns } from '@/features/teardown-report/components/report-runs';
import { ReportSafety } from '@/features/teardown-report/components/report-safety';

const cssString = (s: string) => `"${s.replace(/\\/g, '\\\\').replace(/"/g, '\\"').replace(/\s+/g, ' ')}"`;

/** Page-margin text for print: the report's title on every page, and its review status when not published. */
function PageMargins({ t, printedOn }: { t: TeardownDto; printedOn: string }) {
  const title = `Teardown report · ${t.device.maker} ${t.device.model}${t.unitLabel ? ` · ${t.unitLabel}` : ''}`;
  const status = t.status === 'published' ? `Published ${formatDate(t.publishedAt)}` : `${TEARDOWN_STATUS.labels[t.status]}: not approved`;
  const css = `@media print { @page {
    @top-left { content: ${cssString(title)}; font-size: 8pt; }
    @top-right { content: ${cssString(status)}; font-size: 8pt; }
    @bottom-left { content: ${cssString(`Splitcase · printed ${formatDate(printedOn)} · engineering estimates, not certification results`)}; font-size: 7.5pt; }
  } }`;
  return <style>{css}</style>;
}

export function Component() {
  const params = useParams();
  const id = Number(params.id);
  const valid = Number.isInteger(id) && id > 0;
  const me = useSignedInUser();
  const teardown = useTeardown(id);
  const photos = usePhotos(id);
  const parts = useParts(id);
  const cost = useCost(id, {});
  const power = usePower(id);
  const figures = useFigures(id);
  const runs = useTeardownRuns(id);
  const findings = useFindings(id);
  const printedOn = new Date().toISOString();

  const t = teardown.data;
  useEffect(() => {
    if (!t) return;
    const before = document.title;
    // The browser offers the title as the PDF's file name.
    document.title = `Teardown report – ${t.device.maker} ${t.device.model}${t.unitLabel ? ` (${t.unitLabel})` : ''}`;
    return () => {
      document.title = before;
    };
  }, [t]);

  const home = (
    <Link to={paths.home()} className="inline-flex items-center gap-1.5 text-sm font-medium text-graphite-700 hover:text-copper-700">
      <ArrowLeft className="size-4" aria-hidden /> Back to home
    </Link>
  );
  if (!valid) return <Page toolbar={home} notice={<ErrorPanel error={new Error('This address does not name a teardown.')} />} />;
  if (teardown.isPending) return <Page toolbar={home} notice={<Spinner label="Putting the report together…" />} />;
  if (teardown.isError) {
    // A missing teardown (or one a viewer may not read) will not appear on a retry.
    const retry = teardown.error instanceof ApiError && teardown.error.status < 500 ? undefined : () => teardown.refetch();
    return <Page toolbar={home} notice={<ErrorPanel error={teardown.error} onRetry={retry} />} />;
  }

  const queries = [photos, parts, cost, power, figures, runs, findings];
  const ready = queries.every((q) => !q.isPending);
  const photoList = photos.data?.photos ?? [];
  const hot = Boolean(power.data?.loads.some((l) => l.kind === 'heater') || figures.data?.figures.some((f) => f.caution) || runs.data?.some((r) => r.analysis.thermal));

  const sections: { id: string; title: string; body: ReactNode; aside?: ReactNode }[] = [
    {
      id: 'photos',
      title: 'Photos and callouts',
      aside: photoList.length ? `${photoList.length} photo${photoList.length === 1 ? '' : 's'}, ${photoList.reduce((n, p) => n + p.callouts.length, 0)} pins` : undefined,
      body: photos.isError ? <SectionError what="photos" error={photos.error} /> : <ReportPhotos photos={photoList} renderPinned={(photo) => <PinnedPhoto photo={photo} />} />,
    },
    {
      id: 'bom',
      title: 'Parts (BOM)',
      aside: parts.data?.length ? `${parts.data.length} line${parts.data.length === 1 ? '' : 's'}, ${parts.data.reduce((n, p) => n + p.quantity, 0)} pieces` : undefined,
      body: parts.isError ? (
        <SectionError what="parts" error={parts.error} />
      ) : (
        <ReportBom parts={parts.data ?? []} photos={photoList} cost={cost.data ?? null} costProblem={cost.isError ? cost.error.message : null} />
      ),
    },
    {
      id: 'power',
      title: 'Power system',
      body: power.isError ? <SectionError what="power system" error={power.error} /> : power.data ? <ReportPower power={power.data} /> : null,
    },
    {
      id: 'figures',
      title: 'Derived figures',
      aside: figures.data?.figures.length ? 'formula, inputs and source of each' : undefined,
      body: figures.isError ? <SectionError what="figures" error={figures.error} /> : figures.data ? <ReportFigures data={figures.data} /> : null,
    },
    {
      id: 'runs',
      title: 'Bench runs',
      body: runs.isError ? <SectionError what="bench runs" error={runs.error} /> : <ReportRuns runs={runs.data ?? []} />,
    },
    {
      id: 'findings',
      title: 'Findings',
      aside: findings.data?.findings.length ? `${findings.data.findings.length} recorded` : undefined,
      body: findings.isError ? <SectionError what="findings" error={findings.error} /> : <ReportFindings findings={findings.data?.findings ?? []} photos={photoList} />,
    },
    { id: 'safety', title: 'Safety', body: <ReportSafety teardown={t!} hot={hot} /> },
  ];

  return (
    <Page
      toolbar={
        <>
          <Link to={paths.teardown(id)} className="inline-flex items-center gap-1.5 text-sm font-medium text-graphite-700 hover:text-copper-700">
            <ArrowLeft className="size-4" aria-hidden /> Back to the teardown
          </Link>
          <p className="hidden text-sm text-graphite-500 md:block">Report preview: A4, as it prints</p>
          <Button variant="primary" onClick={() => window.print()} disabled={!ready}>
            <Printer className="size-4" aria-hidden /> Print / Save as PDF
          </Button>
        </>
      }
    >
      <PageMargins t={t!} printedOn={printedOn} />
      <article
        className="mx-auto w-[210mm] max-w-full bg-white px-[14mm] py-[16mm] text-graphite-950 shadow-card [-webkit-print-color-adjust:exact] [print-color-adjust:exact] print:w-auto print:max-w-none print:p-0 print:shadow-none"
        data-testid="report"
        data-ready={ready ? 'true' : 'false'}
        aria-busy={!ready}
      >
        <ReportHeader teardown={t!} printedBy={me.name} printedOn={printedOn} />
        {!ready ? (
          <Spinner label="Loading the sections…" />
        ) : (
          <div className="mt-6">
            {sections.map((s, i) => (
              <ReportSection key={s.id} id={s.id} number={i + 1} title={s.title} aside={s.aside}>
                {s.body}
              </ReportSection>
            ))}
          </div>
        )}
      </article>
    </Page>
  );
}

/** The preview page: a toolbar (never printed) over the sheet, or over a notice while there is no sheet. */
function Page({ toolbar, notice, children }: { toolbar: ReactNode; notice?: ReactNode; children?: ReactNode }) {
  return (
    <div className="min-h-screen bg-graphite-100 pb-10 print:min-h-0 print:bg-white print:pb-0">
      <div className="no-print sticky top-0 z-10 mb-6 border-b border-graphite-150 bg-white/95 backdrop-blur">
        <div className="mx-auto flex h-14 w-[210mm] max-w-full items-center justify-between gap-4 px-4">{toolbar}</div>
      </div>
      {notice && <div className="mx-auto w-[210mm] max-w-full px-4">{notice}</div>}
      {children}
    </div>
  );
}
