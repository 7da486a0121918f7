import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { createTeardownBody, type CreateTeardownBody, type CreateTeardownForm, type TeardownDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, Textarea, FormError } from '@/components/field';
import { LithiumCaution } from '@/components/safety';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateTeardown } from '../api/create-teardown';

const today = () => new Date().toISOString().slice(0, 10);

/** Start a teardown of a device: date, which unit, first safety notes. */
export function StartTeardownForm({ deviceId, onStarted, onCancel }: { deviceId: number; onStarted: (t: TeardownDto) => void; onCancel: () => void }) {
  const create = useCreateTeardown();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<CreateTeardownForm, unknown, CreateTeardownBody>({
    resolver: zodResolver(createTeardownBody),
    defaultValues: { deviceId, date: today(), unitLabel: 'Unit A', safetyNotes: '' },
  });
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      onStarted(await create.mutateAsync(values));
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['date', 'unitLabel', 'safetyNotes', 'deviceId']));
    }
  });
  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label="Start a teardown">
      <LithiumCaution cell={null} />
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Date opened" error={formState.errors.date?.message}>
          {(p) => <Input {...p} type="date" {...register('date')} />}
        </Field>
        <Field label="Unit" error={formState.errors.unitLabel?.message} hint="Which sample you open, e.g. Unit A">
          {(p) => <Input {...p} {...register('unitLabel')} />}
        </Field>
      </div>
      <Field label="Safety notes" error={formState.errors.safetyNotes?.message} hint="e.g. cell voltage before opening, how it was discharged">
        {(p) => <Textarea {...p} rows={2} {...register('safetyNotes')} />}
      </Field>
      <FormError message={formError} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={create.isPending}>
          Start the teardown
        </Button>
        <Button onClick={onCancel}>Cancel</Button>
      </div>
    </form>
  );
}
