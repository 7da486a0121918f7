import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { RATE_TABLE_KIND } from '@splitcase/contracts';
import { UserSchema } from '../users/user.entity';

/**
 * One saved table of currency reference rates: units of each currency per 1 unit of base
 * (the base is 1 and not listed). Tables are never changed once saved; a manual edit or an
 * import saves a new one, and the latest saved is the current table.
 */
export const RateTableSchema = defineEntity({
  name: 'RateTable',
  tableName: 'rate_tables',
  indexes: [{ properties: ['date'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    base: p.string().length(3),
    date: p.string().length(10),
    source: p.string().length(200),
    kind: p.enum([...RATE_TABLE_KIND.values]),
    rates: p.json<Record<string, number>>(),
    note: p.string().length(300).nullable(),
    createdBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type RateTable = InferEntity<typeof RateTableSchema>;
