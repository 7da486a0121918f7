import { Fragment, useMemo, useState, type ReactNode } from 'react';
import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createSortedRowModel,
  filterFn_equalsString,
  filterFn_includesString,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  tableFeatures,
  useTable,
  type ColumnFiltersState,
  type SortingState,
  type RowData,
} from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';

/** A column of a DataTable: the value used for sorting/filtering, and how to show it. */
export interface Column<T> {
  id: string;
  header: string;
  value: (row: T) => string | number | null | undefined;
  cell?: (row: T) => ReactNode;
  /** Filter control in the filter row: free text, a choice among the values present, or none. */
  filter?: 'text' | 'select' | false;
  align?: 'left' | 'right';
  /** Classes for the body cells of this column. */
  className?: string;
  sortable?: boolean;
  /** Keep the column in view at the right edge when the table scrolls sideways (row actions). */
  pinRight?: boolean;
}

/** Classes of a cell of a column pinned to the right edge, on the background of its row. */
const pinned = (col: { pinRight?: boolean }, background: string) => (col.pinRight ? `sticky right-0 ${background} shadow-[-6px_0_6px_-6px_rgb(0_0_0/0.18)]` : '');

const features = tableFeatures({
  columnFilteringFeature,
  rowSortingFeature,
  filteredRowModel: createFilteredRowModel(),
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, basic: sortFn_basic },
  filterFns: { includesString: filterFn_includesString, equalsString: filterFn_equalsString },
});

/** Compact sortable table with a sticky header and a filter row (LOOK.md: ~32 px rows). */
export function DataTable<T extends RowData>({
  rows,
  columns,
  rowId,
  onRowClick,
  initialSort,
  empty,
  caption,
  maxHeight,
  renderExpanded,
  footer,
  rowClassName,
  dense,
}: {
  rows: T[];
  columns: Column<T>[];
  rowId: (row: T) => string;
  onRowClick?: (row: T) => void;
  initialSort?: { id: string; desc?: boolean };
  empty?: ReactNode;
  caption?: string;
  maxHeight?: string;
  /** Content of a full-width row under a row (null: none), e.g. details of an expanded row. */
  renderExpanded?: (row: T) => ReactNode | null;
  /** Rows appended after the data rows, never sorted or filtered (e.g. an entry row). Render <tr> elements. */
  footer?: ReactNode;
  /** Extra classes for a body row (e.g. the row being edited). */
  rowClassName?: (row: T) => string;
  /** Tighter cell padding, for tables with many columns. */
  dense?: boolean;
}) {
  const [sorting, setSorting] = useState<SortingState>(initialSort ? [{ id: initialSort.id, desc: Boolean(initialSort.desc) }] : []);
  const [filters, setFilters] = useState<ColumnFiltersState>([]);
  const helper = useMemo(() => createColumnHelper<typeof features, T>(), []);
  const defs = useMemo(
    () =>
      helper.columns(
        columns.map((c) =>
          helper.accessor((row: T) => c.value(row) ?? undefined, {
            id: c.id,
            header: c.header,
            sortFn: 'alphanumeric',
            sortUndefined: 'last',
            enableSorting: c.sortable !== false,
            enableColumnFilter: Boolean(c.filter),
            filterFn: c.filter === 'select' ? 'equalsString' : 'includesString',
          }),
        ),
      ),
    [columns, helper],
  );
  const table = useTable({
    features,
    columns: defs,
    data: rows,
    getRowId: (r: T) => rowId(r),
    state: { sorting, columnFilters: filters },
    onSortingChange: (u) => setSorting((prev) => (typeof u === 'function' ? u(prev) : u)),
    onColumnFiltersChange: (u) => setFilters((prev) => (typeof u === 'function' ? u(prev) : u)),
  });
  const byId = useMemo(() => new Map(columns.map((c) => [c.id, c])), [columns]);
  const hasFilters = columns.some((c) => c.filter);
  const visible = table.getRowModel().rows;

  return (
    <div className="overflow-auto rounded-lg border border-graphite-150 bg-white" style={maxHeight ? { maxHeight } : undefined}>
      <table className="w-full border-collapse text-sm">
        {caption && <caption className="sr-only">{caption}</caption>}
        <thead className="sticky top-0 z-10 bg-graphite-50">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const col = byId.get(header.column.id)!;
                const sorted = header.column.getIsSorted();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}
                    className={`h-8 whitespace-nowrap border-b border-graphite-150 ${dense ? 'px-1.5' : 'px-3'} text-xs font-semibold uppercase tracking-wide text-graphite-600 ${col.align === 'right' ? 'text-right' : 'text-left'} ${pinned(col, 'bg-graphite-50')}`}
                  >
                    {header.column.getCanSort() ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className={`inline-flex items-center gap-1 hover:text-graphite-950 ${col.align === 'right' ? 'flex-row-reverse' : ''}`}
                      >
                        {col.header}
                        {sorted === 'asc' ? <ArrowUp className="size-3" /> : sorted === 'desc' ? <ArrowDown className="size-3" /> : <ArrowUpDown className="size-3 opacity-30" />}
                      </button>
                    ) : (
                      col.header
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
          {hasFilters && (
            <tr>
              {table.getAllLeafColumns().map((column) => {
                const col = byId.get(column.id)!;
                const value = (column.getFilterValue() as string | undefined) ?? '';
                return (
                  <th key={column.id} className={`border-b border-graphite-150 px-2 py-1 font-normal ${pinned(col, 'bg-graphite-50')}`}>
                    {col.filter === 'text' && (
                      <input
                        aria-label={`Filter ${col.header}`}
                        value={value}
                        onChange={(e) => column.setFilterValue(e.target.value || undefined)}
                        placeholder="Filter"
                        className="h-7 w-full min-w-16 rounded border border-graphite-200 bg-white px-2 text-xs focus:border-copper-500 focus:outline-none"
                      />
                    )}
                    {col.filter === 'select' && (
                      <select
                        aria-label={`Filter ${col.header}`}
                        value={value}
                        onChange={(e) => column.setFilterValue(e.target.value || undefined)}
                        className="h-7 w-full min-w-16 rounded border border-graphite-200 bg-white px-1 text-xs focus:border-copper-500 focus:outline-none"
                      >
                        <option value="">All</option>
                        {[...new Set(rows.map((r) => col.value(r)).filter((v) => v !== null && v !== undefined && v !== ''))]
                          .map(String)
                          .sort()
                          .map((v) => (
                            <option key={v} value={v}>
                              {v}
                            </option>
                          ))}
                      </select>
                    )}
                  </th>
                );
              })}
            </tr>
          )}
        </thead>
        <tbody>
          {visible.map((row) => {
            const expanded = renderExpanded?.(row.original) ?? null;
            return (
              <Fragment key={row.id}>
                <tr
                  onClick={onRowClick ? () => onRowClick(row.original) : undefined}
                  className={`h-8 border-b border-graphite-100 ${expanded === null ? 'last:border-0' : ''} ${onRowClick ? 'cursor-pointer hover:bg-copper-50/60' : 'hover:bg-graphite-50/60'} ${rowClassName?.(row.original) ?? ''}`}
                >
                  {row.getAllCells().map((cell) => {
                    const col = byId.get(cell.column.id)!;
                    return (
                      <td
                        key={cell.id}
                        className={`${dense ? 'px-1.5 py-0.5' : 'px-3 py-1'} align-middle ${col.align === 'right' ? 'num text-right' : ''} ${col.className ?? ''} ${pinned(col, 'bg-white')}`}
                      >
                        {col.cell ? col.cell(row.original) : (col.value(row.original) ?? <span className="text-graphite-400">—</span>)}
                      </td>
                    );
                  })}
                </tr>
                {expanded !== null && (
                  <tr className="border-b border-graphite-100 bg-graphite-50/60">
                    <td colSpan={columns.length} className="px-3 py-3">
                      {/* Stays in view when a wide table is scrolled sideways. */}
                      <div className="sticky left-3 w-fit max-w-[40rem]">{expanded}</div>
                    </td>
                  </tr>
                )}
              </Fragment>
            );
          })}
          {footer && visible.length === 0 && (
            <tr>
              <td colSpan={columns.length} className="p-6 text-center text-sm text-graphite-500">
                {rows.length === 0 ? (empty ?? 'Nothing here yet.') : 'No rows match the filters.'}
              </td>
            </tr>
          )}
          {footer}
        </tbody>
      </table>
      {!footer && visible.length === 0 && <div className="p-6 text-center text-sm text-graphite-500">{rows.length === 0 ? (empty ?? 'Nothing here yet.') : 'No rows match the filters.'}</div>}
    </div>
  );
}
