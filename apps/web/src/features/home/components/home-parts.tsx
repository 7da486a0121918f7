// Small pieces the home blocks share: a block card with its count and one action, a compact empty
// line, a teardown's name as a link into one of its sections, a finding line.
import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { ArrowRight } from 'lucide-react';
import { FINDING_KIND, type HomeFinding, type HomeTeardown } from '@splitcase/contracts';
import { SeverityBadge } from '@/components/status';
import { paths, type TeardownSection } from '@/config/paths';
import { formatDate } from '@/lib/format';

/** Whole days since a date, in words ("today", "yesterday", "12 days ago"). */
export function ago(iso: string | null | undefined, now = new Date()): string {
  if (!iso) return '—';
  const then = new Date(iso);
  if (Number.isNaN(then.getTime())) return '—';
  const day = (d: Date) => Date.UTC(d.getFullYear(), d.getMonth(), d.getDate());
  const days = Math.round((day(now) - day(then)) / 86_400_000);
  if (days <= 0) return 'today';
  if (days === 1) return 'yesterday';
  return `${days} days ago`;
}

export function ActionLink({ to, children }: { to: string; children: ReactNode }) {
  return (
    <Link to={to} className="inline-flex items-center gap-1 text-sm font-medium text-copper-700 hover:underline">
      {children}
      <ArrowRight className="size-3.5" aria-hidden />
    </Link>
  );
}

/** One home block: a titled card with an optional count, its rows, and one action in the header. */
export function Block({ id, title, icon, count, action, children }: { id: string; title: string; icon: ReactNode; count?: number; action?: ReactNode; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-title`} className="scroll-mt-6 rounded-lg border border-graphite-150 bg-white shadow-card" data-block={id}>
      <header className="flex items-center justify-between gap-3 border-b border-graphite-100 px-4 py-2.5">
        <h2 id={`${id}-title`} className="flex items-center gap-2 text-sm font-semibold text-graphite-900">
          <span className="text-graphite-400">{icon}</span>
          {title}
          {count !== undefined && count > 0 && <span className="num rounded-full bg-graphite-100 px-1.5 text-xs font-medium text-graphite-700">{count}</span>}
        </h2>
        {action}
      </header>
      {children}
    </section>
  );
}

/** An empty block: one sentence saying what to do next, and the one action. */
export function EmptyLine({ children, action }: { children: ReactNode; action?: ReactNode }) {
  return (
    <div className="flex flex-wrap items-center justify-between gap-x-4 gap-y-2 px-4 py-4 text-sm text-graphite-600">
      <p>{children}</p>
      {action}
    </div>
  );
}

/** "Maker Model · unit" linking into a section of the teardown. */
export function TeardownLink({ t, section = 'overview' }: { t: Pick<HomeTeardown, 'id' | 'device' | 'unitLabel'>; section?: TeardownSection }) {
  return (
    <Link to={paths.teardown(t.id, section)} className="font-medium text-graphite-950 hover:text-copper-700 hover:underline">
      {t.device.maker} {t.device.model}
      {t.unitLabel && <span className="font-normal text-graphite-500"> · {t.unitLabel}</span>}
    </Link>
  );
}

/** Compact table rows (about 32 px): the first column is the teardown. */
export function HomeTable({ head, children, label }: { head: ReactNode[]; children: ReactNode; label: string }) {
  return (
    <table className="w-full text-sm" aria-label={label}>
      <thead>
        <tr className="border-b border-graphite-100 text-left text-xs text-graphite-500">
          {head.map((h, i) => (
            <th key={i} scope="col" className={`px-4 py-1.5 font-medium ${i > 0 ? 'whitespace-nowrap' : ''}`}>
              {h}
            </th>
          ))}
        </tr>
      </thead>
      <tbody className="divide-y divide-graphite-100">{children}</tbody>
    </table>
  );
}

export const cell = 'px-4 py-1.5 align-middle';

/** A finding: severity (icon + label), kind, the text, and the teardown it belongs to. */
export function FindingLine({ f }: { f: HomeFinding }) {
  return (
    <li className="px-4 py-2.5" data-finding={f.id}>
      <div className="flex flex-wrap items-center gap-x-2 gap-y-1 text-xs text-graphite-500">
        <SeverityBadge severity={f.severity} />
        <span>{FINDING_KIND.labels[f.kind]}</span>
        <span aria-hidden>·</span>
        <Link to={paths.teardown(f.teardownId, 'findings')} className="font-medium text-graphite-700 hover:text-copper-700 hover:underline">
          {f.device.maker} {f.device.model}
        </Link>
        <span aria-hidden>·</span>
        <span title={formatDate(f.createdAt)}>{ago(f.createdAt)}</span>
      </div>
      <p className="mt-1 line-clamp-2 text-sm text-graphite-800">{f.text}</p>
    </li>
  );
}
