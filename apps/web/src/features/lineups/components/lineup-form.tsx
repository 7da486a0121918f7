import { useState, type FormEvent } from 'react';
import { createLineupBody, DEFAULT_LINEUP_MODE, type CreateLineupBody, type DeviceDto, type LineupDto, type LineupModeChoice } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, Select, Textarea, FormError, InlineError } from '@/components/field';
import { Card } from '@/components/page';
import { ApiError } from '@/lib/api-client';
import type { LineupMetrics } from '../api/metrics';
import { DevicePicker } from './device-picker';
import { ModeChoice } from './mode-choice';
import { WeightSliders } from './weight-sliders';

type Errors = Record<string, string>;

/** Field messages from a zod error or the server's `fields`, keyed by path ("deviceIds.2", "weights.packWh"). */
function fieldsOf(issues: { path: PropertyKey[]; message: string }[]): Errors {
  const out: Errors = {};
  for (const i of issues) out[i.path.map(String).join('.') || '_'] ??= i.message;
  return out;
}

/**
 * Name, description, currency, devices and weights of a lineup. Checked with the contracts schema
 * before sending; the server's field messages land on the same fields.
 */
export function LineupForm({
  initial,
  devices,
  currencies,
  defaultCurrency,
  metrics,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  initial?: LineupDto;
  devices: DeviceDto[];
  /** Currencies the current rate table converts. */
  currencies: string[];
  defaultCurrency: string;
  metrics: LineupMetrics;
  submitLabel: string;
  onSubmit: (values: CreateLineupBody) => Promise<unknown>;
  onCancel: () => void;
}) {
  const [name, setName] = useState(initial?.name ?? '');
  const [description, setDescription] = useState(initial?.description ?? '');
  const [currency, setCurrency] = useState(initial?.currency ?? defaultCurrency);
  const [deviceIds, setDeviceIds] = useState<number[]>(initial?.devices.map((d) => d.id) ?? []);
  const [weights, setWeights] = useState<Record<string, number>>(initial?.weights ?? metrics.defaults);
  const [mode, setMode] = useState<LineupModeChoice>(initial?.mode ?? DEFAULT_LINEUP_MODE);
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const options = [...new Set([...currencies, currency])].sort();
  const itemErrors = Object.fromEntries(
    Object.entries(errors)
      .filter(([k]) => /^deviceIds\.\d+$/.test(k))
      .map(([k, v]) => [Number(k.split('.')[1]), v]),
  );
  const weightErrors = Object.fromEntries(
    Object.entries(errors)
      .filter(([k]) => k.startsWith('weights.'))
      .map(([k, v]) => [k.slice('weights.'.length), v]),
  );

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setFormError(null);
    const parsed = createLineupBody.safeParse({ name, description, currency, deviceIds, weights, mode });
    if (!parsed.success) {
      setErrors(fieldsOf(parsed.error.issues));
      return;
    }
    setErrors({});
    setBusy(true);
    try {
      await onSubmit(parsed.data);
    } catch (err) {
      if (err instanceof ApiError && Object.keys(err.fields).length) {
        setErrors(err.fields);
        const known = Object.keys(err.fields).every((k) => ['name', 'description', 'currency', 'deviceIds', 'weights', 'mode'].some((f) => k === f || k.startsWith(`${f}.`)));
        setFormError(known ? null : err.message);
      } else setFormError(err instanceof Error ? err.message : 'Something went wrong.');
    } finally {
      setBusy(false);
    }
  };

  return (
    <form onSubmit={submit} noValidate className="max-w-5xl space-y-5">
      <Card title="Lineup">
        <div className="grid gap-4 p-4 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
          <Field label="Name" error={errors.name}>
            {(p) => <Input {...p} value={name} onChange={(e) => setName(e.target.value)} autoComplete="off" placeholder="e.g. Pocket heaters under 30 EUR" />}
          </Field>
          <Field label="Reporting currency" error={errors.currency} hint="Prices and should-costs are converted at the current rates.">
            {(p) => (
              <Select {...p} value={currency} onChange={(e) => setCurrency(e.target.value)} className="font-mono">
                {options.map((c) => (
                  <option key={c} value={c}>
                    {c}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field label="What it is for" error={errors.description} className="sm:col-span-2">
            {(p) => <Textarea {...p} value={description} onChange={(e) => setDescription(e.target.value)} rows={2} placeholder="The question this comparison answers (optional)" />}
          </Field>
        </div>
      </Card>
      <Card title="Devices">
        <div className="p-4">
          <DevicePicker devices={devices} value={deviceIds} onChange={setDeviceIds} error={errors.deviceIds} itemErrors={itemErrors} />
        </div>
      </Card>
      <Card title="Operating mode compared">
        <div className="space-y-3 p-4">
          <p className="text-sm text-graphite-600">
            Each device’s runtime comes from one of the operating modes recorded in its teardown; the lineup says which and why. A device without a matching mode has no runtime, and a device without
            recorded modes is taken at its main load.
          </p>
          <ModeChoice value={mode} onChange={setMode} error={errors['mode.name'] ?? errors.mode} hideLegend />
        </div>
      </Card>
      <Card title="Weights of the ranking">
        <div className="space-y-3 p-4">
          <p className="text-sm text-graphite-600">
            How much each metric counts in the ranking, from off to {metrics.weightMax}. A device missing a weighted metric is scored on the others and ranked after every device that has them all. You
            can also move these on the lineup page and watch the ranking change before saving.
          </p>
          <WeightSliders metrics={metrics.metrics} weights={weights} max={metrics.weightMax} onChange={(k, v) => setWeights((w) => ({ ...w, [k]: v }))} errors={weightErrors} columns={2} />
          <InlineError message={errors.weights} />
        </div>
      </Card>
      <FormError message={formError} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={busy}>
          {submitLabel}
        </Button>
        <Button onClick={onCancel}>Cancel</Button>
      </div>
    </form>
  );
}
