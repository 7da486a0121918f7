import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { paretoFrontier, paretoFrontierXY } from './pareto';

/** Brute-force definition: dominated if another point has cost ≤ and benefit ≥, one strictly [C]. */
function bruteForce(points: { id: string; cost: number; benefit: number }[]): string[] {
  return points
    .filter((p) => !points.some((q) => q.cost <= p.cost && q.benefit >= p.benefit && (q.cost < p.cost || q.benefit > p.benefit)))
    .sort((a, b) => a.cost - b.cost || (a.id < b.id ? -1 : 1))
    .map((p) => p.id);
}

describe('paretoFrontier', () => {
  it('keeps the devices nothing beats on both cost and benefit (worked by hand) [C]', () => {
    const points = [
      { id: 'a', cost: 10, benefit: 5 },
      { id: 'b', cost: 12, benefit: 9 },
      { id: 'c', cost: 12, benefit: 7 }, // same cost as b, less benefit → dominated
      { id: 'd', cost: 15, benefit: 9 }, // same benefit as b, dearer → dominated
      { id: 'e', cost: 20, benefit: 14 },
      { id: 'f', cost: 8, benefit: 2 },
      { id: 'g', cost: 25, benefit: 13 }, // beaten by e
    ];
    expect(paretoFrontier(points)).toEqual(['f', 'a', 'b', 'e']);
  });

  it('keeps identical points together', () => {
    expect(
      paretoFrontier([
        { id: 'y', cost: 5, benefit: 5 },
        { id: 'x', cost: 5, benefit: 5 },
        { id: 'z', cost: 6, benefit: 5 },
      ]),
    ).toEqual(['x', 'y']);
    expect(paretoFrontier([])).toEqual([]);
  });

  it('matches the definition on random lineups (property) [C]', () => {
    fc.assert(
      fc.property(fc.array(fc.record({ cost: fc.integer({ min: 0, max: 12 }), benefit: fc.integer({ min: 0, max: 12 }) }), { maxLength: 30 }), (raw) => {
        const points = raw.map((p, k) => ({ id: `d${String(k).padStart(2, '0')}`, ...p }));
        expect(paretoFrontier(points)).toEqual(bruteForce(points));
      }),
    );
  });

  it('names a bad point', () => {
    expect(() => paretoFrontier([{ id: 'a', cost: Number.NaN, benefit: 1 }])).toThrow(/points\[0\]\.cost/);
    expect(() => paretoFrontier([{ id: 'a', cost: 1, benefit: Infinity }])).toThrow(/points\[0\]\.benefit/);
    expect(() =>
      paretoFrontier([
        { id: 'a', cost: 1, benefit: 1 },
        { id: 'a', cost: 2, benefit: 2 },
      ]),
    ).toThrow(/points\[1\]\.id "a" appears more than once/);
    expect(() => paretoFrontier([{ id: '', cost: 1, benefit: 1 }])).toThrow(/points\[0\]\.id/);
    expect(() => paretoFrontier('x' as never)).toThrow(/points must be a list/);
  });
});

describe('paretoFrontierXY', () => {
  const pts = [
    { id: 'a', x: 10, y: 5 },
    { id: 'b', x: 20, y: 9 },
    { id: 'c', x: 15, y: 2 },
    { id: 'd', x: 5, y: 8 },
  ];

  it('handles every direction of the axes and returns ascending x [C]', () => {
    // Low x and high y better (price vs energy): d (5, 8) beats a and c; b has the most y.
    expect(paretoFrontierXY(pts, { xBetter: 'low', yBetter: 'high' })).toEqual(['d', 'b']);
    // High x and high y better: b beats everything.
    expect(paretoFrontierXY(pts, { xBetter: 'high', yBetter: 'high' })).toEqual(['b']);
    // Low x, low y: d (5, 8), a (10, 5), c (15, 2) trade off.
    expect(paretoFrontierXY(pts, { xBetter: 'low', yBetter: 'low' })).toEqual(['d', 'a', 'c']);
    // High x, low y: c (15, 2) and b (20, 9).
    expect(paretoFrontierXY(pts, { xBetter: 'high', yBetter: 'low' })).toEqual(['c', 'b']);
  });

  it('names bad directions and values', () => {
    expect(() => paretoFrontierXY(pts, { xBetter: 'up' as never, yBetter: 'high' })).toThrow(/xBetter must be "low" or "high"/);
    expect(() => paretoFrontierXY([{ id: 'a', x: 1, y: Number.NaN }], { xBetter: 'low', yBetter: 'high' })).toThrow(/points\[0\]\.y/);
  });
});
