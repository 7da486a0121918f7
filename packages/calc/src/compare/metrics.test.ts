import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { comparisonMetrics, METRIC_KEYS, METRICS, weightedScores } from './metrics';

const none = { note: 0, minor: 0, major: 0, critical: 0 };

describe('comparisonMetrics', () => {
  it('works out the normalised metrics [C]', () => {
    const m = comparisonMetrics({
      retailPrice: 25,
      packWh: 20,
      measuredWh: 4.6,
      labelWh: 5,
      runtimeH: 2.1,
      packMassKg: 0.096,
      heaterWatts: 9,
      heatedAreaM2: 0.006,
      shouldCost: 6.5,
      impliedMarginFraction: 0.42,
      findingsBySeverity: { note: 3, minor: 2, major: 1, critical: 0 },
    });
    expect(m.whPerCurrency).toBeCloseTo(0.8, 12); // 20 Wh / 25
    expect(m.whPerKg).toBeCloseTo(208.333333, 5); // 20 Wh / 0.096 kg, inside 100–265 Wh/kg (REFERENCES §4) [S]
    expect(m.heaterWPerCm2).toBeCloseTo(0.15, 12); // 9 W / 60 cm²
    expect(m.capacityVsLabel).toBeCloseTo(0.92, 12);
    expect(m).toMatchObject({
      retailPrice: 25,
      packWh: 20,
      runtimeH: 2.1,
      shouldCost: 6.5,
      impliedMargin: 0.42,
      findingsCritical: 0,
      findingsMajor: 1,
      findingsMinor: 2,
      findingsNote: 3,
    });
    expect(Object.keys(m).sort()).toEqual([...METRIC_KEYS].sort());
  });

  it('gives null, never 0, for metrics whose inputs are missing', () => {
    const m = comparisonMetrics({ packWh: 10, measuredWh: 2, heaterWatts: 4, findingsBySeverity: none });
    expect(m.retailPrice).toBeNull();
    expect(m.whPerCurrency).toBeNull();
    expect(m.whPerKg).toBeNull();
    expect(m.heaterWPerCm2).toBeNull();
    expect(m.capacityVsLabel).toBeNull();
    expect(m.runtimeH).toBeNull();
    expect(m.shouldCost).toBeNull();
    expect(m.impliedMargin).toBeNull();
    expect(m.packWh).toBe(10);
    expect(comparisonMetrics({ retailPrice: null, findingsBySeverity: none }).retailPrice).toBeNull();
  });

  it('names the wrong input', () => {
    expect(() => comparisonMetrics({ retailPrice: 0, findingsBySeverity: none })).toThrow(/retailPrice must be greater than zero/);
    expect(() => comparisonMetrics({ packMassKg: -1, findingsBySeverity: none })).toThrow(/packMassKg/);
    expect(() => comparisonMetrics({ packWh: Number.NaN, findingsBySeverity: none })).toThrow(/packWh/);
    expect(() => comparisonMetrics({ impliedMarginFraction: 1.5, findingsBySeverity: none })).toThrow(/impliedMarginFraction must not exceed 1/);
    expect(() => comparisonMetrics({ findingsBySeverity: { ...none, major: 1.5 } })).toThrow(/findingsBySeverity\.major/);
    expect(() => comparisonMetrics({} as never)).toThrow(/findingsBySeverity must give counts/);
    expect(() => comparisonMetrics(null as never)).toThrow(/device must be an object/);
  });

  it('describes every metric with a direction', () => {
    for (const key of METRIC_KEYS) {
      expect(METRICS[key].label).not.toBe('');
      expect(['high', 'low']).toContain(METRICS[key].better);
    }
    expect(METRICS.retailPrice.better).toBe('low');
    expect(METRICS.whPerKg.better).toBe('high');
    expect(METRICS.findingsCritical.better).toBe('low');
  });
});

describe('weightedScores', () => {
  const rows = [
    { id: 'A', metrics: { retailPrice: 20, packWh: 10, findingsCritical: 0, runtimeH: 2 } },
    { id: 'B', metrics: { retailPrice: 30, packWh: 20, findingsCritical: 1, runtimeH: 2 } },
    { id: 'C', metrics: { retailPrice: 25, packWh: null, findingsCritical: 0, runtimeH: 2 } },
  ];

  it('scores three rows worked by hand [C]', () => {
    // retailPrice (low better), range 20..30: A (30−20)/10 = 1, B 0, C (30−25)/10 = 0.5
    // packWh (high better), range 10..20 over A and B: A 0, B 1, C missing
    // findingsCritical (low better), range 0..1: A 1, B 0, C 1
    // weights 1, 2, 1:
    //   A = (1·1 + 2·0 + 1·1) / 4 = 0.50 → 50
    //   B = (1·0 + 2·1 + 1·0) / 4 = 0.50 → 50
    //   C = (1·0.5 + 1·1) / 2 = 0.75 → 75 (packWh left out, weights renormalised)
    const r = weightedScores(rows, { retailPrice: 1, packWh: 2, findingsCritical: 1 });
    // C lacks packWh, so it ranks after the complete rows whatever its score (issue 10 §2.9; it ranked first before).
    expect(r.map((x) => [x.id, x.score, x.rank])).toEqual([
      ['A', 50, 1], // tie with B broken by id
      ['B', 50, 2],
      ['C', 75, 3],
    ]);
    expect(r[2]!.normalised).toEqual({ retailPrice: 0.5, findingsCritical: 1 });
    expect(r[2]).toMatchObject({ complete: false, missing: ['packWh'] });
  });

  it('gives 1 to every row when a metric is equal across the lineup', () => {
    const r = weightedScores(rows, { runtimeH: 1 });
    expect(r.map((x) => x.score)).toEqual([100, 100, 100]);
    expect(r.map((x) => x.id)).toEqual(['A', 'B', 'C']);
  });

  it('ignores zero weights and ranks rows without any weighted metric last with a null score', () => {
    const r = weightedScores([...rows, { id: '0-empty', metrics: {} }], { packWh: 1, retailPrice: 0 });
    expect(r.map((x) => [x.id, x.score])).toEqual([
      ['B', 100],
      ['A', 0],
      ['0-empty', null], // null scores last, by id
      ['C', null],
    ]);
    expect(r.map((x) => x.rank)).toEqual([1, 2, 3, 4]);
  });

  it('stays within 0..100 and does not depend on row order (property)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            retailPrice: fc.option(fc.double({ min: 1, max: 100, noNaN: true }), { nil: null }),
            packWh: fc.option(fc.double({ min: 0, max: 100, noNaN: true }), { nil: null }),
          }),
          { minLength: 1, maxLength: 12 },
        ),
        fc.double({ min: 0.1, max: 5, noNaN: true }),
        (metrics, w) => {
          const input = metrics.map((m, k) => ({ id: `r${k}`, metrics: m }));
          const a = weightedScores(input, { retailPrice: 1, packWh: w });
          const b = weightedScores([...input].reverse(), { retailPrice: 1, packWh: w });
          expect(b).toEqual(a);
          for (const row of a) {
            if (row.score !== null) {
              expect(row.score).toBeGreaterThanOrEqual(0);
              expect(row.score).toBeLessThanOrEqual(100);
            }
          }
        },
      ),
    );
  });

  it('names the wrong input', () => {
    expect(() => weightedScores(rows, { price: 1 })).toThrow(/weights\.price: unknown metric/);
    expect(() => weightedScores(rows, { packWh: -1 })).toThrow(/weights\.packWh must not be negative/);
    expect(() => weightedScores(rows, { packWh: 0 })).toThrow(/at least one metric a weight above zero/);
    expect(() => weightedScores(rows, null as never)).toThrow(/weights must map/);
    expect(() => weightedScores('x' as never, { packWh: 1 })).toThrow(/rows must be a list/);
    expect(() => weightedScores([{ id: '', metrics: {} }], { packWh: 1 })).toThrow(/rows\[0\]\.id/);
    expect(() => weightedScores([rows[0]!, rows[0]!], { packWh: 1 })).toThrow(/rows\[1\]\.id "A" appears more than once/);
    expect(() => weightedScores([{ id: 'x', metrics: null as never }], { packWh: 1 })).toThrow(/rows\[0\]\.metrics must be an object/);
    expect(() => weightedScores([{ id: 'x', metrics: { packWh: Infinity } }], { packWh: 1 })).toThrow(/rows\[0\]\.metrics\.packWh/);
  });
});

describe('a missing metric is never rewarded (issue 10 §2.9)', () => {
  it('a row without one of the weighted metrics ranks after every row that has them all, and says which it lacks [C]', () => {
    // A has only Wh/kg (the best); B has both. Renormalised over what it has, A would score 100 and rank first.
    const r = weightedScores(
      [
        { id: 'A', metrics: { whPerKg: 250, shouldCost: null } },
        { id: 'B', metrics: { whPerKg: 150, shouldCost: 5 } },
        { id: 'C', metrics: { whPerKg: 200, shouldCost: 6 } },
      ],
      { whPerKg: 1, shouldCost: 1 },
    );
    expect(r.map((x) => x.id)).toEqual(['B', 'C', 'A']);
    expect(r.find((x) => x.id === 'A')).toMatchObject({ complete: false, missing: ['shouldCost'], rank: 3 });
    expect(r.find((x) => x.id === 'C')).toMatchObject({ complete: true, missing: [] });
  });
});
