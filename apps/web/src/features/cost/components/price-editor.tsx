import { useState, type KeyboardEvent } from 'react';
import { toast } from 'sonner';
import { Plus, Trash2, X } from 'lucide-react';
import { MIN_QTY_FIELD, PRICE_CONFIDENCE, PRICE_FIELDS, PRICE_SOURCE, type CostLine, type PriceConfidence, type PriceSource } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, Select, inputClass, FormError } from '@/components/field';
import { ApiError } from '@/lib/api-client';
import { useDeletePrice } from '../api/delete-price';
import { useSetPrice } from '../api/set-price';
import { plain } from './display';

interface Row {
  minQty: string;
  unitPrice: string;
}

const today = () => new Date().toISOString().slice(0, 10);

const FIELD_LABELS: Record<string, string> = { currency: 'Currency', priceDate: 'Price date', source: 'Source', confidence: 'Confidence', note: 'Note', breaks: 'Price breaks' };

/** The label a field key of the price body has in this editor, or null when the editor shows no such field. */
function fieldLabel(key: string, rowCount: number): string | null {
  const b = /^breaks\.(\d+)\.(minQty|unitPrice)$/.exec(key);
  if (b) return Number(b[1]) < rowCount ? `Break ${Number(b[1]) + 1} ${b[2] === 'minQty' ? 'minimum quantity' : 'unit price'}` : null;
  return FIELD_LABELS[key] ?? null;
}

/**
 * Price breaks, currency, source, confidence and date of one BOM line. The server checks
 * everything (order of breaks, negative prices, a currency without a rate) and names the field;
 * the roll-up is then read again from the server.
 */
export function PriceEditor({ teardownId, line, currencies, onClose }: { teardownId: number; line: CostLine; currencies: string[]; onClose: () => void }) {
  const p = line.price;
  const [currency, setCurrency] = useState(p?.currency ?? currencies[0] ?? 'USD');
  const [source, setSource] = useState<PriceSource>(p?.source ?? 'catalogue');
  const [confidence, setConfidence] = useState<PriceConfidence>(p?.confidence ?? 'medium');
  const [priceDate, setPriceDate] = useState(p?.priceDate ?? today());
  const [note, setNote] = useState(p?.note ?? '');
  const [rows, setRows] = useState<Row[]>(p ? p.breaks.map((b) => ({ minQty: plain(b.minQty), unitPrice: plain(b.unitPrice) })) : [{ minQty: '1', unitPrice: '' }]);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const save = useSetPrice(teardownId);
  const remove = useDeletePrice(teardownId);
  const name = line.designators ?? line.description;
  const options = [...new Set([...currencies, currency])].sort();

  const update = (k: number, patch: Partial<Row>) => setRows((rs) => rs.map((r, j) => (j === k ? { ...r, ...patch } : r)));
  const addRow = () => {
    setRows((rs) => [...rs, { minQty: '', unitPrice: '' }]);
    setTimeout(() => document.getElementById(`break-qty-${rows.length}`)?.focus(), 0);
  };
  // Enter in the last unit price adds the next break (one hand on the keyboard).
  const onPriceKey = (k: number) => (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === 'Enter' && k === rows.length - 1) {
      e.preventDefault();
      addRow();
    }
  };

  const submit = async () => {
    setErrors({});
    setFormError(null);
    try {
      await save.mutateAsync({
        partId: line.partId,
        currency,
        source,
        confidence,
        priceDate,
        note: note.trim() || undefined,
        // Sent as typed ("5k", "$0.12", "0,12 €"): the server reads them against the currency and names the break and field it refuses.
        breaks: rows.map((r) => ({ minQty: r.minQty, unitPrice: r.unitPrice })),
      });
      toast.success(`Price of ${name} saved; totals updated.`);
      onClose();
    } catch (err) {
      if (err instanceof ApiError && Object.keys(err.fields).length) {
        setErrors(err.fields);
        // Name the fields as this editor labels them ("Break 1 unit price"), never by their keys.
        const labels = Object.keys(err.fields).map((key) => fieldLabel(key, rows.length));
        setFormError(labels.every(Boolean) ? `Not saved: check ${labels.join(', ')}.` : err.message);
      } else setFormError(err instanceof Error ? err.message : 'The price could not be saved.');
    }
  };

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
          <p className="text-xs text-graphite-600">
            {line.quantity} per unit; breaks are by pieces bought (quantity × volume). List them by increasing minimum quantity.
          </p>
        </div>
        <Button size="sm" variant="ghost" onClick={onClose} aria-label="Close the price editor">
          <X className="size-4" aria-hidden />
        </Button>
      </div>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.2fr)]">
        <div className="grid grid-cols-2 gap-3">
          <Field label="Currency" error={errors.currency}>
            {(f) => (
              <Select {...f} value={currency} onChange={(e) => setCurrency(e.target.value)}>
                {options.map((c) => (
                  <option key={c}>{c}</option>
                ))}
              </Select>
            )}
          </Field>
          <Field label="Price date" error={errors.priceDate}>
            {(f) => <Input {...f} type="date" value={priceDate} onChange={(e) => setPriceDate(e.target.value)} />}
          </Field>
          <Field label="Source" error={errors.source}>
            {(f) => (
              <Select {...f} value={source} onChange={(e) => setSource(e.target.value as PriceSource)}>
                {PRICE_SOURCE.values.map((s) => (
                  <option key={s} value={s}>
                    {PRICE_SOURCE.labels[s]}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field label="Confidence" error={errors.confidence}>
            {(f) => (
              <Select {...f} value={confidence} onChange={(e) => setConfidence(e.target.value as PriceConfidence)}>
                {PRICE_CONFIDENCE.values.map((c) => (
                  <option key={c} value={c}>
                    {PRICE_CONFIDENCE.labels[c]}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          <Field label="Note" error={errors.note} className="col-span-2">
            {(f) => <Input {...f} value={note} maxLength={300} placeholder="Quote reference, supplier, conditions…" onChange={(e) => setNote(e.target.value)} />}
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
              {rows.map((r, k) => {
                const qtyErr = errors[`breaks.${k}.minQty`];
                const priceErr = errors[`breaks.${k}.unitPrice`];
                return (
                  <tr key={k} className="align-top">
                    <td className="pr-2 pb-2">
                      <input
                        id={`break-qty-${k}`}
                        aria-label={`Break ${k + 1} minimum quantity`}
                        aria-invalid={Boolean(qtyErr)}
                        placeholder={MIN_QTY_FIELD.example}
                        autoComplete="off"
                        value={r.minQty}
                        onChange={(e) => update(k, { minQty: e.target.value })}
                        className={`${inputClass} num h-8`}
                      />
                      {qtyErr && <p className="mt-0.5 text-xs text-brick-700">{qtyErr}</p>}
                    </td>
                    <td className="pr-2 pb-2">
                      <input
                        aria-label={`Break ${k + 1} unit price`}
                        aria-invalid={Boolean(priceErr)}
                        placeholder={PRICE_FIELDS.unitPrice.example}
                        autoComplete="off"
                        value={r.unitPrice}
                        onKeyDown={onPriceKey(k)}
                        onChange={(e) => update(k, { unitPrice: e.target.value })}
                        className={`${inputClass} num h-8`}
                      />
                      {priceErr && <p className="mt-0.5 text-xs text-brick-700">{priceErr}</p>}
                    </td>
                    <td className="pb-2">
                      <Button size="sm" variant="ghost" aria-label={`Remove break ${k + 1}`} disabled={rows.length === 1} onClick={() => setRows((rs) => rs.filter((_, j) => j !== k))}>
                        <Trash2 className="size-4" aria-hidden />
                      </Button>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          {errors.breaks && <p className="text-xs text-brick-700">{errors.breaks}</p>}
          <Button size="sm" variant="quiet" onClick={addRow}>
            <Plus className="size-4" aria-hidden /> Add a break
          </Button>
        </div>
      </div>
      <FormError message={formError} />
      <div className="mt-4 flex flex-wrap items-center gap-2">
        <Button variant="primary" busy={save.isPending} onClick={submit}>
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
