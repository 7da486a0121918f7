import { useMemo, useState, type ReactNode } from 'react';
import { toast } from 'sonner';
import { Camera, Cpu, Lightbulb, Pencil, Plus, Sparkles, Trash2, X } from 'lucide-react';
import { FINDING_KIND, SEVERITY, type FindingDto, type FindingKind, type Severity, type TeardownDto } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Select } from '@/components/field';
import { Card, EmptyState, Spinner } from '@/components/page';
import { SeverityBadge } from '@/components/status';
import { confirmDialog } from '@/lib/confirm';
import { formatDate } from '@/lib/format';
import { mutationErrorMessage } from '@/lib/unpublish-confirm';
import { useCreateFinding } from '../api/create-finding';
import { useDeleteFinding } from '../api/delete-finding';
import { useFindings, type FindingsData } from '../api/list-findings';
import { useUpdateFinding } from '../api/update-finding';
import { FindingForm } from './finding-form';

const RANK: Record<Severity, number> = { critical: 0, major: 1, minor: 2, note: 3 };

export interface FindingsSectionProps {
  teardown: TeardownDto;
  /** Rendered under each finding (e.g. its photo pins, wired in by the photos feature). */
  renderFindingExtras?: (findingId: number) => ReactNode;
}

/** Findings of a teardown: grouped by severity (or sorted), filtered by kind and tag, with their linked parts and photos. */
export function FindingsSection({ teardown, renderFindingExtras }: FindingsSectionProps) {
  const findings = useFindings(teardown.id);
  const create = useCreateFinding(teardown.id);
  const [adding, setAdding] = useState(false);
  const [editing, setEditing] = useState<number | null>(null);
  const [kind, setKind] = useState<FindingKind | ''>('');
  const [tag, setTag] = useState<string | null>(null);
  const [order, setOrder] = useState<'grouped' | 'severe-first' | 'mild-first' | 'newest'>('grouped');
  const canEdit = teardown.permissions.edit;

  if (findings.isPending) return <Spinner />;
  if (findings.isError) return <ErrorPanel error={findings.error} onRetry={() => findings.refetch()} />;
  const data = findings.data;

  return (
    <div className="space-y-4">
      <Card
        title={`Findings (${data.findings.length})`}
        actions={
          canEdit && !adding ? (
            <Button size="sm" variant="primary" onClick={() => setAdding(true)}>
              <Plus className="size-4" aria-hidden /> New finding
            </Button>
          ) : undefined
        }
      >
        {adding && (
          <div className="border-b border-graphite-100 bg-graphite-50/60 p-4">
            <FindingForm
              parts={data.parts}
              photos={data.photos}
              submitLabel="Add finding"
              onCancel={() => setAdding(false)}
              onSubmit={async (values) => {
                await create.mutateAsync(values);
                toast.success('Finding added.');
                setAdding(false);
              }}
            />
          </div>
        )}
        <Toolbar data={data} kind={kind} setKind={setKind} tag={tag} setTag={setTag} order={order} setOrder={setOrder} />
        <FindingList
          data={data}
          teardown={teardown}
          kind={kind}
          tag={tag}
          order={order}
          editing={editing}
          setEditing={setEditing}
          onTag={setTag}
          renderFindingExtras={renderFindingExtras}
          onAdd={canEdit && !adding ? () => setAdding(true) : undefined}
        />
      </Card>
    </div>
  );
}

function Toolbar({
  data,
  kind,
  setKind,
  tag,
  setTag,
  order,
  setOrder,
}: {
  data: FindingsData;
  kind: FindingKind | '';
  setKind: (k: FindingKind | '') => void;
  tag: string | null;
  setTag: (t: string | null) => void;
  order: string;
  setOrder: (o: 'grouped' | 'severe-first' | 'mild-first' | 'newest') => void;
}) {
  const counts = useMemo(() => {
    const c = new Map<FindingKind, number>();
    for (const f of data.findings) c.set(f.kind, (c.get(f.kind) ?? 0) + 1);
    return c;
  }, [data.findings]);
  const tags = useMemo(() => [...new Set(data.findings.flatMap((f) => f.tags))].sort(), [data.findings]);
  if (data.findings.length === 0) return null;
  return (
    <div className="flex flex-wrap items-center gap-x-4 gap-y-2 border-b border-graphite-100 px-4 py-2.5 text-sm">
      <label className="flex items-center gap-2">
        <span className="text-graphite-600">Kind</span>
        <Select value={kind} onChange={(e) => setKind(e.target.value as FindingKind | '')} className="h-8 w-44" aria-label="Filter by kind">
          <option value="">All kinds ({data.findings.length})</option>
          {FINDING_KIND.values
            .filter((k) => counts.has(k))
            .map((k) => (
              <option key={k} value={k}>
                {FINDING_KIND.labels[k]} ({counts.get(k)})
              </option>
            ))}
        </Select>
      </label>
      <label className="flex items-center gap-2">
        <span className="text-graphite-600">Order</span>
        <Select value={order} onChange={(e) => setOrder(e.target.value as 'grouped')} className="h-8 w-44" aria-label="Order">
          <option value="grouped">Grouped by severity</option>
          <option value="severe-first">Most severe first</option>
          <option value="mild-first">Least severe first</option>
          <option value="newest">Newest first</option>
        </Select>
      </label>
      {tags.length > 0 && (
        <label className="flex items-center gap-2">
          <span className="text-graphite-600">Tag</span>
          <Select value={tag ?? ''} onChange={(e) => setTag(e.target.value || null)} className="h-8 w-36" aria-label="Filter by tag">
            <option value="">Any tag</option>
            {tags.map((t) => (
              <option key={t} value={t}>
                {t}
              </option>
            ))}
          </Select>
        </label>
      )}
      {(kind || tag) && (
        <button type="button" className="inline-flex items-center gap-1 text-xs text-copper-700 hover:underline" onClick={() => (setKind(''), setTag(null))}>
          <X className="size-3" aria-hidden /> Clear filters
        </button>
      )}
    </div>
  );
}

function FindingList({
  data,
  teardown,
  kind,
  tag,
  order,
  editing,
  setEditing,
  onTag,
  renderFindingExtras,
  onAdd,
}: {
  data: FindingsData;
  teardown: TeardownDto;
  kind: FindingKind | '';
  tag: string | null;
  order: 'grouped' | 'severe-first' | 'mild-first' | 'newest';
  editing: number | null;
  setEditing: (id: number | null) => void;
  onTag: (t: string) => void;
  renderFindingExtras?: (findingId: number) => ReactNode;
  onAdd?: () => void;
}) {
  if (data.findings.length === 0) {
    return (
      <EmptyState
        icon={<Lightbulb className="size-8" />}
        message={teardown.permissions.edit ? 'No findings yet. Note what is clever, cheap, risky or wrong, one observation per finding.' : 'No findings recorded for this teardown.'}
        action={
          onAdd && (
            <Button variant="primary" onClick={onAdd}>
              <Plus className="size-4" aria-hidden /> New finding
            </Button>
          )
        }
      />
    );
  }
  const shown = data.findings.filter((f) => (!kind || f.kind === kind) && (!tag || f.tags.includes(tag)));
  if (shown.length === 0) return <p className="px-4 py-6 text-center text-sm text-graphite-500">No findings match the filters.</p>;
  const sorted = [...shown].sort((a, b) =>
    order === 'newest'
      ? b.createdAt.localeCompare(a.createdAt) || b.id - a.id
      : order === 'mild-first'
        ? RANK[b.severity] - RANK[a.severity] || a.id - b.id
        : RANK[a.severity] - RANK[b.severity] || a.id - b.id,
  );
  const item = (f: FindingDto) => (
    <FindingItem key={f.id} f={f} data={data} teardown={teardown} editing={editing === f.id} setEditing={setEditing} onTag={onTag} extras={renderFindingExtras?.(f.id)} />
  );
  if (order !== 'grouped') return <ul className="divide-y divide-graphite-100">{sorted.map(item)}</ul>;
  return (
    <div>
      {SEVERITY.values
        .slice()
        .sort((a, b) => RANK[a] - RANK[b])
        .map((s) => {
          const group = sorted.filter((f) => f.severity === s);
          if (group.length === 0) return null;
          return (
            <section key={s} aria-label={`${SEVERITY.labels[s]} findings`}>
              <h3 className="flex items-center gap-2 border-b border-graphite-100 bg-graphite-50 px-4 py-1.5 text-xs font-semibold uppercase tracking-wide text-graphite-600">
                {SEVERITY.labels[s]} <span className="font-normal">({group.length})</span>
              </h3>
              <ul className="divide-y divide-graphite-100">{group.map(item)}</ul>
            </section>
          );
        })}
    </div>
  );
}

function FindingItem({
  f,
  data,
  teardown,
  editing,
  setEditing,
  onTag,
  extras,
}: {
  f: FindingDto;
  data: FindingsData;
  teardown: TeardownDto;
  editing: boolean;
  setEditing: (id: number | null) => void;
  onTag: (t: string) => void;
  extras?: ReactNode;
}) {
  const update = useUpdateFinding(teardown.id);
  const remove = useDeleteFinding(teardown.id);
  if (editing) {
    return (
      <li className="bg-graphite-50/60 p-4">
        <FindingForm
          parts={data.parts}
          photos={data.photos}
          initial={f}
          submitLabel="Save finding"
          onCancel={() => setEditing(null)}
          onSubmit={async (values) => {
            await update.mutateAsync({ id: f.id, ...values });
            toast.success('Finding saved.');
            setEditing(null);
          }}
        />
      </li>
    );
  }
  const onDelete = async () => {
    const ok = await confirmDialog({
      title: 'Delete this finding?',
      message: f.suggestionKey
        ? 'It was accepted from a suggestion; the suggestion becomes open again in the figures panel.'
        : 'The finding and its links to parts and photos are removed. The history keeps a line saying it was deleted.',
      confirmLabel: 'Delete finding',
      tone: 'danger',
    });
    if (!ok) return;
    remove.mutate(f.id, {
      onSuccess: () => toast.success('Finding deleted.'),
      onError: (err) => {
        const m = mutationErrorMessage(err);
        if (m) toast.error(m);
      },
    });
  };
  return (
    <li className="group px-4 py-3" data-finding-id={f.id}>
      <div className="flex items-start gap-3">
        <div className="min-w-0 flex-1">
          <div className="flex flex-wrap items-center gap-1.5">
            <SeverityBadge severity={f.severity} />
            <Badge>{FINDING_KIND.labels[f.kind]}</Badge>
            {f.suggestionKey && (
              <Badge tone="cell" icon={Sparkles} title={`Accepted from the suggestion ${f.suggestionKey}`}>
                From a suggestion
              </Badge>
            )}
          </div>
          <p className="mt-1.5 whitespace-pre-wrap text-sm text-graphite-900">{f.text}</p>
          <div className="mt-2 flex flex-wrap items-center gap-x-4 gap-y-1 text-xs text-graphite-600">
            {f.parts.length > 0 && (
              <span className="inline-flex flex-wrap items-center gap-1">
                <Cpu className="size-3.5" aria-hidden />
                {f.parts.map((p) => (
                  <span key={p.id} className="rounded bg-graphite-100 px-1.5 py-0.5" title={p.description}>
                    {p.designators ? <span className="font-mono">{p.designators}</span> : null} {p.designators ? '· ' : ''}
                    {p.description.length > 40 ? `${p.description.slice(0, 38)}…` : p.description}
                  </span>
                ))}
              </span>
            )}
            <span className="inline-flex items-center gap-1" title={f.photos.map((p) => p.caption ?? `Photo ${p.id}`).join(', ')}>
              <Camera className="size-3.5" aria-hidden />
              {f.photos.length} photo{f.photos.length === 1 ? '' : 's'}
            </span>
            {f.tags.map((t) => (
              <button
                key={t}
                type="button"
                onClick={() => onTag(t)}
                className="rounded-full bg-copper-50 px-2 py-0.5 text-copper-800 ring-1 ring-inset ring-copper-100 hover:bg-copper-100"
                title={`Show findings tagged ${t}`}
              >
                #{t}
              </button>
            ))}
            <span className="text-graphite-400">
              {f.createdBy?.name ?? 'Former user'} · {formatDate(f.createdAt)}
            </span>
          </div>
          {extras}
        </div>
        {teardown.permissions.edit && (
          <div className="flex shrink-0 gap-1 opacity-70 group-hover:opacity-100">
            <Button size="sm" variant="ghost" onClick={() => setEditing(f.id)} aria-label={`Edit finding ${f.id}`}>
              <Pencil className="size-4" aria-hidden />
            </Button>
            <Button size="sm" variant="ghost" onClick={onDelete} busy={remove.isPending} aria-label={`Delete finding ${f.id}`}>
              <Trash2 className="size-4" aria-hidden />
            </Button>
          </div>
        )}
      </div>
    </li>
  );
}
