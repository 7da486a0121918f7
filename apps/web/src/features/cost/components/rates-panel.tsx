import { useState } from 'react';
import { useFieldArray, useForm, type FieldErrors } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { toast } from 'sonner';
import { FileUp, History, Plus, Trash2 } from 'lucide-react';
import { manualRatesFormSchema, RATE_TABLE_KIND, type ManualRatesBody, type ManualRatesFormValues, type RateTableDto } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Field, Input, FormError, InlineError } from '@/components/field';
import { Card, EmptyState, Spinner } from '@/components/page';
import { ApiError } from '@/lib/api-client';
import { formatDate, formatDateTime } from '@/lib/format';
import { useSettings, useUpdateSettings } from '@/lib/settings';
import { useImportRates } from '../api/import-rates';
import { useRates } from '../api/rates';
import { useSaveRates } from '../api/save-rates';
import { plain } from './display';

function RateList({ table }: { table: RateTableDto }) {
  const entries = Object.entries(table.rates);
  return (
    <dl className="grid grid-cols-[repeat(auto-fill,minmax(8.5rem,10rem))] gap-x-6 gap-y-0.5 text-sm" aria-label={`Rates per 1 ${table.base}`}>
      {entries.map(([code, rate]) => (
        <div key={code} className="flex items-baseline justify-between gap-3 border-b border-graphite-100 py-1">
          <dt className="font-mono text-graphite-600">{code}</dt>
          <dd className="num font-medium">{plain(rate)}</dd>
        </div>
      ))}
    </dl>
  );
}

function ImportRates() {
  const imp = useImportRates();
  const [error, setError] = useState<string | null>(null);
  const [warnings, setWarnings] = useState<string[]>([]);
  const onFile = async (file: File) => {
    setError(null);
    setWarnings([]);
    try {
      const r = await imp.run(file);
      toast.success(`Rates of ${formatDate(r.rates.date)} imported (${Object.keys(r.rates.rates).length} currencies, base ${r.rates.base}).`);
      setWarnings(r.warnings);
    } catch (err) {
      setError(err instanceof ApiError ? (err.fields.file ?? err.message) : err instanceof Error ? err.message : 'The file could not be imported.');
    }
  };
  return (
    <div className="space-y-2">
      <p className="text-sm text-graphite-600">
        Upload the euro reference-rate XML file as published each working day (the daily file, or a history file: its latest day is read). Rates are units of each currency per 1 EUR.
      </p>
      <label
        className={`inline-flex h-9 cursor-pointer items-center gap-2 rounded-md bg-copper-600 px-3.5 text-sm font-medium text-white hover:bg-copper-700 focus-within:ring-2 focus-within:ring-copper-200 ${imp.busy ? 'pointer-events-none opacity-60' : ''}`}
      >
        <FileUp className="size-4" aria-hidden />
        {imp.busy ? `Uploading… ${Math.round((imp.progress ?? 0) * 100)} %` : 'Import reference-rate XML'}
        <input
          type="file"
          accept=".xml,text/xml,application/xml"
          className="sr-only"
          aria-label="Reference-rate XML file"
          onChange={(e) => {
            const f = e.target.files?.[0];
            e.target.value = '';
            if (f) void onFile(f);
          }}
        />
      </label>
      <InlineError message={error} />
      {warnings.map((w) => (
        <p key={w} className="text-sm text-amber-800">
          {w}
        </p>
      ))}
    </div>
  );
}

/** Rates typed by hand: saved as a new table (the history keeps the old ones). */
function ManualRates({ current, onDone }: { current: RateTableDto | null; onDone: () => void }) {
  const [formError, setFormError] = useState<string | null>(null);
  const save = useSaveRates();
  const { register, control, handleSubmit, setError, watch, formState } = useForm<ManualRatesFormValues, unknown, ManualRatesBody>({
    resolver: zodResolver(manualRatesFormSchema),
    defaultValues: {
      base: current?.base ?? 'EUR',
      date: new Date().toISOString().slice(0, 10),
      source: 'Entered by hand',
      rows: current ? Object.entries(current.rates).map(([code, rate]) => ({ code, rate: plain(rate) })) : [{ code: 'USD', rate: '' }],
    },
  });
  const rows = useFieldArray({ control, name: 'rows' });
  const values = watch();
  const errors = formState.errors as FieldErrors<ManualRatesFormValues> & { rates?: Record<string, { message?: string } | undefined> };
  // The schema and the server name a rate by its code (rates.USD); the form shows it on that row.
  const rateError = (k: number) => errors.rates?.[(values.rows[k]?.code ?? '').trim().toUpperCase()]?.message ?? errors.rows?.[k]?.rate?.message;

  const submit = handleSubmit(async (body) => {
    setFormError(null);
    try {
      const r = await save.mutateAsync(body);
      toast.success(`Rates of ${formatDate(r.rates.date)} saved as the current table.`);
      r.warnings.forEach((w) => toast.warning(w));
      onDone();
    } catch (err) {
      if (err instanceof ApiError) {
        for (const [key, message] of Object.entries(err.fields)) setError(key as never, { type: 'server', message });
        setFormError(err.message);
      } else setFormError('The rates could not be saved.');
    }
  });
  return (
    <form noValidate className="space-y-3" onSubmit={submit}>
      <div className="grid gap-3 sm:grid-cols-3">
        <Field label="Base currency" error={errors.base?.message}>
          {(f) => <Input {...f} maxLength={3} className="font-mono uppercase" {...register('base')} />}
        </Field>
        <Field label="Rates of (date)" error={errors.date?.message}>
          {(f) => <Input {...f} type="date" {...register('date')} />}
        </Field>
        <Field label="Source" error={errors.source?.message}>
          {(f) => <Input {...f} {...register('source')} />}
        </Field>
      </div>
      <table className="w-full max-w-md text-sm">
        <caption className="mb-1 text-left text-sm font-medium text-graphite-800">Units of each currency per 1 {values.base.toUpperCase() || 'base'}</caption>
        <tbody>
          {rows.fields.map((r, k) => {
            const err = rateError(k);
            const code = values.rows[k]?.code ?? '';
            return (
              <tr key={r.id} className="align-top">
                <td className="w-28 pr-2 pb-1.5">
                  <Input aria-label={`Currency ${k + 1}`} maxLength={3} className="h-8 font-mono uppercase" {...register(`rows.${k}.code`)} />
                </td>
                <td className="pr-2 pb-1.5">
                  <Input aria-label={`Rate of ${code || `currency ${k + 1}`}`} aria-invalid={Boolean(err)} inputMode="decimal" className="num h-8" {...register(`rows.${k}.rate`)} />
                  {err && <p className="mt-0.5 text-xs text-brick-700">{err}</p>}
                </td>
                <td className="pb-1.5">
                  <Button size="sm" variant="ghost" aria-label={`Remove ${code || `currency ${k + 1}`}`} onClick={() => rows.remove(k)}>
                    <Trash2 className="size-4" aria-hidden />
                  </Button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <Button size="sm" variant="quiet" onClick={() => rows.append({ code: '', rate: '' })}>
        <Plus className="size-4" aria-hidden /> Add a currency
      </Button>
      <FormError message={formError} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={save.isPending}>
          Save as current rates
        </Button>
        <Button onClick={onDone}>Cancel</Button>
      </div>
    </form>
  );
}

function ReportingCurrency({ currencies }: { currencies: string[] }) {
  const settings = useSettings();
  const set = useUpdateSettings();
  if (!settings.data) return null;
  const value = settings.data.reportingCurrency;
  return (
    <div className="flex flex-wrap items-center gap-2 text-sm">
      <label htmlFor="reporting-currency" className="font-medium text-graphite-800">
        Reporting currency
      </label>
      <select
        id="reporting-currency"
        value={value}
        disabled={set.isPending}
        onChange={(e) =>
          set.mutate(
            { reportingCurrency: e.target.value },
            {
              onSuccess: (s) => toast.success(`Cost figures are now reported in ${s.reportingCurrency}.`),
              onError: (err) => toast.error(err.message),
            },
          )
        }
        className="h-8 rounded-md border border-graphite-200 bg-white px-2 text-sm"
      >
        {[...new Set([...currencies, value])].sort().map((c) => (
          <option key={c}>{c}</option>
        ))}
      </select>
      <span className="text-xs text-graphite-500">Teardown cost pages open in this currency.</span>
    </div>
  );
}

const KIND_TONE = { import: 'cell', manual: 'copper', demo: 'neutral' } as const;

export function RatesPanel() {
  const rates = useRates();
  const [editing, setEditing] = useState(false);
  if (rates.isPending) return <Spinner />;
  if (rates.isError) return <ErrorPanel error={rates.error} onRetry={() => rates.refetch()} />;
  const { current, history } = rates.data;
  const currencies = current ? [current.base, ...Object.keys(current.rates)] : [];
  return (
    <div className="space-y-4">
      <Card
        title={current ? `Current rates: ${formatDate(current.date)}` : 'Current rates'}
        actions={
          !editing && (
            <Button size="sm" variant="quiet" onClick={() => setEditing(true)}>
              Enter rates by hand
            </Button>
          )
        }
      >
        <div className="space-y-4 p-4">
          {current ? (
            <>
              <div className="flex flex-wrap items-center gap-2 text-sm">
                <Badge tone={KIND_TONE[current.kind]}>{RATE_TABLE_KIND.labels[current.kind]}</Badge>
                <span className="text-graphite-700">{current.source}</span>
                <span className="text-graphite-500">
                  · base <span className="font-mono">{current.base}</span> · saved {formatDateTime(current.createdAt)}
                  {current.createdBy ? ` by ${current.createdBy}` : ''}
                </span>
              </div>
              {current.note && <p className="text-sm text-graphite-600">{current.note}</p>}
              <p className="text-xs text-graphite-500">
                Units of each currency per 1 {current.base}; other pairs are crossed through {current.base}.
              </p>
              <RateList table={current} />
            </>
          ) : (
            <EmptyState message="No rates yet: import the reference-rate file or enter rates by hand to convert prices between currencies." />
          )}
          {editing ? <ManualRates current={current} onDone={() => setEditing(false)} /> : <ImportRates />}
          <ReportingCurrency currencies={currencies} />
        </div>
      </Card>

      <Card
        title={
          <span className="inline-flex items-center gap-2">
            <History className="size-4 text-graphite-400" aria-hidden /> History
          </span>
        }
      >
        {history.length === 0 ? (
          <p className="p-4 text-sm text-graphite-500">Nothing saved yet.</p>
        ) : (
          <ul className="divide-y divide-graphite-100">
            {history.map((t) => (
              <li key={t.id}>
                <details className="px-4 py-2">
                  <summary className="flex cursor-pointer list-none flex-wrap items-center gap-2 text-sm">
                    <span className="num font-medium">{formatDate(t.date)}</span>
                    <Badge tone={KIND_TONE[t.kind]}>{RATE_TABLE_KIND.labels[t.kind]}</Badge>
                    {t.current && <Badge tone="cell">Current</Badge>}
                    <span className="text-graphite-600">{t.source}</span>
                    <span className="ml-auto text-xs text-graphite-500">
                      saved {formatDateTime(t.createdAt)}
                      {t.createdBy ? ` by ${t.createdBy}` : ''} · {Object.keys(t.rates).length} currencies, base {t.base}
                    </span>
                  </summary>
                  <div className="mt-2">
                    <RateList table={t} />
                  </div>
                </details>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </div>
  );
}
