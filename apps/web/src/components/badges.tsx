import type { LucideIcon } from 'lucide-react';

export type Tone = 'neutral' | 'copper' | 'cell' | 'amber' | 'brick';

const TONES: Record<Tone, string> = {
  neutral: 'bg-graphite-100 text-graphite-700 ring-graphite-200',
  copper: 'bg-copper-50 text-copper-800 ring-copper-200',
  cell: 'bg-cell-50 text-cell-800 ring-cell-100',
  amber: 'bg-amber-50 text-amber-800 ring-amber-100',
  brick: 'bg-brick-50 text-brick-800 ring-brick-100',
};

/** A label with an icon: status and severity never rely on colour alone. */
export function Badge({ tone = 'neutral', icon: Icon, children, title }: { tone?: Tone; icon?: LucideIcon; children: React.ReactNode; title?: string }) {
  return (
    <span title={title} className={`inline-flex items-center gap-1 whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-medium ring-1 ring-inset ${TONES[tone]}`}>
      {Icon && <Icon className="size-3.5" aria-hidden />}
      {children}
    </span>
  );
}
