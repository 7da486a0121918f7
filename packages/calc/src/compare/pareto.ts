/**
 * Pareto frontier of a lineup: the devices no other device beats on both
 * axes at once.
 */
import { requireFinite } from '../shared/validate';

function checkIds(points: { id: string }[], name: string): void {
  if (!Array.isArray(points)) throw new RangeError(`${name} must be a list.`);
  const seen = new Set<string>();
  points.forEach((p, k) => {
    if (p === null || typeof p !== 'object' || typeof p.id !== 'string' || p.id === '') {
      throw new RangeError(`${name}[${k}].id must be non-empty text.`);
    }
    if (seen.has(p.id)) throw new RangeError(`${name}[${k}].id "${p.id}" appears more than once.`);
    seen.add(p.id);
  });
}

/** Ids not dominated (no other point with cost ≤ and benefit ≥, one strictly); ties kept; ascending cost, then id. */
export function paretoFrontier(points: { id: string; cost: number; benefit: number }[]): string[] {
  checkIds(points, 'points');
  points.forEach((p, k) => {
    requireFinite(p.cost, `points[${k}].cost`);
    requireFinite(p.benefit, `points[${k}].benefit`);
  });
  // Sort by cost ascending; sweep groups of equal cost keeping the best benefit of cheaper groups.
  const sorted = [...points].sort((a, b) => a.cost - b.cost || b.benefit - a.benefit || (a.id < b.id ? -1 : 1));
  const frontier: string[] = [];
  let bestCheaper = -Infinity;
  for (let start = 0; start < sorted.length;) {
    const cost = sorted[start]!.cost;
    const groupBest = sorted[start]!.benefit; // the group is sorted by benefit, best first
    let end = start;
    while (end < sorted.length && sorted[end]!.cost === cost) end++;
    if (groupBest > bestCheaper) {
      for (let k = start; k < end && sorted[k]!.benefit === groupBest; k++) frontier.push(sorted[k]!.id);
      bestCheaper = groupBest;
    }
    start = end;
  }
  return frontier;
}

export type Better = 'low' | 'high';

/**
 * Frontier for a scatter chart whose axes may be better low or high: ids of
 * the non-dominated points in ascending x (then id), ready to join as a line.
 */
export function paretoFrontierXY(points: { id: string; x: number; y: number }[], directions: { xBetter: Better; yBetter: Better }): string[] {
  checkIds(points, 'points');
  for (const key of ['xBetter', 'yBetter'] as const) {
    if (directions?.[key] !== 'low' && directions?.[key] !== 'high') {
      throw new RangeError(`${key} must be "low" or "high".`);
    }
  }
  const byId = new Map<string, { x: number; y: number }>();
  const mapped = points.map((p, k) => {
    const x = requireFinite(p.x, `points[${k}].x`);
    const y = requireFinite(p.y, `points[${k}].y`);
    byId.set(p.id, { x, y });
    return { id: p.id, cost: directions.xBetter === 'low' ? x : -x, benefit: directions.yBetter === 'high' ? y : -y };
  });
  const ids = paretoFrontier(mapped);
  return ids.sort((a, b) => byId.get(a)!.x - byId.get(b)!.x || (a < b ? -1 : 1));
}
