import { Caution } from '@/components/caution';

/**
 * Cautions for opening a device with a lithium cell, shown at the photo step. Kept here until the
 * shared caution texts (packages/contracts/src/cautions.ts, on another branch) take them over.
 */
export const PHOTO_LITHIUM_CAUTIONS: { key: string; title: string; text: string }[] = [
  {
    key: 'discharge',
    title: 'Discharge first',
    text: 'Run the device down (about 3.0 V per cell) before opening the case: a damaged cell releases less energy when it is nearly empty.',
  },
  {
    key: 'pouch',
    title: 'Pouch cells',
    text: 'Never puncture, bend, crush or cut a pouch cell. Lift it with plastic tools and never lever against the pouch.',
  },
  {
    key: 'tools',
    title: 'Insulated tools',
    text: 'Use insulated tools; cut or unsolder one cell lead at a time and tape it before touching the other, so the cell cannot be shorted.',
  },
  {
    key: 'surface',
    title: 'Fire-safe surface',
    text: 'Work on a non-flammable surface with a metal box or sand bucket within reach, away from paper and solvents.',
  },
  {
    key: 'swollen',
    title: 'Swollen or hot cells',
    text: 'A swollen, hot, hissing or smelling cell: stop, do not charge or open it further, move it to the fire-safe container and follow the lab’s disposal procedure.',
  },
];

/**
 * `lithium`: true when the recorded pack is lithium; null when no pack is recorded yet. Compact by
 * default (the five points by name); opened to read the details, and open when `open` is set.
 */
export function LithiumCautions({ lithium, open = false }: { lithium: boolean | null; open?: boolean }) {
  if (lithium === false) return null;
  const title = lithium ? 'This device has a lithium cell: before and while opening it' : 'Until the cell is recorded, treat this device as having a lithium cell';
  return (
    <Caution title={title}>
      <details open={open} className="group">
        <summary className="cursor-pointer list-inside marker:text-amber-700">
          {PHOTO_LITHIUM_CAUTIONS.map((c) => c.title).join(' · ')}
          <span className="ml-1 text-xs underline group-open:hidden">details</span>
        </summary>
        <ul className="mt-1.5 grid gap-x-6 gap-y-1 md:grid-cols-2">
          {PHOTO_LITHIUM_CAUTIONS.map((c) => (
            <li key={c.key}>
              <span className="font-medium">{c.title}.</span> {c.text}
            </li>
          ))}
        </ul>
        <p className="mt-1.5 text-xs">These notes support, not replace, your lab’s safety rules, local codes and licensed practice.</p>
      </details>
    </Caution>
  );
}
