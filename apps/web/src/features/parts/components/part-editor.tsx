// The inputs of one editable part row (the row being edited, or the entry row at the bottom): a
// react-hook-form form checked with contracts' partFormSchema (the rules the CSV import reads rows
// with), the server's field messages put on their inputs. Each table cell renders one input; the
// row's form lives in a context so the table's columns do not change on every keystroke.
import { createContext, useContext, useRef, useState, type KeyboardEvent, type RefObject } from 'react';
import { useForm, type UseFormReturn } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { MOUNT_TYPE, PART_CATEGORY, defaultMountFor, partFormSchema, type PartCategory, type PartDto, type PartForm, type PartFormValues } from '@splitcase/contracts';
import { applyServerErrors } from '@/lib/form-errors';

export type DraftField = keyof PartForm;
type Values = PartFormValues;

const FIELDS: readonly DraftField[] = ['designators', 'category', 'description', 'marking', 'makerPartNumber', 'package', 'quantity', 'mount', 'notes'];

const LABELS: Record<DraftField, string> = {
  designators: 'Designators',
  category: 'Category',
  description: 'Description',
  marking: 'Marking',
  makerPartNumber: 'Maker part number',
  package: 'Package',
  quantity: 'Quantity',
  mount: 'Mount',
  notes: 'Notes',
};

const emptyValues = (keep?: Partial<Pick<Values, 'category' | 'mount'>>): Values => ({
  designators: '',
  category: keep?.category ?? 'passive',
  description: '',
  marking: '',
  makerPartNumber: '',
  package: '',
  quantity: '1',
  mount: keep?.mount ?? 'smt',
  notes: '',
});

const valuesOf = (p: PartDto): Values => ({
  designators: p.designators ?? '',
  category: p.category,
  description: p.description,
  marking: p.marking ?? '',
  makerPartNumber: p.makerPartNumber ?? '',
  package: p.package ?? '',
  quantity: String(p.quantity),
  mount: p.mount,
  notes: p.notes ?? '',
});

export interface PartRow {
  form: UseFormReturn<Values, unknown, PartForm>;
  /** Field messages by field, and `_` for the row as a whole. */
  errors: Partial<Record<DraftField | '_', string>>;
  onKeyDown: (e: KeyboardEvent) => void;
  submit: () => Promise<void>;
  /** Start editing a saved line (its mount stays as chosen). */
  load: (p: PartDto) => void;
  /** Empty the row, keeping the category and mount for the next line. */
  clear: () => void;
  /** The user chose the mount; until then it follows the category. */
  mountTouched: { current: boolean };
}

/**
 * One part row's form. `save` sends the body (create or update) and `saved` runs after it;
 * `cancel` is Escape. Until the mount is chosen it follows the category (`defaultMountFor`).
 */
export function usePartRow({ save, saved, cancel }: { save: (body: PartForm) => Promise<unknown>; saved: () => void; cancel: () => void }): PartRow {
  const form = useForm<Values, unknown, PartForm>({ resolver: zodResolver(partFormSchema), defaultValues: emptyValues() });
  const [formError, setFormError] = useState<string | null>(null);
  const mountTouched = useRef(false);

  const submit = form.handleSubmit(async (body) => {
    setFormError(null);
    try {
      await save(body);
      saved();
    } catch (err) {
      setFormError(applyServerErrors(err, form.setError, FIELDS));
    }
  });
  const reset = (values: Values, touched: boolean) => {
    form.reset(values);
    mountTouched.current = touched;
    setFormError(null);
  };
  const errors: PartRow['errors'] = {};
  for (const f of FIELDS) {
    const message = form.formState.errors[f]?.message;
    if (message) errors[f] = message;
  }
  if (formError) errors._ = formError;

  return {
    form,
    errors,
    submit,
    onKeyDown: (e) => {
      if (e.key === 'Enter' && !e.nativeEvent.isComposing) {
        e.preventDefault();
        void submit();
      } else if (e.key === 'Escape') {
        e.preventDefault();
        cancel();
      }
    },
    load: (p) => reset(valuesOf(p), true),
    clear: () => reset(emptyValues({ category: form.getValues('category'), mount: form.getValues('mount') }), mountTouched.current),
    mountTouched,
  };
}

export interface EditorState {
  /** Which row: 'new' for the entry row. */
  rowKey: string;
  row: PartRow;
  firstInput?: RefObject<HTMLInputElement | null>;
  autoFocus?: boolean;
}

export const EditorContext = createContext<EditorState | null>(null);

const cellInput =
  'h-7 w-full rounded border border-graphite-200 bg-white px-1.5 text-sm focus:border-copper-500 focus:outline-none focus:ring-2 focus:ring-copper-200 aria-[invalid=true]:border-brick-600 aria-[invalid=true]:bg-brick-50';

export function DraftInput({ field, mono = false, numeric = false, placeholder }: { field: DraftField; mono?: boolean; numeric?: boolean; placeholder?: string }) {
  const ctx = useContext(EditorContext);
  if (!ctx) return null;
  const { form, errors, onKeyDown } = ctx.row;
  const error = errors[field];
  const label = ctx.rowKey === 'new' ? `New part: ${LABELS[field].toLowerCase()}` : `${LABELS[field]}`;
  if (field === 'category' || field === 'mount') {
    const options = field === 'category' ? PART_CATEGORY : MOUNT_TYPE;
    const touched = ctx.row.mountTouched;
    const registered = form.register(field, {
      onChange: (e: { target: { value: string } }) => {
        if (field === 'mount') touched.current = true;
        else if (!touched.current) form.setValue('mount', defaultMountFor(e.target.value as PartCategory));
      },
    });
    return (
      <select aria-label={label} aria-invalid={Boolean(error)} title={error} {...registered} onKeyDown={onKeyDown} className={`${cellInput} pr-6`}>
        {options.values.map((v) => (
          <option key={v} value={v}>
            {(options.labels as Record<string, string>)[v]}
          </option>
        ))}
      </select>
    );
  }
  const { ref, ...registered } = form.register(field);
  return (
    <input
      ref={(el) => {
        ref(el);
        if (field === 'designators' && ctx.firstInput) ctx.firstInput.current = el;
      }}
      autoFocus={field === 'designators' && ctx.autoFocus}
      aria-label={label}
      aria-invalid={Boolean(error)}
      title={error}
      placeholder={placeholder}
      inputMode={numeric ? 'numeric' : undefined}
      {...registered}
      onKeyDown={onKeyDown}
      className={`${cellInput} ${mono ? 'font-mono' : ''} ${numeric ? 'num text-right' : ''}`}
    />
  );
}

/** Field messages of a row, by label. */
export function DraftErrors({ errors }: { errors: PartRow['errors'] }) {
  const entries = Object.entries(errors);
  if (!entries.length) return null;
  return (
    <div role="alert">
      <ul className="space-y-0.5 text-sm text-brick-700">
        {entries.map(([field, message]) => (
          <li key={field}>
            {field !== '_' && <span className="font-medium">{LABELS[field as DraftField] ?? field}:</span>} {message}
          </li>
        ))}
      </ul>
    </div>
  );
}
