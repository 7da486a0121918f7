import { useEffect, useState } from 'react';
import { Field, Input } from '@/components/field';
import { Button } from '@/components/button';
import { Card, Spinner } from '@/components/page';
import { ErrorPanel } from '@/components/error-boundary';
import { ApiError } from '@/lib/api-client';
import { useSettings, useUpdateSettings } from '@/lib/settings';

/** The workspace threshold under which a measured capacity is flagged against its label (admins change it). */
export function CapacityWarningSetting({ canEdit }: { canEdit: boolean }) {
  const settings = useSettings();
  const update = useUpdateSettings();
  const [percent, setPercent] = useState('');
  const [saved, setSaved] = useState(false);
  const [invalid, setInvalid] = useState<string | null>(null);
  useEffect(() => {
    if (settings.data) setPercent(String(Math.round(settings.data.capacityWarnFraction * 1000) / 10));
  }, [settings.data]);
  if (settings.isPending) return <Spinner />;
  if (settings.isError) return <ErrorPanel error={settings.error} onRetry={() => settings.refetch()} />;
  const current = settings.data.capacityWarnFraction * 100;
  const fieldError = invalid ?? (update.error instanceof ApiError ? update.error.fields.capacityWarnFraction : undefined);
  return (
    <Card title="Capacity warning">
      <div className="space-y-3 p-4 text-sm">
        <p className="text-graphite-700">
          A discharge that delivers less than <strong className="num">{Math.round(current * 10) / 10} %</strong> of the label is flagged, in the runs, the figures and the suggested findings. Runs
          compare energy: the label&apos;s Wh, or its mAh at the cell voltage.
        </p>
        {canEdit ? (
          <form
            className="flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              setSaved(false);
              const value = Number(percent.replace(',', '.').replace('%', '').trim()) / 100;
              if (!Number.isFinite(value) || value < 0.5 || value > 1) {
                setInvalid('Give a percentage between 50 % and 100 %.');
                return;
              }
              setInvalid(null);
              update.mutate({ capacityWarnFraction: value }, { onSuccess: () => setSaved(true) });
            }}
          >
            <Field label="Warn below (% of the label)" error={fieldError} hint="Between 50 % and 100 %; 90 % is usual">
              {(f) => <Input {...f} className="w-28" inputMode="decimal" value={percent} onChange={(e) => setPercent(e.target.value)} />}
            </Field>
            <Button type="submit" size="md" busy={update.isPending}>
              Save
            </Button>
            {saved && !update.isPending && (
              <span className="pb-2 text-cell-700" role="status">
                Saved
              </span>
            )}
          </form>
        ) : (
          <p className="text-xs text-graphite-500">An admin can change this threshold.</p>
        )}
        {update.isError && !fieldError && <ErrorPanel error={update.error} />}
      </div>
    </Card>
  );
}
