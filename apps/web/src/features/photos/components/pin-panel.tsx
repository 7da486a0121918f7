import { useState, type FormEvent } from 'react';
import { Link2, Trash2 } from 'lucide-react';
import type { CalloutDto, CalloutTargets } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, Select, InlineError } from '@/components/field';
import { ApiError } from '@/lib/api-client';
import { PinMark } from './pin';

export interface PinValues {
  label: string;
  partId: number | null;
  findingId: number | null;
}

const fieldErrors = (error: unknown): Record<string, string> => (error instanceof ApiError ? error.fields : {});

/** Label plus part and finding pickers; used to place a new pin and to edit one. */
function PinForm({
  number,
  initial,
  targets,
  busy,
  error,
  submitLabel,
  onSubmit,
  onCancel,
  onDelete,
}: {
  number: number;
  initial: PinValues;
  targets: CalloutTargets | undefined;
  busy: boolean;
  error: unknown;
  submitLabel: string;
  onSubmit: (v: PinValues) => void;
  onCancel: () => void;
  onDelete?: () => void;
}) {
  const [values, setValues] = useState(initial);
  const errors = fieldErrors(error);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    onSubmit(values);
  };
  const other = error && !Object.keys(errors).some((k) => ['label', 'partId', 'findingId'].includes(k)) ? (error as Error).message : null;
  return (
    <form onSubmit={submit} className="space-y-3 rounded-md bg-copper-50/60 p-3 ring-1 ring-copper-100" aria-label={`Pin ${number}`}>
      <Field label={`Label of pin ${number}`} error={errors.label}>
        {(p) => <Input {...p} autoFocus value={values.label} maxLength={200} placeholder="e.g. Charger IC" onChange={(e) => setValues({ ...values, label: e.target.value })} />}
      </Field>
      <Field label="Part" error={errors.partId} hint={targets && !targets.parts.length ? 'No parts recorded yet' : undefined}>
        {(p) => (
          <Select {...p} value={values.partId ?? ''} onChange={(e) => setValues({ ...values, partId: e.target.value ? Number(e.target.value) : null })} disabled={!targets?.parts.length}>
            <option value="">No part</option>
            {targets?.parts.map((t) => (
              <option key={t.id} value={t.id}>
                {t.label}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <Field label="Finding" error={errors.findingId} hint={targets && !targets.findings.length ? 'No findings recorded yet' : undefined}>
        {(p) => (
          <Select {...p} value={values.findingId ?? ''} onChange={(e) => setValues({ ...values, findingId: e.target.value ? Number(e.target.value) : null })} disabled={!targets?.findings.length}>
            <option value="">No finding</option>
            {targets?.findings.map((t) => (
              <option key={t.id} value={t.id}>
                {t.label}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <InlineError message={other} />
      <div className="flex flex-wrap items-center gap-2">
        <Button type="submit" variant="primary" size="sm" busy={busy}>
          {submitLabel}
        </Button>
        <Button size="sm" variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
        {onDelete && (
          <Button size="sm" variant="danger" className="ml-auto" onClick={onDelete} aria-label={`Delete pin ${number}`}>
            <Trash2 className="size-3.5" aria-hidden /> Delete pin
          </Button>
        )}
      </div>
    </form>
  );
}

const EMPTY: PinValues = { label: '', partId: null, findingId: null };

/** The pins of the photo on the stage: a list, the editor of the selected one, the form for a new one. */
export function PinPanel({
  callouts,
  canEdit,
  selectedId,
  onSelect,
  draftNumber,
  targets,
  create,
  update,
  remove,
  onCancelDraft,
}: {
  callouts: CalloutDto[];
  canEdit: boolean;
  selectedId: number | null;
  onSelect: (id: number | null) => void;
  draftNumber: number | null;
  targets: CalloutTargets | undefined;
  create: { busy: boolean; error: unknown; run: (v: PinValues) => void };
  update: { busy: boolean; error: unknown; run: (c: CalloutDto, v: PinValues) => void };
  remove: (c: CalloutDto) => void;
  onCancelDraft: () => void;
}) {
  return (
    <section aria-labelledby="pins-heading" className="space-y-2">
      <div className="flex items-baseline justify-between">
        <h3 id="pins-heading" className="text-sm font-semibold text-graphite-900">
          Pins <span className="num font-normal text-graphite-500">({callouts.length})</span>
        </h3>
        {canEdit && <span className="text-xs text-graphite-500">Click the photo to add one</span>}
      </div>
      {draftNumber !== null && (
        <PinForm
          key={`draft-${draftNumber}`}
          number={draftNumber}
          initial={EMPTY}
          targets={targets}
          busy={create.busy}
          error={create.error}
          submitLabel="Place pin"
          onSubmit={create.run}
          onCancel={onCancelDraft}
        />
      )}
      {callouts.length === 0 && draftNumber === null && <p className="text-sm text-graphite-500">{canEdit ? 'No pins yet. Click a spot on the photo to number it.' : 'No pins on this photo.'}</p>}
      <ul className="space-y-1">
        {callouts.map((c) => (
          <li key={c.id}>
            {selectedId === c.id && canEdit ? (
              <PinForm
                key={`pin-${c.id}`}
                number={c.number}
                initial={{ label: c.label, partId: c.part?.id ?? null, findingId: c.finding?.id ?? null }}
                targets={targets}
                busy={update.busy}
                error={update.error}
                submitLabel="Save pin"
                onSubmit={(v) => update.run(c, v)}
                onCancel={() => onSelect(null)}
                onDelete={() => remove(c)}
              />
            ) : (
              <button
                type="button"
                onClick={() => onSelect(selectedId === c.id ? null : c.id)}
                aria-pressed={selectedId === c.id}
                className={`flex w-full items-start gap-2.5 rounded-md px-2 py-1.5 text-left text-sm ${selectedId === c.id ? 'bg-copper-50 ring-1 ring-copper-200' : 'hover:bg-graphite-50'}`}
              >
                <PinMark number={c.number} />
                <span className="min-w-0 pt-0.5">
                  <span className="block text-graphite-900">{c.label}</span>
                  {(c.part || c.finding) && (
                    <span className="mt-0.5 flex items-start gap-1 text-xs text-graphite-500">
                      <Link2 className="mt-0.5 size-3 shrink-0" aria-hidden />
                      <span>{[c.part && `Part: ${c.part.label}`, c.finding && `Finding: ${c.finding.label}`].filter(Boolean).join(' · ')}</span>
                    </span>
                  )}
                </span>
              </button>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
