import type { CalloutDto, PhotoDto } from '@splitcase/contracts';

type PinSize = 'stage' | 'report' | 'thumb';

const SIZES: Record<PinSize, string> = {
  stage: 'size-7 text-[13px] ring-2',
  report: 'size-5 text-[10px] ring-2',
  thumb: 'size-3.5 text-[8px] ring-1',
};

/**
 * A numbered callout pin: copper disc, white ring, white number, with a thin dark outline and a
 * shadow so it reads on green, black, white or copper-coloured boards alike.
 */
export function PinMark({ number, size = 'stage', selected = false, dimmed = false }: { number: number; size?: PinSize; selected?: boolean; dimmed?: boolean }) {
  return (
    <span
      className={`num flex items-center justify-center rounded-full bg-copper-600 font-semibold leading-none text-white shadow-pop outline outline-1 outline-graphite-950/50 ring-white ${SIZES[size]} ${
        selected ? 'scale-125 bg-copper-700 outline-2 outline-graphite-950' : ''
      } ${dimmed ? 'opacity-45' : ''}`}
    >
      {number}
    </span>
  );
}

/** Position style for something centred on a relative point of the picture. */
export const at = (x: number, y: number) => ({ left: `${x * 100}%`, top: `${y * 100}%` });

/**
 * A thumbnail with its pins drawn to scale, as one SVG in the photo's own pixel space, so the pins
 * stay on their spot at any size (letterboxed, never cropped). `highlight` picks out pins; the
 * others are dimmed when a highlight is given.
 */
export function PinnedThumb({
  photo,
  callouts,
  highlight,
  className = '',
}: {
  photo: Pick<PhotoDto, 'width' | 'height' | 'caption' | 'urls'>;
  callouts: Pick<CalloutDto, 'id' | 'number' | 'x' | 'y' | 'label'>[];
  highlight?: number[];
  className?: string;
}) {
  const { width: w, height: h } = photo;
  const r = Math.max(w, h) * 0.034;
  return (
    <svg viewBox={`0 0 ${w} ${h}`} preserveAspectRatio="xMidYMid meet" className={`block rounded bg-graphite-900 ${className}`} role="img" aria-label={photo.caption ?? 'Photo'}>
      <image href={photo.urls.thumb} width={w} height={h} preserveAspectRatio="none" />
      {callouts.map((c) => {
        const on = highlight?.includes(c.id);
        const dim = Boolean(highlight && !on);
        const rr = on ? r * 1.3 : r;
        return (
          <g key={c.id} opacity={dim ? 0.45 : 1} data-pin={c.number}>
            <title>{`${c.number}. ${c.label}`}</title>
            <circle cx={c.x * w} cy={c.y * h} r={rr * 1.3} className="fill-graphite-950/40" />
            <circle cx={c.x * w} cy={c.y * h} r={rr} strokeWidth={rr * 0.3} className={`${on ? 'fill-copper-700' : 'fill-copper-600'} stroke-white`} />
            <text x={c.x * w} y={c.y * h} dy="0.36em" textAnchor="middle" fontSize={rr * 1.15} fontWeight={700} className="fill-white">
              {c.number}
            </text>
          </g>
        );
      })}
    </svg>
  );
}
