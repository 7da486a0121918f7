import type { PhotoDto } from '@splitcase/contracts';
import { PinnedThumb } from './pin';

/** Thumbnails grouped by layer, in step order; the selected one is outlined in copper. */
export function Filmstrip({ photos, selectedId, onSelect }: { photos: PhotoDto[]; selectedId: number | null; onSelect: (id: number) => void }) {
  const layers = [...new Set(photos.map((p) => p.layer))].sort((a, b) => a - b);
  return (
    <nav aria-label="Photos by layer" className="flex gap-4 overflow-x-auto pb-2">
      {layers.map((layer) => (
        <section key={layer} className="shrink-0">
          <h3 className="mb-1 text-2xs font-semibold uppercase tracking-wider text-graphite-500">Layer {layer}</h3>
          <ul className="flex gap-2">
            {photos
              .filter((p) => p.layer === layer)
              .map((p) => (
                <li key={p.id}>
                  <button
                    type="button"
                    onClick={() => onSelect(p.id)}
                    aria-current={selectedId === p.id ? 'true' : undefined}
                    aria-label={`Layer ${p.layer}, step ${p.step}: ${p.caption ?? p.name}`}
                    className={`block w-36 rounded-md p-1 text-left ${selectedId === p.id ? 'bg-copper-50 ring-2 ring-copper-500' : 'hover:bg-graphite-100'}`}
                    data-testid={`thumb-${p.id}`}
                  >
                    <PinnedThumb photo={p} callouts={p.callouts} className="h-[5.25rem] w-full" />
                    <span className="mt-1 block truncate text-xs text-graphite-700">
                      <span className="num font-medium text-graphite-900">S{p.step}</span> · {p.caption ?? p.name}
                    </span>
                  </button>
                </li>
              ))}
          </ul>
        </section>
      ))}
    </nav>
  );
}
