import { useId, useState } from 'react';
import { DEVICE_CATEGORY, FINDING_KIND, SEARCH_TYPE, SEVERITY, TEARDOWN_STATUS, type SearchFacets, type SearchResponse, type SearchState } from '@splitcase/contracts';
import { changeSearch, toggleValue } from '@/lib/search-url';

type ListFacet = 'type' | 'kind' | 'severity' | 'category' | 'maker' | 'tag' | 'status';

interface FacetSpec {
  facet: ListFacet;
  title: string;
  /** Fixed values in display order with labels (enums); dynamic facets list what the counts hold. */
  values?: readonly string[];
  labels?: Record<string, string>;
  /** Finding-only facets say so. */
  hint?: string;
  /** Show this many values before "Show all". */
  fold?: number;
}

const SPECS: FacetSpec[] = [
  { facet: 'type', title: 'Type', values: SEARCH_TYPE.values, labels: SEARCH_TYPE.labels },
  { facet: 'severity', title: 'Severity', values: [...SEVERITY.values].reverse(), labels: SEVERITY.labels, hint: 'findings' },
  { facet: 'kind', title: 'Kind', values: FINDING_KIND.values, labels: FINDING_KIND.labels, hint: 'findings' },
  { facet: 'category', title: 'Device category', values: DEVICE_CATEGORY.values, labels: DEVICE_CATEGORY.labels },
  { facet: 'maker', title: 'Maker', fold: 8 },
  { facet: 'tag', title: 'Tag', hint: 'findings', fold: 10 },
  { facet: 'status', title: 'Teardown status', values: TEARDOWN_STATUS.values, labels: TEARDOWN_STATUS.labels },
];

const monthLabel = (ym: string) => {
  const [y, m] = ym.split('-').map(Number);
  return new Date(Date.UTC(y!, m! - 1, 1)).toLocaleDateString('en-GB', { month: 'short', year: 'numeric', timeZone: 'UTC' });
};
const monthEnd = (ym: string) => {
  const [y, m] = ym.split('-').map(Number);
  return `${ym}-${String(new Date(Date.UTC(y!, m!, 0)).getUTCDate()).padStart(2, '0')}`;
};

/**
 * Facets with counts over the current results. Values of one facet are alternatives; facets narrow
 * each other and the words. Each facet's counts leave its own choice out, so they read as "how many
 * hits this value would bring".
 */
export function FacetPanel({ state, data, onChange }: { state: SearchState; data: SearchResponse | undefined; onChange: (next: SearchState) => void }) {
  const facets: SearchFacets | undefined = data?.facets;
  return (
    <div className="space-y-5" aria-label="Facets" role="group">
      {SPECS.map((spec) => (
        <FacetList key={spec.facet} spec={spec} counts={facets?.[spec.facet] ?? {}} state={state} effectiveTypes={data?.types ?? []} onChange={onChange} />
      ))}
      <DateFacet state={state} months={facets?.month ?? {}} onChange={onChange} />
    </div>
  );
}

function FacetList({
  spec,
  counts,
  state,
  effectiveTypes,
  onChange,
}: {
  spec: FacetSpec;
  counts: Record<string, number>;
  state: SearchState;
  effectiveTypes: string[];
  onChange: (next: SearchState) => void;
}) {
  const [open, setOpen] = useState(false);
  const headingId = useId();
  const chosen: string[] = state[spec.facet];
  // Browse mode lists findings when no type is chosen: show that as the choice.
  const shownChosen = spec.facet === 'type' && chosen.length === 0 ? effectiveTypes : chosen;
  const values = spec.values ? [...spec.values] : Object.keys(counts).sort((a, b) => (counts[b] ?? 0) - (counts[a] ?? 0) || a.localeCompare(b, 'en', { sensitivity: 'base' }));
  const folded = spec.fold && !open ? values.filter((v, i) => i < spec.fold! || chosen.includes(v)) : values;
  const toggle = (v: string) => {
    const base = spec.facet === 'type' && chosen.length === 0 ? effectiveTypes : chosen;
    onChange(changeSearch(state, { [spec.facet]: toggleValue(base, v) } as Partial<SearchState>));
  };
  return (
    <section aria-labelledby={headingId}>
      <div className="mb-1.5 flex items-baseline justify-between gap-2">
        <h3 id={headingId} className="text-xs font-semibold tracking-wide text-graphite-600 uppercase">
          {spec.title}
          {spec.hint && <span className="ml-1 font-normal tracking-normal text-graphite-400 normal-case">({spec.hint})</span>}
        </h3>
        {chosen.length > 0 && (
          <button type="button" className="text-xs text-copper-700 hover:underline" onClick={() => onChange(changeSearch(state, { [spec.facet]: [] } as Partial<SearchState>))}>
            Any
          </button>
        )}
      </div>
      {values.length === 0 ? (
        <p className="text-xs text-graphite-400">None in these results.</p>
      ) : (
        <ul className="space-y-px">
          {folded.map((v) => {
            const n = counts[v] ?? 0;
            const checked = shownChosen.includes(v);
            const idle = n === 0 && !checked;
            return (
              <li key={v}>
                <label
                  className={`flex h-7 cursor-pointer items-center gap-2 rounded px-1.5 text-sm ${checked ? 'bg-copper-50 text-graphite-950' : idle ? 'text-graphite-400' : 'text-graphite-800 hover:bg-graphite-100'}`}
                >
                  <input type="checkbox" className="size-3.5 accent-copper-600" checked={checked} disabled={idle} onChange={() => toggle(v)} />
                  <span className="min-w-0 flex-1 truncate" title={spec.labels?.[v] ?? v}>
                    {spec.labels?.[v] ?? v}
                  </span>
                  <span className="num text-xs text-graphite-500">{n}</span>
                </label>
              </li>
            );
          })}
        </ul>
      )}
      {spec.fold && values.length > spec.fold && (
        <button type="button" className="mt-1 px-1.5 text-xs text-copper-700 hover:underline" onClick={() => setOpen(!open)} aria-expanded={open}>
          {open ? 'Show fewer' : `Show all ${values.length}`}
        </button>
      )}
    </section>
  );
}

function DateFacet({ state, months, onChange }: { state: SearchState; months: Record<string, number>; onChange: (next: SearchState) => void }) {
  const headingId = useId();
  const list = Object.keys(months).sort().reverse();
  const max = Math.max(1, ...Object.values(months));
  const invalid = Boolean(state.from && state.to && state.from > state.to);
  const set = (patch: Partial<SearchState>) => onChange(changeSearch(state, patch));
  return (
    <section aria-labelledby={headingId}>
      <div className="mb-1.5 flex items-baseline justify-between gap-2">
        <h3 id={headingId} className="text-xs font-semibold tracking-wide text-graphite-600 uppercase">
          Teardown date
        </h3>
        {(state.from || state.to) && (
          <button type="button" className="text-xs text-copper-700 hover:underline" onClick={() => set({ from: null, to: null })}>
            Any
          </button>
        )}
      </div>
      <div className="grid grid-cols-2 gap-2">
        <label className="text-xs text-graphite-600">
          From
          <input
            type="date"
            value={state.from ?? ''}
            onChange={(e) => set({ from: e.target.value || null })}
            className="mt-0.5 block h-8 w-full rounded border border-graphite-200 bg-white px-1.5 text-xs focus:border-copper-500 focus:outline-none"
          />
        </label>
        <label className="text-xs text-graphite-600">
          To
          <input
            type="date"
            value={state.to ?? ''}
            aria-invalid={invalid}
            onChange={(e) => set({ to: e.target.value || null })}
            className="mt-0.5 block h-8 w-full rounded border border-graphite-200 bg-white px-1.5 text-xs focus:border-copper-500 focus:outline-none aria-[invalid=true]:border-brick-600"
          />
        </label>
      </div>
      {invalid && (
        <p className="mt-1 text-xs text-brick-700" role="alert">
          The end date is before the start date.
        </p>
      )}
      {list.length > 0 && (
        <ul className="mt-2 space-y-px" aria-label="Hits by month of the teardown date">
          {list.map((ym) => {
            const active = state.from === `${ym}-01` && state.to === monthEnd(ym);
            return (
              <li key={ym}>
                <button
                  type="button"
                  onClick={() => set(active ? { from: null, to: null } : { from: `${ym}-01`, to: monthEnd(ym) })}
                  aria-pressed={active}
                  className={`flex h-6 w-full items-center gap-2 rounded px-1.5 text-xs ${active ? 'bg-copper-50 text-graphite-950' : 'text-graphite-700 hover:bg-graphite-100'}`}
                >
                  <span className="w-16 shrink-0 text-left">{monthLabel(ym)}</span>
                  <span className="h-1.5 flex-1 overflow-hidden rounded-full bg-graphite-100" aria-hidden>
                    <span className="block h-full rounded-full bg-copper-400" style={{ width: `${(100 * (months[ym] ?? 0)) / max}%` }} />
                  </span>
                  <span className="num w-6 text-right text-graphite-500">{months[ym]}</span>
                </button>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
