import { useRef, type KeyboardEvent, type MouseEvent, type PointerEvent } from 'react';
import type { CalloutDto, PhotoDto } from '@splitcase/contracts';
import { useLiveState } from '@/lib/use-live-state';
import { PinMark, at } from './pin';

const clamp = (v: number) => Math.min(1, Math.max(0, v));
const round = (v: number) => Math.round(v * 10000) / 10000;

interface Drag {
  id: number;
  x: number;
  y: number;
  startX: number;
  startY: number;
  moved: boolean;
}

/**
 * The large picture with its pins. Editors click the picture to place a pin, drag a pin to move it,
 * or focus it and use the arrow keys (Shift for bigger steps).
 */
export function PhotoStage({
  photo,
  canEdit,
  selectedId,
  draft,
  onSelect,
  onPlace,
  onMove,
}: {
  photo: PhotoDto;
  canEdit: boolean;
  selectedId: number | null;
  draft: { x: number; y: number } | null;
  onSelect: (id: number | null) => void;
  onPlace: (pos: { x: number; y: number }) => void;
  onMove: (callout: CalloutDto, pos: { x: number; y: number }) => void;
}) {
  const box = useRef<HTMLDivElement>(null);
  // Live state: the handlers read the drag as it is now, not as of the last render.
  const [drag, setDrag, currentDrag] = useLiveState<Drag | null>(null);
  const suppressClick = useRef(false);
  const aspect = photo.width / photo.height;

  const relative = (clientX: number, clientY: number) => {
    const r = box.current!.getBoundingClientRect();
    return { x: round(clamp((clientX - r.left) / r.width)), y: round(clamp((clientY - r.top) / r.height)) };
  };

  const onPictureClick = (e: MouseEvent<HTMLImageElement>) => {
    if (!canEdit) return onSelect(null);
    onPlace(relative(e.clientX, e.clientY));
  };

  const pinHandlers = (c: CalloutDto) => ({
    onPointerDown: (e: PointerEvent<HTMLButtonElement>) => {
      if (!canEdit || e.button !== 0) return;
      e.currentTarget.setPointerCapture(e.pointerId);
      setDrag({ id: c.id, x: c.x, y: c.y, startX: e.clientX, startY: e.clientY, moved: false });
    },
    onPointerMove: (e: PointerEvent<HTMLButtonElement>) => {
      const d = currentDrag();
      if (!d || d.id !== c.id) return;
      const moved = d.moved || Math.hypot(e.clientX - d.startX, e.clientY - d.startY) > 3;
      setDrag({ ...d, ...(moved ? relative(e.clientX, e.clientY) : {}), moved });
    },
    onPointerUp: (e: PointerEvent<HTMLButtonElement>) => {
      const d = currentDrag();
      if (!d || d.id !== c.id) return;
      e.currentTarget.releasePointerCapture(e.pointerId);
      if (d.moved) {
        suppressClick.current = true;
        onMove(c, { x: d.x, y: d.y });
        onSelect(c.id);
      }
      setDrag(null);
    },
    onPointerCancel: () => setDrag(null),
    onClick: () => {
      if (suppressClick.current) {
        suppressClick.current = false;
        return;
      }
      onSelect(selectedId === c.id ? null : c.id);
    },
    onKeyDown: (e: KeyboardEvent<HTMLButtonElement>) => {
      if (!canEdit) return;
      const step = e.shiftKey ? 0.05 : 0.01;
      const delta = { ArrowLeft: [-step, 0], ArrowRight: [step, 0], ArrowUp: [0, -step], ArrowDown: [0, step] }[e.key];
      if (!delta) return;
      e.preventDefault();
      onMove(c, { x: round(clamp(c.x + delta[0]!)), y: round(clamp(c.y + delta[1]!)) });
    },
  });

  const nextNumber = Math.max(0, ...photo.callouts.map((c) => c.number)) + 1;
  return (
    <div className="flex justify-center rounded-lg bg-graphite-950 p-2">
      <div ref={box} className="relative select-none" style={{ aspectRatio: `${photo.width} / ${photo.height}`, width: `min(100%, calc(66vh * ${aspect.toFixed(4)}))` }} data-testid="photo-stage">
        <img
          src={photo.urls.display}
          alt={photo.caption ?? photo.name}
          draggable={false}
          onClick={onPictureClick}
          className={`absolute inset-0 size-full rounded ${canEdit ? 'cursor-crosshair' : ''}`}
        />
        {photo.callouts.map((c) => {
          const pos = drag?.id === c.id ? drag : c;
          return (
            <button
              key={c.id}
              type="button"
              className={`absolute -translate-x-1/2 -translate-y-1/2 rounded-full p-1 focus-visible:outline-offset-0 ${canEdit ? 'cursor-grab touch-none active:cursor-grabbing' : ''}`}
              style={at(pos.x, pos.y)}
              aria-label={`Pin ${c.number}: ${c.label}`}
              aria-pressed={selectedId === c.id}
              title={`${c.number}. ${c.label}${c.part ? ` → ${c.part.label}` : ''}${c.finding ? ` → ${c.finding.label}` : ''}`}
              data-testid={`stage-pin-${c.number}`}
              {...pinHandlers(c)}
            >
              <PinMark number={c.number} selected={selectedId === c.id} />
            </button>
          );
        })}
        {draft && (
          <span className="pointer-events-none absolute -translate-x-1/2 -translate-y-1/2 p-1" style={at(draft.x, draft.y)} aria-hidden>
            <span className="absolute inset-0 animate-ping rounded-full bg-copper-400/60" />
            <PinMark number={nextNumber} selected />
          </span>
        )}
      </div>
    </div>
  );
}
