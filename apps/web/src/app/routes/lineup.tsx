import { Link, useNavigate, useParams, useSearchParams } from 'react-router';
import { toast } from 'sonner';
import { CircleCheck, Pencil, PencilLine, Printer, Trash2 } from 'lucide-react';
import { LINEUP_METRIC_KEYS, type LineupMetricKey } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { PageHeader, Spinner } from '@/components/page';
import { paths } from '@/config/paths';
import { confirmDialog } from '@/lib/confirm';
import { formatDate } from '@/lib/format';
import { useDeleteLineup } from '@/features/lineups/api/delete-lineup';
import { useLineup } from '@/features/lineups/api/get-lineup';
import { useUpdateLineup } from '@/features/lineups/api/update-lineup';
import { modeChoiceText } from '@/features/lineups/components/display';
import { LineupStatusBadge } from '@/features/lineups/components/lineup-status';
import { LineupWorkspace } from '@/features/lineups/components/lineup-workspace';

const metricParam = (v: string | null): LineupMetricKey | undefined => (v && (LINEUP_METRIC_KEYS as readonly string[]).includes(v) ? (v as LineupMetricKey) : undefined);

/** A lineup: the normalised comparison, the scatter chart with its Pareto frontier, and the weighted ranking. */
export function Component() {
  const id = Number(useParams().id);
  const [search, setSearch] = useSearchParams();
  const navigate = useNavigate();
  const lineup = useLineup(id);
  const update = useUpdateLineup();
  const remove = useDeleteLineup();
  if (!Number.isInteger(id) || id <= 0) return <ErrorPanel error={new Error('This address does not name a lineup.')} />;
  if (lineup.isPending) return <Spinner />;
  if (lineup.isError) return <ErrorPanel error={lineup.error} onRetry={() => lineup.refetch()} />;
  const l = lineup.data;
  const axes = { x: metricParam(search.get('x')), y: metricParam(search.get('y')) };

  const setStatus = (status: 'draft' | 'published') =>
    update.mutate(
      { id, status, version: l.version },
      {
        onSuccess: () => toast.success(status === 'published' ? 'Lineup published: viewers can read it now.' : 'Lineup back to draft.'),
        onError: (err) => toast.error(err.message),
      },
    );
  const onDelete = async () => {
    const ok = await confirmDialog({
      title: `Delete “${l.name}”?`,
      message: 'The lineup and its weights are removed; the devices and their teardowns stay. The audit log keeps a line saying it was deleted.',
      confirmLabel: 'Delete lineup',
      tone: 'danger',
    });
    if (!ok) return;
    remove.mutate(id, {
      onSuccess: () => {
        toast.success('Lineup deleted.');
        navigate(paths.lineups());
      },
      onError: (err) => toast.error(err.message),
    });
  };

  return (
    <>
      <PageHeader
        eyebrow={
          <Link to={paths.lineups()} className="hover:text-copper-700">
            Lineups
          </Link>
        }
        title={l.name}
        subtitle={l.description ?? undefined}
        actions={
          <>
            <Link to={paths.lineupPrint(id, axes)}>
              <Button tabIndex={-1}>
                <Printer className="size-4" aria-hidden /> Printable report
              </Button>
            </Link>
            {l.permissions.edit && (
              <Link to={paths.editLineup(id)}>
                <Button tabIndex={-1}>
                  <Pencil className="size-4" aria-hidden /> Edit
                </Button>
              </Link>
            )}
            {l.permissions.publish &&
              (l.status === 'draft' ? (
                <Button variant="primary" onClick={() => setStatus('published')} busy={update.isPending}>
                  <CircleCheck className="size-4" aria-hidden /> Publish
                </Button>
              ) : (
                <Button onClick={() => setStatus('draft')} busy={update.isPending}>
                  <PencilLine className="size-4" aria-hidden /> Back to draft
                </Button>
              ))}
            {l.permissions.delete && (
              <Button variant="danger" onClick={onDelete} aria-label="Delete lineup">
                <Trash2 className="size-4" aria-hidden />
              </Button>
            )}
          </>
        }
      />
      <dl className="-mt-3 mb-5 flex flex-wrap items-center gap-x-6 gap-y-2 text-sm text-graphite-600">
        <div>
          <dt className="sr-only">Status</dt>
          <dd>
            <LineupStatusBadge status={l.status} />
          </dd>
        </div>
        <div className="flex gap-1.5">
          <dt>Currency</dt>
          <dd className="font-mono font-medium text-graphite-950">{l.currency}</dd>
        </div>
        <div className="flex gap-1.5">
          <dt>Devices</dt>
          <dd className="num font-medium text-graphite-950">{l.devices.length}</dd>
        </div>
        <div className="flex gap-1.5">
          <dt>Mode compared</dt>
          <dd className="text-graphite-950" data-testid="lineup-mode">
            {modeChoiceText(l.mode)}
          </dd>
        </div>
        <div className="flex gap-1.5">
          <dt>Built by</dt>
          <dd className="text-graphite-950">
            {l.createdBy?.name ?? '—'}, {formatDate(l.createdAt)}
          </dd>
        </div>
        {l.publishedAt && (
          <div className="flex gap-1.5">
            <dt>Published</dt>
            <dd className="text-graphite-950">
              {formatDate(l.publishedAt)}
              {l.publishedBy ? ` by ${l.publishedBy}` : ''}
            </dd>
          </div>
        )}
      </dl>
      {l.hiddenDevices > 0 && (
        <p className="mb-4 text-sm text-graphite-600">
          {l.hiddenDevices === 1 ? 'One device of this lineup has' : `${l.hiddenDevices} devices of this lineup have`} no published teardown yet and {l.hiddenDevices === 1 ? 'is' : 'are'} not shown.
        </p>
      )}
      <LineupWorkspace
        lineup={l}
        axes={axes}
        onAxes={(next) =>
          setSearch(
            (prev) => {
              const p = new URLSearchParams(prev);
              if (next.x) p.set('x', next.x);
              if (next.y) p.set('y', next.y);
              return p;
            },
            { replace: true },
          )
        }
      />
    </>
  );
}
