// The inputs of one editable part row (the row being edited, or the entry row at the bottom).
// Each table cell renders one input; the row's state lives in a context so the table's columns
// do not change on every keystroke.
import { createContext, useContext, type KeyboardEvent, type RefObject } from 'react';
import { MOUNT_TYPE, PART_CATEGORY, defaultMountFor, type MountType, type PartCategory, type PartDto, type UpdatePartBody } from '@splitcase/contracts';

export interface PartDraft {
  designators: string;
  category: PartCategory;
  description: string;
  marking: string;
  makerPartNumber: string;
  package: string;
  quantity: string;
  mount: MountType;
  notes: string;
  /** The user chose the mount; otherwise it follows the category. */
  mountTouched: boolean;
}

export type DraftField = Exclude<keyof PartDraft, 'mountTouched'>;

export const emptyDraft = (keep?: Pick<PartDraft, 'category' | 'mount' | 'mountTouched'>): PartDraft => ({
  designators: '',
  category: keep?.category ?? 'passive',
  description: '',
  marking: '',
  makerPartNumber: '',
  package: '',
  quantity: '1',
  mount: keep?.mount ?? 'smt',
  notes: '',
  mountTouched: keep?.mountTouched ?? false,
});

export const draftOf = (p: PartDto): PartDraft => ({
  designators: p.designators ?? '',
  category: p.category,
  description: p.description,
  marking: p.marking ?? '',
  makerPartNumber: p.makerPartNumber ?? '',
  package: p.package ?? '',
  quantity: String(p.quantity),
  mount: p.mount,
  notes: p.notes ?? '',
  mountTouched: true,
});

/** The request body of a draft, or the field errors found before asking the server. */
export function bodyOf(d: PartDraft): { body: Required<Omit<UpdatePartBody, 'designator'>> } | { errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  const quantity = Number(d.quantity.trim());
  if (!/^\d+$/.test(d.quantity.trim()) || quantity < 1) errors.quantity = 'Enter a whole number of at least 1';
  if (!d.description.trim()) errors.description = 'Required: describe the part';
  if (Object.keys(errors).length) return { errors };
  const text = (s: string) => (s.trim() === '' ? null : s.trim());
  return {
    body: {
      designators: text(d.designators),
      category: d.category,
      description: d.description.trim(),
      marking: text(d.marking),
      makerPartNumber: text(d.makerPartNumber),
      package: text(d.package),
      quantity,
      mount: d.mount,
      notes: text(d.notes),
    },
  };
}

export interface EditorState {
  /** Which row: 'new' for the entry row. */
  rowKey: string;
  draft: PartDraft;
  errors: Record<string, string>;
  setField: (field: DraftField, value: string) => void;
  onKeyDown: (e: KeyboardEvent) => void;
  firstInput?: RefObject<HTMLInputElement | null>;
  autoFocus?: boolean;
}

export const EditorContext = createContext<EditorState | null>(null);

/** Apply a field change; a category change moves an untouched mount to the category's default. */
export function withField(d: PartDraft, field: DraftField, value: string): PartDraft {
  if (field === 'category') {
    const category = value as PartCategory;
    return { ...d, category, mount: d.mountTouched ? d.mount : defaultMountFor(category) };
  }
  if (field === 'mount') return { ...d, mount: value as MountType, mountTouched: true };
  return { ...d, [field]: value };
}

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

const cellInput =
  'h-7 w-full rounded border border-graphite-200 bg-white px-1.5 text-sm focus:border-copper-500 focus:outline-none focus:ring-2 focus:ring-copper-200 aria-[invalid=true]:border-brick-600 aria-[invalid=true]:bg-brick-50';

export function DraftInput({ field, mono = false, numeric = false, placeholder }: { field: DraftField; mono?: boolean; numeric?: boolean; placeholder?: string }) {
  const ctx = useContext(EditorContext);
  if (!ctx) return null;
  const error = ctx.errors[field];
  const label = ctx.rowKey === 'new' ? `New part: ${LABELS[field].toLowerCase()}` : `${LABELS[field]}`;
  if (field === 'category' || field === 'mount') {
    const options = field === 'category' ? PART_CATEGORY : MOUNT_TYPE;
    return (
      <select
        aria-label={label}
        aria-invalid={Boolean(error)}
        title={error}
        value={ctx.draft[field]}
        onChange={(e) => ctx.setField(field, e.target.value)}
        onKeyDown={ctx.onKeyDown}
        className={`${cellInput} pr-6`}
      >
        {options.values.map((v) => (
          <option key={v} value={v}>
            {(options.labels as Record<string, string>)[v]}
          </option>
        ))}
      </select>
    );
  }
  return (
    <input
      ref={field === 'designators' ? ctx.firstInput : undefined}
      autoFocus={field === 'designators' && ctx.autoFocus}
      aria-label={label}
      aria-invalid={Boolean(error)}
      title={error}
      value={ctx.draft[field]}
      placeholder={placeholder}
      inputMode={numeric ? 'numeric' : undefined}
      onChange={(e) => ctx.setField(field, e.target.value)}
      onKeyDown={ctx.onKeyDown}
      className={`${cellInput} ${mono ? 'font-mono' : ''} ${numeric ? 'num text-right' : ''}`}
    />
  );
}

/** Field messages of a row, by label. */
export function DraftErrors({ errors }: { errors: Record<string, string> }) {
  const entries = Object.entries(errors);
  if (!entries.length) return null;
  return (
    <ul className="space-y-0.5 text-sm text-brick-700" role="alert">
      {entries.map(([field, message]) => (
        <li key={field}>
          <span className="font-medium">{LABELS[field as DraftField] ?? field}:</span> {message}
        </li>
      ))}
    </ul>
  );
}
