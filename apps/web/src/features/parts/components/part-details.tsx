import type { ReactNode } from 'react';
import { ArrowDown, ArrowUp } from 'lucide-react';
import type { PartDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { DecodedMarking, DecodedReadingList } from '@/components/decoded-marking';
import { formatQuantity } from '@/lib/format';

export const decodedText = (p: Pick<PartDto, 'decodedValue' | 'decodedUnit'>) => (p.decodedValue === null || !p.decodedUnit ? null : formatQuantity(p.decodedValue, p.decodedUnit));

/** A line's details under its row: the marking and every reading of it, the notes, moving the line, and what other features add. */
export function PartDetails({
  part: p,
  canEdit,
  first,
  last,
  moving,
  onMove,
  extras,
}: {
  part: PartDto;
  canEdit: boolean;
  first: boolean;
  last: boolean;
  moving: boolean;
  onMove: (by: -1 | 1) => void;
  extras?: ReactNode;
}) {
  return (
    <div className="grid gap-4 text-sm md:grid-cols-[minmax(0,1fr)_auto]">
      <dl className="grid grid-cols-[8rem_minmax(0,1fr)] gap-x-3 gap-y-1">
        <dt className="text-graphite-500">Marking as read</dt>
        <dd className="font-mono">{p.marking ?? '—'}</dd>
        <dt className="text-graphite-500">Decoded value</dt>
        <dd>
          {p.decodedReadings.length > 1 ? <DecodedReadingList readings={p.decodedReadings} /> : p.decodedReadings[0] ? <DecodedMarking readings={p.decodedReadings} /> : '—'}
          {p.decodeNote && <span className="ml-2 text-amber-700">{p.decodeNote}</span>}
          {!p.decodeNote && decodedText(p) === null && p.marking && <span className="ml-2 text-graphite-500">Only resistor and capacitor markings are decoded.</span>}
        </dd>
        <dt className="text-graphite-500">Notes</dt>
        <dd className="whitespace-pre-wrap">{p.notes ?? '—'}</dd>
      </dl>
      {canEdit && (
        <div className="flex items-start gap-1">
          <Button size="sm" variant="ghost" disabled={first || moving} onClick={() => onMove(-1)}>
            <ArrowUp className="size-4" aria-hidden /> Up
          </Button>
          <Button size="sm" variant="ghost" disabled={last || moving} onClick={() => onMove(1)}>
            <ArrowDown className="size-4" aria-hidden /> Down
          </Button>
        </div>
      )}
      {extras && <div className="md:col-span-2">{extras}</div>}
    </div>
  );
}
