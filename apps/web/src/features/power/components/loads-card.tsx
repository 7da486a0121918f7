import { useMemo } from 'react';
import {
  CONNECTION,
  ELEMENT_MATERIAL,
  LOAD_FIELDS,
  LOAD_KIND,
  SURFACE_MATERIAL,
  loadFormSchema,
  type ConverterDto,
  type LoadDto,
  type LoadForm as LoadBody,
  type LoadFormValues,
} from '@splitcase/contracts';
import type { Column } from '@/components/data-table';
import { Field, Input, Select, LabelledOptions } from '@/components/field';
import type { EditGate } from '@/components/published-edit';
import { formatStored } from '@/lib/format';
import { useCreateLoad } from '../api/create-load';
import { useDeleteLoad } from '../api/delete-load';
import { useUpdateLoad } from '../api/update-load';
import { FormFrame, RecordsCard, useCardForm } from './form-card';
import { QuantityFields, quantityList, TypedQuantity, labelsOf, quantityTexts } from './quantity-field';

// Labels, placeholders and the bare-number rule of each field: contracts' LOAD_FIELDS.
const QUANTITIES = quantityList({ resistanceOhms: 'Ω', currentAmps: 'A', powerWatts: 'W', supplyVolts: 'V', count: '', duty: '', heatedAreaM2: 'm²', heatedMassKg: 'kg' });
type QKey = (typeof QUANTITIES)[number]['key'];
const only = (...keys: QKey[]) => QUANTITIES.filter((f) => keys.includes(f.key));

const LABELS = {
  kind: 'Kind',
  label: 'Label',
  connection: 'Connection',
  converterId: 'Fed through',
  surfaceMaterial: 'Surface material',
  elementMaterial: 'Element material',
  ...labelsOf(LOAD_FIELDS),
};

const valuesOf = (l: LoadDto | null): LoadFormValues => ({
  kind: l?.kind ?? 'heater',
  label: l?.label ?? '',
  connection: l?.connection ?? 'parallel',
  converterId: l?.converterId ? String(l.converterId) : '',
  surfaceMaterial: l?.surfaceMaterial ?? '',
  elementMaterial: l?.elementMaterial ?? '',
  ...quantityTexts(QUANTITIES, LOAD_FIELDS, l, { count: '1', duty: '100 %' }),
});

const shown = (l: LoadDto, key: QKey, unit: string) => {
  const v = l[key];
  if (v === null) return null;
  return <TypedQuantity typed={l.entered[key]} si={key === 'duty' ? `${Math.round(v * 1000) / 10} %` : formatStored(v, unit)} />;
};

/** Loads: heater elements, motors, LEDs, USB outputs, each per element with count and connection. */
export function LoadsCard({ teardownId, loads, converters, gate }: { teardownId: number; loads: LoadDto[]; converters: ConverterDto[]; gate: EditGate }) {
  const remove = useDeleteLoad(teardownId);
  const converterName = useMemo(() => new Map(converters.map((c) => [c.id, c.label])), [converters]);

  const columns = useMemo<Column<LoadDto>[]>(
    () => [
      {
        id: 'load',
        header: 'Load',
        value: (l) => l.label,
        filter: 'text',
        className: 'min-w-52',
        cell: (l) => (
          <span className="block py-0.5 leading-tight">
            <span className="font-medium">{l.label}</span>
            <span className="block text-xs text-graphite-500">{LOAD_KIND.labels[l.kind]}</span>
          </span>
        ),
      },
      {
        id: 'element',
        header: 'Per element',
        value: (l) => l.resistanceOhms ?? l.currentAmps ?? l.powerWatts ?? undefined,
        cell: (l) => shown(l, 'resistanceOhms', 'Ω') ?? shown(l, 'currentAmps', 'A') ?? shown(l, 'powerWatts', 'W'),
        className: 'whitespace-nowrap num',
      },
      {
        id: 'supply',
        header: 'Supply',
        value: (l) => l.supplyVolts ?? undefined,
        cell: (l) => shown(l, 'supplyVolts', 'V') ?? <span className="text-graphite-400">from source</span>,
        className: 'whitespace-nowrap num',
      },
      { id: 'count', header: 'Count', value: (l) => l.count, cell: (l) => `${l.count} × ${CONNECTION.labels[l.connection].toLowerCase()}`, className: 'whitespace-nowrap' },
      { id: 'duty', header: 'Duty', value: (l) => l.duty, cell: (l) => shown(l, 'duty', ''), align: 'right' },
      {
        id: 'via',
        header: 'Fed through',
        value: (l) => (l.converterId ? converterName.get(l.converterId) : 'Pack'),
        filter: 'select',
        className: 'min-w-40',
        cell: (l) => (l.converterId ? converterName.get(l.converterId) : <span className="text-graphite-500">the pack, directly</span>),
      },
      {
        id: 'area',
        header: 'Heated area',
        value: (l) => l.heatedAreaM2 ?? undefined,
        className: 'whitespace-nowrap',
        cell: (l) =>
          l.heatedAreaM2 === null ? (
            <span className="text-graphite-300">—</span>
          ) : (
            <span className="block leading-tight">
              {shown(l, 'heatedAreaM2', 'm²')}
              {l.surfaceMaterial && <span className="block text-xs text-graphite-500">{SURFACE_MATERIAL.labels[l.surfaceMaterial]} surface</span>}
            </span>
          ),
      },
    ],
    [converterName],
  );

  return (
    <RecordsCard
      title="Loads"
      noun="load"
      rows={loads}
      columns={columns}
      gate={gate}
      empty={{ editor: 'No loads yet: add the heater elements, motors, LEDs or USB outputs the pack feeds.', reader: 'No loads recorded.' }}
      remove={{ busy: remove.isPending, run: (l) => remove.mutateAsync({ teardownId, id: l.id }) }}
      renderForm={(load, done) => <LoadForm teardownId={teardownId} load={load} converters={converters} onDone={done} />}
    />
  );
}

function LoadForm({ teardownId, load, converters, onDone }: { teardownId: number; load: LoadDto | null; converters: ConverterDto[]; onDone: () => void }) {
  const create = useCreateLoad(teardownId);
  const update = useUpdateLoad(teardownId);
  const card = useCardForm<LoadFormValues, LoadBody>({
    schema: loadFormSchema,
    defaultValues: useMemo(() => valuesOf(load), [load]),
    save: (body) => (load ? update.mutateAsync({ teardownId, id: load.id, body }) : create.mutateAsync({ teardownId, body })),
    saved: () => (load ? 'Load saved.' : 'Load added.'),
    onSaved: onDone,
  });
  const { form } = card;
  const errors = form.formState.errors;
  const kind = form.watch('kind');

  return (
    <FormFrame
      card={card}
      label={load ? `Edit ${load.label}` : 'New load'}
      title={load ? `Edit ${load.label}` : 'New load'}
      labels={LABELS}
      submitLabel={load ? 'Save load' : 'Add load'}
      onCancel={onDone}
    >
      <Field label="Kind" error={errors.kind?.message}>
        {(p) => (
          <Select {...p} {...form.register('kind')} autoFocus>
            <LabelledOptions list={LOAD_KIND} />
          </Select>
        )}
      </Field>
      <Field label="Label" error={errors.label?.message} hint="e.g. Heater elements, front and back" className="xl:col-span-2">
        {(p) => <Input {...p} {...form.register('label')} />}
      </Field>
      <QuantityFields form={form} list={only('resistanceOhms', 'currentAmps', 'powerWatts', 'supplyVolts', 'count')} fields={LOAD_FIELDS} record={load} />
      <Field label="Connection" error={errors.connection?.message}>
        {(p) => (
          <Select {...p} {...form.register('connection')}>
            <LabelledOptions list={CONNECTION} />
          </Select>
        )}
      </Field>
      <QuantityFields form={form} list={only('duty')} fields={LOAD_FIELDS} record={load} />
      <Field label="Fed through" error={errors.converterId?.message}>
        {(p) => (
          <Select {...p} {...form.register('converterId')}>
            <option value="">Straight from the pack</option>
            {converters.map((c) => (
              <option key={c.id} value={c.id}>
                {c.label}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <QuantityFields form={form} list={only('heatedAreaM2')} fields={LOAD_FIELDS} record={load} />
      <Field label="Surface material" error={errors.surfaceMaterial?.message} hint="Sets the touch-temperature limit">
        {(p) => (
          <Select {...p} {...form.register('surfaceMaterial')}>
            <option value="">Not a touch surface</option>
            <LabelledOptions list={SURFACE_MATERIAL} />
          </Select>
        )}
      </Field>
      {kind === 'heater' && (
        <>
          <Field label="Element material" error={errors.elementMaterial?.message} hint="Copper elements lose power as they warm (R rises about 0.39 %/K)">
            {(p) => (
              <Select {...p} {...form.register('elementMaterial')}>
                <option value="">Not recorded</option>
                <LabelledOptions list={ELEMENT_MATERIAL} />
              </Select>
            )}
          </Field>
          <QuantityFields form={form} list={only('heatedMassKg')} fields={LOAD_FIELDS} record={load} />
        </>
      )}
    </FormFrame>
  );
}
