import type { EntityManager } from '@mikro-orm/sqlite';
import type { TeardownFigureInput } from '@splitcase/calc';
import type { Teardown } from '../teardowns/teardown.entity';
import { findInChunks, refId } from '../../db/batch';
import { BenchRunSchema, type BenchRun } from './bench-run.entity';


/**
 * Feeds the teardown figures with what the bench measured: the capacity delivered by the latest
 * discharge run (pack terminals, Ah) — calc turns it into capacity.measuredVsLabel and the capacity
 * suggestion — and the peak surface temperature of the latest thermal run, which the touch margin
 * uses instead of the estimate (the same peak the run's own burn-threshold margin uses).
 */
export async function benchRunFigureInputs(em: EntityManager, teardowns: Teardown[]): Promise<Map<number, Partial<TeardownFigureInput>>> {
  const runs = await findInChunks(
    teardowns.map((t) => t.id),
    (chunk) =>
      em.find(
        BenchRunSchema,
        { teardown: { $in: chunk }, kind: { $in: ['discharge', 'thermal'] } },
        { fields: ['teardown', 'kind', 'label', 'analysis', 'createdAt'] as never, orderBy: { createdAt: 'desc', id: 'desc' } },
      ),
  );
  // Newest first: the first run of a kind seen for a teardown is its latest.
  const latest = new Map<string, BenchRun>();
  for (const r of runs) {
    const key = `${refId(r.teardown)}:${r.kind}`;
    if (!latest.has(key)) latest.set(key, r);
  }
  const out = new Map<number, Partial<TeardownFigureInput>>();
  for (const t of teardowns) {
    const discharge = latest.get(`${t.id}:discharge`);
    const thermal = latest.get(`${t.id}:thermal`);
    const add: Partial<TeardownFigureInput> = {};
    const ampHours = discharge?.analysis.ampHours;
    if (typeof ampHours === 'number' && Number.isFinite(ampHours)) add.measuredCapacityAh = ampHours;
    const peak = thermal?.analysis.thermal?.maxC;
    if (thermal && typeof peak === 'number' && Number.isFinite(peak)) add.measuredSurface = { temperatureC: peak, basis: `peak of the thermal run "${thermal.label}"` };
    out.set(t.id, add);
  }
  return out;
}
