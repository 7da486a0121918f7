import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { createFindingBody, FINDING_KIND, PART_CATEGORY, SEVERITY, type CreateFindingBody, type FindingDto, type FindingFormValues, type LinkablePart, type LinkablePhoto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Select, Textarea, FormError } from '@/components/field';
import { SeverityBadge } from '@/components/status';
import { TagInput } from '@/components/tag-input';
import { applyServerErrors } from '@/lib/form-errors';
import { isUnpublishCancelled } from '@/lib/unpublish-confirm';

const KNOWN = ['kind', 'severity', 'text', 'tags', 'partIds', 'photoIds'] as const;

function Checklist<T extends { id: number }>({
  items,
  value,
  onChange,
  label,
  describe,
  empty,
}: {
  items: T[];
  value: number[];
  onChange: (ids: number[]) => void;
  label: string;
  describe: (item: T) => React.ReactNode;
  empty: string;
}) {
  if (items.length === 0) return <p className="text-xs text-graphite-500">{empty}</p>;
  return (
    <fieldset className="max-h-44 overflow-auto rounded-md border border-graphite-200 bg-white">
      <legend className="sr-only">{label}</legend>
      {items.map((item) => (
        <label key={item.id} className="flex cursor-pointer items-start gap-2 border-b border-graphite-100 px-2.5 py-1.5 text-sm last:border-0 hover:bg-graphite-50">
          <input
            type="checkbox"
            className="mt-0.5 accent-copper-600"
            checked={value.includes(item.id)}
            onChange={(e) => onChange(e.target.checked ? [...value, item.id] : value.filter((id) => id !== item.id))}
          />
          <span className="min-w-0">{describe(item)}</span>
        </label>
      ))}
    </fieldset>
  );
}

export function FindingForm({
  parts,
  photos,
  initial,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  parts: LinkablePart[];
  photos: LinkablePhoto[];
  initial?: FindingDto;
  submitLabel: string;
  onSubmit: (values: CreateFindingBody) => Promise<unknown>;
  onCancel: () => void;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, formState } = useForm<FindingFormValues, unknown, CreateFindingBody>({
    resolver: zodResolver(createFindingBody),
    defaultValues: initial
      ? { kind: initial.kind, severity: initial.severity, text: initial.text, tags: initial.tags, partIds: initial.parts.map((p) => p.id), photoIds: initial.photos.map((p) => p.id) }
      : { kind: 'safety', severity: 'minor', text: '', tags: [], partIds: [], photoIds: [] },
  });
  const errors = formState.errors;
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await onSubmit(values);
    } catch (err) {
      if (isUnpublishCancelled(err)) return; // kept published on purpose; the form keeps the edit
      setFormError(applyServerErrors(err, setError, KNOWN));
    }
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label={initial ? `Edit finding ${initial.id}` : 'New finding'}>
      <div className="grid gap-4 sm:grid-cols-[14rem_1fr]">
        <Field label="Kind" error={errors.kind?.message}>
          {(p) => (
            <Select {...p} {...register('kind')}>
              {FINDING_KIND.values.map((k) => (
                <option key={k} value={k}>
                  {FINDING_KIND.labels[k]}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <fieldset>
          <legend className="mb-1 block text-sm font-medium text-graphite-800">Severity</legend>
          <div className="flex flex-wrap gap-2">
            {SEVERITY.values.map((s) => (
              <label key={s} className="flex h-9 cursor-pointer items-center gap-1.5 rounded-md px-2 ring-1 ring-graphite-200 has-[:checked]:bg-copper-50 has-[:checked]:ring-copper-500">
                <input type="radio" value={s} {...register('severity')} className="accent-copper-600" />
                <SeverityBadge severity={s} />
              </label>
            ))}
          </div>
          {errors.severity?.message && <p className="mt-1 text-sm text-brick-700">{errors.severity.message}</p>}
        </fieldset>
      </div>
      <Field label="What you found" error={errors.text?.message} hint="One observation: what, where, and why it matters.">
        {(p) => <Textarea {...p} rows={4} {...register('text')} />}
      </Field>
      <Field label="Tags" error={errors.tags?.message ?? (errors.tags as unknown as Record<string, { message?: string }> | undefined)?.[0]?.message}>
        {(p) => <Controller control={control} name="tags" render={({ field }) => <TagInput {...p} value={field.value ?? []} onChange={field.onChange} />} />}
      </Field>
      <div className="grid gap-4 md:grid-cols-2">
        <div className="space-y-1">
          <p className="text-sm font-medium text-graphite-800">Linked parts</p>
          <Controller
            control={control}
            name="partIds"
            render={({ field }) => (
              <Checklist
                label="Linked parts"
                items={parts}
                value={field.value ?? []}
                onChange={field.onChange}
                empty="No parts recorded for this teardown yet."
                describe={(p) => (
                  <>
                    {p.designators && <span className="mr-1.5 font-mono text-xs text-graphite-700">{p.designators}</span>}
                    {p.description} <span className="text-xs text-graphite-500">· {PART_CATEGORY.labels[p.category]}</span>
                  </>
                )}
              />
            )}
          />
          {errors.partIds?.message && <p className="text-sm text-brick-700">{errors.partIds.message}</p>}
        </div>
        <div className="space-y-1">
          <p className="text-sm font-medium text-graphite-800">Linked photos</p>
          <Controller
            control={control}
            name="photoIds"
            render={({ field }) => (
              <Checklist
                label="Linked photos"
                items={photos}
                value={field.value ?? []}
                onChange={field.onChange}
                empty="No photos uploaded for this teardown yet."
                describe={(p) => `${p.caption ?? `Photo ${p.id}`} · layer ${p.layer}`}
              />
            )}
          />
          {errors.photoIds?.message && <p className="text-sm text-brick-700">{errors.photoIds.message}</p>}
        </div>
      </div>
      <FormError message={formError} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={formState.isSubmitting}>
          {submitLabel}
        </Button>
        <Button onClick={onCancel}>Cancel</Button>
      </div>
    </form>
  );
}
