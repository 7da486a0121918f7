// The one form card of the power system (pack, loads, converters): a react-hook-form form checked
// with the card's form schema from contracts (zodResolver), saved through the card's mutation, the
// server's field messages put on their fields (setError), a summary naming the fields to fix as
// labelled, save and cancel (Enter saves, Escape cancels), and a card of records with its table,
// "Add" button and row actions for the cards that hold a list.
import { useMemo, useState, type BaseSyntheticEvent, type ReactNode } from 'react';
import { useForm, type DefaultValues, type FieldErrors, type FieldValues, type UseFormReturn } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { toast } from 'sonner';
import { Plus } from 'lucide-react';
import { Button } from '@/components/button';
import { DataTable, type Column } from '@/components/data-table';
import { FormError } from '@/components/field';
import { Card } from '@/components/page';
import type { EditGate } from '@/components/published-edit';
import { rowActionsColumn } from '@/components/row-actions';
import { applyServerErrors } from '@/lib/form-errors';

export interface CardForm<V extends FieldValues, O> {
  form: UseFormReturn<V, unknown, O>;
  submit: (e?: BaseSyntheticEvent) => Promise<void>;
  formError: string | null;
  busy: boolean;
}

/**
 * A card's form: `schema` is the form schema from contracts (its output is the request body),
 * `save` sends it; a saved form says `saved` and calls `onSaved`. Field messages of the server land
 * on the field of the same name (nested as "internalResistanceReadings.lowAmps").
 */
export function useCardForm<V extends FieldValues, O>({
  schema,
  defaultValues,
  save,
  saved,
  onSaved,
}: {
  schema: z.ZodType<O, V>;
  defaultValues: DefaultValues<V>;
  save: (body: O) => Promise<unknown>;
  saved: (body: O) => string;
  onSaved?: () => void;
}): CardForm<V, O> {
  const form = useForm<V, unknown, O>({ resolver: zodResolver(schema), defaultValues });
  const [formError, setFormError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const known = useMemo(() => fieldNames(defaultValues), [defaultValues]);
  const submit = form.handleSubmit(async (body) => {
    setFormError(null);
    setBusy(true);
    try {
      await save(body);
      toast.success(saved(body));
      onSaved?.();
    } catch (err) {
      setFormError(applyServerErrors(err, form.setError, known));
    } finally {
      setBusy(false);
    }
  });
  return { form, submit, formError, busy };
}

/** Every field name of a form's values, nested ones with dots. */
function fieldNames(values: object, prefix = ''): string[] {
  return Object.entries(values).flatMap(([k, v]) => (v !== null && typeof v === 'object' ? fieldNames(v as object, `${prefix}${k}.`) : [`${prefix}${k}`]));
}

/** The names of the fields with an error, nested ones with dots, in the form's order. */
function erroredFields(errors: FieldErrors, prefix = ''): string[] {
  return Object.entries(errors).flatMap(([k, e]) => {
    if (!e || k === 'root') return [];
    if (typeof (e as { message?: unknown }).message === 'string') return [`${prefix}${k}`];
    return erroredFields(e as FieldErrors, `${prefix}${k}.`);
  });
}

/** "Not saved: check Rated capacity (per cell), Duty.": the fields to fix, named as labelled. */
export function ErrorSummary({ errors, labels, formError }: { errors: FieldErrors; labels: Record<string, string>; formError: string | null }) {
  const names = erroredFields(errors).map((f) => labels[f] ?? f);
  return (
    <>
      <FormError message={formError} />
      {names.length > 0 && (
        <p className="text-sm font-medium text-brick-800" data-testid="form-summary">
          Not saved: check {names.join(', ')}.
        </p>
      )}
    </>
  );
}

/**
 * The form frame: title, the error summary, the fields in a grid, save (Enter in a field) and
 * cancel (Escape, or the button when `cancelButton`).
 */
export function FormFrame<V extends FieldValues, O>({
  card,
  label,
  title,
  labels,
  submitLabel,
  onCancel,
  cancelButton = true,
  framed = true,
  intro,
  note,
  children,
}: {
  card: CardForm<V, O>;
  /** The form's accessible name. */
  label: string;
  title?: string;
  /** Field name → label as on screen, for the summary. */
  labels: Record<string, string>;
  submitLabel: string;
  onCancel: () => void;
  cancelButton?: boolean;
  /** A panel under a table (loads, converters) rather than the card's whole body (pack). */
  framed?: boolean;
  intro?: ReactNode;
  note?: ReactNode;
  children: ReactNode;
}) {
  return (
    <form
      onSubmit={(e) => void card.submit(e)}
      onKeyDown={(e) => {
        if (e.key === 'Escape') {
          e.preventDefault();
          onCancel();
        }
      }}
      noValidate
      className={framed ? 'space-y-4 rounded-md border border-graphite-150 bg-graphite-50/60 p-4' : 'space-y-4 p-4'}
      aria-label={label}
    >
      {title && <h3 className="text-sm font-semibold">{title}</h3>}
      {intro}
      <ErrorSummary errors={card.form.formState.errors} labels={labels} formError={card.formError} />
      <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">{children}</div>
      <div className="flex items-center gap-3">
        <Button type="submit" variant="primary" busy={card.busy}>
          {submitLabel}
        </Button>
        {cancelButton && (
          <Button variant="ghost" onClick={onCancel}>
            Cancel
          </Button>
        )}
        {note}
      </div>
    </form>
  );
}

/**
 * A card that lists records (loads, converters) in a table with row actions for editors, an "Add"
 * button, and the record's form under the table while one is added or edited.
 */
export function RecordsCard<T extends { id: number; label: string }>({
  title,
  noun,
  rows,
  columns,
  empty,
  gate,
  remove,
  renderForm,
}: {
  title: string;
  /** "load", "converter": in the button, the delete confirmation and the toasts. */
  noun: string;
  rows: T[];
  columns: Column<T>[];
  empty: { editor: string; reader: string };
  gate: EditGate;
  remove: { busy: boolean; run: (row: T) => Promise<unknown> };
  renderForm: (record: T | null, done: () => void) => ReactNode;
}) {
  const [editing, setEditing] = useState<T | 'new' | null>(null);
  const [confirmDelete, setConfirmDelete] = useState<number | null>(null);
  const withActions = useMemo(
    () => [
      ...columns,
      rowActionsColumn<T>({
        canEdit: gate.canEdit,
        confirming: confirmDelete,
        setConfirming: setConfirmDelete,
        busy: remove.busy,
        editLabel: (r) => `Edit ${r.label}`,
        deleteLabel: (r) => `Delete ${r.label}`,
        keepLabel: `Keep the ${noun}`,
        onEdit: setEditing,
        onDelete: (r) =>
          remove
            .run(r)
            .then(
              () => toast.success(`Removed ${r.label}.`),
              (e: unknown) => toast.error(e instanceof Error ? e.message : `The ${noun} was not removed.`),
            )
            .finally(() => setConfirmDelete(null)),
      }),
    ],
    [columns, gate.canEdit, confirmDelete, remove, noun],
  );
  return (
    <Card
      title={title}
      actions={
        gate.canEdit &&
        editing === null && (
          <Button size="sm" onClick={() => setEditing('new')}>
            <Plus className="size-4" aria-hidden /> Add {noun}
          </Button>
        )
      }
    >
      <div className="space-y-3 p-2">
        <DataTable caption={title} rows={rows} columns={withActions} rowId={(r) => String(r.id)} empty={gate.canEdit ? empty.editor : empty.reader} />
        {editing !== null && <div key={editing === 'new' ? 'new' : editing.id}>{renderForm(editing === 'new' ? null : editing, () => setEditing(null))}</div>}
      </div>
    </Card>
  );
}
