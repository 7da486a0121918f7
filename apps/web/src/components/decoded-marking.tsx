import type { DecodedReadingDto } from '@splitcase/contracts';
import { formatQuantity } from '@/lib/format';

/** One reading as a figure: the value with its unit and, when the code carries one, the tolerance ("1.00 kΩ ±10 %"). */
export const readingText = (r: DecodedReadingDto) => `${formatQuantity(r.value, r.unit)}${r.tolerance ? ` ${r.tolerance.text}` : ''}`;

/** The readings after the first, with their rule: "1.24 Ω (EIA-96)". */
export const otherReadingsText = (readings: DecodedReadingDto[]) =>
  readings
    .slice(1)
    .map((r) => `${readingText(r)} (${r.schemeShortLabel})`)
    .join(', ');

/**
 * A part's decoded marking as the server read it: the first reading and, when the code reads another way
 * too, "or 1.24 Ω (EIA-96)" in small text on a line of its own (tables stay narrow). With `onShowAll` the
 * alternative is a button (keyboard and screen-reader reachable) that opens where every reading is listed
 * with its rule; its title gives the ranking rule.
 */
export function DecodedMarking({ readings, onShowAll, expanded, className = '' }: { readings: DecodedReadingDto[]; onShowAll?: () => void; expanded?: boolean; className?: string }) {
  const first = readings[0];
  if (!first) return null;
  const others = otherReadingsText(readings);
  const why = first.rankReason ?? undefined;
  return (
    <span className={className}>
      <span className="text-cell-700">{readingText(first)}</span>
      {others &&
        (onShowAll ? (
          <span className="block leading-tight">
            <button
              type="button"
              className="rounded-sm text-xs text-graphite-600 underline decoration-dotted underline-offset-2 hover:text-graphite-900"
              title={why}
              aria-expanded={expanded}
              onClick={(e) => {
                e.stopPropagation();
                onShowAll();
              }}
            >
              or {others}
              <span className="sr-only">: show every reading</span>
            </button>
          </span>
        ) : (
          <span className="block text-xs leading-tight text-graphite-600" title={why}>
            or {others}
          </span>
        ))}
    </span>
  );
}

/** Every reading of a marking, ranked, each with its rule, and the rule that ranks them. */
export function DecodedReadingList({ readings }: { readings: DecodedReadingDto[] }) {
  if (readings.length < 2) return null;
  return (
    <div className="mt-1">
      <ol className="list-decimal space-y-0.5 pl-5" aria-label="Readings of the marking, most likely first">
        {readings.map((r) => (
          <li key={r.rank}>
            <span className="num font-medium text-cell-700">{readingText(r)}</span> <span className="text-graphite-600">— {r.schemeLabel}</span>
            {r.rank === 1 && <span className="text-graphite-500"> (most likely)</span>}
          </li>
        ))}
      </ol>
      {readings[0]!.rankReason && <p className="mt-1 text-xs text-graphite-600">{readings[0]!.rankReason}</p>}
    </div>
  );
}
