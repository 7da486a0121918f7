import { useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { toast } from 'sonner';
import { Download } from 'lucide-react';
import { bareHint, MEASURED_QUANTITY, MEASUREMENT_FIELDS, measurementExample, SI_UNIT, type MeasuredQuantity, type MeasurementDto, type TeardownDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { rowActionsColumn } from '@/components/row-actions';
import { DataTable, type Column } from '@/components/data-table';
import { ErrorPanel } from '@/components/error-boundary';
import { inputClass } from '@/components/field';
import { Card, Spinner } from '@/components/page';
import { PublishedEditNotice, useEditGate } from '@/components/published-edit';
import { ApiError } from '@/lib/api-client';
import { formatDateTime, formatStored, sameQuantityText } from '@/lib/format';
import { useCreateMeasurement } from '../api/create-measurement';
import { useDeleteMeasurement } from '../api/delete-measurement';
import { measurementsCsvUrl, useMeasurements } from '../api/measurements';
import { useUpdateMeasurement } from '../api/update-measurement';

/** The example each quantity's value field shows, and how a bare number is read: contracts' MEASUREMENT_FIELDS. */
const example = (q: MeasuredQuantity) => measurementExample(q);
const bareRule = (q: MeasuredQuantity) => (q === 'other' ? 'the number, then its unit' : bareHint(MEASUREMENT_FIELDS[q]));

interface Draft {
  quantity: MeasuredQuantity;
  value: string;
  subject: string;
  conditions: string;
  instrument: string;
  uncertainty: string;
}
const blank: Draft = { quantity: 'resistance', value: '', subject: '', conditions: '', instrument: '', uncertainty: '' };
const draftOf = (m: MeasurementDto): Draft => ({
  quantity: m.quantity,
  value: m.entered,
  subject: m.subject,
  conditions: m.conditions ?? '',
  instrument: m.instrument ?? '',
  uncertainty: m.uncertainty ?? '',
});

/** "3.02 Ω" as typed, with the stored value beside it when the two read differently. */
export function readingText(m: MeasurementDto): { typed: string; si: string | null } {
  const si = m.quantity === 'other' ? `${m.value} ${m.unit}`.trim() : formatStored(m.value, m.unit, 4);
  return { typed: m.entered, si: sameQuantityText(m.entered, si) ? null : si };
}

const Clamp = ({ text }: { text: string | null }) =>
  text ? (
    <span className="line-clamp-1" title={text}>
      {text}
    </span>
  ) : (
    <span className="text-graphite-300">—</span>
  );

/** Measurements: a quick-entry row (Enter saves and stays ready for the next reading) over the table of readings. */
export function MeasurementsSection({ teardown }: { teardown: TeardownDto }) {
  const readings = useMeasurements(teardown.id);
  const gate = useEditGate(teardown);
  const [editing, setEditing] = useState<MeasurementDto | null>(null);
  const [confirmDelete, setConfirmDelete] = useState<number | null>(null);
  const remove = useDeleteMeasurement(teardown.id);

  const columns = useMemo<Column<MeasurementDto>[]>(
    () => [
      { id: 'when', header: 'Taken', value: (m) => m.takenAt, cell: (m) => <span className="whitespace-nowrap text-graphite-600">{formatDateTime(m.takenAt)}</span> },
      { id: 'quantity', header: 'Quantity', value: (m) => MEASURED_QUANTITY.labels[m.quantity], filter: 'select' },
      {
        id: 'reading',
        header: 'Reading',
        value: (m) => m.value,
        align: 'right',
        className: 'whitespace-nowrap',
        cell: (m) => {
          const r = readingText(m);
          return (
            <span>
              <span className="font-medium">{r.typed}</span>
              {r.si && <span className="ml-1.5 text-graphite-400">= {r.si}</span>}
            </span>
          );
        },
      },
      { id: 'subject', header: 'What was measured', value: (m) => m.subject, filter: 'text', className: 'min-w-56', cell: (m) => <Clamp text={m.subject} /> },
      { id: 'conditions', header: 'Conditions', value: (m) => m.conditions, filter: 'text', className: 'min-w-40 text-graphite-600', cell: (m) => <Clamp text={m.conditions} /> },
      { id: 'instrument', header: 'Instrument', value: (m) => m.instrument, filter: 'text', className: 'min-w-40 text-graphite-600', cell: (m) => <Clamp text={m.instrument} /> },
      { id: 'uncertainty', header: 'Uncertainty', value: (m) => m.uncertainty, className: 'whitespace-nowrap text-graphite-600' },
      { id: 'by', header: 'By', value: (m) => m.takenBy?.name, filter: 'select', className: 'whitespace-nowrap text-graphite-600' },
      rowActionsColumn<MeasurementDto>({
        canEdit: gate.canEdit,
        confirming: confirmDelete,
        setConfirming: setConfirmDelete,
        busy: remove.isPending,
        editLabel: (m) => `Correct the reading of ${m.subject}`,
        deleteLabel: (m) => `Delete the reading of ${m.subject}`,
        keepLabel: 'Keep the reading',
        onEdit: setEditing,
        onDelete: (m) => remove.mutate({ id: m.id }, { onSuccess: () => toast.success('Reading removed.'), onError: (e) => toast.error(e.message), onSettled: () => setConfirmDelete(null) }),
      }),
    ],
    [gate, confirmDelete, remove],
  );

  if (readings.isPending) return <Spinner />;
  if (readings.isError) return <ErrorPanel error={readings.error} onRetry={() => readings.refetch()} />;

  return (
    <div className="space-y-4">
      <PublishedEditNotice gate={gate} />
      {gate.canEdit && <QuickEntry key={editing?.id ?? 'new'} teardownId={teardown.id} editing={editing} onDoneEditing={() => setEditing(null)} />}
      <Card
        title={
          <span>
            Readings <span className="ml-1 font-normal text-graphite-500">{readings.data.length}</span>
          </span>
        }
        actions={
          <a
            href={measurementsCsvUrl(teardown.id)}
            download
            className="inline-flex h-8 items-center gap-1.5 rounded-md bg-white px-2.5 text-sm font-medium text-graphite-900 ring-1 ring-inset ring-graphite-200 hover:bg-graphite-50"
          >
            <Download className="size-4" aria-hidden /> Export CSV
          </a>
        }
      >
        <div className="p-2">
          <DataTable
            caption="Readings"
            rows={readings.data}
            columns={columns}
            rowId={(m) => String(m.id)}
            initialSort={{ id: 'when', desc: true }}
            rowClassName={(m) => (m.id === editing?.id ? 'bg-copper-50/70' : '')}
            empty={gate.canEdit ? 'No readings yet: type the first one above and press Enter.' : 'No readings recorded.'}
          />
        </div>
      </Card>
    </div>
  );
}

const big = `${inputClass} h-11 text-base`;

function QuickEntry({ teardownId, editing, onDoneEditing }: { teardownId: number; editing: MeasurementDto | null; onDoneEditing: () => void }) {
  const create = useCreateMeasurement(teardownId);
  const update = useUpdateMeasurement(teardownId);
  const [draft, setDraft] = useState<Draft>(() => (editing ? draftOf(editing) : blank));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState<string | null>(null);
  const valueInput = useRef<HTMLInputElement>(null);
  const busy = create.isPending || update.isPending;

  const save = async () => {
    setErrors({});
    setSaved(null);
    const local: Record<string, string> = {};
    if (!draft.value.trim()) local.value = `Required: type the reading with its unit, e.g. ${example(draft.quantity)}`;
    if (!draft.subject.trim()) local.subject = 'Say what was measured';
    if (Object.keys(local).length) return setErrors(local);
    const body = {
      quantity: draft.quantity,
      value: draft.value.trim(),
      subject: draft.subject.trim(),
      conditions: draft.conditions.trim() || null,
      instrument: draft.instrument.trim() || null,
      uncertainty: draft.uncertainty.trim() || null,
    };
    try {
      if (editing) {
        await update.mutateAsync({ id: editing.id, body });
        toast.success('Reading corrected.');
        onDoneEditing();
        return;
      }
      const m = await create.mutateAsync({ teardownId, body });
      setSaved(`Saved ${m.entered} — ${m.subject}. Ready for the next reading.`);
      setDraft((d) => ({ ...d, value: '' }));
      valueInput.current?.focus();
    } catch (err) {
      if (err instanceof ApiError && Object.keys(err.fields).length) setErrors(err.fields);
      else setErrors({ _: err instanceof Error ? err.message : 'The reading was not saved.' });
    }
  };

  const onKeyDown = (e: KeyboardEvent) => {
    if (e.key === 'Enter' && !e.nativeEvent.isComposing) {
      e.preventDefault();
      void save();
    } else if (e.key === 'Escape') {
      e.preventDefault();
      if (editing) onDoneEditing();
      else setDraft((d) => ({ ...d, value: '' }));
    }
  };

  const field = (key: keyof Draft, label: string, placeholder: string, extra: { mono?: boolean; ref?: typeof valueInput; className?: string } = {}) => (
    <label className={`block min-w-0 ${extra.className ?? ''}`}>
      <span className="mb-1 block text-xs font-medium text-graphite-700">{label}</span>
      <input
        ref={extra.ref}
        name={key}
        value={draft[key]}
        placeholder={placeholder}
        autoComplete="off"
        spellCheck={false}
        aria-invalid={Boolean(errors[key])}
        aria-describedby={errors[key] ? `reading-${key}-error` : undefined}
        onChange={(e) => setDraft({ ...draft, [key]: e.target.value })}
        onKeyDown={onKeyDown}
        className={`${big} ${extra.mono ? 'num' : ''}`}
      />
    </label>
  );

  return (
    <Card title={editing ? 'Correct a reading' : 'New reading'}>
      <div className="space-y-3 p-4" role="group" aria-label={editing ? 'Correct a reading' : 'New reading'}>
        <div className="grid gap-3 sm:grid-cols-[10rem_11rem_minmax(0,1fr)]">
          <label className="block">
            <span className="mb-1 block text-xs font-medium text-graphite-700">Quantity</span>
            <select
              name="quantity"
              value={draft.quantity}
              onChange={(e) => setDraft({ ...draft, quantity: e.target.value as MeasuredQuantity })}
              onKeyDown={onKeyDown}
              className={`${big} pr-8`}
              autoFocus={!editing}
            >
              {MEASURED_QUANTITY.values.map((q) => (
                <option key={q} value={q}>
                  {MEASURED_QUANTITY.labels[q]}
                  {SI_UNIT[q] ? ` (${SI_UNIT[q]})` : ''}
                </option>
              ))}
            </select>
          </label>
          {field('value', 'Value with unit', example(draft.quantity), { mono: true, ref: valueInput })}
          {field('subject', 'What was measured', 'Heater element, front')}
        </div>
        <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_8rem_auto]">
          {field('conditions', 'Conditions', '23 °C, four-wire')}
          {field('instrument', 'Instrument', 'Bench DMM')}
          {field('uncertainty', 'Uncertainty', '±0.5 %')}
          <div className="flex items-end gap-2">
            <Button variant="primary" size="lg" busy={busy} onClick={() => void save()} className="min-w-24">
              {editing ? 'Save' : 'Add'}
            </Button>
            {editing && (
              <Button size="lg" variant="ghost" onClick={onDoneEditing}>
                Cancel
              </Button>
            )}
          </div>
        </div>
        {Object.entries(errors).map(([k, message]) => (
          <p key={k} id={`reading-${k}-error`} role="alert" className="text-sm text-brick-700">
            {/* The server's messages about the value already start with the field's label. */}
            {!(k === 'value' && message.startsWith('Value with unit')) && (
              <span className="font-medium">{k === 'value' ? 'Value with unit' : k === 'subject' ? 'What was measured' : k === '_' ? 'Not saved' : k}: </span>
            )}
            {message}
          </p>
        ))}
        {saved && !Object.keys(errors).length && (
          <p className="text-sm text-cell-700" role="status">
            {saved}
          </p>
        )}
        {!saved && !Object.keys(errors).length && (
          <p className="text-xs text-graphite-500">
            {MEASURED_QUANTITY.labels[draft.quantity]}: e.g. {example(draft.quantity)} · {bareRule(draft.quantity)}. Enter saves the reading and keeps the row ready for the next one; Esc{' '}
            {editing ? 'cancels the correction' : 'clears the value'}.
          </p>
        )}
      </div>
    </Card>
  );
}
