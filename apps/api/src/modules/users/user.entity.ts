import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { ROLES } from '@splitcase/contracts';

export const UserSchema = defineEntity({
  name: 'User',
  tableName: 'users',
  properties: {
    id: p.integer().primary().autoincrement(),
    email: p.string().length(254).unique(),
    name: p.string().length(120),
    role: p.enum([...ROLES]),
    passwordHash: p.string().length(200).hidden(),
    active: p.boolean().default(true),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
    lastSignInAt: p.datetime().nullable(),
    /** Raised to end every session of the user at once (password reset or change, deactivation). */
    sessionEpoch: p.integer().default(0),
  },
});
export type User = InferEntity<typeof UserSchema>;
