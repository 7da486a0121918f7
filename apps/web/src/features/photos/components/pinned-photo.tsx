import type { PhotoDto } from '@splitcase/contracts';
import { PinMark, at } from './pin';

/**
 * A photo with its numbered pins at their relative spots, for reading and printing (reports): the
 * display image in a box of the photo's own proportions, so the pins stay on their spot at any width.
 */
export function PinnedPhoto({ photo, className = '' }: { photo: Pick<PhotoDto, 'id' | 'width' | 'height' | 'caption' | 'name' | 'urls' | 'callouts'>; className?: string }) {
  return (
    <div className={`relative overflow-hidden rounded bg-graphite-900 ${className}`} style={{ aspectRatio: `${photo.width} / ${photo.height}` }} data-testid="pinned-photo">
      <img src={photo.urls.display} alt={photo.caption ?? photo.name} className="absolute inset-0 size-full" decoding="sync" />
      {photo.callouts.map((c) => (
        <span key={c.id} className="absolute -translate-x-1/2 -translate-y-1/2" style={at(c.x, c.y)} role="img" aria-label={`Pin ${c.number}: ${c.label}`} data-pin={c.number}>
          <PinMark number={c.number} size="report" />
        </span>
      ))}
    </div>
  );
}
