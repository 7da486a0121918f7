import { Link } from 'react-router';
import { MapPin } from 'lucide-react';
import type { PlacedCalloutDto } from '@splitcase/contracts';
import { paths } from '@/config/paths';
import { usePlacedCallouts } from '../api/get-placed-callouts';
import { PinnedThumb } from './pin';

/**
 * Where a part or a finding is pinned on the teardown's photos: one small thumbnail per photo with
 * that pin highlighted, linking to the photo on the stage. For the parts and findings sections
 * (their `renderPartExtras(partId)` / `renderFindingExtras(findingId)`).
 */
export function PinsFor({ teardownId, partId, findingId }: { teardownId: number; partId?: number; findingId?: number }) {
  const pins = usePlacedCallouts(teardownId, { partId, findingId });
  if (!partId && !findingId) return null;
  if (pins.isPending) return <p className="text-xs text-graphite-500">Looking for pins…</p>;
  if (pins.isError) return <p className="text-xs text-brick-700">Pins could not be loaded: {pins.error.message}</p>;
  if (!pins.data.length) {
    return (
      <p className="flex items-center gap-1.5 text-xs text-graphite-500">
        <MapPin className="size-3.5" aria-hidden /> Not pinned on a photo yet.{' '}
        <Link to={paths.teardown(teardownId, 'photos')} className="font-medium text-copper-700 hover:underline">
          Open the photos
        </Link>
      </p>
    );
  }
  const byPhoto = new Map<number, PlacedCalloutDto[]>();
  for (const c of pins.data) byPhoto.set(c.photo.id, [...(byPhoto.get(c.photo.id) ?? []), c]);
  return (
    <ul className="flex flex-wrap gap-2" aria-label="Pins on photos" data-testid="pins-for">
      {[...byPhoto.values()].map((group) => {
        const photo = group[0]!.photo;
        return (
          <li key={photo.id}>
            <Link
              to={paths.teardownPhoto(teardownId, photo.id, group[0]!.id)}
              className="block w-28 rounded-md p-1 hover:bg-graphite-100"
              title={group.map((c) => `${c.number}. ${c.label}`).join('\n')}
            >
              <PinnedThumb photo={photo} callouts={group} highlight={group.map((c) => c.id)} className="h-16 w-full" />
              <span className="mt-0.5 block truncate text-2xs text-graphite-600">
                <span className="num">
                  L{photo.layer} S{photo.step}
                </span>{' '}
                · pin {group.map((c) => c.number).join(', ')}
              </span>
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
