import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { TeardownSchema } from '../teardowns/teardown.entity';
import { UserSchema } from '../users/user.entity';

/** An uploaded image of a teardown layer; files live under uploads/<storageKey>/. */
export const PhotoSchema = defineEntity({
  name: 'Photo',
  tableName: 'photos',
  properties: {
    id: p.integer().primary().autoincrement(),
    teardown: () => p.manyToOne(TeardownSchema).deleteRule('cascade'),
    storageKey: p.string().length(64).unique(),
    originalName: p.string().length(255),
    mime: p.string().length(40),
    originalExt: p.string().length(8),
    width: p.integer(),
    height: p.integer(),
    bytes: p.integer(),
    caption: p.string().length(500).nullable(),
    layer: p.integer().default(1),
    step: p.integer().default(1),
    uploadedBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type Photo = InferEntity<typeof PhotoSchema>;
