import { lazy, Suspense, useEffect, useState } from 'react';
import { useSearchParams } from 'react-router';
import { toast } from 'sonner';
import { Activity, Download, Layers, Pencil, Plus, Trash2 } from 'lucide-react';
import { RUN_KIND, type RunDto, type TeardownDto } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import { Button } from '@/components/button';
import { ErrorPanel, WidgetBoundary } from '@/components/error-boundary';
import { Card, EmptyState, Spinner } from '@/components/page';
import { confirmDialog } from '@/lib/confirm';
import { mutationErrorMessage } from '@/lib/unpublish-confirm';
import { formatDateTime } from '@/lib/format';
import { useDeleteRun } from '../api/delete-run';
import { useTeardownRuns } from '../api/teardown-runs';
import { RunEditForm } from './run-edit-form';
import { RunPicker } from './run-picker';
import { RunResults } from './run-results';
import { RunTable } from './run-table';
import { RunUpload } from './run-upload';
import { formatBytes } from './time-format';

const RunCharts = lazy(() => import('./run-charts'));

/** Charts with their own boundary and a spinner while the chart code loads. */
export function ChartsPanel({ runs }: { runs: RunDto[] }) {
  return (
    <WidgetBoundary name="run-charts">
      <Suspense fallback={<Spinner label="Loading the charts…" />}>
        <RunCharts runs={runs} key={runs.map((r) => r.id).join('-')} />
      </Suspense>
    </WidgetBoundary>
  );
}

function DeleteRun({ run, onDeleted }: { run: RunDto; onDeleted: () => void }) {
  const del = useDeleteRun();
  const onDelete = async () => {
    const ok = await confirmDialog({
      title: `Delete “${run.label}”?`,
      message: 'The run and its log file are removed. The history keeps a line saying it was deleted.',
      confirmLabel: 'Delete the run',
      cancelLabel: 'Keep it',
      tone: 'danger',
    });
    if (!ok) return;
    del.mutate(
      { run },
      {
        onSuccess: onDeleted,
        onError: (err) => {
          const m = mutationErrorMessage(err);
          if (m) toast.error(m);
        },
      },
    );
  };
  return (
    <Button size="sm" variant="danger" busy={del.isPending} onClick={onDelete}>
      <Trash2 className="size-4" aria-hidden /> Delete
    </Button>
  );
}

function RunDetail({ run, canEdit, onDeleted }: { run: RunDto; canEdit: boolean; onDeleted: () => void }) {
  const [editing, setEditing] = useState(false);
  const [comparing, setComparing] = useState(false);
  const [others, setOthers] = useState<RunDto[]>([]);
  useEffect(() => {
    setOthers([]);
    setEditing(false);
  }, [run.id]);
  const mapped = Object.entries(run.mapping)
    .filter(([k, v]) => ['time', 'voltage', 'current', 'power', 'temperature'].includes(k) && v)
    .map(([k, v]) => `${k}: “${(v as { column: string }).column}” (${(v as { unit: string }).unit})`)
    .join(' · ');
  return (
    <>
      <Card
        title={
          <span className="flex flex-wrap items-center gap-2">
            {run.label}
            <Badge tone="neutral" icon={Activity}>
              {RUN_KIND.labels[run.kind]}
            </Badge>
          </span>
        }
        actions={
          <div className="flex flex-wrap gap-1.5">
            <a href={`/api/runs/${run.id}/raw`} download={run.fileName} className="inline-flex h-8 items-center gap-1.5 rounded-md px-2.5 text-sm font-medium text-copper-700 hover:bg-copper-50">
              <Download className="size-4" aria-hidden /> Raw log
            </a>
            {canEdit && !editing && (
              <Button size="sm" variant="ghost" onClick={() => setEditing(true)}>
                <Pencil className="size-4" aria-hidden /> Settings
              </Button>
            )}
            {canEdit && <DeleteRun run={run} onDeleted={onDeleted} />}
          </div>
        }
      >
        <div className="space-y-4 p-4">
          <p className="text-xs text-graphite-500">
            {run.fileName} · {formatBytes(run.fileBytes)} · {run.samples.toLocaleString('en-GB')} samples · added {formatDateTime(run.createdAt)}
            {run.createdBy && ` by ${run.createdBy.name}`}
            <span className="block">Columns: {mapped}</span>
          </p>
          {editing && <RunEditForm run={run} onClose={() => setEditing(false)} />}
          <RunResults run={run} />
        </div>
      </Card>
      <Card
        title="Charts"
        actions={
          <Button size="sm" variant={comparing ? 'secondary' : 'ghost'} onClick={() => setComparing((c) => !c)} aria-expanded={comparing}>
            <Layers className="size-4" aria-hidden /> {comparing ? 'Hide the run list' : 'Overlay other runs'}
          </Button>
        }
      >
        <div className="space-y-4 p-4">
          {comparing && (
            <div className="rounded-md border border-graphite-100 bg-graphite-50/50 p-3">
              <p className="mb-2 text-sm text-graphite-700">Overlay up to three more runs, from any teardown you can open — the same test on several devices, say.</p>
              <RunPicker kind={run.kind} fixed={[run]} selected={others} onChange={setOthers} />
            </div>
          )}
          <ChartsPanel runs={[run, ...others]} />
        </div>
      </Card>
    </>
  );
}

/** Teardown section: the runs of this unit, one run's figures and charts, upload for editors. */
export function RunsSection({ teardown }: { teardown: TeardownDto }) {
  const runs = useTeardownRuns(teardown.id);
  const [params, setParams] = useSearchParams();
  const [adding, setAdding] = useState(false);
  const canEdit = teardown.permissions.edit;
  const select = (id: number | null) =>
    setParams(
      (p) => {
        const next = new URLSearchParams(p);
        if (id === null) next.delete('run');
        else next.set('run', String(id));
        return next;
      },
      { replace: true },
    );

  if (runs.isPending) return <Spinner />;
  if (runs.isError) return <ErrorPanel error={runs.error} onRetry={() => runs.refetch()} />;
  const list = runs.data;
  const wanted = Number(params.get('run'));
  const selected = list.find((r) => r.id === wanted) ?? list[0];

  return (
    <div className="space-y-5">
      <Card
        title="Bench runs"
        actions={
          canEdit && !adding ? (
            <Button variant="primary" size="sm" onClick={() => setAdding(true)}>
              <Plus className="size-4" aria-hidden /> Add a run
            </Button>
          ) : undefined
        }
      >
        {list.length === 0 ? (
          <EmptyState
            icon={<Activity className="size-8" />}
            message={
              canEdit
                ? 'No bench runs yet: upload a log from an electronic load, a USB meter or a thermocouple logger to get delivered capacity, charge phases or surface temperatures.'
                : 'No bench runs have been recorded for this unit.'
            }
            action={
              canEdit && !adding ? (
                <Button variant="primary" onClick={() => setAdding(true)}>
                  <Plus className="size-4" aria-hidden /> Add a run
                </Button>
              ) : undefined
            }
          />
        ) : (
          <div className="p-3">
            <RunTable runs={list} selectedId={selected?.id} onSelect={(r) => select(r.id)} />
          </div>
        )}
      </Card>
      {adding && (
        <RunUpload
          teardown={teardown}
          onCancel={() => setAdding(false)}
          onDone={(run) => {
            setAdding(false);
            select(run.id);
          }}
        />
      )}
      {selected && <RunDetail run={selected} canEdit={canEdit} onDeleted={() => select(null)} />}
    </div>
  );
}
