import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import type { CostModelDto } from '@splitcase/contracts';
import { TeardownSchema } from '../teardowns/teardown.entity';
import { UserSchema } from '../users/user.entity';

/**
 * A cost model: the workspace default (no teardown) or one teardown's own model that replaces
 * the default for it. The model itself is validated by contracts' costModelSchema.
 */
export const CostModelSchema = defineEntity({
  name: 'CostModel',
  tableName: 'cost_models',
  properties: {
    id: p.integer().primary().autoincrement(),
    /** Null for the workspace default (one row); set for a teardown's own model. */
    teardown: () => p.oneToOne(TeardownSchema).owner().nullable().unique().deleteRule('cascade'),
    model: p.json<CostModelDto>(),
    updatedBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type CostModelRow = InferEntity<typeof CostModelSchema>;
