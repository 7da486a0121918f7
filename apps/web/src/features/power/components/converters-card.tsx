import { useMemo, useState, type FormEvent } from 'react';
import { toast } from 'sonner';
import { Plus } from 'lucide-react';
import { CONVERTER_FIELDS, CONVERTER_ROLE, CONVERTER_TOPOLOGY, type ConverterDto, type ConverterRole, type ConverterTopology, type CreateConverterBody } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import { Button } from '@/components/button';
import { rowActionsColumn } from '@/components/row-actions';
import { DataTable, type Column } from '@/components/data-table';
import { Field, Input, Select, LabelledOptions, FormError } from '@/components/field';
import { Card } from '@/components/page';
import type { EditGate } from '@/components/published-edit';
import { ApiError } from '@/lib/api-client';
import { formatStored } from '@/lib/format';
import { useCreateConverter } from '../api/create-converter';
import { useDeleteConverter } from '../api/delete-converter';
import { useUpdateConverter } from '../api/update-converter';
import { QuantityField, TypedQuantity, typedOr } from './quantity-field';

// Labels, placeholders and the bare-number rule of each field: contracts' CONVERTER_FIELDS.
const QUANTITIES = [
  { key: 'inputVolts', unit: 'V' },
  { key: 'outputVolts', unit: 'V' },
  { key: 'ratedCurrentAmps', unit: 'A' },
  { key: 'chargeCurrentAmps', unit: 'A' },
  { key: 'efficiency', unit: '' },
] as const;
type QKey = (typeof QUANTITIES)[number]['key'];

interface Draft {
  label: string;
  topology: ConverterTopology;
  role: ConverterRole;
  efficiencySource: 'measured' | 'assumed';
  q: Record<QKey, string>;
}

const draftOf = (c: ConverterDto | null): Draft => ({
  label: c?.label ?? '',
  topology: c?.topology ?? 'buck',
  role: c?.role ?? 'charge',
  efficiencySource: c?.efficiencySource ?? 'assumed',
  q: Object.fromEntries(QUANTITIES.map((f) => [f.key, c ? typedOr(c.entered, f.key, c[f.key], CONVERTER_FIELDS[f.key]) : ''])) as Record<QKey, string>,
});

const shown = (c: ConverterDto, key: QKey, unit: string) => {
  const v = c[key];
  if (v === null) return <span className="text-graphite-300">—</span>;
  return <TypedQuantity typed={c.entered[key]} si={key === 'efficiency' ? `${Math.round(v * 1000) / 10} %` : formatStored(v, unit)} />;
};

/** DC-DC stages with their efficiency, measured or assumed (the figures assume 0.90 when none is given). */
export function ConvertersCard({ teardownId, converters, gate }: { teardownId: number; converters: ConverterDto[]; gate: EditGate }) {
  const [editing, setEditing] = useState<ConverterDto | 'new' | null>(null);
  const [confirmDelete, setConfirmDelete] = useState<number | null>(null);
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
      { id: 'current', header: 'Current', value: (c) => c.chargeCurrentAmps ?? c.ratedCurrentAmps ?? undefined, className: 'num whitespace-nowrap', cell: (c) => (c.role === 'charge' ? shown(c, 'chargeCurrentAmps', 'A') : shown(c, 'ratedCurrentAmps', 'A')) },
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
      rowActionsColumn<ConverterDto>({
        canEdit: gate.canEdit,
        confirming: confirmDelete,
        setConfirming: setConfirmDelete,
        busy: remove.isPending,
        editLabel: (c) => `Edit ${c.label}`,
        deleteLabel: (c) => `Delete ${c.label}`,
        keepLabel: 'Keep the converter',
        onEdit: setEditing,
        onDelete: (c) => remove.mutate({ teardownId, id: c.id }, { onSuccess: () => toast.success(`Removed ${c.label}.`), onError: (e) => toast.error(e.message), onSettled: () => setConfirmDelete(null) }),
      }),
    ],
    [gate, confirmDelete, remove, teardownId],
  );

  return (
    <Card
      title="Converters"
      actions={
        gate.canEdit &&
        editing === null && (
          <Button size="sm" onClick={() => setEditing('new')}>
            <Plus className="size-4" aria-hidden /> Add converter
          </Button>
        )
      }
    >
      <div className="space-y-3 p-2">
        <DataTable caption="Converters" rows={converters} columns={columns} rowId={(c) => String(c.id)} empty={gate.canEdit ? 'No converters yet: add the charger and any boost or buck stage.' : 'No converters recorded.'} />
        {editing !== null && <ConverterForm key={editing === 'new' ? 'new' : editing.id} teardownId={teardownId} converter={editing === 'new' ? null : editing} onDone={() => setEditing(null)} />}
      </div>
    </Card>
  );
}

function ConverterForm({ teardownId, converter, onDone }: { teardownId: number; converter: ConverterDto | null; onDone: () => void }) {
  const create = useCreateConverter(teardownId);
  const update = useUpdateConverter(teardownId);
  const [draft, setDraft] = useState<Draft>(() => draftOf(converter));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setErrors({});
    setFormError(null);
    const q = Object.fromEntries(QUANTITIES.map((f) => [f.key, draft.q[f.key].trim() === '' ? null : draft.q[f.key]])) as Record<QKey, string | null>;
    const body: CreateConverterBody = {
      label: draft.label.trim() || null,
      topology: draft.topology,
      role: draft.role,
      efficiencySource: draft.efficiencySource,
      ...q,
      inputVolts: q.inputVolts ?? '',
      outputVolts: q.outputVolts ?? '',
    };
    try {
      if (converter) await update.mutateAsync({ teardownId, id: converter.id, body });
      else await create.mutateAsync({ teardownId, body });
      toast.success(converter ? 'Converter saved.' : 'Converter added.');
      onDone();
    } catch (err) {
      if (err instanceof ApiError && Object.keys(err.fields).length) setErrors(err.fields);
      else setFormError(err instanceof Error ? err.message : 'The converter was not saved.');
    }
  };

  return (
    <form onSubmit={submit} onKeyDown={(e) => e.key === 'Escape' && onDone()} noValidate className="space-y-4 rounded-md border border-graphite-150 bg-graphite-50/60 p-4" aria-label={converter ? `Edit ${converter.label}` : 'New converter'}>
      <h3 className="text-sm font-semibold">{converter ? `Edit ${converter.label}` : 'New converter'}</h3>
      <FormError message={formError} />
      <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">
        <Field label="Topology" error={errors.topology}>
          {(p) => (
            <Select {...p} value={draft.topology} onChange={(e) => setDraft({ ...draft, topology: e.target.value as ConverterTopology })} autoFocus>
              <LabelledOptions list={CONVERTER_TOPOLOGY} />
            </Select>
          )}
        </Field>
        <Field label="Role" error={errors.role}>
          {(p) => (
            <Select {...p} value={draft.role} onChange={(e) => setDraft({ ...draft, role: e.target.value as ConverterRole })}>
              <LabelledOptions list={CONVERTER_ROLE} />
            </Select>
          )}
        </Field>
        <Field label="Label" error={errors.label} hint="Blank: named from topology and role" className="sm:col-span-2 xl:col-span-1">
          {(p) => <Input {...p} value={draft.label} onChange={(e) => setDraft({ ...draft, label: e.target.value })} />}
        </Field>
        {QUANTITIES.map((f) => (
          <QuantityField
            key={f.key}
            name={f.key}
            field={CONVERTER_FIELDS[f.key]}
            unit={f.unit}
            value={draft.q[f.key]}
            error={errors[f.key]}
            saved={converter ? { value: converter[f.key], text: typedOr(converter.entered, f.key, converter[f.key], CONVERTER_FIELDS[f.key]) } : undefined}
            onChange={(v) => setDraft({ ...draft, q: { ...draft.q, [f.key]: v } })}
          />
        ))}
        <Field label="Efficiency is" error={errors.efficiencySource}>
          {(p) => (
            <Select {...p} value={draft.efficiencySource} onChange={(e) => setDraft({ ...draft, efficiencySource: e.target.value as 'measured' | 'assumed' })}>
              <option value="assumed">Assumed</option>
              <option value="measured">Measured</option>
            </Select>
          )}
        </Field>
      </div>
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={create.isPending || update.isPending}>
          {converter ? 'Save converter' : 'Add converter'}
        </Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
