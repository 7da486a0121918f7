import { TriangleAlert } from 'lucide-react';
import type { ReactNode } from 'react';

/** A calm, specific safety note placed where the risk is. */
export function Caution({ title, children }: { title: string; children: ReactNode }) {
  return (
    <aside className="flex gap-3 rounded-md border border-amber-100 bg-amber-50 px-3 py-2.5 text-sm text-amber-800" role="note" aria-label={title}>
      <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden />
      <div>
        <p className="font-medium">{title}</p>
        <div className="mt-0.5 text-amber-800/90">{children}</div>
      </div>
    </aside>
  );
}
