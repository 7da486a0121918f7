import { useState } from 'react';
import { useFieldArray, useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { toast } from 'sonner';
import { Plus, Trash2 } from 'lucide-react';
import { salesTaxFormSchema, type SalesTaxForm, type SalesTaxFormValues } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { FormError, Input } from '@/components/field';
import { Card, Spinner } from '@/components/page';
import { ApiError } from '@/lib/api-client';
import { useSettings, useUpdateSettings } from '@/lib/settings';
import { plain } from './display';

const rowsOf = (map: Record<string, number>): SalesTaxFormValues['rows'] =>
  Object.entries(map)
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([currency, rate]) => ({ currency, rate: plain(rate * 100) }));

/**
 * The workspace default of sales tax (VAT, GST) in retail prices, by the price's currency: the
 * implied margin takes it out of a device's price unless the device sets its own rate.
 */
export function SalesTaxPanel() {
  const settings = useSettings();
  if (settings.isPending) return <Spinner />;
  if (settings.isError) return <ErrorPanel error={settings.error} onRetry={() => settings.refetch()} />;
  return (
    <Card title="Sales tax in retail prices">
      <SalesTaxForm key={JSON.stringify(settings.data.salesTaxByCurrency)} initial={settings.data.salesTaxByCurrency} />
    </Card>
  );
}

function SalesTaxForm({ initial }: { initial: Record<string, number> }) {
  const save = useUpdateSettings();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, formState } = useForm<SalesTaxFormValues, unknown, SalesTaxForm>({
    resolver: zodResolver(salesTaxFormSchema),
    defaultValues: { rows: rowsOf(initial) },
  });
  const { fields, append, remove } = useFieldArray({ control, name: 'rows' });
  const errors = formState.errors.rows;

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    const map = Object.fromEntries(values.rows.map((r) => [r.currency, r.rate as number]));
    try {
      await save.mutateAsync({ salesTaxByCurrency: map });
      toast.success('Sales-tax defaults saved; implied margins use them now.');
    } catch (err) {
      if (!(err instanceof ApiError)) {
        setFormError(err instanceof Error ? err.message : 'The sales-tax defaults could not be saved.');
        return;
      }
      // The server names settings fields as salesTaxByCurrency.EUR: put each on its row.
      let placed = false;
      for (const [key, message] of Object.entries(err.fields)) {
        const code = key.startsWith('salesTaxByCurrency.') ? key.slice('salesTaxByCurrency.'.length) : null;
        const k = code === null ? -1 : values.rows.findIndex((r) => r.currency === code.toUpperCase());
        if (k >= 0) {
          setError(`rows.${k}.rate` as Path<SalesTaxFormValues>, { type: 'server', message });
          placed = true;
        }
      }
      if (!placed) setFormError(err.message);
    }
  });

  return (
    <form noValidate onSubmit={submit} className="space-y-3 p-4 text-sm">
      <p className="text-graphite-700">
        The implied margin takes the sales tax out of a retail price first: net = price ÷ (1 + rate). A device can set its own rate (Sales tax in the price, on the device form); otherwise the rate for
        its price's currency below applies. Use 0 % where prices are quoted before tax, as is usual in the US.
      </p>
      <p className="text-xs text-graphite-500">
        Rates differ by country, even within one currency, and they change: set the ones of the markets you compare. The starting values are common standard rates, not advice on any country's tax.
      </p>
      <table className="w-full max-w-md" aria-label="Sales tax by currency">
        <thead className="text-left text-xs uppercase tracking-wide text-graphite-500">
          <tr>
            <th className="pb-1 font-semibold">Currency</th>
            <th className="pb-1 font-semibold">Sales tax in the price</th>
            <th className="w-10" />
          </tr>
        </thead>
        <tbody>
          {fields.map((f, k) => {
            const codeError = errors?.[k]?.currency?.message;
            const rateError = errors?.[k]?.rate?.message;
            return (
              <tr key={f.id} className="align-top">
                <td className="w-28 pr-2 pb-1.5">
                  <Input aria-label={`Currency ${k + 1}`} aria-invalid={Boolean(codeError)} maxLength={3} className="h-8 font-mono uppercase" {...register(`rows.${k}.currency`)} />
                  {codeError && <p className="mt-0.5 text-xs text-brick-700">{codeError}</p>}
                </td>
                <td className="pr-2 pb-1.5">
                  <div className="relative w-32">
                    <Input aria-label={`Sales tax in prices of currency ${k + 1}`} aria-invalid={Boolean(rateError)} inputMode="decimal" className="num h-8 pr-8" {...register(`rows.${k}.rate`)} />
                    <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-xs text-graphite-500">%</span>
                  </div>
                  {rateError && <p className="mt-0.5 text-xs text-brick-700">{rateError}</p>}
                </td>
                <td className="pb-1.5">
                  <Button size="sm" variant="ghost" aria-label={`Remove currency ${k + 1}`} onClick={() => remove(k)}>
                    <Trash2 className="size-4" aria-hidden />
                  </Button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <Button size="sm" variant="quiet" onClick={() => append({ currency: '', rate: '' })}>
        <Plus className="size-4" aria-hidden /> Add a currency
      </Button>
      <FormError message={formError} />
      <div>
        <Button type="submit" variant="primary" busy={save.isPending}>
          Save sales tax
        </Button>
      </div>
      <p className="text-xs text-graphite-500">A device priced in a currency that is not listed here and that has no rate of its own gets no implied margin, with a note saying what to set.</p>
    </form>
  );
}
