import { useState, type FormEvent, type ReactNode } from 'react';
import { toast } from 'sonner';
import { Battery } from 'lucide-react';
import { CHEMISTRY, INTERNAL_RESISTANCE_READING_FIELDS, JOINING, PACK_FIELDS, type Chemistry, type Joining, type PackDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, Select, LabelledOptions, FormError } from '@/components/field';
import { Card } from '@/components/page';
import type { EditGate } from '@/components/published-edit';
import { ApiError } from '@/lib/api-client';
import { formatStored } from '@/lib/format';
import { useDeletePack } from '../api/delete-pack';
import { useSavePack } from '../api/save-pack';
import { QuantityField, TypedQuantity, typedOr } from './quantity-field';

// Labels, placeholders and the bare-number rule of each field: contracts' PACK_FIELDS.
const QUANTITIES = [
  { key: 'nominalVolts', unit: 'V', pick: (p: PackDto) => p.nominalVolts },
  { key: 'maxVolts', unit: 'V', pick: (p: PackDto) => p.maxVolts },
  { key: 'capacityAh', unit: 'Ah', pick: (p: PackDto) => p.capacityAh },
  { key: 'measuredCapacityAh', unit: 'Ah', pick: (p: PackDto) => p.measuredCapacityAh },
  { key: 'series', unit: '', pick: (p: PackDto) => p.series },
  { key: 'parallel', unit: '', pick: (p: PackDto) => p.parallel },
  { key: 'massKg', unit: 'kg', pick: (p: PackDto) => p.massKg },
  { key: 'internalResistanceOhms', unit: 'Ω', pick: (p: PackDto) => p.internalResistanceOhms },
] as const;

/** The two readings of the DC method (IEC 61960-3): the cell voltage at a low and at a high current. */
const READINGS = [
  { key: 'lowAmps' },
  { key: 'lowVolts' },
  { key: 'highAmps' },
  { key: 'highVolts' },
] as const;
type RKey = (typeof READINGS)[number]['key'];
type QKey = (typeof QUANTITIES)[number]['key'];

interface Draft {
  chemistry: Chemistry;
  cellFormat: string;
  protection: boolean;
  joining: Joining | '';
  q: Record<QKey, string>;
  readings: Record<RKey, string>;
}

const draftOf = (p: PackDto | null): Draft => ({
  chemistry: p?.chemistry ?? 'li-ion',
  cellFormat: p?.cellFormat ?? '',
  protection: p?.protection ?? false,
  joining: p?.joining ?? '',
  q: Object.fromEntries(QUANTITIES.map((f) => [f.key, p ? typedOr(p.entered, f.key, f.pick(p), PACK_FIELDS[f.key]) : f.key === 'series' || f.key === 'parallel' ? '1' : ''])) as Record<QKey, string>,
  readings: Object.fromEntries(READINGS.map((r) => [r.key, p?.internalResistanceReadings ? String(p.internalResistanceReadings[r.key]) : ''])) as Record<RKey, string>,
});

/**
 * The pack (one per teardown): typed with units, stored in SI, the typed text shown back. Give it
 * `key={pack?.updatedAt}` so a saved pack refreshes the form.
 */
export function PackCard({ teardownId, pack, gate }: { teardownId: number; pack: PackDto | null; gate: EditGate }) {
  const save = useSavePack(teardownId);
  const remove = useDeletePack(teardownId);
  const [draft, setDraft] = useState<Draft>(() => draftOf(pack));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [confirmRemove, setConfirmRemove] = useState(false);

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setErrors({});
    setFormError(null);
    try {
      await save.mutateAsync({
        teardownId,
        body: {
          chemistry: draft.chemistry,
          cellFormat: draft.cellFormat.trim() || null,
          protection: draft.protection,
          joining: draft.joining || null,
          nominalVolts: draft.q.nominalVolts,
          maxVolts: draft.q.maxVolts || null,
          capacityAh: draft.q.capacityAh,
          measuredCapacityAh: draft.q.measuredCapacityAh || null,
          series: draft.q.series || 1,
          parallel: draft.q.parallel || 1,
          massKg: draft.q.massKg || null,
          internalResistanceOhms: draft.q.internalResistanceOhms || null,
          internalResistanceReadings: READINGS.some((r) => draft.readings[r.key].trim() !== '') ? draft.readings : null,
        },
      });
      toast.success('Pack saved.');
    } catch (err) {
      if (err instanceof ApiError && Object.keys(err.fields).length) setErrors(err.fields);
      else setFormError(err instanceof Error ? err.message : 'The pack was not saved.');
    }
  };

  if (!gate.canEdit) {
    return (
      <Card title="Cells and pack">
        {pack ? <PackSummary pack={pack} /> : <p className="p-4 text-sm text-graphite-500">No pack recorded yet.</p>}
      </Card>
    );
  }

  return (
    <Card
      title="Cells and pack"
      actions={
        pack &&
        (confirmRemove ? (
          <span className="flex items-center gap-2 text-sm">
            Remove the pack record?
            <Button size="sm" variant="danger" busy={remove.isPending} onClick={() => remove.mutate({ teardownId }, { onSuccess: () => toast.success('Pack removed.'), onSettled: () => setConfirmRemove(false), onError: (e) => toast.error(e.message) })}>
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
      <form onSubmit={submit} noValidate className="space-y-4 p-4" aria-label="Pack">
        {!pack && (
          <p className="flex items-center gap-2 text-sm text-graphite-600">
            <Battery className="size-4 text-graphite-400" aria-hidden /> Record the cells: chemistry, voltage and capacity per cell, and how many in series and parallel.
          </p>
        )}
        <FormError message={formError} />
        <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">
          <Field label="Chemistry" error={errors.chemistry}>
            {(p) => (
              <Select {...p} value={draft.chemistry} onChange={(e) => setDraft({ ...draft, chemistry: e.target.value as Chemistry })}>
                <LabelledOptions list={CHEMISTRY} />
              </Select>
            )}
          </Field>
          <Field label="Cell format" error={errors.cellFormat} hint="18650, pouch 503450…">
            {(p) => <Input {...p} value={draft.cellFormat} onChange={(e) => setDraft({ ...draft, cellFormat: e.target.value })} />}
          </Field>
          <Field label="Joining" error={errors.joining}>
            {(p) => (
              <Select {...p} value={draft.joining} onChange={(e) => setDraft({ ...draft, joining: e.target.value as Joining | '' })}>
                <option value="">Not recorded</option>
                <LabelledOptions list={JOINING} />
              </Select>
            )}
          </Field>
          {QUANTITIES.map((f) => (
            <QuantityField
              key={f.key}
              name={f.key}
              field={PACK_FIELDS[f.key]}
              unit={f.unit}
              value={draft.q[f.key]}
              error={errors[f.key]}
              saved={pack ? { value: f.pick(pack), text: typedOr(pack.entered, f.key, f.pick(pack), PACK_FIELDS[f.key]) } : undefined}
              onChange={(v) => setDraft({ ...draft, q: { ...draft.q, [f.key]: v } })}
            />
          ))}
          <fieldset className="rounded-md border border-graphite-150 p-3 sm:col-span-2 xl:col-span-3">
            <legend className="px-1 text-sm font-medium text-graphite-800">Internal resistance from two readings (DC method)</legend>
            <p className="mb-2 text-xs text-graphite-600">
              Discharge at a low current for 10 s and read the cell voltage, step to a high current and read it again after 1 s: R = (U₁ − U₂) / (I₂ − I₁). Given, it replaces the value above.
            </p>
            <div className="grid gap-3 sm:grid-cols-2 xl:grid-cols-4">
              {READINGS.map((r) => (
                <QuantityField
                  key={r.key}
                  name={`internalResistanceReadings.${r.key}`}
                  field={INTERNAL_RESISTANCE_READING_FIELDS[r.key]}
                  unit=""
                  value={draft.readings[r.key]}
                  error={errors[`internalResistanceReadings.${r.key}`]}
                  onChange={(v) => setDraft({ ...draft, readings: { ...draft.readings, [r.key]: v } })}
                />
              ))}
            </div>
          </fieldset>
          <label className="flex items-center gap-2 self-end pb-2 text-sm font-medium text-graphite-800">
            <input type="checkbox" checked={draft.protection} onChange={(e) => setDraft({ ...draft, protection: e.target.checked })} className="size-4 accent-copper-600" />
            Protection circuit present
          </label>
        </div>
        <div className="flex items-center gap-3">
          <Button type="submit" variant="primary" busy={save.isPending}>
            {pack ? 'Save pack' : 'Record pack'}
          </Button>
          <p className="text-xs text-graphite-500">Type values with their units; a plain number is read in the unit of the field’s example (46 is 46 g).</p>
        </div>
      </form>
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
      <TypedQuantity key={f.key} typed={pack.entered[f.key]} si={formatStored(f.pick(pack), f.unit)} />,
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
