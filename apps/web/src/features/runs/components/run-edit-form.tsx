import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { RUN_OPTION_KEYS, runEditFormSchema, type RunDto, type RunEditFormValues, type UpdateRunBody } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, FormError, Input } from '@/components/field';
import { applyServerErrors } from '@/lib/form-errors';
import { isUnpublishCancelled } from '@/lib/unpublish-confirm';
import { useUpdateRun } from '../api/update-run';
import { optionTexts, RunOptionFields } from './run-option-fields';

const SERVER_FIELDS = ['label', ...RUN_OPTION_KEYS.map((k) => `options.${k}`)];

/** Label and analysis settings of a run; saving re-analyses the stored series on the server. */
export function RunEditForm({ run, onClose }: { run: RunDto; onClose: () => void }) {
  const update = useUpdateRun();
  const [formError, setFormError] = useState<string | null>(null);
  const schema = useMemo(() => runEditFormSchema(run.kind), [run.kind]);
  const { register, handleSubmit, setError, formState } = useForm<RunEditFormValues, unknown, UpdateRunBody>({
    resolver: zodResolver(schema),
    defaultValues: { label: run.label, options: optionTexts(run.kind, run.options) },
  });
  const errors = formState.errors;

  const save = handleSubmit(async (body) => {
    setFormError(null);
    try {
      await update.mutateAsync({ run, body });
      onClose();
    } catch (err) {
      if (isUnpublishCancelled(err)) return; // kept published on purpose; the form keeps the edit
      setFormError(applyServerErrors(err, setError, SERVER_FIELDS));
    }
  });

  return (
    <form className="space-y-3 rounded-md border border-graphite-150 bg-graphite-50/60 p-3" noValidate onSubmit={save} aria-label="Run settings">
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <Field label="Label" error={errors.label?.message}>
          {(f) => <Input {...f} maxLength={160} {...register('label')} />}
        </Field>
        <RunOptionFields kind={run.kind} field={(key) => register(`options.${key}`)} errorOf={(key) => errors.options?.[key]?.message} />
      </div>
      <FormError message={formError} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" size="sm" busy={update.isPending}>
          Save and re-analyse
        </Button>
        <Button size="sm" onClick={onClose}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
