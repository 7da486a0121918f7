import { useId } from 'react';
import { LINEUP_MODE_RULE, type LineupModeChoice } from '@splitcase/contracts';
import { Input, InlineError } from '@/components/field';

/**
 * Which operating mode of each device the lineup compares: one of the four rules by its contract
 * label; "A mode by name" asks for the name. Controlled: the form or the page keeps the choice.
 */
export function ModeChoice({
  value,
  onChange,
  error,
  layout = 'stack',
  hideLegend = false,
}: {
  value: LineupModeChoice;
  onChange: (next: LineupModeChoice) => void;
  /** The message for the mode name (e.g. the server's `mode.name`). */
  error?: string | undefined;
  /** 'row': the rules side by side where there is room (the lineup page). */
  layout?: 'stack' | 'row';
  /** Keep the legend for screen readers only (under a card that already says it). */
  hideLegend?: boolean;
}) {
  const id = useId();
  const nameId = `${id}-name`;
  return (
    <fieldset className="min-w-0" data-testid="mode-choice">
      <legend className={hideLegend ? 'sr-only' : 'mb-1.5 text-sm font-medium text-graphite-800'}>Mode compared</legend>
      <div className={layout === 'row' ? 'flex flex-wrap gap-x-5 gap-y-1.5' : 'space-y-1.5'}>
        {LINEUP_MODE_RULE.values.map((rule) => (
          <label key={rule} className="flex min-h-7 cursor-pointer items-center gap-2 text-sm text-graphite-900">
            <input
              type="radio"
              name={`${id}-rule`}
              value={rule}
              checked={value.rule === rule}
              onChange={() => onChange(rule === 'named' ? { rule, name: value.name ?? '' } : { rule })}
              className="size-4 accent-copper-600"
            />
            {LINEUP_MODE_RULE.labels[rule]}
          </label>
        ))}
      </div>
      {value.rule === 'named' && (
        <div className="mt-2 max-w-xs space-y-1">
          <label htmlFor={nameId} className="block text-sm font-medium text-graphite-800">
            Mode name
          </label>
          <Input
            id={nameId}
            value={value.name ?? ''}
            onChange={(e) => onChange({ rule: 'named', name: e.target.value })}
            placeholder="e.g. High"
            autoComplete="off"
            maxLength={80}
            aria-invalid={Boolean(error)}
            aria-describedby={error ? `${nameId}-error` : `${nameId}-hint`}
          />
          {error ? (
            <InlineError id={`${nameId}-error`} message={error} />
          ) : (
            <p id={`${nameId}-hint`} className="text-xs text-graphite-500">
              As recorded in each teardown’s power system; letter case does not matter.
            </p>
          )}
        </div>
      )}
    </fieldset>
  );
}
