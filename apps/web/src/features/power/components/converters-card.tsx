import { useMemo } from 'react';
import { CONVERTER_FIELDS, CONVERTER_ROLE, CONVERTER_TOPOLOGY, converterFormSchema, type ConverterDto, type ConverterForm as ConverterBody, type ConverterFormValues } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import type { Column } from '@/components/data-table';
import { Field, Input, Select, LabelledOptions } from '@/components/field';
import type { EditGate } from '@/components/published-edit';
import { formatStored } from '@/lib/format';
import { useCreateConverter } from '../api/create-converter';
import { useDeleteConverter } from '../api/delete-converter';
import { useUpdateConverter } from '../api/update-converter';
import { FormFrame, RecordsCard, useCardForm } from './form-card';
import { QuantityFields, quantityList, TypedQuantity, labelsOf, quantityTexts } from './quantity-field';

// Labels, placeholders and the bare-number rule of each field: contracts' CONVERTER_FIELDS.
const QUANTITIES = quantityList({ inputVolts: 'V', outputVolts: 'V', ratedCurrentAmps: 'A', chargeCurrentAmps: 'A', efficiency: '' });
type QKey = (typeof QUANTITIES)[number]['key'];

const LABELS = { topology: 'Topology', role: 'Role', label: 'Label', efficiencySource: 'Efficiency is', ...labelsOf(CONVERTER_FIELDS) };

const valuesOf = (c: ConverterDto | null): ConverterFormValues => ({
  label: c?.label ?? '',
  topology: c?.topology ?? 'buck',
  role: c?.role ?? 'charge',
  efficiencySource: c?.efficiencySource ?? 'assumed',
  ...quantityTexts(QUANTITIES, CONVERTER_FIELDS, c),
});

const shown = (c: ConverterDto, key: QKey, unit: string) => {
  const v = c[key];
  if (v === null) return <span className="text-graphite-300">—</span>;
  return <TypedQuantity typed={c.entered[key]} si={key === 'efficiency' ? `${Math.round(v * 1000) / 10} %` : formatStored(v, unit)} />;
};

/** DC-DC stages with their efficiency, measured or assumed (the figures assume 0.90 when none is given). */
export function ConvertersCard({ teardownId, converters, gate }: { teardownId: number; converters: ConverterDto[]; gate: EditGate }) {
  const remove = useDeleteConverter(teardownId);

  const columns = useMemo<Column<ConverterDto>[]>(
    () => [
      { id: 'label', header: 'Converter', value: (c) => c.label, filter: 'text', className: 'min-w-48 font-medium' },
      { id: 'topology', header: 'Topology', value: (c) => CONVERTER_TOPOLOGY.labels[c.topology], filter: 'select', className: 'whitespace-nowrap' },
      { id: 'role', header: 'Role', value: (c) => CONVERTER_ROLE.labels[c.role], filter: 'select', className: 'min-w-32' },
      {
        id: 'volts',
        header: 'Vin → Vout',
        value: (c) => c.outputVolts,
        className: 'num whitespace-nowrap',
        cell: (c) => (
          <span>
            {shown(c, 'inputVolts', 'V')} → {shown(c, 'outputVolts', 'V')}
          </span>
        ),
      },
      {
        id: 'current',
        header: 'Current',
        value: (c) => c.chargeCurrentAmps ?? c.ratedCurrentAmps ?? undefined,
        className: 'num whitespace-nowrap',
        cell: (c) => (c.role === 'charge' ? shown(c, 'chargeCurrentAmps', 'A') : shown(c, 'ratedCurrentAmps', 'A')),
      },
      {
        id: 'efficiency',
        header: 'Efficiency',
        value: (c) => c.efficiency ?? undefined,
        className: 'num whitespace-nowrap',
        cell: (c) =>
          c.efficiency === null ? (
            <span className="text-graphite-500">not given (0.90 assumed)</span>
          ) : (
            <span className="inline-flex items-center gap-2">
              {shown(c, 'efficiency', '')}
              <Badge tone={c.efficiencySource === 'measured' ? 'cell' : 'neutral'}>{c.efficiencySource}</Badge>
            </span>
          ),
      },
    ],
    [],
  );

  return (
    <RecordsCard
      title="Converters"
      noun="converter"
      rows={converters}
      columns={columns}
      gate={gate}
      empty={{ editor: 'No converters yet: add the charger and any boost or buck stage.', reader: 'No converters recorded.' }}
      remove={{ busy: remove.isPending, run: (c) => remove.mutateAsync({ teardownId, id: c.id }) }}
      renderForm={(converter, done) => <ConverterForm teardownId={teardownId} converter={converter} onDone={done} />}
    />
  );
}

function ConverterForm({ teardownId, converter, onDone }: { teardownId: number; converter: ConverterDto | null; onDone: () => void }) {
  const create = useCreateConverter(teardownId);
  const update = useUpdateConverter(teardownId);
  const card = useCardForm<ConverterFormValues, ConverterBody>({
    schema: converterFormSchema,
    defaultValues: useMemo(() => valuesOf(converter), [converter]),
    save: (body) => (converter ? update.mutateAsync({ teardownId, id: converter.id, body }) : create.mutateAsync({ teardownId, body })),
    saved: () => (converter ? 'Converter saved.' : 'Converter added.'),
    onSaved: onDone,
  });
  const { form } = card;
  const errors = form.formState.errors;

  return (
    <FormFrame
      card={card}
      label={converter ? `Edit ${converter.label}` : 'New converter'}
      title={converter ? `Edit ${converter.label}` : 'New converter'}
      labels={LABELS}
      submitLabel={converter ? 'Save converter' : 'Add converter'}
      onCancel={onDone}
    >
      <Field label="Topology" error={errors.topology?.message}>
        {(p) => (
          <Select {...p} {...form.register('topology')} autoFocus>
            <LabelledOptions list={CONVERTER_TOPOLOGY} />
          </Select>
        )}
      </Field>
      <Field label="Role" error={errors.role?.message}>
        {(p) => (
          <Select {...p} {...form.register('role')}>
            <LabelledOptions list={CONVERTER_ROLE} />
          </Select>
        )}
      </Field>
      <Field label="Label" error={errors.label?.message} hint="Blank: named from topology and role" className="sm:col-span-2 xl:col-span-1">
        {(p) => <Input {...p} {...form.register('label')} />}
      </Field>
      <QuantityFields form={form} list={QUANTITIES} fields={CONVERTER_FIELDS} record={converter} />
      <Field label="Efficiency is" error={errors.efficiencySource?.message}>
        {(p) => (
          <Select {...p} {...form.register('efficiencySource')}>
            <option value="assumed">Assumed</option>
            <option value="measured">Measured</option>
          </Select>
        )}
      </Field>
    </FormFrame>
  );
}
