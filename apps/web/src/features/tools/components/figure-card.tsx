import type { ExplainedFigure } from '@splitcase/contracts';
import { ChevronRight, TriangleAlert } from 'lucide-react';
import type { ReactNode } from 'react';
import { formatFigure } from './format-figure';

/** The parts of a result every tool shows: formula, inputs, assumptions and source, folded away. */
export function HowComputed({ formula, source, inputs, assumptions }: Pick<ExplainedFigure, 'formula' | 'source' | 'inputs' | 'assumptions'>) {
  return (
    <details className="group mt-2 text-sm">
      <summary className="flex min-h-11 cursor-pointer list-none items-center gap-1.5 rounded-md px-1 text-copper-700 hover:text-copper-800 [&::-webkit-details-marker]:hidden">
        <ChevronRight className="size-4 transition-transform group-open:rotate-90" aria-hidden />
        How was this computed
      </summary>
      <div className="mt-1 space-y-3 rounded-md bg-graphite-50 p-3 text-graphite-800">
        <div>
          <div className="text-xs font-medium uppercase tracking-wider text-graphite-500">Formula</div>
          <p className="mt-0.5 font-mono text-[13px]" data-testid="formula">
            {formula}
          </p>
        </div>
        {inputs.length > 0 && (
          <div>
            <div className="text-xs font-medium uppercase tracking-wider text-graphite-500">Inputs</div>
            <table className="mt-1 w-full text-[13px]">
              <tbody>
                {inputs.map((i) => (
                  <tr key={i.label} className="border-t border-graphite-150 first:border-t-0">
                    <th scope="row" className="py-1 pr-3 text-left font-normal text-graphite-600">
                      {i.label}
                    </th>
                    <td className="num py-1 text-right">{formatFigure(i.value, i.unit ?? '')}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
        {assumptions.length > 0 && (
          <div>
            <div className="text-xs font-medium uppercase tracking-wider text-graphite-500">Assumptions</div>
            <ul className="mt-1 list-disc space-y-1 pl-5">
              {assumptions.map((a) => (
                <li key={a}>{a}</li>
              ))}
            </ul>
          </div>
        )}
        <div>
          <div className="text-xs font-medium uppercase tracking-wider text-graphite-500">Source</div>
          <p className="mt-0.5" data-testid="source">
            {source}
          </p>
        </div>
      </div>
    </details>
  );
}

export function Warnings({ warnings }: { warnings: string[] }) {
  if (warnings.length === 0) return null;
  return (
    <ul className="mt-2 space-y-1.5">
      {warnings.map((w) => (
        <li key={w} className="flex gap-2 rounded-md bg-amber-50 px-2.5 py-1.5 text-sm text-amber-800">
          <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden />
          <span>
            <span className="sr-only">Warning: </span>
            {w}
          </span>
        </li>
      ))}
    </ul>
  );
}

/** One explained figure: label, value with its unit (3 significant figures), warnings, and how it was computed. */
export function FigureCard({ figure, children }: { figure: ExplainedFigure; children?: ReactNode }) {
  return (
    <article className="rounded-lg border border-graphite-150 bg-white px-4 pb-2 pt-3 shadow-card" aria-label={figure.label} data-figure={figure.key}>
      <div className="text-sm text-graphite-600">{figure.label}</div>
      <div className="num mt-0.5 text-2xl font-semibold tracking-tight text-cell-700" data-testid={`value-${figure.key}`}>
        {formatFigure(figure.value, figure.unit)}
      </div>
      <Warnings warnings={figure.warnings} />
      {children}
      <HowComputed formula={figure.formula} source={figure.source} inputs={figure.inputs} assumptions={figure.assumptions} />
    </article>
  );
}
