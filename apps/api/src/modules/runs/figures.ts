import type { EntityManager } from '@mikro-orm/sqlite';
import type { TeardownFigureInput } from '@splitcase/calc';
import type { Teardown } from '../teardowns/teardown.entity';
import { BenchRunSchema } from './bench-run.entity';

/**
 * Feeds the teardown figures with the capacity delivered by the latest discharge run (pack
 * terminals, Ah); calc's teardownFigures turns it into capacity.measuredVsLabel and the
 * capacity suggestion.
 */
export async function benchRunFigureInput(em: EntityManager, teardown: Teardown): Promise<Partial<TeardownFigureInput>> {
  const latest = await em.findOne(BenchRunSchema, { teardown: teardown.id, kind: 'discharge' }, { orderBy: { createdAt: 'desc', id: 'desc' } });
  const ampHours = latest?.analysis.ampHours;
  return typeof ampHours === 'number' && Number.isFinite(ampHours) ? { measuredCapacityAh: ampHours } : {};
}
