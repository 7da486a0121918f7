import { useEffect } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import { ArrowLeft, Printer } from 'lucide-react';
import { LINEUP_METRIC_KEYS, type LineupMetricKey } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Spinner } from '@/components/page';
import { paths } from '@/config/paths';
import { useSignedInUser } from '@/lib/session';
import { useComparison } from '@/features/lineups/api/comparison';
import { useLineup } from '@/features/lineups/api/get-lineup';
import { LineupReport } from '@/features/lineups/components/lineup-report';

const metricParam = (v: string | null): LineupMetricKey | undefined => (v && (LINEUP_METRIC_KEYS as readonly string[]).includes(v) ? (v as LineupMetricKey) : undefined);

/** The printable lineup report, without the rail: the browser's print-to-PDF gives the document. */
export function Component() {
  const id = Number(useParams().id);
  const [search] = useSearchParams();
  const me = useSignedInUser();
  const axes = { x: metricParam(search.get('x')), y: metricParam(search.get('y')) };
  const lineup = useLineup(id);
  const comparison = useComparison(id, axes, Number.isInteger(id) && id > 0);
  const name = lineup.data?.name;
  useEffect(() => {
    if (!name) return;
    const before = document.title;
    document.title = `${name} — lineup report`;
    return () => {
      document.title = before;
    };
  }, [name]);

  const failed = [lineup, comparison].find((q) => q.isError);
  return (
    <div className="min-h-screen bg-graphite-100 py-6 print:bg-white print:py-0">
      {/* Each printed page names the document at its foot (the page number is on the right, from styles.css). */}
      {name && <style>{`@media print { @page { @bottom-left { content: ${JSON.stringify(`Splitcase · ${name} · lineup report`)}; font-size: 9pt; } } }`}</style>}
      <div className="no-print mx-auto mb-4 flex max-w-[200mm] items-center justify-between gap-3 px-2">
        <Link to={paths.lineup(id)} className="inline-flex items-center gap-1.5 text-sm font-medium text-copper-700 hover:underline">
          <ArrowLeft className="size-4" aria-hidden /> Back to the lineup
        </Link>
        <Button variant="primary" onClick={() => window.print()} disabled={!comparison.data}>
          <Printer className="size-4" aria-hidden /> Print or save as PDF
        </Button>
      </div>
      {failed ? (
        <div className="mx-auto max-w-[200mm]">
          <ErrorPanel error={failed.error} onRetry={() => failed.refetch()} />
        </div>
      ) : lineup.isPending || comparison.isPending ? (
        <Spinner label="Preparing the report…" />
      ) : (
        <LineupReport lineup={lineup.data!} comparison={comparison.data!} printedBy={me.name} />
      )}
    </div>
  );
}
