// The columns of the parts table: each shows a part's value, or the row editor's input for the line
// being edited; the last is the shared row actions (pinned right, as in every editable table).
import type { ReactNode } from 'react';
import { Check, ChevronDown, ChevronRight, TriangleAlert, X } from 'lucide-react';
import { MOUNT_TYPE, PART_CATEGORY, type PartDto } from '@splitcase/contracts';
import type { Column } from '@/components/data-table';
import { DecodedMarking } from '@/components/decoded-marking';
import { rowActionsColumn } from '@/components/row-actions';
import { DraftInput, type DraftField } from './part-editor';

export const iconButton = 'inline-flex size-6 items-center justify-center rounded text-graphite-500 hover:bg-graphite-100 hover:text-graphite-900 disabled:opacity-40';

/** The name a line goes by in buttons and messages. */
export const partName = (p: PartDto) => p.designators ?? p.description;

export interface PartColumnsOptions {
  canEdit: boolean;
  editingId: number | null;
  expanded: ReadonlySet<number>;
  toggle: (id: number) => void;
  confirmDelete: number | null;
  setConfirmDelete: (id: number | null) => void;
  deleting: boolean;
  onEdit: (p: PartDto) => void;
  onSave: () => void;
  onCancel: () => void;
  onDelete: (p: PartDto) => void;
}

export function partColumns(o: PartColumnsOptions): Column<PartDto>[] {
  const editing = (p: PartDto) => p.id === o.editingId;
  const show = (p: PartDto, field: DraftField, view: ReactNode, opts: { mono?: boolean; numeric?: boolean } = {}) => (editing(p) ? <DraftInput field={field} {...opts} /> : view);
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
          aria-expanded={o.expanded.has(p.id)}
          aria-label={`Details of ${partName(p)}`}
          onClick={(e) => {
            e.stopPropagation();
            o.toggle(p.id);
          }}
        >
          {o.expanded.has(p.id) ? <ChevronDown className="size-4" /> : <ChevronRight className="size-4" />}
        </button>
      ),
    },
    { id: 'designators', header: 'Designators', value: (p) => p.designators, filter: 'text', className: 'min-w-24 font-medium', cell: (p) => show(p, 'designators', p.designators ?? dash) },
    {
      id: 'category',
      header: 'Category',
      value: (p) => PART_CATEGORY.labels[p.category],
      filter: 'select',
      className: 'min-w-28 whitespace-nowrap',
      cell: (p) => show(p, 'category', PART_CATEGORY.labels[p.category]),
    },
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
    {
      id: 'marking',
      header: 'Marking',
      value: (p) => p.marking,
      filter: 'text',
      className: 'min-w-20 whitespace-nowrap font-mono text-xs',
      cell: (p) => show(p, 'marking', p.marking ?? dash, { mono: true }),
    },
    {
      id: 'decoded',
      header: 'Decoded',
      value: (p) => p.decodedValue ?? undefined,
      align: 'right',
      className: 'min-w-20 whitespace-nowrap',
      cell: (p) =>
        p.decodedReadings.length > 0 ? (
          <DecodedMarking readings={p.decodedReadings} expanded={o.expanded.has(p.id)} onShowAll={() => o.toggle(p.id)} />
        ) : p.decodeNote ? (
          <span className="inline-flex items-center gap-1 text-xs text-amber-700" title={p.decodeNote}>
            <TriangleAlert className="size-3.5" aria-hidden /> not a code
          </span>
        ) : (
          dash
        ),
    },
    {
      id: 'mpn',
      header: 'Maker part no.',
      value: (p) => p.makerPartNumber,
      filter: 'text',
      className: 'min-w-28 whitespace-nowrap font-mono text-xs',
      cell: (p) => show(p, 'makerPartNumber', p.makerPartNumber ?? dash, { mono: true }),
    },
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
    rowActionsColumn<PartDto>({
      canEdit: o.canEdit,
      confirming: o.confirmDelete,
      setConfirming: o.setConfirmDelete,
      busy: o.deleting,
      editLabel: (p) => `Edit ${partName(p)}`,
      deleteLabel: (p) => `Delete ${partName(p)}`,
      keepLabel: 'Keep the line',
      onEdit: o.onEdit,
      onDelete: o.onDelete,
      editDisabled: o.editingId !== null,
      className: 'w-20',
      editingCell: (p) =>
        editing(p) ? (
          <>
            <button type="button" className={iconButton} aria-label="Save the line (Enter)" onClick={o.onSave}>
              <Check className="size-4" />
            </button>
            <button type="button" className={iconButton} aria-label="Cancel (Esc)" onClick={o.onCancel}>
              <X className="size-4" />
            </button>
          </>
        ) : undefined,
    }),
  ];
}
