import { Pencil, Trash2, X } from 'lucide-react';
import { Button } from './button';

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
