/**
 * The load a device is bought for, so that a lineup compares runtimes like for like: the heater
 * of a pocket heater, the USB output of a power bank, the LED of a headlamp, the motor of a fan.
 */
import type { LoadKind } from '../figures/types';
import { requireFinite } from '../shared/validate';

/** Device category → the kind of load that defines it [CP]. Categories not listed fall back to the largest load. */
export const MAIN_LOAD_KIND: Readonly<Record<string, LoadKind>> = {
  'pocket-heater': 'heater',
  'power-bank': 'usb-output',
  headlamp: 'led',
  'usb-fan': 'motor',
  toothbrush: 'motor',
};

export interface MainLoadChoice {
  /** Ids of the main load(s), in the order given. */
  ids: string[];
  /** 'category': every load of the category's kind; 'largest': the load with the highest full-duty power; 'none': nothing to choose. */
  basis: 'category' | 'largest' | 'none';
}

/**
 * The main load(s) of a device: every load of the kind its category is bought for; otherwise
 * the one load with the highest full-duty power (ties: the first given); none when no load has a power.
 */
export function mainLoads(category: string, loads: { id: string; kind: LoadKind; fullDutyWatts?: number | null }[]): MainLoadChoice {
  if (!Array.isArray(loads)) throw new RangeError('loads must be a list of { id, kind, fullDutyWatts }.');
  loads.forEach((l, k) => {
    if (l === null || typeof l !== 'object' || typeof l.id !== 'string' || l.id === '') throw new RangeError(`loads[${k}].id must be non-empty text.`);
    if (l.fullDutyWatts !== undefined && l.fullDutyWatts !== null) requireFinite(l.fullDutyWatts, `loads[${k}].fullDutyWatts`);
  });
  const kind = MAIN_LOAD_KIND[category];
  if (kind) {
    const ids = loads.filter((l) => l.kind === kind).map((l) => l.id);
    if (ids.length > 0) return { ids, basis: 'category' };
  }
  let best: { id: string; watts: number } | undefined;
  for (const l of loads) {
    const w = l.fullDutyWatts;
    if (w === undefined || w === null) continue;
    if (!best || w > best.watts) best = { id: l.id, watts: w };
  }
  return best ? { ids: [best.id], basis: 'largest' } : { ids: [], basis: 'none' };
}
