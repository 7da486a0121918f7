import { useState } from 'react';
import { Link } from 'react-router';
import { toast } from 'sonner';
import { Check, ChevronDown, ChevronRight, Gauge, RotateCcw, Sparkles, TriangleAlert, X } from 'lucide-react';
import { FINDING_KIND, type FigureDto, type SuggestionDto } from '@splitcase/contracts';
import { Badge } from '@/components/badges';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Spinner } from '@/components/page';
import { EstimatesNote, HotSurfaceNote } from '@/components/safety';
import { SeverityBadge } from '@/components/status';
import { paths } from '@/config/paths';
import { figureId, figureInputValue as inputValue, figureValue, groupFigures } from '@/lib/figure-values';
import { mutationErrorMessage } from '@/lib/unpublish-confirm';
import { useAcceptSuggestion } from '../api/accept-suggestion';
import { useDismissSuggestion } from '../api/dismiss-suggestion';
import { useFigures } from '../api/get-figures';
import { useReopenSuggestion } from '../api/reopen-suggestion';

/** Units shown as figures of energy and power (cell teal, LOOK.md). */
const ENERGY_UNITS = new Set(['W', 'Wh', 'Ah', 'h', 'Wh/kg', 'A', 'W/cm²']);

function FigureRow({ f, showCaution }: { f: FigureDto; showCaution: boolean }) {
  const [open, setOpen] = useState(false);
  const id = `figure-${figureId(f).replace(/[^a-z0-9]+/gi, '-')}`;
  return (
    <li className="border-b border-graphite-100 last:border-0" data-figure={f.key} data-mode={f.modeId ?? undefined}>
      <button type="button" onClick={() => setOpen(!open)} aria-expanded={open} aria-controls={id} className="flex w-full items-start gap-2 px-3 py-2 text-left hover:bg-graphite-50">
        {open ? <ChevronDown className="mt-0.5 size-3.5 shrink-0 text-graphite-400" aria-hidden /> : <ChevronRight className="mt-0.5 size-3.5 shrink-0 text-graphite-400" aria-hidden />}
        <span className="min-w-0 flex-1 text-xs leading-5 text-graphite-600">{f.label}</span>
        <span className={`num shrink-0 text-sm font-semibold ${f.implausible ? 'text-brick-700' : ENERGY_UNITS.has(f.unit) ? 'text-cell-700' : 'text-graphite-900'}`} data-testid="figure-value">
          {figureValue(f.value, f.unit)}
        </span>
        {f.implausible && (
          <span className="shrink-0 rounded bg-brick-50 px-1 text-2xs font-semibold uppercase text-brick-700" title="Outside what the physics or the chemistry allows: check the inputs">
            Implausible
          </span>
        )}
        {f.warnings.length > 0 && <TriangleAlert className="mt-0.5 size-3.5 shrink-0 text-amber-600" aria-label={`${f.warnings.length} warning${f.warnings.length === 1 ? '' : 's'}`} />}
      </button>
      {f.caution && showCaution && (
        <div className="px-3 pb-2">
          <HotSurfaceNote text={f.caution} />
        </div>
      )}
      {open && (
        <div id={id} className="space-y-2 bg-graphite-50/70 px-3 pb-3 pt-1 text-xs">
          <div>
            <p className="font-medium text-graphite-700">Formula</p>
            <p className="font-mono text-graphite-900">{f.formula}</p>
          </div>
          {f.inputs.length > 0 && (
            <div>
              <p className="font-medium text-graphite-700">Inputs</p>
              <table className="w-full">
                <tbody>
                  {f.inputs.map((i, n) => (
                    <tr key={`${i.label}-${n}`} className="align-top">
                      <td className="py-0.5 pr-2 text-graphite-600">{i.label}</td>
                      <td className="num py-0.5 text-right text-graphite-900">{inputValue(i)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
          {f.assumptions.length > 0 && (
            <div>
              <p className="font-medium text-graphite-700">Assumptions</p>
              <ul className="list-disc space-y-0.5 pl-4 text-graphite-700">
                {f.assumptions.map((a) => (
                  <li key={a}>{a}</li>
                ))}
              </ul>
            </div>
          )}
          {f.warnings.length > 0 && (
            <div className="rounded border border-amber-100 bg-amber-50 px-2 py-1.5 text-amber-800">
              <p className="font-medium">Warnings</p>
              <ul className="list-disc space-y-0.5 pl-4">
                {f.warnings.map((w) => (
                  <li key={w}>{w}</li>
                ))}
              </ul>
            </div>
          )}
          <p className="text-graphite-500">
            <span className="font-medium text-graphite-700">Source: </span>
            {f.source}
          </p>
        </div>
      )}
    </li>
  );
}

function SuggestionItem({ s, teardownId, canEdit }: { s: SuggestionDto; teardownId: number; canEdit: boolean }) {
  const [open, setOpen] = useState(false);
  const accept = useAcceptSuggestion(teardownId);
  const dismiss = useDismissSuggestion(teardownId);
  const reopen = useReopenSuggestion(teardownId);
  const onError = (err: unknown) => {
    const m = mutationErrorMessage(err);
    if (m) toast.error(m);
  };
  return (
    <li className="space-y-1.5 px-3 py-2.5" data-suggestion={s.key}>
      <div className="flex flex-wrap items-center gap-1.5">
        <SeverityBadge severity={s.severity} />
        <Badge>{FINDING_KIND.labels[s.kind]}</Badge>
        {s.status === 'accepted' && (
          <Badge tone="cell" icon={Check}>
            Accepted
          </Badge>
        )}
        {s.status === 'dismissed' && <Badge icon={X}>Dismissed</Badge>}
      </div>
      <p className={`text-sm font-medium ${s.status === 'dismissed' ? 'text-graphite-500' : 'text-graphite-900'}`}>{s.title}</p>
      <p className={`text-xs text-graphite-700 ${open ? '' : 'line-clamp-2'}`}>{s.detail}</p>
      <button type="button" className="text-xs text-copper-700 hover:underline" onClick={() => setOpen(!open)} aria-expanded={open}>
        {open ? 'Less' : 'More'}
      </button>
      {s.status === 'accepted' && s.findingId !== null && (
        <p className="text-xs text-graphite-600">
          Finding #{s.findingId}
          {s.decidedBy ? `, accepted by ${s.decidedBy}` : ''}.{' '}
          <Link to={paths.teardown(teardownId, 'findings')} className="text-copper-700 hover:underline">
            Open findings
          </Link>
        </p>
      )}
      {s.status === 'dismissed' && s.decidedBy && <p className="text-xs text-graphite-500">Dismissed by {s.decidedBy}.</p>}
      {canEdit && s.status === 'open' && (
        <div className="flex gap-2 pt-0.5">
          <Button size="sm" variant="primary" busy={accept.isPending} onClick={() => accept.mutate(s.key, { onSuccess: (f) => toast.success(`Finding #${f.id} added from the suggestion.`), onError })}>
            <Check className="size-3.5" aria-hidden /> Accept
          </Button>
          <Button size="sm" busy={dismiss.isPending} onClick={() => dismiss.mutate(s.key, { onError })}>
            Dismiss
          </Button>
        </div>
      )}
      {canEdit && s.status === 'dismissed' && (
        <Button size="sm" variant="ghost" busy={reopen.isPending} onClick={() => reopen.mutate(s.key, { onError })}>
          <RotateCcw className="size-3.5" aria-hidden /> Reopen
        </Button>
      )}
    </li>
  );
}

/** Derived figures and suggested findings, beside the section being edited; refreshed after every change. */
export function FiguresPanel({ teardownId, canEdit }: { teardownId: number; canEdit: boolean }) {
  const figures = useFigures(teardownId);
  return (
    <aside aria-label="Figures" className="rounded-lg border border-graphite-150 bg-white shadow-card">
      <div className="flex items-center justify-between gap-2 border-b border-graphite-100 px-3 py-2.5">
        <h2 className="flex items-center gap-1.5 text-sm font-semibold">
          <Gauge className="size-4 text-cell-600" aria-hidden /> Figures
        </h2>
        {figures.isFetching && !figures.isPending && <span className="text-2xs text-graphite-500">Updating…</span>}
      </div>
      {figures.isPending ? (
        <Spinner label="Computing…" />
      ) : figures.isError ? (
        <div className="px-3 pb-3">
          <ErrorPanel error={figures.error} onRetry={() => figures.refetch()} />
        </div>
      ) : (
        <>
          {figures.data.figures.length === 0 ? (
            <p className="px-3 py-3 text-sm text-graphite-600">No figures yet. Record the cells and the loads of the power system, and the power, energy and runtime figures appear here.</p>
          ) : (
            <div aria-label="Derived figures" role="list">
              {figures.data.modes.length === 0 && figures.data.figures.some((f) => f.key === 'load.power') && (
                <p className="border-b border-graphite-100 px-3 py-2 text-xs text-graphite-600" data-testid="all-at-once">
                  All loads at once: record the operating modes in the power system for power and runtime per mode.
                </p>
              )}
              {groupFigures(figures.data.figures, figures.data.modes).map((g) => (
                <section key={g.mode ? `mode-${g.mode.id}` : g.title} aria-label={g.title} role="listitem" data-mode-group={g.mode?.name}>
                  <h3 className={`px-3 py-1 text-2xs font-semibold uppercase tracking-wide ${g.mode ? 'bg-cell-50 text-cell-800' : 'bg-graphite-50 text-graphite-600'}`}>
                    {g.title}
                    {g.mode?.note && <span className="ml-1 font-normal normal-case tracking-normal">({g.mode.note})</span>}
                  </h3>
                  {g.figures.length === 0 ? (
                    <p className="px-3 py-2 text-xs text-graphite-600">Nothing on in this mode.</p>
                  ) : (
                    <ul>
                      {g.figures.map((f, i) => (
                        // One caution per group, after the last figure that carries it.
                        <FigureRow key={figureId(f)} f={f} showCaution={f.caution !== null && !g.figures.slice(i + 1).some((x) => x.caution === f.caution)} />
                      ))}
                    </ul>
                  )}
                </section>
              ))}
            </div>
          )}
          {figures.data.suggestions.length > 0 && (
            <div className="border-t border-graphite-100">
              <h3 className="flex items-center gap-1.5 px-3 pt-2.5 text-xs font-semibold uppercase tracking-wide text-graphite-600">
                <Sparkles className="size-3.5 text-cell-600" aria-hidden /> Suggested findings ({figures.data.suggestions.length})
              </h3>
              <ul className="divide-y divide-graphite-100" aria-label="Suggested findings">
                {figures.data.suggestions.map((s) => (
                  <SuggestionItem key={s.key} s={s} teardownId={teardownId} canEdit={canEdit} />
                ))}
              </ul>
            </div>
          )}
          <div className="border-t border-graphite-100 px-3 py-2.5">
            <EstimatesNote text={figures.data.note} />
          </div>
        </>
      )}
    </aside>
  );
}
