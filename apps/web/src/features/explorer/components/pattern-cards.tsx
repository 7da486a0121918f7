import { Link } from 'react-router';
import { Info, ShieldAlert } from 'lucide-react';
import type { Pattern } from '@splitcase/contracts';
import { paths } from '@/config/paths';
import { searchHref } from '@/lib/search-url';

/**
 * Pattern counts across devices, each with the devices behind it (links to their pages) and a link
 * that narrows the explorer to those devices.
 */
export function PatternCards({ patterns }: { patterns: Pattern[] }) {
  return (
    <ul className="grid gap-3 sm:grid-cols-2 xl:grid-cols-4" aria-label="Patterns across devices">
      {patterns.map((p) => (
        <li key={p.key} className="flex flex-col rounded-lg border border-graphite-150 bg-white px-3 pt-2.5 pb-2 shadow-card" data-pattern={p.key}>
          <div className="flex items-center gap-2">
            <span className={`num text-xl font-semibold ${p.count > 0 ? (p.safety ? 'text-amber-800' : 'text-graphite-950') : 'text-graphite-400'}`}>{p.count}</span>
            <span className="num text-xs text-graphite-500">of {p.of}</span>
            {p.of > 0 && (
              <span className="h-1.5 flex-1 overflow-hidden rounded-full bg-graphite-100" aria-hidden>
                <span className={`block h-full rounded-full ${p.safety ? 'bg-amber-600' : 'bg-cell-600'}`} style={{ width: `${(100 * p.count) / p.of}%` }} />
              </span>
            )}
            {p.safety && (
              <span className="inline-flex shrink-0 items-center gap-0.5 text-[11px] font-medium text-amber-800">
                <ShieldAlert className="size-3.5" aria-hidden />
                Safety
              </span>
            )}
          </div>
          <h3 className="mt-1 text-sm leading-snug text-graphite-900">{p.of === 0 ? `${p.title}: no device has the data to judge this yet.` : p.label}</h3>
          {p.devices.length > 0 && (
            <ul className="mt-1.5 flex flex-wrap gap-1" aria-label={`Devices behind “${p.label}”`}>
              {p.devices.map((d) => (
                <li key={d.id}>
                  <Link to={paths.device(d.id)} className="inline-block rounded bg-graphite-100 px-1.5 py-0.5 text-xs text-graphite-800 hover:bg-copper-50 hover:text-copper-800">
                    {d.maker} {d.model}
                  </Link>
                </li>
              ))}
            </ul>
          )}
          <div className="mt-auto flex items-center justify-between gap-2 pt-1.5">
            <details className="group text-xs text-graphite-500">
              <summary className="inline-flex cursor-pointer list-none items-center gap-1 select-none hover:text-graphite-700">
                <Info className="size-3.5" aria-hidden />
                How it is judged
              </summary>
              <p className="mt-1">{p.basis}</p>
            </details>
            {p.devices.length > 0 && (
              <Link to={searchHref({ device: p.deviceIds })} className="shrink-0 self-start text-xs font-medium text-copper-700 hover:underline">
                Their findings →
              </Link>
            )}
          </div>
        </li>
      ))}
    </ul>
  );
}
