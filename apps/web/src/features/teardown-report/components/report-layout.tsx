// The building blocks of the printable report: numbered sections whose heading stays with what
// follows it, compact tables whose rows never split across pages, and a line for "none recorded".
import type { ReactNode } from 'react';

/** A numbered report section. The heading is kept with the first block after it in print. */
export function ReportSection({ id, number, title, aside, children }: { id: string; number: number; title: string; aside?: ReactNode; children: ReactNode }) {
  return (
    <section aria-labelledby={`report-${id}`} data-section={id} className="mt-7 first:mt-0 print:mt-6">
      <header className="mb-2.5 flex items-baseline justify-between gap-3 border-b-2 border-graphite-950 pb-1 break-after-avoid">
        <h2 id={`report-${id}`} className="text-base font-semibold tracking-tight text-graphite-950">
          <span className="num mr-2 text-copper-700">{number}</span>
          {title}
        </h2>
        {aside && <div className="text-xs text-graphite-500">{aside}</div>}
      </header>
      {children}
    </section>
  );
}

/** A sub-heading inside a section (kept with what follows). */
export function ReportSubheading({ children }: { children: ReactNode }) {
  return <h3 className="mb-1.5 mt-4 text-xs font-semibold uppercase tracking-wider text-graphite-600 break-after-avoid">{children}</h3>;
}

export function NoneRecorded({ children = 'None recorded.' }: { children?: ReactNode }) {
  return <p className="text-sm italic text-graphite-500">{children}</p>;
}

/** A data table for print: 9–10 pt text, a repeated header on each page, rows kept whole. `keep` keeps the whole table on one page. */
export function ReportTable({ label, head, children, keep = false, className = '' }: { label: string; head: ReactNode[]; children: ReactNode; keep?: boolean; className?: string }) {
  return (
    <table className={`w-full border-collapse text-xs ${keep ? 'break-inside-avoid' : ''} ${className}`} aria-label={label}>
      <thead>
        <tr className="border-b border-graphite-300 text-left align-bottom text-2xs uppercase tracking-wide text-graphite-500">
          {head.map((h, i) => (
            <th key={i} scope="col" className="px-1.5 py-1 font-semibold first:pl-0 last:pr-0">
              {h}
            </th>
          ))}
        </tr>
      </thead>
      <tbody className="[&>tr]:break-inside-avoid [&>tr]:border-b [&>tr]:border-graphite-150 [&_td]:px-1.5 [&_td]:py-1 [&_td]:align-top [&_td:first-child]:pl-0 [&_td:last-child]:pr-0">
        {children}
      </tbody>
    </table>
  );
}

/** Label → value pairs in a compact grid (kept on one page). */
export function Facts({ items, columns = 4 }: { items: { label: string; value: ReactNode }[]; columns?: 2 | 3 | 4 }) {
  const cols = columns === 2 ? 'grid-cols-2' : columns === 3 ? 'grid-cols-3' : 'grid-cols-4';
  return (
    <dl className={`grid ${cols} gap-x-4 gap-y-2 break-inside-avoid`}>
      {items.map((i) => (
        <div key={i.label} className="min-w-0">
          <dt className="text-2xs uppercase tracking-wide text-graphite-500">{i.label}</dt>
          <dd className="text-sm text-graphite-950">{i.value}</dd>
        </div>
      ))}
    </dl>
  );
}

/** A section whose data could not be loaded: says so instead of printing a blank. */
export function SectionError({ what, error }: { what: string; error: Error }) {
  return (
    <p className="rounded border border-brick-100 bg-brick-50 px-2 py-1.5 text-sm text-brick-800" role="alert">
      The {what} could not be loaded: {error.message}
    </p>
  );
}

/** Elapsed time of a run: "4 h 51 min", "12 min 30 s", "45.0 s". */
export function duration(seconds: number | null | undefined): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return '—';
  const s = Math.round(Math.abs(seconds));
  if (Math.abs(seconds) < 59.95) return `${Number(Math.abs(seconds).toPrecision(3))} s`;
  if (s < 3600) {
    const m = Math.floor(s / 60);
    const rest = s - m * 60;
    return rest ? `${m} min ${rest} s` : `${m} min`;
  }
  const h = Math.floor(s / 3600);
  const m = Math.round((s - h * 3600) / 60);
  return m === 60 ? `${h + 1} h` : m ? `${h} h ${m} min` : `${h} h`;
}
