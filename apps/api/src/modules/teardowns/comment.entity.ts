import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { UserSchema } from '../users/user.entity';
import { TeardownSchema } from './teardown.entity';

/** A comment on a teardown; review decisions (send back with a note) are comments too. */
export const CommentSchema = defineEntity({
  name: 'Comment',
  tableName: 'comments',
  properties: {
    id: p.integer().primary().autoincrement(),
    teardown: () => p.manyToOne(TeardownSchema).deleteRule('cascade'),
    author: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    kind: p.enum(['comment', 'sent-back', 'approved', 'submitted']).default('comment'),
    body: p.text(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type Comment = InferEntity<typeof CommentSchema>;
