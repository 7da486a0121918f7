import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { UserSchema } from '../users/user.entity';

export const ResetTokenSchema = defineEntity({
  name: 'ResetToken',
  tableName: 'password_reset_tokens',
  properties: {
    id: p.integer().primary().autoincrement(),
    user: () => p.manyToOne(UserSchema).deleteRule('cascade'),
    tokenHash: p.string().length(64).unique().hidden(),
    createdAt: p.datetime().onCreate(() => new Date()),
    expiresAt: p.datetime(),
    usedAt: p.datetime().nullable(),
  },
});
export type ResetToken = InferEntity<typeof ResetTokenSchema>;
