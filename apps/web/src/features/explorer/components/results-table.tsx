import { Link } from 'react-router';
import { ArrowDown, ArrowUp, ArrowUpDown, Box, FileText, MessageSquare, SearchCheck } from 'lucide-react';
import { DEVICE_CATEGORY, FINDING_KIND, SEARCH_SORT_DIR, SEARCH_TYPE, type SearchItem, type SearchSort, type SortDir } from '@splitcase/contracts';
import { SeverityBadge, StatusBadge } from '@/components/status';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/format';
import { Snippet } from './snippet';

const TYPE_ICON = { finding: SearchCheck, part: Box, teardown: FileText, comment: MessageSquare } as const;

interface ColumnSpec {
  id: string;
  header: string;
  sort?: SearchSort;
  className?: string;
}

const COLUMNS: ColumnSpec[] = [
  { id: 'type', header: 'Type', sort: 'type', className: 'w-24' },
  { id: 'title', header: 'Hit', sort: 'title' },
  { id: 'device', header: 'Device', sort: 'device', className: 'w-36' },
  { id: 'severity', header: 'Severity', sort: 'severity', className: 'w-[6.5rem]' },
  { id: 'kind', header: 'Kind', sort: 'kind', className: 'w-32' },
  { id: 'status', header: 'Teardown', sort: 'status', className: 'w-44' },
];

/** Shorter type names for the narrow first column. */
const TYPE_SHORT = { finding: 'Finding', part: 'Part', teardown: 'Summary', comment: 'Comment' } as const;

/** Where a hit lives in its teardown: the section that holds it. */
export const hitHref = (item: SearchItem) => paths.teardown(item.teardownId, item.section);

/**
 * The results, sorted on the server (the sort applies to every page, not just this one): a click
 * on a column header sorts by it, a second click reverses.
 */
export function ResultsTable({ items, sort, dir, onSort, busy }: { items: SearchItem[]; sort: SearchSort; dir: SortDir; onSort: (sort: SearchSort, dir: SortDir) => void; busy: boolean }) {
  return (
    <div className={`overflow-auto rounded-lg border border-graphite-150 bg-white transition-opacity ${busy ? 'opacity-60' : ''}`} style={{ maxHeight: 'calc(100vh - 13rem)' }} aria-busy={busy}>
      <table className="w-full min-w-[52rem] table-fixed border-collapse text-sm">
        <caption className="sr-only">Search results</caption>
        <thead className="sticky top-0 z-10 bg-graphite-50">
          <tr>
            {COLUMNS.map((c) => {
              const active = c.sort === sort;
              return (
                <th
                  key={c.id}
                  scope="col"
                  aria-sort={active || (c.id === 'status' && sort === 'date') ? (dir === 'asc' ? 'ascending' : 'descending') : 'none'}
                  className={`h-8 border-b border-graphite-150 px-3 text-left text-xs font-semibold tracking-wide whitespace-nowrap text-graphite-600 uppercase ${c.className ?? ''}`}
                >
                  {c.id === 'status' ? (
                    <span className="inline-flex items-center gap-2">
                      <SortButton
                        label="Teardown"
                        active={sort === 'status'}
                        dir={dir}
                        onClick={() => onSort('status', sort === 'status' ? (dir === 'asc' ? 'desc' : 'asc') : SEARCH_SORT_DIR.status)}
                      />
                      <SortButton label="Date" active={sort === 'date'} dir={dir} onClick={() => onSort('date', sort === 'date' ? (dir === 'asc' ? 'desc' : 'asc') : SEARCH_SORT_DIR.date)} />
                    </span>
                  ) : c.sort ? (
                    <button
                      type="button"
                      className={`inline-flex items-center gap-1 uppercase hover:text-graphite-950 ${active ? 'text-graphite-950' : ''}`}
                      onClick={() => onSort(c.sort!, active ? (dir === 'asc' ? 'desc' : 'asc') : SEARCH_SORT_DIR[c.sort!])}
                    >
                      {c.header}
                      {active ? dir === 'asc' ? <ArrowUp className="size-3" aria-hidden /> : <ArrowDown className="size-3" aria-hidden /> : <ArrowUpDown className="size-3 opacity-30" aria-hidden />}
                    </button>
                  ) : (
                    c.header
                  )}
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {items.map((item) => {
            const Icon = TYPE_ICON[item.type];
            return (
              <tr key={`${item.type}:${item.id}`} className="border-b border-graphite-100 align-top last:border-0 hover:bg-copper-50/40">
                <td className="px-3 py-2 whitespace-nowrap text-graphite-600">
                  <span className="inline-flex items-center gap-1.5">
                    <Icon className="size-3.5 text-graphite-400" aria-hidden />
                    <span title={SEARCH_TYPE.labels[item.type]}>{TYPE_SHORT[item.type]}</span>
                  </span>
                </td>
                <td className="px-3 py-2">
                  <Link to={hitHref(item)} className="font-medium text-graphite-950 hover:text-copper-700 hover:underline">
                    {item.title}
                  </Link>
                  <p className="mt-0.5 line-clamp-2 text-xs leading-5 text-graphite-600">
                    <Snippet text={item.snippet} />
                  </p>
                  {item.tags.length > 0 && (
                    <p className="mt-1 flex flex-wrap gap-1">
                      {item.tags.map((tag) => (
                        <span key={tag} className="rounded bg-graphite-100 px-1.5 py-px text-[11px] text-graphite-600">
                          {tag}
                        </span>
                      ))}
                    </p>
                  )}
                </td>
                <td className="px-3 py-2">
                  <Link to={paths.device(item.deviceId)} className="text-graphite-900 hover:text-copper-700 hover:underline">
                    {item.device.maker} {item.device.model}
                  </Link>
                  <div className="text-xs text-graphite-500">{DEVICE_CATEGORY.labels[item.device.category]}</div>
                </td>
                <td className="px-3 py-2">{item.severity ? <SeverityBadge severity={item.severity} /> : <span className="text-graphite-400">—</span>}</td>
                <td className="px-3 py-2 text-graphite-700">{item.kind ? FINDING_KIND.labels[item.kind] : <span className="text-graphite-400">—</span>}</td>
                <td className="px-3 py-2">
                  <StatusBadge status={item.teardown.status} />
                  <div className="num mt-1 text-xs whitespace-nowrap text-graphite-500">{formatDate(item.teardown.date)}</div>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

function SortButton({ label, active, dir, onClick }: { label: string; active: boolean; dir: SortDir; onClick: () => void }) {
  return (
    <button type="button" className={`inline-flex items-center gap-1 uppercase hover:text-graphite-950 ${active ? 'text-graphite-950' : ''}`} onClick={onClick}>
      {label}
      {active ? dir === 'asc' ? <ArrowUp className="size-3" aria-hidden /> : <ArrowDown className="size-3" aria-hidden /> : <ArrowUpDown className="size-3 opacity-30" aria-hidden />}
    </button>
  );
}
