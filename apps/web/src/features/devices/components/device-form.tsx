import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  bareHint,
  createDeviceBody,
  DEVICE_CATEGORY,
  DEVICE_CLAIM_FIELDS,
  PRICE_FIELDS,
  type CreateDeviceBody,
  type DeviceClaimField,
  type DeviceDto,
  type DeviceFormValues,
} from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, Select, Textarea, FormError } from '@/components/field';
import { Card } from '@/components/page';
import { applyServerErrors } from '@/lib/form-errors';

const CLAIMS = Object.keys(DEVICE_CLAIM_FIELDS) as DeviceClaimField[];
const KNOWN = ['maker', 'model', 'category', 'retailPrice', 'currency', 'salesTaxRate', 'priceSeenOn', 'whereBought', 'claimOutputText', 'notes', ...CLAIMS] as const;

/** Form values for an existing device: each claim as typed (or its stored value with its unit). */
export function deviceFormValues(d?: DeviceDto): DeviceFormValues {
  if (!d) {
    return {
      maker: '',
      model: '',
      category: 'pocket-heater',
      retailPrice: '',
      currency: '',
      salesTaxRate: '',
      priceSeenOn: '',
      whereBought: '',
      claimCapacityAh: '',
      claimCapacityWh: '',
      claimOutputWatts: '',
      claimRuntimeH: '',
      claimPowerW: '',
      claimOutputText: '',
      notes: '',
    };
  }
  return {
    maker: d.maker,
    model: d.model,
    category: d.category,
    retailPrice: d.retailPrice === null ? '' : String(d.retailPrice),
    currency: d.currency ?? '',
    // Stored as a share (0.2), typed as a percentage ("20").
    salesTaxRate: d.salesTaxRate === null ? '' : String(Number((d.salesTaxRate * 100).toPrecision(10))),
    priceSeenOn: d.priceSeenOn ?? '',
    whereBought: d.whereBought ?? '',
    // As typed, else the exact stored value with its unit ("5.2 Ah"): never a bare number read in another unit.
    ...Object.fromEntries(CLAIMS.map((k) => [k, d.entered[k] ?? (d[k] === null ? '' : `${d[k]} ${DEVICE_CLAIM_FIELDS[k].unit}`)])),
    claimOutputText: d.claimOutputText ?? '',
    notes: d.notes ?? '',
  };
}

export function DeviceForm({ initial, submitLabel, onSubmit, onCancel }: { initial?: DeviceDto; submitLabel: string; onSubmit: (values: CreateDeviceBody) => Promise<unknown>; onCancel: () => void }) {
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<DeviceFormValues, unknown, CreateDeviceBody>({
    resolver: zodResolver(createDeviceBody),
    defaultValues: deviceFormValues(initial),
  });
  const errors = formState.errors;
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await onSubmit(values);
    } catch (err) {
      setFormError(applyServerErrors(err, setError, KNOWN));
    }
  });
  return (
    <form onSubmit={submit} noValidate className="max-w-4xl space-y-5">
      <Card title="Device">
        <div className="grid gap-4 p-4 sm:grid-cols-3">
          <Field label="Maker" error={errors.maker?.message}>
            {(p) => <Input {...p} {...register('maker')} autoComplete="off" />}
          </Field>
          <Field label="Model" error={errors.model?.message}>
            {(p) => <Input {...p} {...register('model')} autoComplete="off" />}
          </Field>
          <Field label="Category" error={errors.category?.message}>
            {(p) => (
              <Select {...p} {...register('category')}>
                {DEVICE_CATEGORY.values.map((c) => (
                  <option key={c} value={c}>
                    {DEVICE_CATEGORY.labels[c]}
                  </option>
                ))}
              </Select>
            )}
          </Field>
        </div>
      </Card>
      <Card title="Where and for how much">
        <div className="grid gap-4 p-4 sm:grid-cols-3">
          <Field label={PRICE_FIELDS.retailPrice.label} error={errors.retailPrice?.message} hint={`e.g. ${PRICE_FIELDS.retailPrice.example} or €${PRICE_FIELDS.retailPrice.example}`}>
            {(p) => <Input {...p} {...register('retailPrice')} placeholder={PRICE_FIELDS.retailPrice.example} className="num" autoComplete="off" />}
          </Field>
          <Field label="Currency" error={errors.currency?.message} hint="ISO code, e.g. USD; blank: from the price">
            {(p) => <Input {...p} {...register('currency')} maxLength={3} className="font-mono uppercase" />}
          </Field>
          <Field label="Sales tax in the price" error={errors.salesTaxRate?.message} hint="Blank: the workspace default for the currency; 0 if quoted before tax">
            {(p) => (
              <div className="relative">
                <Input {...p} {...register('salesTaxRate')} inputMode="decimal" className="num pr-8" placeholder="Default" />
                <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-xs text-graphite-500">%</span>
              </div>
            )}
          </Field>
          <Field label="Price seen on" error={errors.priceSeenOn?.message}>
            {(p) => <Input {...p} {...register('priceSeenOn')} type="date" />}
          </Field>
          <Field label="Where bought" error={errors.whereBought?.message}>
            {(p) => <Input {...p} {...register('whereBought')} />}
          </Field>
        </div>
      </Card>
      <Card title="On the label">
        <div className="grid gap-4 p-4 sm:grid-cols-3">
          {CLAIMS.map((k) => (
            <Field key={k} label={DEVICE_CLAIM_FIELDS[k].label} error={errors[k]?.message} hint={`e.g. ${DEVICE_CLAIM_FIELDS[k].example} · ${bareHint(DEVICE_CLAIM_FIELDS[k])}`}>
              {(p) => <Input {...p} {...register(k)} placeholder={DEVICE_CLAIM_FIELDS[k].placeholder} className="num" autoComplete="off" />}
            </Field>
          ))}
          <Field label="Outputs as printed" error={errors.claimOutputText?.message} hint='e.g. "USB-A 5 V 1 A"'>
            {(p) => <Input {...p} {...register('claimOutputText')} />}
          </Field>
        </div>
      </Card>
      <Card>
        <div className="p-4">
          <Field label="Notes" error={errors.notes?.message}>
            {(p) => <Textarea {...p} {...register('notes')} rows={3} />}
          </Field>
        </div>
      </Card>
      <FormError message={formError} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={formState.isSubmitting}>
          {submitLabel}
        </Button>
        <Button onClick={onCancel}>Cancel</Button>
      </div>
    </form>
  );
}
