import { X } from 'lucide-react';
import { DEVICE_CATEGORY, FINDING_KIND, SEARCH_TYPE, SEVERITY, TEARDOWN_STATUS, type SearchState } from '@splitcase/contracts';
import { formatDate } from '@/lib/format';
import { changeSearch } from '@/lib/search-url';

type ListKey = 'type' | 'kind' | 'severity' | 'category' | 'maker' | 'tag' | 'status';
const LABELS: Record<ListKey, (v: string) => string> = {
  type: (v) => SEARCH_TYPE.labels[v as keyof typeof SEARCH_TYPE.labels] ?? v,
  kind: (v) => FINDING_KIND.labels[v as keyof typeof FINDING_KIND.labels] ?? v,
  severity: (v) => SEVERITY.labels[v as keyof typeof SEVERITY.labels] ?? v,
  category: (v) => DEVICE_CATEGORY.labels[v as keyof typeof DEVICE_CATEGORY.labels] ?? v,
  maker: (v) => v,
  tag: (v) => `#${v}`,
  status: (v) => TEARDOWN_STATUS.labels[v as keyof typeof TEARDOWN_STATUS.labels] ?? v,
};

/** The filters in force, each removable, and one action to clear the whole search. */
export function ActiveFilters({ state, deviceNames, onChange }: { state: SearchState; deviceNames: Map<number, string>; onChange: (next: SearchState) => void }) {
  const chips: { key: string; label: string; remove: Partial<SearchState> }[] = [];
  for (const k of Object.keys(LABELS) as ListKey[]) {
    for (const v of state[k] as string[]) chips.push({ key: `${k}:${v}`, label: LABELS[k](v), remove: { [k]: (state[k] as string[]).filter((x) => x !== v) } });
  }
  if (state.device.length) {
    const names = state.device.map((id) => deviceNames.get(id)).filter(Boolean);
    chips.push({
      key: 'device',
      label: names.length === state.device.length && names.length <= 3 ? names.join(', ') : `${state.device.length} chosen devices`,
      remove: { device: [] },
    });
  }
  if (state.from || state.to) {
    chips.push({
      key: 'date',
      label: state.from && state.to ? `${formatDate(state.from)} – ${formatDate(state.to)}` : state.from ? `From ${formatDate(state.from)}` : `Until ${formatDate(state.to)}`,
      remove: { from: null, to: null },
    });
  }
  if (chips.length === 0) return null;
  return (
    <div className="flex flex-wrap items-center gap-1.5" aria-label="Filters in force">
      {chips.map((c) => (
        <button
          key={c.key}
          type="button"
          onClick={() => onChange(changeSearch(state, c.remove))}
          className="inline-flex h-6 items-center gap-1 rounded-full bg-copper-50 pr-1.5 pl-2 text-xs text-copper-800 ring-1 ring-copper-200 ring-inset hover:bg-copper-100"
          aria-label={`Remove the filter ${c.label}`}
        >
          {c.label}
          <X className="size-3" aria-hidden />
        </button>
      ))}
      <button
        type="button"
        className="ml-1 text-xs text-graphite-600 hover:text-graphite-950 hover:underline"
        onClick={() => onChange({ ...changeSearch(state, { type: [], kind: [], severity: [], category: [], maker: [], tag: [], status: [], device: [], from: null, to: null }) })}
      >
        Clear filters
      </button>
    </div>
  );
}
