import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { cutoffDebounceSettingBody, type CutoffDebounceSettingBody, type CutoffDebounceSettingForm } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, FormError, Input } from '@/components/field';
import { Card, Spinner } from '@/components/page';
import { ErrorPanel } from '@/components/error-boundary';
import { applyServerErrors } from '@/lib/form-errors';
import { useSettings, useUpdateSettings } from '@/lib/settings';

/** How long a discharge must stay at or below its cut-off voltage to end (admins change it). */
export function CutoffDebounceSetting({ canEdit }: { canEdit: boolean }) {
  const settings = useSettings();
  const update = useUpdateSettings();
  const [saved, setSaved] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, reset, setError, formState } = useForm<CutoffDebounceSettingForm, unknown, CutoffDebounceSettingBody>({ resolver: zodResolver(cutoffDebounceSettingBody) });
  const current = settings.data?.cutoffDebounceSeconds;
  useEffect(() => {
    if (current !== undefined) reset({ cutoffDebounceSeconds: current });
  }, [current, reset]);
  if (settings.isPending) return <Spinner />;
  if (settings.isError) return <ErrorPanel error={settings.error} onRetry={() => settings.refetch()} />;
  const submit = handleSubmit(async (values) => {
    setSaved(false);
    setFormError(null);
    try {
      await update.mutateAsync(values);
      setSaved(true);
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['cutoffDebounceSeconds']));
    }
  });
  return (
    <Card title="Cut-off debounce">
      <div className="space-y-3 p-4 text-sm">
        <p className="text-graphite-700">
          A discharge ends at its cut-off voltage once the voltage stays at or below it for <strong className="num">{current} s</strong>; a shorter sag, as at a load step, is ignored. A dip still
          under the cut-off when the load stops or the log ends always ends the run.
        </p>
        <p className="text-xs text-graphite-500">
          0 s ends a run at the first sample at the cut-off. Applies to runs analysed from now on (an upload, or “Save and re-analyse”); a run can set its own, and each run shows the debounce it used.
        </p>
        {canEdit ? (
          <form className="space-y-2" onSubmit={submit} noValidate aria-label="Cut-off debounce">
            <div className="flex flex-wrap items-end gap-2">
              <Field label="Debounce (s)" error={formState.errors.cutoffDebounceSeconds?.message} hint="0–600 s">
                {(f) => (
                  <Input
                    {...f}
                    className="w-28"
                    inputMode="decimal"
                    {...register('cutoffDebounceSeconds', { setValueAs: (v: string) => (String(v).trim() === '' ? Number.NaN : Number(String(v).replace(',', '.'))) })}
                  />
                )}
              </Field>
              <Button type="submit" size="md" busy={update.isPending}>
                Save
              </Button>
              {saved && !update.isPending && (
                <span className="pb-2 text-cell-700" role="status">
                  Saved
                </span>
              )}
            </div>
            <FormError message={formError} />
          </form>
        ) : (
          <p className="text-xs text-graphite-500">An admin can change this setting.</p>
        )}
      </div>
    </Card>
  );
}
