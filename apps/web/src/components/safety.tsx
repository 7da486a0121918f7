// The safety cautions, in the words of @splitcase/contracts (cautions.ts), for every feature to place
// where the risk is: opening a device with a lithium cell, hot surfaces, the nature of the figures.
import { Info, Thermometer } from 'lucide-react';
import { CHEMISTRY, ESTIMATES_NOTE, HOT_SURFACE_CAUTION, LITHIUM_CELL_CAUTION, UNKNOWN_CELL_NOTE, type Chemistry } from '@splitcase/contracts';
import { Caution } from './caution';

/**
 * Before opening a device with a lithium cell. `cell` is the recorded cell (TeardownDto.cell):
 * not lithium → nothing; not recorded yet → the same caution, treating the cell as lithium.
 */
export function LithiumCaution({ cell, collapsed = false }: { cell: { chemistry: Chemistry; lithium: boolean } | null | undefined; collapsed?: boolean }) {
  if (cell && !cell.lithium) return null;
  const intro = cell ? `${CHEMISTRY.labels[cell.chemistry]} cell recorded.` : UNKNOWN_CELL_NOTE;
  const points = (
    <>
      <ul className="mt-1 list-disc space-y-0.5 pl-4">
        {LITHIUM_CELL_CAUTION.points.map((p) => (
          <li key={p}>{p}</li>
        ))}
      </ul>
      <p className="mt-1.5 text-xs">{LITHIUM_CELL_CAUTION.defer}</p>
    </>
  );
  return (
    <Caution title={LITHIUM_CELL_CAUTION.title}>
      {collapsed ? (
        <details>
          <summary className="cursor-pointer">
            {intro} {LITHIUM_CELL_CAUTION.summary}
          </summary>
          {points}
        </details>
      ) : (
        <>
          <p>{intro}</p>
          {points}
        </>
      )}
    </Caution>
  );
}

/** Beside touch- and surface-temperature figures. */
export function HotSurfaceNote({ text = HOT_SURFACE_CAUTION }: { text?: string }) {
  return (
    <p className="flex gap-1.5 rounded border border-amber-100 bg-amber-50 px-2 py-1.5 text-xs text-amber-800" role="note">
      <Thermometer className="mt-0.5 size-3.5 shrink-0" aria-hidden />
      <span>{text}</span>
    </p>
  );
}

/** "Engineering estimates, not certification results…" — with every set of derived figures. */
export function EstimatesNote({ text = ESTIMATES_NOTE }: { text?: string }) {
  return (
    <p className="flex gap-1.5 text-xs text-graphite-500" role="note">
      <Info className="mt-0.5 size-3.5 shrink-0" aria-hidden />
      <span>{text}</span>
    </p>
  );
}
