import { useState, type ReactNode } from 'react';
import { Battery } from 'lucide-react';
import { CHEMISTRY, INTERNAL_RESISTANCE_READING_FIELDS, JOINING, PACK_FIELDS, packFormSchema, type PackDto, type PackForm, type PackFormValues } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, Select, LabelledOptions } from '@/components/field';
import { Card } from '@/components/page';
import type { EditGate } from '@/components/published-edit';
import { formatStored } from '@/lib/format';
import { toast } from 'sonner';
import { useDeletePack } from '../api/delete-pack';
import { useSavePack } from '../api/save-pack';
import { FormFrame, useCardForm } from './form-card';
import { QuantityField, QuantityFields, quantityList, TypedQuantity, labelsOf, quantityTexts } from './quantity-field';

// Labels, placeholders and the bare-number rule of each field: contracts' PACK_FIELDS.
const QUANTITIES = quantityList({ nominalVolts: 'V', maxVolts: 'V', capacityAh: 'Ah', measuredCapacityAh: 'Ah', series: '', parallel: '', massKg: 'kg', internalResistanceOhms: 'Ω' });

/** The two readings of the DC method (IEC 61960-3): the cell voltage at a low and at a high current. */
const READINGS = ['lowAmps', 'lowVolts', 'highAmps', 'highVolts'] as const;

const LABELS = {
  chemistry: 'Chemistry',
  cellFormat: 'Cell format',
  joining: 'Joining',
  protection: 'Protection circuit present',
  ...labelsOf(PACK_FIELDS),
  ...labelsOf(INTERNAL_RESISTANCE_READING_FIELDS, 'internalResistanceReadings.'),
};

const valuesOf = (p: PackDto | null): PackFormValues => ({
  chemistry: p?.chemistry ?? 'li-ion',
  cellFormat: p?.cellFormat ?? '',
  protection: p?.protection ?? false,
  joining: p?.joining ?? '',
  ...quantityTexts(QUANTITIES, PACK_FIELDS, p, { series: '1', parallel: '1' }),
  internalResistanceReadings: Object.fromEntries(READINGS.map((r) => [r, p?.internalResistanceReadings ? String(p.internalResistanceReadings[r]) : ''])) as Record<(typeof READINGS)[number], string>,
});

/**
 * The pack (one per teardown): typed with units, stored in SI, the typed text shown back. Give it
 * `key={pack?.updatedAt}` so a saved pack refreshes the form. Escape puts the saved values back.
 */
export function PackCard({ teardownId, pack, gate }: { teardownId: number; pack: PackDto | null; gate: EditGate }) {
  const save = useSavePack(teardownId);
  const remove = useDeletePack(teardownId);
  const [confirmRemove, setConfirmRemove] = useState(false);
  const [defaultValues] = useState(() => valuesOf(pack));
  const card = useCardForm<PackFormValues, PackForm>({
    schema: packFormSchema,
    defaultValues,
    save: (body) => save.mutateAsync({ teardownId, body }),
    saved: () => 'Pack saved.',
  });
  const { form } = card;

  if (!gate.canEdit) {
    return <Card title="Cells and pack">{pack ? <PackSummary pack={pack} /> : <p className="p-4 text-sm text-graphite-500">No pack recorded yet.</p>}</Card>;
  }

  const errors = form.formState.errors;
  return (
    <Card
      title="Cells and pack"
      actions={
        pack &&
        (confirmRemove ? (
          <span className="flex items-center gap-2 text-sm">
            Remove the pack record?
            <Button
              size="sm"
              variant="danger"
              busy={remove.isPending}
              onClick={() => remove.mutate({ teardownId }, { onSuccess: () => toast.success('Pack removed.'), onSettled: () => setConfirmRemove(false), onError: (e) => toast.error(e.message) })}
            >
              Remove
            </Button>
            <Button size="sm" variant="ghost" onClick={() => setConfirmRemove(false)}>
              Keep
            </Button>
          </span>
        ) : (
          <Button size="sm" variant="ghost" onClick={() => setConfirmRemove(true)}>
            Remove pack
          </Button>
        ))
      }
    >
      <FormFrame
        card={card}
        label="Pack"
        labels={LABELS}
        framed={false}
        submitLabel={pack ? 'Save pack' : 'Record pack'}
        onCancel={() => form.reset()}
        cancelButton={false}
        intro={
          !pack && (
            <p className="flex items-center gap-2 text-sm text-graphite-600">
              <Battery className="size-4 text-graphite-400" aria-hidden /> Record the cells: chemistry, voltage and capacity per cell, and how many in series and parallel.
            </p>
          )
        }
        note={<p className="text-xs text-graphite-500">Type values with their units; a plain number is read in the unit of the field’s example (46 is 46 g).</p>}
      >
        <Field label="Chemistry" error={errors.chemistry?.message}>
          {(p) => (
            <Select {...p} {...form.register('chemistry')}>
              <LabelledOptions list={CHEMISTRY} />
            </Select>
          )}
        </Field>
        <Field label="Cell format" error={errors.cellFormat?.message} hint="18650, pouch 503450…">
          {(p) => <Input {...p} {...form.register('cellFormat')} />}
        </Field>
        <Field label="Joining" error={errors.joining?.message}>
          {(p) => (
            <Select {...p} {...form.register('joining')}>
              <option value="">Not recorded</option>
              <LabelledOptions list={JOINING} />
            </Select>
          )}
        </Field>
        <QuantityFields form={form} list={QUANTITIES} fields={PACK_FIELDS} record={pack} />
        <fieldset className="rounded-md border border-graphite-150 p-3 sm:col-span-2 xl:col-span-3">
          <legend className="px-1 text-sm font-medium text-graphite-800">Internal resistance from two readings (DC method)</legend>
          <p className="mb-2 text-xs text-graphite-600">
            Discharge at a low current for 10 s and read the cell voltage, step to a high current and read it again after 1 s: R = (U₁ − U₂) / (I₂ − I₁). Given, it replaces the value above.
          </p>
          <div className="grid gap-3 sm:grid-cols-2 xl:grid-cols-4">
            {READINGS.map((r) => (
              <QuantityField key={r} form={form} name={`internalResistanceReadings.${r}`} field={INTERNAL_RESISTANCE_READING_FIELDS[r]} unit="" />
            ))}
          </div>
        </fieldset>
        <label className="flex items-center gap-2 self-end pb-2 text-sm font-medium text-graphite-800">
          <input type="checkbox" {...form.register('protection')} className="size-4 accent-copper-600" />
          Protection circuit present
        </label>
      </FormFrame>
    </Card>
  );
}

function PackSummary({ pack }: { pack: PackDto }) {
  const rows: [string, ReactNode][] = [
    ['Chemistry', CHEMISTRY.labels[pack.chemistry]],
    ['Cell format', pack.cellFormat ?? '—'],
    ['Arrangement', `${pack.series}S${pack.parallel}P (${pack.series * pack.parallel} cell${pack.series * pack.parallel === 1 ? '' : 's'})`],
    ...QUANTITIES.filter((f) => f.key !== 'series' && f.key !== 'parallel').map((f): [string, ReactNode] => [
      PACK_FIELDS[f.key].label,
      <TypedQuantity key={f.key} typed={pack.entered[f.key]} si={formatStored(pack[f.key], f.unit)} />,
    ]),
    ...(pack.internalResistanceReadings
      ? ([
          [
            'Internal resistance from',
            `${pack.internalResistanceReadings.lowVolts} V at ${pack.internalResistanceReadings.lowAmps} A and ${pack.internalResistanceReadings.highVolts} V at ${pack.internalResistanceReadings.highAmps} A (DC method)`,
          ],
        ] as [string, ReactNode][])
      : []),
    ['Protection circuit', pack.protection ? 'Present' : 'None found'],
    ['Joining', pack.joining ? JOINING.labels[pack.joining] : '—'],
  ];
  return (
    <dl className="grid grid-cols-[12rem_minmax(0,1fr)] gap-x-4 gap-y-1.5 p-4 text-sm">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-graphite-500">{k}</dt>
          <dd className="num">{v}</dd>
        </div>
      ))}
    </dl>
  );
}
