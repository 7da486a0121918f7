import type { EntityManager } from '@mikro-orm/sqlite';
import type { TeardownFigureInput } from '@splitcase/calc';
import type { Teardown } from '../teardowns/teardown.entity';
import { findInChunks, refId } from '../../db/batch';
import { MeasurementSchema } from './measurement.entity';

/**
 * Feeds the teardown figures with the hottest surface-temperature reading of each teardown: the touch
 * margin then uses it instead of the estimate (the figures service keeps the hotter of this and a
 * thermal run's peak). One query for any number of teardowns.
 */
export async function readingFigureInputs(em: EntityManager, teardowns: Teardown[]): Promise<Map<number, Partial<TeardownFigureInput>>> {
  const rows = await findInChunks(
    teardowns.map((t) => t.id),
    (chunk) => em.find(MeasurementSchema, { teardown: { $in: chunk }, quantity: 'surface-temperature' }, { fields: ['teardown', 'value', 'subject', 'entered'] as never }),
  );
  const out = new Map<number, Partial<TeardownFigureInput>>();
  for (const r of rows) {
    const id = refId(r.teardown);
    const value = Number(r.value);
    const seen = out.get(id)?.measuredSurface;
    if (!seen || value > seen.temperatureC) out.set(id, { measuredSurface: { temperatureC: value, basis: `reading "${r.subject}" (${r.entered})` } });
  }
  return out;
}
