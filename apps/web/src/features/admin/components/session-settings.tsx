import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { SETTING_LABELS, workspaceSettingsSchema } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Field, FormError, Input } from '@/components/field';
import { Card, Spinner } from '@/components/page';
import { applyServerErrors } from '@/lib/form-errors';
import { useSettings, useUpdateSettings } from '@/lib/settings';

const sessionLimits = workspaceSettingsSchema.pick({ sessionMaxHours: true, sessionIdleMinutes: true }).required();
type SessionLimits = { sessionMaxHours: number; sessionIdleMinutes: number };

/** How long a sign-in lasts: an absolute limit and an idle limit, for every user of the workspace. */
export function SessionSettings() {
  const settings = useSettings();
  if (settings.isPending) return <Spinner />;
  if (settings.isError) return <ErrorPanel error={settings.error} onRetry={() => settings.refetch()} />;
  return <SessionSettingsForm initial={{ sessionMaxHours: settings.data.sessionMaxHours, sessionIdleMinutes: settings.data.sessionIdleMinutes }} />;
}

function SessionSettingsForm({ initial }: { initial: SessionLimits }) {
  const update = useUpdateSettings();
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const { register, handleSubmit, setError, formState } = useForm<SessionLimits>({ resolver: zodResolver(sessionLimits), defaultValues: initial });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setSaved(false);
    try {
      await update.mutateAsync(values);
      setSaved(true);
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['sessionMaxHours', 'sessionIdleMinutes']));
    }
  });
  return (
    <Card title="Sign-in sessions">
      <form onSubmit={onSubmit} className="space-y-3 p-4 text-sm" noValidate>
        <p className="text-graphite-700">A session ends at the first of the two limits; the user signs in again. Changes apply to every session at its next request.</p>
        <FormError message={formError} />
        <div className="flex flex-wrap items-end gap-3">
          <Field label={`${SETTING_LABELS.sessionMaxHours} (hours)`} error={formState.errors.sessionMaxHours?.message} hint="1 to 168 h; 12 h by default">
            {(p) => <Input {...p} className="w-28" inputMode="numeric" {...register('sessionMaxHours', { valueAsNumber: true })} />}
          </Field>
          <Field label={`${SETTING_LABELS.sessionIdleMinutes} (minutes)`} error={formState.errors.sessionIdleMinutes?.message} hint="5 to 1440 min; 60 min by default">
            {(p) => <Input {...p} className="w-28" inputMode="numeric" {...register('sessionIdleMinutes', { valueAsNumber: true })} />}
          </Field>
          <Button type="submit" busy={update.isPending}>
            Save
          </Button>
          {saved && !update.isPending && (
            <span className="pb-2 text-cell-700" role="status">
              Saved
            </span>
          )}
        </div>
      </form>
    </Card>
  );
}
