import { useState } from 'react';
import { History } from 'lucide-react';
import type { AuditEntry, TeardownDto } from '@splitcase/contracts';
import { ErrorPanel } from '@/components/error-boundary';
import { Card, EmptyState, Spinner } from '@/components/page';
import { formatDateTime } from '@/lib/format';
import { useHistory } from '../api/history';

const show = (v: unknown) => (v === null || v === undefined || v === '' ? '—' : typeof v === 'object' ? JSON.stringify(v) : String(v));

function Entry({ e }: { e: AuditEntry }) {
  const [open, setOpen] = useState(false);
  const changes = Object.entries(e.changes ?? {});
  return (
    <li className="grid grid-cols-[9.5rem_minmax(0,1fr)] gap-3 border-b border-graphite-100 px-4 py-2.5 text-sm last:border-0">
      <time dateTime={e.at} className="num text-xs text-graphite-500">
        {formatDateTime(e.at)}
      </time>
      <div className="min-w-0">
        <p>
          <span className="font-medium">{e.actor ?? 'System'}</span> <span className="text-graphite-700">{e.summary}</span>
        </p>
        {changes.length > 0 && (
          <>
            <button type="button" className="mt-0.5 text-xs text-copper-700 hover:underline" aria-expanded={open} onClick={() => setOpen(!open)}>
              {open ? 'Hide' : 'Show'} {changes.length} change{changes.length === 1 ? '' : 's'}
            </button>
            {open && (
              <dl className="mt-1.5 space-y-1 rounded bg-graphite-50 p-2 text-xs">
                {changes.map(([field, c]) => (
                  <div key={field} className="grid grid-cols-[8rem_minmax(0,1fr)] gap-2">
                    <dt className="font-mono text-graphite-600">{field}</dt>
                    <dd className="min-w-0 whitespace-pre-wrap break-words">
                      <span className="text-graphite-500 line-through decoration-graphite-300">{show(c.from)}</span> → <span>{show(c.to)}</span>
                    </dd>
                  </div>
                ))}
              </dl>
            )}
          </>
        )}
      </div>
    </li>
  );
}

/** Every change to the teardown and its records, newest first (from the audit log). */
export function HistorySection({ teardown }: { teardown: TeardownDto }) {
  const history = useHistory(teardown.id);
  return (
    <Card title="History">
      {history.isPending ? (
        <Spinner />
      ) : history.isError ? (
        <div className="p-4">
          <ErrorPanel error={history.error} onRetry={() => history.refetch()} />
        </div>
      ) : history.data.length === 0 ? (
        <EmptyState icon={<History className="size-8" />} message="No changes recorded yet." />
      ) : (
        <ol aria-label="Changes">
          {history.data.map((e) => (
            <Entry key={e.id} e={e} />
          ))}
        </ol>
      )}
    </Card>
  );
}
