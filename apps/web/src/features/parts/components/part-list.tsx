import { useCallback, useMemo, useRef, useState, type KeyboardEvent, type ReactNode } from 'react';
import { toast } from 'sonner';
import { ArrowDown, ArrowUp, Check, ChevronDown, ChevronRight, Pencil, Plus, Trash2, TriangleAlert, X } from 'lucide-react';
import { MOUNT_TYPE, PART_CATEGORY, type PartDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { DataTable, type Column } from '@/components/data-table';
import { DecodedMarking, DecodedReadingList } from '@/components/decoded-marking';
import type { EditGate } from '@/components/published-edit';
import { ApiError } from '@/lib/api-client';
import { formatQuantity } from '@/lib/format';
import { useCreatePart } from '../api/create-part';
import { useDeletePart } from '../api/delete-part';
import { useReorderParts } from '../api/reorder-parts';
import { useUpdatePart } from '../api/update-part';
import { DraftErrors, DraftInput, EditorContext, bodyOf, draftOf, emptyDraft, withField, type DraftField, type EditorState, type PartDraft } from './part-editor';

const errorsOf = (err: unknown): Record<string, string> => {
  if (err instanceof ApiError) return Object.keys(err.fields).length ? err.fields : { _: err.message };
  return { _: err instanceof Error ? err.message : 'Something went wrong.' };
};

export const decodedText = (p: Pick<PartDto, 'decodedValue' | 'decodedUnit'>) => (p.decodedValue === null || !p.decodedUnit ? null : formatQuantity(p.decodedValue, p.decodedUnit));

const iconButton = 'inline-flex size-6 items-center justify-center rounded text-graphite-500 hover:bg-graphite-100 hover:text-graphite-900 disabled:opacity-40';

/**
 * The bill of materials as an inline-editable table: click a row (or its pencil) to edit it in
 * place, Enter saves, Esc cancels; the entry row at the bottom adds a line on Enter and stays ready
 * for the next. `renderPartExtras` adds content to a row's details (e.g. the photo pins of the part).
 */
export function PartList({
  teardownId,
  parts,
  gate,
  renderPartExtras,
}: {
  teardownId: number;
  parts: PartDto[];
  gate: EditGate;
  renderPartExtras?: (partId: number) => ReactNode;
}) {
  const canEdit = gate.canEdit;
  const create = useCreatePart(teardownId);
  const update = useUpdatePart(teardownId);
  const remove = useDeletePart(teardownId);
  const reorder = useReorderParts(teardownId);

  const [editingId, setEditingId] = useState<number | null>(null);
  const [editDraft, setEditDraft] = useState<PartDraft>(emptyDraft());
  const [editErrors, setEditErrors] = useState<Record<string, string>>({});
  const [newDraft, setNewDraft] = useState<PartDraft>(emptyDraft());
  const [newErrors, setNewErrors] = useState<Record<string, string>>({});
  const [expanded, setExpanded] = useState<Set<number>>(new Set());
  const [confirmDelete, setConfirmDelete] = useState<number | null>(null);
  const firstNewInput = useRef<HTMLInputElement | null>(null);

  const startEdit = useCallback(
    (p: PartDto) => {
      if (!canEdit) return;
      setEditingId(p.id);
      setEditDraft(draftOf(p));
      setEditErrors({});
    },
    [canEdit],
  );
  const cancelEdit = useCallback(() => {
    setEditingId(null);
    setEditErrors({});
  }, []);

  const saveEdit = async () => {
    if (editingId === null) return;
    const built = bodyOf(editDraft);
    if ('errors' in built) return setEditErrors(built.errors);
    try {
      await update.mutateAsync({ id: editingId, body: built.body });
      setEditingId(null);
      setEditErrors({});
    } catch (err) {
      setEditErrors(errorsOf(err));
    }
  };

  const addNew = async () => {
    const built = bodyOf(newDraft);
    if ('errors' in built) return setNewErrors(built.errors);
    try {
      await create.mutateAsync({ teardownId, body: built.body });
      setNewDraft(emptyDraft({ category: newDraft.category, mount: newDraft.mount, mountTouched: newDraft.mountTouched }));
      setNewErrors({});
      firstNewInput.current?.focus();
    } catch (err) {
      setNewErrors(errorsOf(err));
    }
  };

  const remove1 = (p: PartDto) =>
    remove.mutate(
      { id: p.id },
      { onSuccess: () => toast.success(`Removed ${p.designators ?? p.description}.`), onError: (e) => toast.error(e.message), onSettled: () => setConfirmDelete(null) },
    );

  const move = (p: PartDto, by: -1 | 1) => {
    const ids = [...parts].sort((a, b) => a.position - b.position || a.id - b.id).map((x) => x.id);
    const i = ids.indexOf(p.id);
    const j = i + by;
    if (j < 0 || j >= ids.length) return;
    [ids[i], ids[j]] = [ids[j]!, ids[i]!];
    reorder.mutate({ teardownId, ids }, { onError: (e) => toast.error(e.message) });
  };

  const keyHandler = (save: () => void, cancel: () => void) => (e: KeyboardEvent) => {
    if (e.key === 'Enter' && !e.nativeEvent.isComposing) {
      e.preventDefault();
      save();
    } else if (e.key === 'Escape') {
      e.preventDefault();
      cancel();
    }
  };

  const editState: EditorState = {
    rowKey: String(editingId),
    draft: editDraft,
    errors: editErrors,
    setField: (field: DraftField, value: string) => setEditDraft((d) => withField(d, field, value)),
    onKeyDown: keyHandler(() => void saveEdit(), cancelEdit),
    autoFocus: true,
  };
  const newState: EditorState = {
    rowKey: 'new',
    draft: newDraft,
    errors: newErrors,
    setField: (field: DraftField, value: string) => setNewDraft((d) => withField(d, field, value)),
    onKeyDown: keyHandler(
      () => void addNew(),
      () => {
        setNewDraft(emptyDraft({ category: newDraft.category, mount: newDraft.mount, mountTouched: newDraft.mountTouched }));
        setNewErrors({});
      },
    ),
    firstInput: firstNewInput,
  };

  // The table's columns call the latest handlers without being rebuilt on every keystroke.
  const latest = useRef({ saveEdit, remove1 });
  latest.current = { saveEdit, remove1 };

  const toggle = (id: number) =>
    setExpanded((s) => {
      const next = new Set(s);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  const columns = useMemo<Column<PartDto>[]>(() => {
    const editing = (p: PartDto) => p.id === editingId;
    const show = (p: PartDto, field: DraftField, view: ReactNode, opts: { mono?: boolean; numeric?: boolean } = {}) =>
      editing(p) ? <DraftInput field={field} {...opts} /> : view;
    const dash = <span className="text-graphite-300">—</span>;
    return [
      {
        id: 'expand',
        header: '',
        value: () => '',
        sortable: false,
        className: 'w-8',
        cell: (p) => (
          <button
            type="button"
            className={iconButton}
            aria-expanded={expanded.has(p.id)}
            aria-label={`Details of ${p.designators ?? p.description}`}
            onClick={(e) => {
              e.stopPropagation();
              toggle(p.id);
            }}
          >
            {expanded.has(p.id) ? <ChevronDown className="size-4" /> : <ChevronRight className="size-4" />}
          </button>
        ),
      },
      { id: 'designators', header: 'Designators', value: (p) => p.designators, filter: 'text', className: 'min-w-24 font-medium', cell: (p) => show(p, 'designators', p.designators ?? dash) },
      { id: 'category', header: 'Category', value: (p) => PART_CATEGORY.labels[p.category], filter: 'select', className: 'min-w-28 whitespace-nowrap', cell: (p) => show(p, 'category', PART_CATEGORY.labels[p.category]) },
      {
        id: 'description',
        header: 'Description',
        value: (p) => p.description,
        filter: 'text',
        className: 'min-w-44',
        cell: (p) =>
          show(
            p,
            'description',
            <span className="line-clamp-1" title={p.description}>
              {p.description}
            </span>,
          ),
      },
      { id: 'marking', header: 'Marking', value: (p) => p.marking, filter: 'text', className: 'min-w-20 whitespace-nowrap font-mono text-xs', cell: (p) => show(p, 'marking', p.marking ?? dash, { mono: true }) },
      {
        id: 'decoded',
        header: 'Decoded',
        value: (p) => p.decodedValue ?? undefined,
        align: 'right',
        className: 'min-w-20 whitespace-nowrap',
        cell: (p) =>
          p.decodedReadings.length > 0 ? (
            <DecodedMarking readings={p.decodedReadings} expanded={expanded.has(p.id)} onShowAll={() => toggle(p.id)} />
          ) : p.decodeNote ? (
            <span className="inline-flex items-center gap-1 text-xs text-amber-700" title={p.decodeNote}>
              <TriangleAlert className="size-3.5" aria-hidden /> not a code
            </span>
          ) : (
            dash
          ),
      },
      { id: 'mpn', header: 'Maker part no.', value: (p) => p.makerPartNumber, filter: 'text', className: 'min-w-28 whitespace-nowrap font-mono text-xs', cell: (p) => show(p, 'makerPartNumber', p.makerPartNumber ?? dash, { mono: true }) },
      { id: 'package', header: 'Package', value: (p) => p.package, filter: 'text', className: 'min-w-20 whitespace-nowrap', cell: (p) => show(p, 'package', p.package ?? dash) },
      { id: 'quantity', header: 'Qty', value: (p) => p.quantity, align: 'right', className: 'w-16', cell: (p) => show(p, 'quantity', p.quantity, { numeric: true }) },
      { id: 'mount', header: 'Mount', value: (p) => MOUNT_TYPE.labels[p.mount], filter: 'select', className: 'min-w-24 whitespace-nowrap', cell: (p) => show(p, 'mount', MOUNT_TYPE.labels[p.mount]) },
      {
        id: 'notes',
        header: 'Notes',
        value: (p) => p.notes,
        filter: 'text',
        className: 'min-w-32 max-w-56',
        cell: (p) =>
          show(
            p,
            'notes',
            p.notes ? (
              <span className="line-clamp-1 text-graphite-600" title={p.notes}>
                {p.notes}
              </span>
            ) : (
              dash
            ),
          ),
      },
      {
        id: 'actions',
        header: '',
        value: () => '',
        sortable: false,
        align: 'right',
        className: 'w-20 whitespace-nowrap',
        cell: (p) =>
          !canEdit ? null : editing(p) ? (
            <span className="inline-flex">
              <button type="button" className={iconButton} aria-label="Save the line (Enter)" onClick={(e) => {
                  e.stopPropagation();
                  void latest.current.saveEdit();
                }}>
                <Check className="size-4" />
              </button>
              <button type="button" className={iconButton} aria-label="Cancel (Esc)" onClick={(e) => {
                  e.stopPropagation();
                  cancelEdit();
                }}>
                <X className="size-4" />
              </button>
            </span>
          ) : confirmDelete === p.id ? (
            <span className="inline-flex items-center gap-1" onClick={(e) => e.stopPropagation()}>
              <Button size="sm" variant="danger" className="h-7" onClick={() => latest.current.remove1(p)} busy={remove.isPending} autoFocus>
                Delete
              </Button>
              <button type="button" className={iconButton} aria-label="Keep the line" onClick={() => setConfirmDelete(null)}>
                <X className="size-4" />
              </button>
            </span>
          ) : (
            <span className="inline-flex">
              <button type="button" className={iconButton} aria-label={`Edit ${p.designators ?? p.description}`} disabled={editingId !== null} onClick={(e) => {
                  e.stopPropagation();
                  startEdit(p);
                }}>
                <Pencil className="size-3.5" />
              </button>
              <button type="button" className={iconButton} aria-label={`Delete ${p.designators ?? p.description}`} onClick={(e) => {
                  e.stopPropagation();
                  setConfirmDelete(p.id);
                }}>
                <Trash2 className="size-3.5" />
              </button>
            </span>
          ),
      },
    ];
  }, [editingId, expanded, canEdit, confirmDelete, remove.isPending, startEdit, cancelEdit]);

  const sorted = useMemo(() => [...parts].sort((a, b) => a.position - b.position || a.id - b.id), [parts]);
  const firstId = sorted[0]?.id;
  const lastId = sorted.at(-1)?.id;

  const details = (p: PartDto): ReactNode | null => {
    if (p.id === editingId) {
      return (
        <div className="space-y-1">
          <DraftErrors errors={editErrors} />
          <p className="text-xs text-graphite-500">Enter saves the line · Esc cancels</p>
        </div>
      );
    }
    if (!expanded.has(p.id)) return null;
    return (
      <div className="grid gap-4 text-sm md:grid-cols-[minmax(0,1fr)_auto]">
        <dl className="grid grid-cols-[8rem_minmax(0,1fr)] gap-x-3 gap-y-1">
          <dt className="text-graphite-500">Marking as read</dt>
          <dd className="font-mono">{p.marking ?? '—'}</dd>
          <dt className="text-graphite-500">Decoded value</dt>
          <dd>
            {p.decodedReadings.length > 1 ? <DecodedReadingList readings={p.decodedReadings} /> : p.decodedReadings[0] ? <DecodedMarking readings={p.decodedReadings} /> : '—'}
            {p.decodeNote && <span className="ml-2 text-amber-700">{p.decodeNote}</span>}
            {!p.decodeNote && decodedText(p) === null && p.marking && <span className="ml-2 text-graphite-500">Only resistor and capacitor markings are decoded.</span>}
          </dd>
          <dt className="text-graphite-500">Notes</dt>
          <dd className="whitespace-pre-wrap">{p.notes ?? '—'}</dd>
        </dl>
        {canEdit && (
          <div className="flex items-start gap-1">
            <Button size="sm" variant="ghost" disabled={p.id === firstId || reorder.isPending} onClick={() => move(p, -1)}>
              <ArrowUp className="size-4" aria-hidden /> Up
            </Button>
            <Button size="sm" variant="ghost" disabled={p.id === lastId || reorder.isPending} onClick={() => move(p, 1)}>
              <ArrowDown className="size-4" aria-hidden /> Down
            </Button>
          </div>
        )}
        {renderPartExtras && <div className="md:col-span-2">{renderPartExtras(p.id)}</div>}
      </div>
    );
  };

  const footer = canEdit ? (
    <EditorContext.Provider value={newState}>
      <tr className="h-9 border-t-2 border-graphite-150 bg-copper-50/40">
        <td className="px-1.5 text-center text-copper-600">
          <Plus className="mx-auto size-4" aria-hidden />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="designators" placeholder="R1, R2" />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="category" />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="description" placeholder="What it is" />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="marking" mono placeholder="472" />
        </td>
        <td className="px-1.5 py-1 text-right text-xs text-graphite-400">auto</td>
        <td className="px-1.5 py-1">
          <DraftInput field="makerPartNumber" mono />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="package" placeholder="0402" />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="quantity" numeric />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="mount" />
        </td>
        <td className="px-1.5 py-1">
          <DraftInput field="notes" />
        </td>
        <td className="px-1.5 py-1 text-right">
          <Button size="sm" variant="primary" className="h-7" onClick={() => void addNew()} busy={create.isPending}>
            Add
          </Button>
        </td>
      </tr>
      <tr>
        <td colSpan={12} className="px-3 pb-2 pt-1">
          <div className="sticky left-3 w-fit max-w-[40rem]">
            {Object.keys(newErrors).length ? <DraftErrors errors={newErrors} /> : <p className="text-xs text-graphite-500">Type a line and press Enter: it is added and this row is ready for the next. Esc clears it.</p>}
          </div>
        </td>
      </tr>
    </EditorContext.Provider>
  ) : undefined;

  return (
    <EditorContext.Provider value={editState}>
      <DataTable
        caption="Parts list"
        rows={sorted}
        columns={columns}
        rowId={(p) => String(p.id)}
        onRowClick={canEdit && editingId === null ? startEdit : undefined}
        renderExpanded={details}
        rowClassName={(p) => (p.id === editingId ? 'bg-copper-50/70 hover:bg-copper-50/70' : '')}
        footer={footer}
        maxHeight="calc(100vh - 13rem)"
        dense
        empty={canEdit ? 'No parts yet: type the first line below, or import a CSV.' : 'No parts recorded yet.'}
      />
    </EditorContext.Provider>
  );
}
