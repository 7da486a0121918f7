import { ChevronLeft, ChevronRight } from 'lucide-react';
import { Button } from '@/components/button';

/** "51–100 of 123" with the previous and next pages. */
export function Pager({ page, pageSize, total, onPage }: { page: number; pageSize: number; total: number; onPage: (page: number) => void }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  if (total <= pageSize && page === 1) return null;
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Pages of results" className="flex items-center justify-end gap-2 text-sm text-graphite-600">
      <span className="num">
        {first}–{last} of {total}
      </span>
      <Button size="sm" variant="ghost" disabled={page <= 1} onClick={() => onPage(page - 1)} aria-label="Previous page">
        <ChevronLeft className="size-4" aria-hidden />
      </Button>
      <span className="num">
        Page {Math.min(page, pages)} of {pages}
      </span>
      <Button size="sm" variant="ghost" disabled={page >= pages} onClick={() => onPage(page + 1)} aria-label="Next page">
        <ChevronRight className="size-4" aria-hidden />
      </Button>
    </nav>
  );
}
