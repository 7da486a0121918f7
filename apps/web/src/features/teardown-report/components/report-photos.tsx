import type { ReactNode } from 'react';
import type { PhotoDto } from '@splitcase/contracts';
import { NoneRecorded } from './report-layout';

/** "Photo 3": the number a photo has in this report (layer and step order). */
export const photoNumber = (photos: Pick<PhotoDto, 'id'>[], id: number) => photos.findIndex((p) => p.id === id) + 1;

/**
 * Each photo with its pins drawn over it (`renderPinned`, from the photos feature) beside the key of
 * its pins: number → label → the part or finding it marks. Photo and key stay on one page.
 */
export function ReportPhotos({ photos, renderPinned }: { photos: PhotoDto[]; renderPinned: (photo: PhotoDto) => ReactNode }) {
  if (!photos.length) return <NoneRecorded>No photos recorded.</NoneRecorded>;
  return (
    <div className="space-y-5">
      {photos.map((photo, i) => (
        <figure key={photo.id} className="grid grid-cols-[minmax(0,11fr)_minmax(0,9fr)] gap-4 break-inside-avoid" data-photo={photo.id}>
          <div className="min-w-0">
            {renderPinned(photo)}
            <figcaption className="mt-1 text-xs text-graphite-600">
              <span className="font-semibold text-graphite-900">Photo {i + 1}.</span>{' '}
              <span className="num">
                Layer {photo.layer}, step {photo.step}
              </span>
              {photo.caption ? ` — ${photo.caption}` : ''}
            </figcaption>
          </div>
          <div className="min-w-0">
            <p className="mb-1 text-2xs font-semibold uppercase tracking-wide text-graphite-500">Key</p>
            {photo.callouts.length === 0 ? (
              <p className="text-xs italic text-graphite-500">No pins on this photo.</p>
            ) : (
              <ol className="space-y-1 text-xs" aria-label={`Pins of photo ${i + 1}`}>
                {[...photo.callouts]
                  .sort((a, b) => a.number - b.number)
                  .map((c) => (
                    <li key={c.id} className="flex gap-2" data-key-pin={c.number}>
                      <span className="num flex size-4 shrink-0 items-center justify-center rounded-full bg-copper-600 text-[9px] font-semibold text-white">{c.number}</span>
                      <span className="min-w-0">
                        <span className="text-graphite-950">{c.label}</span>
                        {c.part && <span className="block text-graphite-500">Part: {c.part.label}</span>}
                        {c.finding && <span className="block text-graphite-500">Finding: {c.finding.label}</span>}
                      </span>
                    </li>
                  ))}
              </ol>
            )}
          </div>
        </figure>
      ))}
    </div>
  );
}
