import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { toast } from 'sonner';
import { CircleCheck, Eye, MessageSquare, Undo2 } from 'lucide-react';
import {
  DEVICE_CATEGORY,
  TEARDOWN_FIELD_LABELS,
  teardownConflictDetails,
  updateTeardownBody,
  type CommentDto,
  type TeardownDto,
  type TeardownEditableField,
  type UpdateTeardownBody,
  type UpdateTeardownForm,
} from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, Textarea, FormError } from '@/components/field';
import { Card, Spinner } from '@/components/page';
import { LithiumCaution } from '@/components/safety';
import { StatusBadge } from '@/components/status';
import { conflictFields, VersionConflict } from '@/components/version-conflict';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { formatDate, formatDateTime } from '@/lib/format';
import { useSettings } from '@/lib/settings';
import { mutationErrorMessage } from '@/lib/unpublish-confirm';
import { useComments } from '../api/comments';
import { useUpdateTeardown } from '../api/update-teardown';

type FormValues = { date: string; unitLabel: string; contactSeconds: string; summary: string; safetyNotes: string };
const FIELDS = Object.keys(TEARDOWN_FIELD_LABELS) as TeardownEditableField[];

const valuesOf = (t: TeardownDto): FormValues => ({
  date: t.date,
  unitLabel: t.unitLabel ?? '',
  contactSeconds: t.contactSeconds === null ? '' : String(t.contactSeconds),
  summary: t.summary ?? '',
  safetyNotes: t.safetyNotes ?? '',
});

/** The fields of `mine` that differ from `base` (what this person actually changed). */
const changedFields = (base: FormValues, mine: FormValues) => FIELDS.filter((k) => base[k].trim() !== mine[k].trim());

interface Conflict {
  current: TeardownDto;
  mine: FormValues;
}

/** Overview of a teardown: the record (date, unit, contact time, summary, safety notes), status and review history. */
export function OverviewSection({ teardown }: { teardown: TeardownDto }) {
  return (
    <div className="space-y-5">
      {teardown.status === 'draft' && teardown.permissions.edit && <LithiumCaution cell={teardown.cell} collapsed />}
      {teardown.permissions.edit ? <RecordForm teardown={teardown} /> : <RecordView teardown={teardown} />}
      <ReviewCard teardown={teardown} />
    </div>
  );
}

function RecordView({ teardown: t }: { teardown: TeardownDto }) {
  return (
    <Card title="Teardown record">
      <dl className="grid gap-x-6 gap-y-3 p-4 text-sm sm:grid-cols-3">
        <div>
          <dt className="text-graphite-500">Date opened</dt>
          <dd>{formatDate(t.date)}</dd>
        </div>
        <div>
          <dt className="text-graphite-500">Unit</dt>
          <dd>{t.unitLabel ?? '—'}</dd>
        </div>
        <div>
          <dt className="text-graphite-500">Touch contact time</dt>
          <dd className="num">{t.contactSeconds === null ? 'Workspace default' : `${t.contactSeconds} s`}</dd>
        </div>
        <div className="sm:col-span-3">
          <dt className="text-graphite-500">Summary</dt>
          <dd className="mt-0.5 whitespace-pre-wrap">{t.summary ?? 'No summary yet.'}</dd>
        </div>
        <div className="sm:col-span-3">
          <dt className="text-graphite-500">Safety notes</dt>
          <dd className="mt-0.5 whitespace-pre-wrap">{t.safetyNotes ?? '—'}</dd>
        </div>
      </dl>
    </Card>
  );
}

function RecordForm({ teardown }: { teardown: TeardownDto }) {
  const update = useUpdateTeardown(teardown.id);
  const settings = useSettings();
  // The record as it was when this person started editing: the base of their changes.
  const [base, setBase] = useState<TeardownDto>(teardown);
  const [conflict, setConflict] = useState<Conflict | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<UpdateTeardownForm, unknown, UpdateTeardownBody>({ resolver: zodResolver(updateTeardownBody), defaultValues: { version: teardown.version, ...valuesOf(teardown) } });
  const { register, handleSubmit, reset, setError, formState, getValues } = form;

  // Someone else's save (or a review step) arrives while the form is untouched: follow it.
  useEffect(() => {
    if (teardown.version !== base.version && !formState.isDirty && !conflict) {
      setBase(teardown);
      reset({ version: teardown.version, ...valuesOf(teardown) });
    }
  }, [teardown, base.version, formState.isDirty, conflict, reset]);

  const save = async (onto: TeardownDto, mine: FormValues) => {
    const changed = changedFields(valuesOf(base), mine);
    if (changed.length === 0) {
      toast.info('Nothing to save: the fields are as they were.');
      return;
    }
    setFormError(null);
    try {
      const saved = await update.mutateAsync({ version: onto.version, ...Object.fromEntries(changed.map((k) => [k, mine[k]])) });
      setConflict(null);
      setBase(saved);
      reset({ version: saved.version, ...valuesOf(saved) });
      toast.success(saved.status !== onto.status ? 'Saved. The teardown is a draft again and needs review.' : 'Saved.');
    } catch (err) {
      if (err instanceof ApiError && err.code === 'stale_version') {
        const parsed = teardownConflictDetails.safeParse(err.details);
        if (parsed.success) {
          setConflict({ current: parsed.data.current, mine });
          return;
        }
      }
      const message = mutationErrorMessage(err);
      if (message === null) return; // kept published on purpose
      setFormError(applyServerErrors(err, setError, FIELDS));
    }
  };

  const onSubmit = handleSubmit(() => save(base, getValues() as unknown as FormValues));
  // Without its own time, a teardown is judged at its device category's time, else the workspace default (Admin → Figures & safety).
  const categoryContact = settings.data?.contactSecondsByCategory[teardown.device.category];
  const contactDefault = !settings.data
    ? 'the workspace default'
    : categoryContact !== undefined
      ? `${categoryContact} s, the workspace time for the category “${DEVICE_CATEGORY.labels[teardown.device.category]}”`
      : `${settings.data.defaultContactSeconds} s, the workspace default`;

  return (
    <Card title="Teardown record" actions={<span className="text-xs text-graphite-500">Version {base.version}</span>}>
      <form onSubmit={onSubmit} noValidate className="space-y-4 p-4" aria-label="Teardown record">
        {conflict && (
          <VersionConflict
            fields={conflictFields(TEARDOWN_FIELD_LABELS, valuesOf(base), valuesOf(conflict.current), conflict.mine)}
            who={`version ${conflict.current.version}, ${formatDateTime(conflict.current.updatedAt)}`}
            busy={update.isPending}
            onReapply={() => save(conflict.current, conflict.mine)}
            onTakeTheirs={() => {
              setBase(conflict.current);
              reset({ version: conflict.current.version, ...valuesOf(conflict.current) });
              setConflict(null);
            }}
          />
        )}
        <div className="grid gap-4 sm:grid-cols-3">
          <Field label={TEARDOWN_FIELD_LABELS.date} error={formState.errors.date?.message}>
            {(p) => <Input {...p} type="date" {...register('date')} />}
          </Field>
          <Field label={TEARDOWN_FIELD_LABELS.unitLabel} error={formState.errors.unitLabel?.message}>
            {(p) => <Input {...p} {...register('unitLabel')} />}
          </Field>
          <Field label="Touch contact time (s)" error={formState.errors.contactSeconds?.message} hint={`Empty: ${contactDefault}`}>
            {(p) => <Input {...p} inputMode="numeric" className="num" {...register('contactSeconds')} />}
          </Field>
        </div>
        <Field label={TEARDOWN_FIELD_LABELS.summary} error={formState.errors.summary?.message} hint="What this device is, how it is built, and what stood out.">
          {(p) => <Textarea {...p} rows={5} {...register('summary')} />}
        </Field>
        <Field label={TEARDOWN_FIELD_LABELS.safetyNotes} error={formState.errors.safetyNotes?.message} hint="Cell state on arrival, how it was discharged, anything the next person must know.">
          {(p) => <Textarea {...p} rows={3} {...register('safetyNotes')} />}
        </Field>
        <FormError message={formError} />
        <div className="flex items-center gap-3">
          <Button type="submit" variant="primary" busy={update.isPending && !conflict} disabled={!formState.isDirty || Boolean(conflict)}>
            Save
          </Button>
          {formState.isDirty && !conflict && (
            <Button variant="ghost" onClick={() => reset({ version: base.version, ...valuesOf(base) })}>
              Undo changes
            </Button>
          )}
          {teardown.status === 'published' && <span className="text-xs text-graphite-500">Published: saving a change moves it back to draft.</span>}
        </div>
      </form>
    </Card>
  );
}

const REVIEW_KINDS = {
  submitted: { icon: Eye, label: 'Submitted for review' },
  'sent-back': { icon: Undo2, label: 'Sent back to draft' },
  approved: { icon: CircleCheck, label: 'Approved and published' },
} as const;

function ReviewCard({ teardown: t }: { teardown: TeardownDto }) {
  const comments = useComments(t.id);
  const steps = (comments.data ?? []).filter((c): c is CommentDto & { kind: keyof typeof REVIEW_KINDS } => c.kind !== 'comment');
  return (
    <Card title="Status and review" actions={<StatusBadge status={t.status} />}>
      <div className="space-y-3 p-4 text-sm">
        <p className="text-graphite-600">
          {t.status === 'draft' && (t.permissions.edit ? 'Draft: when the record is complete, submit it for review from the header.' : 'Draft: the engineer is still working on it.')}
          {t.status === 'in_review' && `In review since ${formatDateTime(t.submittedAt)}: a lead approves it or sends it back with a comment.`}
          {t.status === 'published' && `Published ${formatDateTime(t.publishedAt)}: viewers can read it.`}
        </p>
        {t.lastReviewNote && t.status === 'draft' && (
          <p className="flex gap-2 rounded border border-amber-100 bg-amber-50 px-3 py-2 text-amber-800">
            <MessageSquare className="mt-0.5 size-4 shrink-0" aria-hidden />
            <span>
              <span className="font-medium">Last review note: </span>
              {t.lastReviewNote}
            </span>
          </p>
        )}
        {comments.isPending ? (
          <Spinner label="Loading the review history…" />
        ) : steps.length === 0 ? (
          <p className="text-graphite-500">No review steps yet.</p>
        ) : (
          <ol className="relative space-y-3 border-l border-graphite-150 pl-5" aria-label="Review history">
            {steps.map((c) => {
              const k = REVIEW_KINDS[c.kind];
              return (
                <li key={c.id} className="relative">
                  <span className="absolute -left-[1.72rem] top-0.5 rounded-full bg-white p-0.5 text-graphite-500 ring-1 ring-graphite-150">
                    <k.icon className="size-3.5" aria-hidden />
                  </span>
                  <div className="flex flex-wrap items-baseline gap-x-2">
                    <span className="font-medium">{k.label}</span>
                    <span className="text-xs text-graphite-500">
                      {c.author?.name ?? 'Former user'} · {formatDateTime(c.createdAt)}
                    </span>
                  </div>
                  <p className="mt-0.5 whitespace-pre-wrap text-graphite-700">{c.body}</p>
                </li>
              );
            })}
          </ol>
        )}
      </div>
    </Card>
  );
}
