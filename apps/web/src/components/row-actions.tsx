import type { ReactNode } from 'react';
import { Pencil, Trash2, X } from 'lucide-react';
import { Button } from './button';
import type { Column } from './data-table';

/**
 * Edit and delete buttons for a table row, with a second click to confirm the delete.
 * `editLabel`/`deleteLabel` name the row for screen readers; `keepLabel` cancels the delete.
 */
export function RowActions({
  confirming,
  busy,
  editLabel,
  deleteLabel,
  keepLabel,
  onEdit,
  onAskDelete,
  onCancelDelete,
  onDelete,
  editDisabled = false,
}: {
  confirming: boolean;
  /** Another row is being edited. */
  editDisabled?: boolean;
  busy: boolean;
  editLabel: string;
  deleteLabel: string;
  keepLabel: string;
  onEdit: () => void;
  onAskDelete: () => void;
  onCancelDelete: () => void;
  onDelete: () => void;
}) {
  if (confirming) {
    return (
      <span className="inline-flex items-center gap-1">
        <Button size="sm" variant="danger" className="h-7" busy={busy} onClick={onDelete} autoFocus>
          Delete
        </Button>
        <button type="button" className="rounded p-1 text-graphite-500 hover:bg-graphite-100" aria-label={keepLabel} onClick={onCancelDelete}>
          <X className="size-4" />
        </button>
      </span>
    );
  }
  return (
    <span className="inline-flex">
      <button type="button" className="rounded p-1.5 text-graphite-500 hover:bg-graphite-100 disabled:opacity-40" aria-label={editLabel} disabled={editDisabled} onClick={onEdit}>
        <Pencil className="size-3.5" />
      </button>
      <button type="button" className="rounded p-1.5 text-graphite-500 hover:bg-graphite-100" aria-label={deleteLabel} onClick={onAskDelete}>
        <Trash2 className="size-3.5" />
      </button>
    </span>
  );
}

/**
 * The last column of an editable table, pinned to the right edge: RowActions per row for editors,
 * nothing for readers. `confirming` is the id of the row whose delete waits for its second click.
 * A table edited in place gives `editingCell` (the save/cancel of the row being edited) and
 * `editDisabled` (while a row is edited); clicks on the actions never reach the row.
 */
export function rowActionsColumn<T extends { id: number }>(o: {
  canEdit: boolean;
  confirming: number | null;
  setConfirming: (id: number | null) => void;
  busy: boolean;
  editLabel: (row: T) => string;
  deleteLabel: (row: T) => string;
  keepLabel: string;
  onEdit: (row: T) => void;
  onDelete: (row: T) => void;
  editingCell?: (row: T) => ReactNode | undefined;
  editDisabled?: boolean;
  className?: string;
}): Column<T> {
  return {
    id: 'actions',
    header: '',
    value: () => '',
    sortable: false,
    align: 'right',
    className: `whitespace-nowrap ${o.className ?? ''}`,
    pinRight: o.canEdit,
    cell: (row) =>
      o.canEdit ? (
        // Clicks on the actions are not clicks on the row (a row click starts editing in some tables).
        <span className="inline-flex" onClick={(e) => e.stopPropagation()}>
          {o.editingCell?.(row) ?? (
            <RowActions
              confirming={o.confirming === row.id}
              busy={o.busy}
              editLabel={o.editLabel(row)}
              deleteLabel={o.deleteLabel(row)}
              keepLabel={o.keepLabel}
              onEdit={() => o.onEdit(row)}
              onAskDelete={() => o.setConfirming(row.id)}
              onCancelDelete={() => o.setConfirming(null)}
              onDelete={() => o.onDelete(row)}
              editDisabled={o.editDisabled}
            />
          )}
        </span>
      ) : null,
  };
}
