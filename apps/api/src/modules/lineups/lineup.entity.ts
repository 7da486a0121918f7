import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { LINEUP_STATUS } from '@splitcase/contracts';
import { UserSchema } from '../users/user.entity';

/**
 * A named set of devices compared side by side in one reporting currency, with metric weights for
 * the ranking. Drafts are for the team; viewers see published lineups. `version` gives optimistic locking.
 */
export const LineupSchema = defineEntity({
  name: 'Lineup',
  tableName: 'lineups',
  indexes: [{ properties: ['status'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    name: p.string().length(160),
    description: p.text().nullable(),
    /** Reporting currency of the money metrics (ISO 4217). */
    currency: p.string().length(3),
    /** Metric key → weight 0..10 (every metric key present). */
    weights: p.json<Record<string, number>>(),
    /** Which operating mode of each device is compared ({ rule, name? }); null: the most power at the main load. */
    modeChoice: p.json<{ rule: 'highest' | 'lowest' | 'power-bank' | 'named'; name?: string }>().nullable(),
    status: p.enum([...LINEUP_STATUS.values]).default('draft'),
    createdBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    publishedAt: p.datetime().nullable(),
    publishedBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    version: p.integer().version(),
  },
});
export type Lineup = InferEntity<typeof LineupSchema>;
