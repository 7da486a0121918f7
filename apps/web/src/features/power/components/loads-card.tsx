import { useMemo, useState, type FormEvent } from 'react';
import { toast } from 'sonner';
import { Plus } from 'lucide-react';
import { CONNECTION, ELEMENT_MATERIAL, LOAD_FIELDS, LOAD_KIND, SURFACE_MATERIAL, type Connection, type ConverterDto, type CreateLoadBody, type ElementMaterial, type LoadDto, type LoadKind, type SurfaceMaterial } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { rowActionsColumn } from '@/components/row-actions';
import { DataTable, type Column } from '@/components/data-table';
import { Field, Input, Select, LabelledOptions, FormError } from '@/components/field';
import { Card } from '@/components/page';
import type { EditGate } from '@/components/published-edit';
import { ApiError } from '@/lib/api-client';
import { formatStored } from '@/lib/format';
import { useCreateLoad } from '../api/create-load';
import { useDeleteLoad } from '../api/delete-load';
import { useUpdateLoad } from '../api/update-load';
import { QuantityField, TypedQuantity, typedOr } from './quantity-field';

// Labels, placeholders and the bare-number rule of each field: contracts' LOAD_FIELDS.
const QUANTITIES = [
  { key: 'resistanceOhms', unit: 'Ω' },
  { key: 'currentAmps', unit: 'A' },
  { key: 'powerWatts', unit: 'W' },
  { key: 'supplyVolts', unit: 'V' },
  { key: 'count', unit: '' },
  { key: 'duty', unit: '' },
  { key: 'heatedAreaM2', unit: 'm²' },
  { key: 'heatedMassKg', unit: 'kg' },
] as const;
type QKey = (typeof QUANTITIES)[number]['key'];

interface Draft {
  kind: LoadKind;
  label: string;
  connection: Connection;
  converterId: string;
  surfaceMaterial: SurfaceMaterial | '';
  elementMaterial: ElementMaterial | '';
  q: Record<QKey, string>;
}

const draftOf = (l: LoadDto | null): Draft => ({
  kind: l?.kind ?? 'heater',
  label: l?.label ?? '',
  connection: l?.connection ?? 'parallel',
  converterId: l?.converterId ? String(l.converterId) : '',
  surfaceMaterial: l?.surfaceMaterial ?? '',
  elementMaterial: l?.elementMaterial ?? '',
  q: Object.fromEntries(QUANTITIES.map((f) => [f.key, l ? typedOr(l.entered, f.key, l[f.key], LOAD_FIELDS[f.key]) : f.key === 'count' ? '1' : f.key === 'duty' ? '100 %' : ''])) as Record<QKey, string>,
});

const shown = (l: LoadDto, key: QKey, unit: string) => {
  const v = l[key];
  if (v === null) return null;
  return <TypedQuantity typed={l.entered[key]} si={key === 'duty' ? `${Math.round(v * 1000) / 10} %` : formatStored(v, unit)} />;
};

/** Loads: heater elements, motors, LEDs, USB outputs, each per element with count and connection. */
export function LoadsCard({ teardownId, loads, converters, gate }: { teardownId: number; loads: LoadDto[]; converters: ConverterDto[]; gate: EditGate }) {
  const [editing, setEditing] = useState<LoadDto | 'new' | null>(null);
  const [confirmDelete, setConfirmDelete] = useState<number | null>(null);
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
      { id: 'supply', header: 'Supply', value: (l) => l.supplyVolts ?? undefined, cell: (l) => shown(l, 'supplyVolts', 'V') ?? <span className="text-graphite-400">from source</span>, className: 'whitespace-nowrap num' },
      { id: 'count', header: 'Count', value: (l) => l.count, cell: (l) => `${l.count} × ${CONNECTION.labels[l.connection].toLowerCase()}`, className: 'whitespace-nowrap' },
      { id: 'duty', header: 'Duty', value: (l) => l.duty, cell: (l) => shown(l, 'duty', ''), align: 'right' },
      { id: 'via', header: 'Fed through', value: (l) => (l.converterId ? converterName.get(l.converterId) : 'Pack'), filter: 'select', className: 'min-w-40', cell: (l) => (l.converterId ? converterName.get(l.converterId) : <span className="text-graphite-500">the pack, directly</span>) },
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
      rowActionsColumn<LoadDto>({
        canEdit: gate.canEdit,
        confirming: confirmDelete,
        setConfirming: setConfirmDelete,
        busy: remove.isPending,
        editLabel: (l) => `Edit ${l.label}`,
        deleteLabel: (l) => `Delete ${l.label}`,
        keepLabel: 'Keep the load',
        onEdit: setEditing,
        onDelete: (l) => remove.mutate({ teardownId, id: l.id }, { onSuccess: () => toast.success(`Removed ${l.label}.`), onError: (e) => toast.error(e.message), onSettled: () => setConfirmDelete(null) }),
      }),
    ],
    [gate, confirmDelete, remove, teardownId, converterName],
  );

  return (
    <Card
      title="Loads"
      actions={
        gate.canEdit &&
        editing === null && (
          <Button size="sm" onClick={() => setEditing('new')}>
            <Plus className="size-4" aria-hidden /> Add load
          </Button>
        )
      }
    >
      <div className="space-y-3 p-2">
        <DataTable caption="Loads" rows={loads} columns={columns} rowId={(l) => String(l.id)} empty={gate.canEdit ? 'No loads yet: add the heater elements, motors, LEDs or USB outputs the pack feeds.' : 'No loads recorded.'} />
        {editing !== null && (
          <LoadForm key={editing === 'new' ? 'new' : editing.id} teardownId={teardownId} load={editing === 'new' ? null : editing} converters={converters} onDone={() => setEditing(null)} />
        )}
      </div>
    </Card>
  );
}

function LoadForm({ teardownId, load, converters, onDone }: { teardownId: number; load: LoadDto | null; converters: ConverterDto[]; onDone: () => void }) {
  const create = useCreateLoad(teardownId);
  const update = useUpdateLoad(teardownId);
  const [draft, setDraft] = useState<Draft>(() => draftOf(load));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setErrors({});
    setFormError(null);
    const body: CreateLoadBody = {
      kind: draft.kind,
      label: draft.label.trim() || null,
      connection: draft.connection,
      converterId: draft.converterId ? Number(draft.converterId) : null,
      surfaceMaterial: draft.surfaceMaterial || null,
      elementMaterial: draft.elementMaterial || null,
      ...(Object.fromEntries(QUANTITIES.map((f) => [f.key, draft.q[f.key].trim() === '' ? null : draft.q[f.key]])) as Record<QKey, string | null>),
      count: draft.q.count.trim() || '1',
      duty: draft.q.duty.trim() || '100 %',
    };
    try {
      if (load) await update.mutateAsync({ teardownId, id: load.id, body });
      else await create.mutateAsync({ teardownId, body });
      toast.success(load ? 'Load saved.' : 'Load added.');
      onDone();
    } catch (err) {
      if (err instanceof ApiError && Object.keys(err.fields).length) setErrors(err.fields);
      else setFormError(err instanceof Error ? err.message : 'The load was not saved.');
    }
  };

  return (
    <form onSubmit={submit} onKeyDown={(e) => e.key === 'Escape' && onDone()} noValidate className="space-y-4 rounded-md border border-graphite-150 bg-graphite-50/60 p-4" aria-label={load ? `Edit ${load.label}` : 'New load'}>
      <h3 className="text-sm font-semibold">{load ? `Edit ${load.label}` : 'New load'}</h3>
      <FormError message={formError} />
      <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">
        <Field label="Kind" error={errors.kind}>
          {(p) => (
            <Select {...p} value={draft.kind} onChange={(e) => setDraft({ ...draft, kind: e.target.value as LoadKind })} autoFocus>
              <LabelledOptions list={LOAD_KIND} />
            </Select>
          )}
        </Field>
        <Field label="Label" error={errors.label} hint="e.g. Heater elements, front and back" className="xl:col-span-2">
          {(p) => <Input {...p} value={draft.label} onChange={(e) => setDraft({ ...draft, label: e.target.value })} />}
        </Field>
        {QUANTITIES.slice(0, 4).map((f) => (
          <QuantityField
            key={f.key}
            name={f.key}
            field={LOAD_FIELDS[f.key]}
            unit={f.unit}
            value={draft.q[f.key]}
            error={errors[f.key]}
            saved={load ? { value: load[f.key], text: typedOr(load.entered, f.key, load[f.key], LOAD_FIELDS[f.key]) } : undefined}
            onChange={(v) => setDraft({ ...draft, q: { ...draft.q, [f.key]: v } })}
          />
        ))}
        <QuantityField name="count" field={LOAD_FIELDS.count} unit="" value={draft.q.count} error={errors.count} onChange={(v) => setDraft({ ...draft, q: { ...draft.q, count: v } })} />
        <Field label="Connection" error={errors.connection}>
          {(p) => (
            <Select {...p} value={draft.connection} onChange={(e) => setDraft({ ...draft, connection: e.target.value as Connection })}>
              <LabelledOptions list={CONNECTION} />
            </Select>
          )}
        </Field>
        <QuantityField name="duty" field={LOAD_FIELDS.duty} unit="" value={draft.q.duty} error={errors.duty} onChange={(v) => setDraft({ ...draft, q: { ...draft.q, duty: v } })} />
        <Field label="Fed through" error={errors.converterId}>
          {(p) => (
            <Select {...p} value={draft.converterId} onChange={(e) => setDraft({ ...draft, converterId: e.target.value })}>
              <option value="">Straight from the pack</option>
              {converters.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.label}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <QuantityField
          name="heatedAreaM2"
          field={LOAD_FIELDS.heatedAreaM2}
          unit="m²"
          value={draft.q.heatedAreaM2}
          error={errors.heatedAreaM2}
          saved={load ? { value: load.heatedAreaM2, text: typedOr(load.entered, 'heatedAreaM2', load.heatedAreaM2, LOAD_FIELDS.heatedAreaM2) } : undefined}
          onChange={(v) => setDraft({ ...draft, q: { ...draft.q, heatedAreaM2: v } })}
        />
        <Field label="Surface material" error={errors.surfaceMaterial} hint="Sets the touch-temperature limit">
          {(p) => (
            <Select {...p} value={draft.surfaceMaterial} onChange={(e) => setDraft({ ...draft, surfaceMaterial: e.target.value as SurfaceMaterial | '' })}>
              <option value="">Not a touch surface</option>
              <LabelledOptions list={SURFACE_MATERIAL} />
            </Select>
          )}
        </Field>
        {draft.kind === 'heater' && (
          <>
            <Field label="Element material" error={errors.elementMaterial} hint="Copper elements lose power as they warm (R rises about 0.39 %/K)">
              {(p) => (
                <Select {...p} value={draft.elementMaterial} onChange={(e) => setDraft({ ...draft, elementMaterial: e.target.value as ElementMaterial | '' })}>
                  <option value="">Not recorded</option>
                  <LabelledOptions list={ELEMENT_MATERIAL} />
                </Select>
              )}
            </Field>
            <QuantityField
              name="heatedMassKg"
              field={LOAD_FIELDS.heatedMassKg}
              unit="kg"
              value={draft.q.heatedMassKg}
              error={errors.heatedMassKg}
              saved={load ? { value: load.heatedMassKg, text: typedOr(load.entered, 'heatedMassKg', load.heatedMassKg, LOAD_FIELDS.heatedMassKg) } : undefined}
              onChange={(v) => setDraft({ ...draft, q: { ...draft.q, heatedMassKg: v } })}
            />
          </>
        )}
      </div>
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={create.isPending || update.isPending}>
          {load ? 'Save load' : 'Add load'}
        </Button>
        <Button variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
