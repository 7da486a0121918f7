import type { EntityManager } from '@mikro-orm/sqlite';
import type { TeardownFigureInput } from '@splitcase/calc';
import type { Teardown } from '../teardowns/teardown.entity';
import { BenchRunSchema } from './bench-run.entity';

/**
 * Feeds the teardown figures with what the bench measured: the capacity delivered by the latest
 * discharge run (pack terminals, Ah) — calc turns it into capacity.measuredVsLabel and the capacity
 * suggestion — and the peak surface temperature of the latest thermal run, which the touch margin
 * uses instead of the estimate (the same peak the run's own burn-threshold margin uses).
 */
export async function benchRunFigureInput(em: EntityManager, teardown: Teardown): Promise<Partial<TeardownFigureInput>> {
  const latest = (kind: 'discharge' | 'thermal') => em.findOne(BenchRunSchema, { teardown: teardown.id, kind }, { orderBy: { createdAt: 'desc', id: 'desc' } });
  const [discharge, thermal] = [await latest('discharge'), await latest('thermal')];
  const out: Partial<TeardownFigureInput> = {};
  const ampHours = discharge?.analysis.ampHours;
  if (typeof ampHours === 'number' && Number.isFinite(ampHours)) out.measuredCapacityAh = ampHours;
  const peak = thermal?.analysis.thermal?.maxC;
  if (thermal && typeof peak === 'number' && Number.isFinite(peak)) out.measuredSurface = { temperatureC: peak, basis: `peak of the thermal run "${thermal.label}"` };
  return out;
}
