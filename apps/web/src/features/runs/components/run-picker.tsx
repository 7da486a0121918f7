import { useState } from 'react';
import { Search } from 'lucide-react';
import { RUN_KIND, type RunDto, type RunKind } from '@splitcase/contracts';
import { ErrorPanel } from '@/components/error-boundary';
import { Input, Select } from '@/components/field';
import { Spinner } from '@/components/page';
import { useAllRuns } from '../api/all-runs';
import { LabelVerdict, runHeadline } from './run-table';
import { formatElapsed } from './time-format';

export const MAX_OVERLAY = 4;

/** Pick runs to overlay, across the teardowns the user may read (same kind by default). */
export function RunPicker({
  kind: initialKind,
  fixed,
  selected,
  onChange,
}: {
  kind: RunKind | '';
  /** Runs already in the chart that the picker does not offer (e.g. the run being viewed). */
  fixed: RunDto[];
  selected: RunDto[];
  onChange: (runs: RunDto[]) => void;
}) {
  const [kind, setKind] = useState<RunKind | ''>(initialKind);
  const [q, setQ] = useState('');
  const list = useAllRuns({ kind: kind || undefined, q: q.trim() || undefined });
  const room = MAX_OVERLAY - fixed.length;
  const chosen = new Set(selected.map((r) => r.id));
  const fixedIds = new Set(fixed.map((r) => r.id));
  const toggle = (run: RunDto) => onChange(chosen.has(run.id) ? selected.filter((r) => r.id !== run.id) : [...selected, run]);

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-end gap-2">
        <label className="min-w-56 flex-1 space-y-0.5 text-xs">
          <span className="block text-graphite-500">Device, unit or run label</span>
          <span className="relative block">
            <Search className="pointer-events-none absolute left-2.5 top-2.5 size-4 text-graphite-400" aria-hidden />
            <Input className="pl-8" value={q} onChange={(e) => setQ(e.target.value)} placeholder="e.g. Stackcell" />
          </span>
        </label>
        <label className="space-y-0.5 text-xs">
          <span className="block text-graphite-500">Kind</span>
          <Select value={kind} onChange={(e) => setKind(e.target.value as RunKind | '')}>
            <option value="">Any kind</option>
            {RUN_KIND.values.map((k) => (
              <option key={k} value={k}>
                {RUN_KIND.labels[k]}
              </option>
            ))}
          </Select>
        </label>
        <p className="pb-2 text-xs text-graphite-500">
          {selected.length + fixed.length} of {MAX_OVERLAY} in the chart
        </p>
      </div>
      {list.isError && <ErrorPanel error={list.error} onRetry={() => list.refetch()} />}
      {list.isPending ? (
        <Spinner label="Finding runs…" />
      ) : (
        <ul className="max-h-60 divide-y divide-graphite-100 overflow-auto rounded-md border border-graphite-150 bg-white text-sm" aria-label="Runs to overlay">
          {(list.data ?? [])
            .filter((r) => !fixedIds.has(r.id))
            .map((r) => {
              const on = chosen.has(r.id);
              const full = !on && selected.length >= room;
              return (
                <li key={r.id}>
                  <label className={`flex items-center gap-3 px-3 py-1.5 ${full ? 'cursor-not-allowed text-graphite-400' : 'cursor-pointer hover:bg-copper-50/60'}`}>
                    <input type="checkbox" className="size-4 accent-copper-600" checked={on} disabled={full} onChange={() => toggle(r)} />
                    <span className="min-w-0 flex-1">
                      <span className="font-medium">
                        {r.device.maker} {r.device.model}
                      </span>
                      {r.unitLabel && <span className="text-graphite-500"> · {r.unitLabel}</span>}
                      {r.teardownStatus !== 'published' && <span className="ml-1.5 text-xs text-graphite-500">({r.teardownStatus === 'in_review' ? 'in review' : 'draft'})</span>}
                      <span className="block truncate text-xs text-graphite-500">
                        {RUN_KIND.labels[r.kind]} · {r.label}
                      </span>
                    </span>
                    <span className="hidden sm:block">
                      <LabelVerdict run={r} />
                    </span>
                    <span className="num hidden text-right text-xs text-graphite-600 sm:block">
                      {runHeadline(r)}
                      <span className="block text-graphite-500">{formatElapsed(r.durationS)}</span>
                    </span>
                  </label>
                </li>
              );
            })}
          {list.data && list.data.filter((r) => !fixedIds.has(r.id)).length === 0 && <li className="px-3 py-4 text-center text-graphite-500">No other runs match.</li>}
        </ul>
      )}
    </div>
  );
}
