// Operating modes: a matrix of the teardown's loads × its modes, the PWM duty of each load in each
// mode in the cells (blank = off), plus each mode's standby current and note. One row is edited at a
// time; Enter saves it, Escape cancels. The figures panel shows the figures of every mode.
import { useMemo, useState, type KeyboardEvent } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { toast } from 'sonner';
import { Plus, Thermometer } from 'lucide-react';
import { z } from 'zod';
import { createModeBody, LOAD_KIND, type LoadDto, type ModeDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { FormError, Input, InlineError } from '@/components/field';
import { Card } from '@/components/page';
import type { EditGate } from '@/components/published-edit';
import { RowActions } from '@/components/row-actions';
import { ApiError } from '@/lib/api-client';
import { formatStored } from '@/lib/format';
import { useCreateMode } from '../api/create-mode';
import { useDeleteMode } from '../api/delete-mode';
import { useDutyForTarget } from '../api/duty-for-target';
import { useUpdateMode } from '../api/update-mode';
import { TypedQuantity } from './quantity-field';

/** The row being edited: the mode's fields as typed, the duty of each load by load id ('' = off). */
const modeForm = z.object({
  name: createModeBody.shape.name,
  note: z.string().trim().max(300, 'At most 300 characters'),
  quiescentAmps: z.string().trim().max(40, 'At most 40 characters'),
  duties: z.record(z.string(), z.string().trim().max(40, 'At most 40 characters')),
});
type ModeForm = z.infer<typeof modeForm>;

const OFF = /^(0+([.,]0*)?\s*%?|off|—|-)?$/i;

const dutyText = (duty: number) => `${Math.round(duty * 1000) / 10} %`;

function defaults(mode: ModeDto | null, loads: LoadDto[]): ModeForm {
  const duties: Record<string, string> = {};
  for (const l of loads) {
    const entry = mode?.loads.find((x) => x.loadId === l.id);
    duties[String(l.id)] = entry ? dutyText(entry.duty) : '';
  }
  return { name: mode?.name ?? '', note: mode?.note ?? '', quiescentAmps: mode ? (mode.entered.quiescentAmps ?? (mode.quiescentAmps !== null ? String(mode.quiescentAmps) : '')) : '', duties };
}

export function ModesCard({ teardownId, loads, modes, gate }: { teardownId: number; loads: LoadDto[]; modes: ModeDto[]; gate: EditGate }) {
  const [editing, setEditing] = useState<ModeDto | 'new' | null>(null);
  const [confirmDelete, setConfirmDelete] = useState<number | null>(null);
  const remove = useDeleteMode(teardownId);
  const heaters = useMemo(() => loads.filter((l) => l.kind === 'heater' && l.heatedAreaM2 !== null), [loads]);

  if (loads.length === 0 && modes.length === 0) return null;
  const editRow = (mode: ModeDto | null) => <ModeRow key={mode?.id ?? 'new'} teardownId={teardownId} mode={mode} loads={loads} heaters={heaters} onDone={() => setEditing(null)} />;

  return (
    <Card
      title="Operating modes"
      actions={
        gate.canEdit &&
        editing === null &&
        loads.length > 0 && (
          <Button size="sm" onClick={() => setEditing('new')}>
            <Plus className="size-4" aria-hidden /> Add mode
          </Button>
        )
      }
    >
      <div className="space-y-2 p-3">
        <p className="text-sm text-graphite-600">
          {modes.length === 0
            ? 'No modes yet: the figures take every load at its own duty at once. Add the modes the device has (low, high, power-bank output, standby) for power and runtime per mode.'
            : 'The loads on in each mode and their PWM duty (blank: off). The figures panel gives power, current and runtime per mode.'}
        </p>
        {(modes.length > 0 || editing !== null) && (
          <div className="overflow-x-auto">
            <table className="w-full text-sm">
              <caption className="sr-only">Operating modes: duty of each load in each mode</caption>
              <thead>
                <tr className="border-b border-graphite-150 text-left text-xs font-medium text-graphite-600">
                  <th scope="col" className="min-w-36 px-2 py-1.5">
                    Mode
                  </th>
                  {loads.map((l) => (
                    <th key={l.id} scope="col" className="min-w-28 px-2 py-1.5">
                      <span className="block">{l.label}</span>
                      <span className="block font-normal text-graphite-600">{LOAD_KIND.labels[l.kind]} · duty</span>
                    </th>
                  ))}
                  <th scope="col" className="min-w-28 px-2 py-1.5">
                    Standby current
                  </th>
                  <th scope="col" className="min-w-40 px-2 py-1.5">
                    Note
                  </th>
                  <th scope="col" className="px-2 py-1.5">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {modes.map((m) =>
                  editing !== 'new' && editing?.id === m.id ? (
                    editRow(m)
                  ) : (
                    <tr key={m.id} className="border-b border-graphite-100 align-top" data-mode={m.name}>
                      <th scope="row" className="px-2 py-1.5 text-left font-medium text-graphite-900">
                        {m.name}
                      </th>
                      {loads.map((l) => {
                        const entry = m.loads.find((x) => x.loadId === l.id);
                        return (
                          <td key={l.id} className="num px-2 py-1.5">
                            {entry ? dutyText(entry.duty) : <span className="text-graphite-500">off</span>}
                          </td>
                        );
                      })}
                      <td className="num px-2 py-1.5">
                        {m.quiescentAmps === null ? <span className="text-graphite-500">—</span> : <TypedQuantity typed={m.entered.quiescentAmps} si={formatStored(m.quiescentAmps, 'A')} />}
                      </td>
                      <td className="px-2 py-1.5 text-graphite-700">{m.note ?? ''}</td>
                      <td className="px-2 py-1 text-right">
                        {gate.canEdit && editing === null && (
                          <RowActions
                            confirming={confirmDelete === m.id}
                            busy={remove.isPending}
                            editLabel={`Edit mode ${m.name}`}
                            deleteLabel={`Delete mode ${m.name}`}
                            keepLabel="Keep the mode"
                            onEdit={() => setEditing(m)}
                            onAskDelete={() => setConfirmDelete(m.id)}
                            onCancelDelete={() => setConfirmDelete(null)}
                            onDelete={() =>
                              remove.mutate(
                                { teardownId, id: m.id },
                                { onSuccess: () => toast.success(`Removed mode ${m.name}.`), onError: (e) => toast.error(e.message), onSettled: () => setConfirmDelete(null) },
                              )
                            }
                          />
                        )}
                      </td>
                    </tr>
                  ),
                )}
                {editing === 'new' && editRow(null)}
              </tbody>
            </table>
          </div>
        )}
      </div>
    </Card>
  );
}

function ModeRow({ teardownId, mode, loads, heaters, onDone }: { teardownId: number; mode: ModeDto | null; loads: LoadDto[]; heaters: LoadDto[]; onDone: () => void }) {
  const create = useCreateMode(teardownId);
  const update = useUpdateMode(teardownId);
  const duty = useDutyForTarget();
  const [target, setTarget] = useState('45 °C');
  const [targetNote, setTargetNote] = useState<string | null>(null);
  const [targetError, setTargetError] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, setValue, formState } = useForm<ModeForm>({ resolver: zodResolver(modeForm), defaultValues: defaults(mode, loads) });
  const errors = formState.errors;
  const label = mode ? mode.name : 'the new mode';

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    const sent = loads.filter((l) => !OFF.test(values.duties[String(l.id)] ?? ''));
    const body = {
      name: values.name,
      note: values.note || null,
      quiescentAmps: values.quiescentAmps || null,
      loads: sent.map((l) => ({ loadId: l.id, duty: values.duties[String(l.id)]! })),
    };
    try {
      if (mode) await update.mutateAsync({ teardownId, id: mode.id, body });
      else await create.mutateAsync({ teardownId, body });
      toast.success(mode ? `Mode ${values.name} saved.` : `Mode ${values.name} added.`);
      onDone();
    } catch (err) {
      if (!(err instanceof ApiError) || Object.keys(err.fields).length === 0) {
        setFormError(err instanceof Error ? err.message : 'The mode was not saved.');
        return;
      }
      let unplaced = false;
      for (const [field, message] of Object.entries(err.fields)) {
        const row = /^loads\.(\d+)\.(duty|loadId)$/.exec(field);
        if (row) setError(`duties.${sent[Number(row[1])]!.id}`, { type: 'server', message });
        else if (field === 'name' || field === 'note' || field === 'quiescentAmps') setError(field, { type: 'server', message });
        else unplaced = true;
      }
      if (unplaced) setFormError(err.message);
    }
  });

  const onKeyDown = (e: KeyboardEvent) => {
    if (e.key === 'Escape') onDone();
    else if (e.key === 'Enter' && !e.nativeEvent.isComposing) {
      e.preventDefault();
      void submit();
    }
  };

  const fillDuty = (heater: LoadDto) => {
    setTargetError(null);
    duty.mutate(
      { teardownId, loadId: heater.id, target },
      {
        onSuccess: (f) => {
          const d = Number(f.value);
          setValue(`duties.${heater.id}`, dutyText(d), { shouldDirty: true });
          setTargetNote(
            `${heater.label}: duty ${dutyText(d)} holds about ${target} at the surface in still air (${f.formula}). ${f.warnings.join(' ')} A fixed duty holds it only with nothing covering the heater; holding it in use needs a temperature sensor.`,
          );
        },
        onError: (e) => setTargetError(e instanceof ApiError ? (e.fields.target ?? e.message) : e.message),
      },
    );
  };

  const busy = create.isPending || update.isPending;
  return (
    <>
      <tr className="border-b border-graphite-100 bg-graphite-50/70 align-top" onKeyDown={onKeyDown} data-mode-editing={mode?.name ?? 'new'}>
        <td className="px-2 py-1.5">
          <Input aria-label={`Name of ${label}`} aria-invalid={Boolean(errors.name)} placeholder="High" autoFocus {...register('name')} />
          <InlineError message={errors.name?.message} />
        </td>
        {loads.map((l) => {
          const err = errors.duties?.[String(l.id)]?.message;
          return (
            <td key={l.id} className="px-2 py-1.5">
              <Input
                aria-label={`Duty of ${l.label} in ${label}`}
                aria-invalid={Boolean(err)}
                placeholder="off"
                className="num"
                autoComplete="off"
                spellCheck={false}
                {...register(`duties.${l.id}`)}
              />
              <InlineError message={err} />
              {heaters.some((h) => h.id === l.id) && (
                <button type="button" className="mt-1 inline-flex items-center gap-1 text-xs text-copper-700 underline-offset-2 hover:underline" onClick={() => fillDuty(l)} disabled={duty.isPending}>
                  <Thermometer className="size-3" aria-hidden /> Duty for {target}
                </button>
              )}
            </td>
          );
        })}
        <td className="px-2 py-1.5">
          <Input aria-label={`Standby current of ${label}`} aria-invalid={Boolean(errors.quiescentAmps)} placeholder="20 µA" className="num" autoComplete="off" {...register('quiescentAmps')} />
          <InlineError message={errors.quiescentAmps?.message} />
        </td>
        <td className="px-2 py-1.5">
          <Input aria-label={`Note on ${label}`} aria-invalid={Boolean(errors.note)} placeholder="button held 2 s" {...register('note')} />
          <InlineError message={errors.note?.message} />
        </td>
        <td className="whitespace-nowrap px-2 py-1.5 text-right">
          <Button size="sm" variant="primary" busy={busy} onClick={() => void submit()}>
            {mode ? 'Save' : 'Add'}
          </Button>{' '}
          <Button size="sm" variant="ghost" onClick={onDone}>
            Cancel
          </Button>
        </td>
      </tr>
      {(formError || heaters.length > 0) && (
        <tr className="bg-graphite-50/70">
          <td colSpan={loads.length + 4} className="space-y-1.5 px-2 pb-2">
            <FormError message={formError} />
            {heaters.length > 0 && (
              <div className="flex flex-wrap items-center gap-2 text-xs text-graphite-700">
                <label htmlFor={`target-${mode?.id ?? 'new'}`}>Target surface temperature for “Duty for”:</label>
                <Input id={`target-${mode?.id ?? 'new'}`} className="num h-8 w-24" value={target} onChange={(e) => setTarget(e.target.value)} aria-invalid={Boolean(targetError)} />
                <InlineError message={targetError} />
              </div>
            )}
            {targetNote && (
              <p className="text-xs text-graphite-700" role="status">
                {targetNote}
              </p>
            )}
          </td>
        </tr>
      )}
    </>
  );
}
