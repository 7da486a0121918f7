import { useMemo, useRef, useState, type ReactNode } from 'react';
import { toast } from 'sonner';
import type { PartDto } from '@splitcase/contracts';
import { DataTable } from '@/components/data-table';
import type { EditGate } from '@/components/published-edit';
import { useCreatePart } from '../api/create-part';
import { useDeletePart } from '../api/delete-part';
import { useReorderParts } from '../api/reorder-parts';
import { useUpdatePart } from '../api/update-part';
import { partColumns, partName } from './part-columns';
import { PartDetails } from './part-details';
import { DraftErrors, EditorContext, usePartRow, type EditorState } from './part-editor';
import { PartEntryRow } from './part-entry-row';

/**
 * The bill of materials as an inline-editable table: click a row (or its pencil) to edit it in
 * place, Enter saves, Esc cancels; the entry row at the bottom adds a line on Enter and stays ready
 * for the next. `renderPartExtras` adds content to a row's details (e.g. the photo pins of the part).
 */
export function PartList({ teardownId, parts, gate, renderPartExtras }: { teardownId: number; parts: PartDto[]; gate: EditGate; renderPartExtras?: (partId: number) => ReactNode }) {
  const canEdit = gate.canEdit;
  const create = useCreatePart(teardownId);
  const update = useUpdatePart(teardownId);
  const remove = useDeletePart(teardownId);
  const reorder = useReorderParts(teardownId);

  const [editingId, setEditingId] = useState<number | null>(null);
  const [expanded, setExpanded] = useState<Set<number>>(new Set());
  const [confirmDelete, setConfirmDelete] = useState<number | null>(null);
  const firstNewInput = useRef<HTMLInputElement | null>(null);

  const edit = usePartRow({
    save: (body) => update.mutateAsync({ id: editingId!, body }),
    saved: () => setEditingId(null),
    cancel: () => setEditingId(null),
  });
  const entry = usePartRow({
    save: (body) => create.mutateAsync({ teardownId, body }),
    saved: () => {
      entry.clear();
      firstNewInput.current?.focus();
    },
    cancel: () => entry.clear(),
  });

  // The table's columns call the latest handlers without being rebuilt on every keystroke.
  const latest = useRef({ edit, canEdit });
  latest.current = { edit, canEdit };
  const startEdit = useMemo(
    () => (p: PartDto) => {
      if (!latest.current.canEdit) return;
      latest.current.edit.load(p);
      setEditingId(p.id);
    },
    [],
  );

  const removeLine = (p: PartDto) =>
    remove.mutate({ id: p.id }, { onSuccess: () => toast.success(`Removed ${partName(p)}.`), onError: (e) => toast.error(e.message), onSettled: () => setConfirmDelete(null) });
  const latestRemove = useRef(removeLine);
  latestRemove.current = removeLine;

  const sorted = useMemo(() => [...parts].sort((a, b) => a.position - b.position || a.id - b.id), [parts]);
  const move = (p: PartDto, by: -1 | 1) => {
    const ids = sorted.map((x) => x.id);
    const i = ids.indexOf(p.id);
    const j = i + by;
    if (j < 0 || j >= ids.length) return;
    [ids[i], ids[j]] = [ids[j]!, ids[i]!];
    reorder.mutate({ teardownId, ids }, { onError: (e) => toast.error(e.message) });
  };

  const columns = useMemo(
    () =>
      partColumns({
        canEdit,
        editingId,
        expanded,
        toggle: (id) =>
          setExpanded((s) => {
            const next = new Set(s);
            if (next.has(id)) next.delete(id);
            else next.add(id);
            return next;
          }),
        confirmDelete,
        setConfirmDelete,
        deleting: remove.isPending,
        onEdit: startEdit,
        onSave: () => void latest.current.edit.submit(),
        onCancel: () => setEditingId(null),
        onDelete: (p) => latestRemove.current(p),
      }),
    [canEdit, editingId, expanded, confirmDelete, remove.isPending, startEdit],
  );

  const details = (p: PartDto): ReactNode | null => {
    if (p.id === editingId) {
      return (
        <div className="space-y-1">
          <DraftErrors errors={edit.errors} />
          <p className="text-xs text-graphite-500">Enter saves the line · Esc cancels</p>
        </div>
      );
    }
    if (!expanded.has(p.id)) return null;
    return (
      <PartDetails
        part={p}
        canEdit={canEdit}
        first={p.id === sorted[0]?.id}
        last={p.id === sorted.at(-1)?.id}
        moving={reorder.isPending}
        onMove={(by) => move(p, by)}
        extras={renderPartExtras?.(p.id)}
      />
    );
  };

  const editState: EditorState = { rowKey: String(editingId), row: edit, autoFocus: true };
  const entryState: EditorState = { rowKey: 'new', row: entry, firstInput: firstNewInput };

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
        footer={canEdit ? <PartEntryRow state={entryState} busy={create.isPending} /> : undefined}
        maxHeight="calc(100vh - 13rem)"
        dense
        empty={canEdit ? 'No parts yet: type the first line below, or import a CSV.' : 'No parts recorded yet.'}
      />
    </EditorContext.Provider>
  );
}
