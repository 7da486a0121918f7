import { useState, type KeyboardEvent } from 'react';
import { useFieldArray, useForm, type FieldErrors } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { toast } from 'sonner';
import { Plus, Trash2, X } from 'lucide-react';
import { MIN_QTY_FIELD, PRICE_CONFIDENCE, PRICE_FIELDS, PRICE_SOURCE, setPartPriceBody, type CostLine, type SetPartPriceBody, type SetPartPriceForm } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, LabelledOptions, Select, inputClass, FormError } from '@/components/field';
import { ApiError } from '@/lib/api-client';
import { useDeletePrice } from '../api/delete-price';
import { useSetPrice } from '../api/set-price';
import { plain } from './display';

const today = () => new Date().toISOString().slice(0, 10);

const FIELD_LABELS: Record<string, string> = { currency: 'Currency', priceDate: 'Price date', source: 'Source', confidence: 'Confidence', note: 'Note', breaks: 'Price breaks' };
const FIELDS = Object.keys(FIELD_LABELS);

/** The label a field key of the price body has in this editor, or null when the editor shows no such field. */
function fieldLabel(key: string, rowCount: number): string | null {
  const b = /^breaks\.(\d+)\.(minQty|unitPrice)$/.exec(key);
  if (b) return Number(b[1]) < rowCount ? `Break ${Number(b[1]) + 1} ${b[2] === 'minQty' ? 'minimum quantity' : 'unit price'}` : null;
  return FIELD_LABELS[key] ?? null;
}

/** The field keys of the form's own errors ("breaks.0.unitPrice"), as the server names them. */
function errorKeys(errors: FieldErrors<SetPartPriceBody>): string[] {
  const keys = FIELDS.filter((k) => k !== 'breaks' && errors[k as keyof SetPartPriceBody]);
  const breaks = errors.breaks;
  if (breaks?.message) keys.push('breaks');
  if (Array.isArray(breaks)) breaks.forEach((b, k) => b && (['minQty', 'unitPrice'] as const).forEach((f) => b[f] && keys.push(`breaks.${k}.${f}`)));
  return keys;
}

/** "Not saved: check Break 1 unit price." — the fields named as this editor labels them, never by their keys. */
const checkMessage = (keys: string[], rowCount: number, fallback: string) => {
  const labels = keys.map((key) => fieldLabel(key, rowCount));
  return labels.length && labels.every(Boolean) ? `Not saved: check ${labels.join(', ')}.` : fallback;
};

/**
 * Price breaks, currency, source, confidence and date of one BOM line. The form checks the shape
 * (contracts' `setPartPriceBody`); the server reads the amounts typed, checks the rest (order of
 * breaks, a currency mark that is not the line's, a currency without a rate) and names the field;
 * the roll-up is then read again from the server.
 */
export function PriceEditor({ teardownId, line, currencies, onClose }: { teardownId: number; line: CostLine; currencies: string[]; onClose: () => void }) {
  const p = line.price;
  const [formError, setFormError] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, watch, formState } = useForm<SetPartPriceBody, unknown, SetPartPriceForm>({
    resolver: zodResolver(setPartPriceBody),
    defaultValues: {
      currency: p?.currency ?? currencies[0] ?? 'USD',
      source: p?.source ?? 'catalogue',
      confidence: p?.confidence ?? 'medium',
      priceDate: p?.priceDate ?? today(),
      note: p?.note ?? '',
      breaks: p ? p.breaks.map((b) => ({ minQty: plain(b.minQty), unitPrice: plain(b.unitPrice) })) : [{ minQty: '1', unitPrice: '' }],
    },
  });
  const breaks = useFieldArray({ control, name: 'breaks' });
  const errors = formState.errors;
  const rows = breaks.fields.length;
  const save = useSetPrice(teardownId);
  const remove = useDeletePrice(teardownId);
  const name = line.designators ?? line.description;
  const currency = watch('currency');
  const options = [...new Set([...currencies, currency])].sort();

  const addRow = () => breaks.append({ minQty: '', unitPrice: '' }, { shouldFocus: true });
  // Enter in the last unit price adds the next break (one hand on the keyboard).
  const onPriceKey = (k: number) => (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === 'Enter' && k === rows - 1) {
      e.preventDefault();
      addRow();
    }
  };

  const submit = handleSubmit(
    async (body) => {
      setFormError(null);
      try {
        // The breaks go as typed ("5k", "$0.12", "0,12 €"): the server reads them against the currency and names the break and field it refuses.
        await save.mutateAsync({ partId: line.partId, ...body });
        toast.success(`Price of ${name} saved; totals updated.`);
        onClose();
      } catch (err) {
        if (err instanceof ApiError && Object.keys(err.fields).length) {
          for (const [key, message] of Object.entries(err.fields)) if (fieldLabel(key, rows)) setError(key as never, { type: 'server', message });
          setFormError(checkMessage(Object.keys(err.fields), rows, err.message));
        } else setFormError(err instanceof Error ? err.message : 'The price could not be saved.');
      }
    },
    (invalid) => setFormError(checkMessage(errorKeys(invalid), rows, 'Not saved: check the marked fields.')),
  );

  const drop = async () => {
    try {
      await remove.mutateAsync(line.partId);
      toast.success(`Price of ${name} removed; the line is unpriced.`);
      onClose();
    } catch (err) {
      setFormError(err instanceof Error ? err.message : 'The price could not be removed.');
    }
  };

  return (
    <section aria-label={`Price of ${name}`} className="rounded-lg border border-copper-200 bg-copper-50/40 p-4">
      <div className="mb-3 flex items-start justify-between gap-3">
        <div>
          <h3 className="text-sm font-semibold text-graphite-900">
            Price of <span className="font-mono">{line.designators ?? '—'}</span> · {line.description}
          </h3>
          <p className="text-xs text-graphite-600">{line.quantity} per unit; breaks are by pieces bought (quantity × volume). List them by increasing minimum quantity.</p>
        </div>
        <Button size="sm" variant="ghost" onClick={onClose} aria-label="Close the price editor">
          <X className="size-4" aria-hidden />
        </Button>
      </div>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.2fr)]">
        <div className="grid grid-cols-2 gap-3">
          <Field label="Currency" error={errors.currency?.message}>
            {(f) => (
              <Select {...f} {...register('currency')}>
                {options.map((c) => (
                  <option key={c}>{c}</option>
                ))}
              </Select>
            )}
          </Field>
          <Field label="Price date" error={errors.priceDate?.message}>
            {(f) => <Input {...f} type="date" {...register('priceDate')} />}
          </Field>
          <Field label="Source" error={errors.source?.message}>
            {(f) => (
              <Select {...f} {...register('source')}>
                <LabelledOptions list={PRICE_SOURCE} />
              </Select>
            )}
          </Field>
          <Field label="Confidence" error={errors.confidence?.message}>
            {(f) => (
              <Select {...f} {...register('confidence')}>
                <LabelledOptions list={PRICE_CONFIDENCE} />
              </Select>
            )}
          </Field>
          <Field label="Note" error={errors.note?.message} className="col-span-2">
            {(f) => <Input {...f} maxLength={300} placeholder="Quote reference, supplier, conditions…" {...register('note')} />}
          </Field>
        </div>
        <div>
          <table className="w-full table-fixed text-sm">
            <caption className="mb-1 text-left text-sm font-medium text-graphite-800">
              Price breaks ({currency})
              <span className="block text-xs font-normal text-graphite-600">
                Amounts in {currency}, e.g. {PRICE_FIELDS.unitPrice.example}, or with their currency; quantities such as {MIN_QTY_FIELD.example} or 5k.
              </span>
            </caption>
            <thead>
              <tr className="text-left text-xs uppercase tracking-wide text-graphite-600">
                <th className="pb-1 font-semibold">Min. quantity</th>
                <th className="pb-1 font-semibold">Unit price</th>
                <th className="w-10" />
              </tr>
            </thead>
            <tbody>
              {breaks.fields.map((r, k) => {
                const qtyErr = errors.breaks?.[k]?.minQty?.message;
                const priceErr = errors.breaks?.[k]?.unitPrice?.message;
                return (
                  <tr key={r.id} className="align-top">
                    <td className="pr-2 pb-2">
                      <input
                        aria-label={`Break ${k + 1} minimum quantity`}
                        aria-invalid={Boolean(qtyErr)}
                        placeholder={MIN_QTY_FIELD.example}
                        autoComplete="off"
                        className={`${inputClass} num h-8`}
                        {...register(`breaks.${k}.minQty`)}
                      />
                      {qtyErr && <p className="mt-0.5 text-xs text-brick-700">{qtyErr}</p>}
                    </td>
                    <td className="pr-2 pb-2">
                      <input
                        aria-label={`Break ${k + 1} unit price`}
                        aria-invalid={Boolean(priceErr)}
                        placeholder={PRICE_FIELDS.unitPrice.example}
                        autoComplete="off"
                        onKeyDown={onPriceKey(k)}
                        className={`${inputClass} num h-8`}
                        {...register(`breaks.${k}.unitPrice`)}
                      />
                      {priceErr && <p className="mt-0.5 text-xs text-brick-700">{priceErr}</p>}
                    </td>
                    <td className="pb-2">
                      <Button size="sm" variant="ghost" aria-label={`Remove break ${k + 1}`} disabled={rows === 1} onClick={() => breaks.remove(k)}>
                        <Trash2 className="size-4" aria-hidden />
                      </Button>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          {(errors.breaks?.message ?? errors.breaks?.root?.message) && <p className="text-xs text-brick-700">{errors.breaks?.message ?? errors.breaks?.root?.message}</p>}
          <Button size="sm" variant="quiet" onClick={addRow}>
            <Plus className="size-4" aria-hidden /> Add a break
          </Button>
        </div>
      </div>
      <FormError message={formError} />
      <div className="mt-4 flex flex-wrap items-center gap-2">
        <Button variant="primary" busy={save.isPending} onClick={() => void submit()}>
          Save price
        </Button>
        <Button onClick={onClose}>Cancel</Button>
        {p && (
          <Button variant="danger" className="ml-auto" busy={remove.isPending} onClick={drop}>
            Remove price
          </Button>
        )}
      </div>
    </section>
  );
}
