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
}: {
  confirming: boolean;
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
        <Button size="sm" variant="danger" className="h-7" busy={busy} onClick={onDelete}>
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
      <button type="button" className="rounded p-1.5 text-graphite-500 hover:bg-graphite-100" aria-label={editLabel} onClick={onEdit}>
        <Pencil className="size-3.5" />
      </button>
      <button type="button" className="rounded p-1.5 text-graphite-500 hover:bg-graphite-100" aria-label={deleteLabel} onClick={onAskDelete}>
        <Trash2 className="size-3.5" />
      </button>
    </span>
  );
}

/**
 * The last column of an editable table: RowActions per row for editors, nothing for readers.
 * `confirming` is the id of the row whose delete waits for its second click.
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
}): Column<T> {
  return {
    id: 'actions',
    header: '',
    value: () => '',
    sortable: false,
    align: 'right',
    className: 'whitespace-nowrap',
    pinRight: o.canEdit,
    cell: (row) =>
      o.canEdit ? (
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
        />
      ) : null,
  };
}
