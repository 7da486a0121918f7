// Shown when a save comes back 409 stale_version: what changed, field by field (theirs vs yours),
// with the choice to put your edit on top of the current version or to take theirs. Nothing is lost.
import { GitCompareArrows } from 'lucide-react';
import { Button } from './button';

export interface ConflictField {
  key: string;
  label: string;
  /** Values as shown to people ('' for empty). */
  base: string;
  theirs: string;
  yours: string;
}

/** Fields someone else changed, or that you changed, with both sides. */
export function conflictFields<T extends Record<string, unknown>>(
  labels: Record<string, string>,
  base: T,
  theirs: T,
  yours: T,
  show: (key: string, v: unknown) => string = (_k, v) => (v === null || v === undefined ? '' : String(v)),
): ConflictField[] {
  return Object.entries(labels)
    .map(([key, label]) => ({ key, label, base: show(key, base[key]), theirs: show(key, theirs[key]), yours: show(key, yours[key]) }))
    .filter((f) => f.theirs !== f.base || f.yours !== f.base);
}

export function VersionConflict({
  fields,
  who,
  onReapply,
  onTakeTheirs,
  busy,
}: {
  fields: ConflictField[];
  /** Who saved in between, and when, if known. */
  who?: string;
  onReapply: () => void;
  onTakeTheirs: () => void;
  busy?: boolean;
}) {
  return (
    <section role="alert" aria-label="Changed by someone else" className="rounded-lg border border-amber-100 bg-amber-50 p-4 text-sm text-amber-800">
      <div className="flex items-start gap-2">
        <GitCompareArrows className="mt-0.5 size-4 shrink-0" aria-hidden />
        <div className="min-w-0 flex-1">
          <p className="font-medium">Someone saved this teardown after you opened it{who ? ` (${who})` : ''}.</p>
          <p className="mt-0.5 text-amber-800/90">Your edit is not saved yet. Compare, then re-apply yours on top of the current version or keep theirs.</p>
          <table className="mt-3 w-full table-fixed border-collapse overflow-hidden rounded bg-white text-left text-graphite-900 ring-1 ring-amber-100">
            <thead className="bg-graphite-50 text-xs uppercase tracking-wide text-graphite-600">
              <tr>
                <th scope="col" className="w-40 px-2 py-1.5">
                  Field
                </th>
                <th scope="col" className="px-2 py-1.5">
                  Theirs (saved now)
                </th>
                <th scope="col" className="px-2 py-1.5">
                  Yours
                </th>
              </tr>
            </thead>
            <tbody>
              {fields.map((f) => (
                <tr key={f.key} className="border-t border-graphite-100 align-top" data-field={f.key}>
                  <th scope="row" className="px-2 py-1.5 text-xs font-medium text-graphite-700">
                    {f.label}
                    <span className="block font-normal text-graphite-500">{f.theirs !== f.base && f.yours !== f.base ? 'both changed' : f.theirs !== f.base ? 'they changed' : 'you changed'}</span>
                  </th>
                  <td className={`whitespace-pre-wrap px-2 py-1.5 ${f.theirs !== f.base ? 'bg-amber-50/60' : 'text-graphite-500'}`}>{f.theirs || <em className="text-graphite-400">empty</em>}</td>
                  <td className={`whitespace-pre-wrap px-2 py-1.5 ${f.yours !== f.base ? 'bg-copper-50' : 'text-graphite-500'}`}>{f.yours || <em className="text-graphite-400">empty</em>}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <div className="mt-3 flex flex-wrap gap-2">
            <Button variant="primary" size="sm" onClick={onReapply} busy={busy}>
              Re-apply my changes on top
            </Button>
            <Button size="sm" onClick={onTakeTheirs} disabled={busy}>
              Discard mine, keep theirs
            </Button>
          </div>
        </div>
      </div>
    </section>
  );
}
