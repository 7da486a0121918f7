import type { ReactNode } from 'react';
import { Calculator } from 'lucide-react';
import { Card, EmptyState } from '@/components/page';

/** Inputs on the left, the server's results on the right. */
export function ToolLayout({ title, inputs, actions, children }: { title: string; inputs: ReactNode; actions?: ReactNode; children: ReactNode }) {
  return (
    <div className="grid items-start gap-6 lg:grid-cols-[24rem_minmax(0,1fr)]">
      <Card title={title} actions={actions}>
        <div className="space-y-4 p-4">{inputs}</div>
      </Card>
      <div className="min-w-0 space-y-4" aria-live="polite">
        {children}
      </div>
    </div>
  );
}

/** Results area around the figures: empty, computing, a message from the server, dimmed when out of date. */
export function ResultsState({
  empty,
  hasResult,
  outdated,
  busy,
  message,
  children,
}: {
  empty: ReactNode;
  hasResult: boolean;
  outdated: boolean;
  busy: boolean;
  message: string | null;
  children: ReactNode;
}) {
  return (
    <>
      {message && (
        <div role="alert" className="rounded-md border border-brick-100 bg-brick-50 px-3 py-2.5 text-sm text-brick-800">
          {message}
        </div>
      )}
      {!hasResult && !message ? (
        <Card>
          {busy ? (
            <p className="p-6 text-sm text-graphite-500" role="status">
              Computing…
            </p>
          ) : (
            <EmptyState icon={<Calculator className="size-8" />} message={empty} />
          )}
        </Card>
      ) : hasResult ? (
        <div className={outdated ? 'opacity-60 transition-opacity' : 'transition-opacity'} aria-busy={busy || undefined}>
          {outdated && !busy && <p className="mb-2 text-xs text-graphite-500">These results are for the last inputs that could be computed.</p>}
          {children}
        </div>
      ) : null}
    </>
  );
}
