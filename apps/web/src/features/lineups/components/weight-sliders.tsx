import type { ComparisonMetricDto } from '@splitcase/contracts';
import { betterText } from './display';

/**
 * One slider per metric, 0 (left out of the ranking) to `max`. Controlled: the page keeps the
 * weights and asks the server for the ranking they give.
 */
export function WeightSliders({
  metrics,
  weights,
  max,
  onChange,
  errors = {},
  columns = 1,
}: {
  metrics: ComparisonMetricDto[];
  weights: Record<string, number>;
  max: number;
  onChange: (key: string, value: number) => void;
  /** Messages by metric key (e.g. from the server's `weights.<key>` fields). */
  errors?: Record<string, string>;
  /** 'auto': two columns on small screens, one beside the chart on wide ones. */
  columns?: 1 | 2 | 'auto';
}) {
  return (
    <ul className={`grid gap-x-6 gap-y-1.5 ${columns === 2 ? 'sm:grid-cols-2' : columns === 'auto' ? 'sm:grid-cols-2 xl:grid-cols-1' : ''}`} aria-label="Metric weights">
      {metrics.map((m) => {
        const w = weights[m.key] ?? 0;
        const id = `weight-${m.key}`;
        return (
          <li key={m.key} className="min-w-0">
            <div className="flex items-baseline justify-between gap-2 text-sm">
              <label htmlFor={id} className={`truncate ${w > 0 ? 'font-medium text-graphite-900' : 'text-graphite-500'}`} title={`${m.description} (${betterText(m)})`}>
                {m.label}
              </label>
              <output htmlFor={id} className={`num shrink-0 text-xs ${w > 0 ? 'font-semibold text-copper-700' : 'text-graphite-500'}`}>
                {w > 0 ? `× ${w}` : 'off'}
              </output>
            </div>
            <input
              id={id}
              type="range"
              min={0}
              max={max}
              step={1}
              value={w}
              aria-label={`Weight of ${m.label}`}
              aria-valuetext={w > 0 ? `${w} of ${max}` : 'off'}
              aria-invalid={Boolean(errors[m.key])}
              onChange={(e) => onChange(m.key, Number(e.target.value))}
              className="h-5 w-full cursor-pointer accent-copper-600"
            />
            {errors[m.key] && (
              <p className="text-xs text-brick-700" role="alert">
                {errors[m.key]}
              </p>
            )}
          </li>
        );
      })}
    </ul>
  );
}
