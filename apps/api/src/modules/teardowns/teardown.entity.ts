import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { TEARDOWN_STATUS } from '@splitcase/contracts';
import { DeviceSchema } from '../devices/device.entity';
import { UserSchema } from '../users/user.entity';

/** One unit of a device taken apart. `version` gives optimistic locking (stale PATCH → 409). */
export const TeardownSchema = defineEntity({
  name: 'Teardown',
  tableName: 'teardowns',
  indexes: [{ properties: ['status'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    device: () => p.manyToOne(DeviceSchema).deleteRule('cascade'),
    engineer: () => p.manyToOne(UserSchema),
    unitLabel: p.string().length(80).nullable(),
    date: p.string().length(10),
    status: p.enum([...TEARDOWN_STATUS.values]).default('draft'),
    summary: p.text().nullable(),
    safetyNotes: p.text().nullable(),
    /** Contact time assumed for touch-temperature figures (s). */
    contactSeconds: p.integer().nullable(),
    version: p.integer().version(),
    submittedAt: p.datetime().nullable(),
    publishedAt: p.datetime().nullable(),
    publishedBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    lastReviewNote: p.text().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type Teardown = InferEntity<typeof TeardownSchema>;
