import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { toast } from 'sonner';
import { DEVICE_CATEGORY, durationText, figureSettingsFormSchema, type FigureSettingsForm, type FigureSettingsFormValues, type WorkspaceSettings } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Field, FormError, Input } from '@/components/field';
import { Card, Spinner } from '@/components/page';
import { HotSurfaceNote } from '@/components/safety';
import { ApiError } from '@/lib/api-client';
import { useSettings, useUpdateSettings } from '@/lib/settings';

/** A fraction as the percentage typed back into the form ("90", "87.5"). */
const percentText = (fraction: number) => String(Number((fraction * 100).toPrecision(6)));

const valuesOf = (s: WorkspaceSettings): FigureSettingsFormValues => ({
  defaultContact: durationText(s.defaultContactSeconds),
  byCategory: Object.fromEntries(DEVICE_CATEGORY.values.map((c) => [c, s.contactSecondsByCategory[c] !== undefined ? durationText(s.contactSecondsByCategory[c]!) : ''])),
  usablePercent: percentText(s.usableFraction),
});

/** The server's names for these settings → the form's fields. */
function formFieldOf(key: string): string | null {
  if (key === 'defaultContactSeconds') return 'defaultContact';
  if (key === 'usableFraction') return 'usablePercent';
  if (key.startsWith('contactSecondsByCategory.')) return `byCategory.${key.slice('contactSecondsByCategory.'.length)}`;
  return null;
}

/**
 * The workspace settings behind the touch and runtime figures (admin): the contact time the burn
 * threshold is read at, by device category and by default, and the usable share of the rated energy.
 */
export function FigureSettingsPanel() {
  const settings = useSettings();
  if (settings.isPending) return <Spinner />;
  if (settings.isError) return <ErrorPanel error={settings.error} onRetry={() => settings.refetch()} />;
  // A save elsewhere (or here) starts the form again from what is stored.
  return <FigureSettingsEditor key={JSON.stringify([settings.data.defaultContactSeconds, settings.data.contactSecondsByCategory, settings.data.usableFraction])} settings={settings.data} />;
}

function FigureSettingsEditor({ settings }: { settings: WorkspaceSettings }) {
  const save = useUpdateSettings();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<FigureSettingsFormValues, unknown, FigureSettingsForm>({
    resolver: zodResolver(figureSettingsFormSchema),
    defaultValues: valuesOf(settings),
  });
  const errors = formState.errors;
  const byCategoryErrors = errors.byCategory as Partial<Record<string, { message?: string }>> | undefined;
  const workspaceDefault = durationText(settings.defaultContactSeconds);

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      // The whole settings object goes back: a PATCH that names only some fields may reset the others to their defaults.
      await save.mutateAsync({ ...settings, ...values });
      toast.success('Figure settings saved; touch margins and runtimes use them now.');
    } catch (err) {
      if (!(err instanceof ApiError)) {
        setFormError(err instanceof Error ? err.message : 'The figure settings could not be saved.');
        return;
      }
      let unplaced = Object.keys(err.fields).length === 0;
      for (const [key, message] of Object.entries(err.fields)) {
        const field = formFieldOf(key);
        if (field) setError(field as never, { type: 'server', message });
        else unplaced = true;
      }
      if (unplaced) setFormError(err.message);
    }
  });

  return (
    <form noValidate onSubmit={submit} aria-label="Figure settings" className="max-w-4xl space-y-5">
      <Card title="Contact time for touch figures">
        <div className="space-y-4 p-4 text-sm">
          <div className="space-y-2 text-graphite-700">
            <p>
              The touch margin compares a heated surface with the burn threshold: the temperature at which skin burns after a given time of contact (ISO 13732-1, values from memory [M]). For 1 min of
              contact the threshold depends on the material: bare or coated metal 51 °C, ceramics and glass 56 °C, plastics 60 °C, wood 60 °C. For 10 min it is 48 °C and for 8 h or longer 43 °C,
              whatever the material. A time between two listed ones is judged at the next longer one.
            </p>
            <p>
              Which time applies follows how the device is used, not its surface: what is held or worn for long — a pocket heater in the hand, a headlamp on the forehead — is judged at 10 min or 8 h,
              not at 1 min [CP]. A teardown can set its own contact time (its Overview); otherwise its device’s category below decides; a blank category uses the workspace default. Each touch figure
              says which time it used and why.
            </p>
          </div>
          <Field label="Workspace default contact time" error={errors.defaultContact?.message} hint="For categories left blank, e.g. 1 min, 10 min or 8 h; from 1 s to 8 h">
            {(f) => (
              <div className="w-40">
                <Input {...f} autoComplete="off" {...register('defaultContact')} />
              </div>
            )}
          </Field>
          <table className="max-w-xl" aria-label="Contact time by device category">
            <thead className="text-left text-xs uppercase tracking-wide text-graphite-600">
              <tr>
                <th scope="col" className="pb-1 font-semibold">
                  Device category
                </th>
                <th scope="col" className="pb-1 font-semibold">
                  Contact time
                </th>
              </tr>
            </thead>
            <tbody>
              {DEVICE_CATEGORY.values.map((c) => {
                const message = byCategoryErrors?.[c]?.message;
                const id = `contact-${c}`;
                return (
                  <tr key={c} className="align-top">
                    <td className="py-1 pr-3 pt-2.5">
                      <label htmlFor={id} className="text-graphite-900">
                        {DEVICE_CATEGORY.labels[c]}
                      </label>
                    </td>
                    <td className="w-48 py-1">
                      <Input
                        id={id}
                        className="h-8"
                        autoComplete="off"
                        placeholder={`default, ${workspaceDefault}`}
                        aria-invalid={Boolean(message)}
                        aria-describedby={message ? `${id}-error` : undefined}
                        {...register(`byCategory.${c}`)}
                      />
                      {message && (
                        <p id={`${id}-error`} className="mt-0.5 text-xs text-brick-700" role="alert">
                          {message}
                        </p>
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <p className="text-xs text-graphite-600">Type a time with its unit: 60 s, 10 min, 8 h or 1 h 30 min. Leave a category blank to use the workspace default.</p>
          <HotSurfaceNote />
        </div>
      </Card>

      <Card title="Usable energy for runtimes">
        <div className="space-y-4 p-4 text-sm">
          <p className="text-graphite-700">
            A runtime uses the energy a discharge bench run actually delivered, when the teardown has one. Without a run it takes the rated energy times this share: a device stops at its own cut-off,
            usually before the cell’s rated capacity is spent [CP]. The runtime figure states which of the two it used.
          </p>
          <Field label="Usable share of the rated energy (%)" error={errors.usablePercent?.message} hint="From 50 % to 100 %; 90 % is usual">
            {(f) => (
              <div className="relative w-32">
                <Input {...f} className="num pr-8" inputMode="decimal" autoComplete="off" {...register('usablePercent')} />
                <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-xs text-graphite-600" aria-hidden>
                  %
                </span>
              </div>
            )}
          </Field>
        </div>
      </Card>

      <FormError message={formError} />
      <Button type="submit" variant="primary" busy={save.isPending}>
        Save figure settings
      </Button>
      <p className="text-xs text-graphite-600">Figures are engineering estimates, not certification results: the lab’s own rules and the standards that apply to a product decide.</p>
    </form>
  );
}
