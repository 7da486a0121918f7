import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { ROLES } from '@splitcase/contracts';
import { UserSchema } from '../users/user.entity';

export const InvitationSchema = defineEntity({
  name: 'Invitation',
  tableName: 'invitations',
  properties: {
    id: p.integer().primary().autoincrement(),
    email: p.string().length(254),
    role: p.enum([...ROLES]),
    tokenHash: p.string().length(64).unique().hidden(),
    invitedBy: () => p.manyToOne(UserSchema).nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    expiresAt: p.datetime(),
    acceptedAt: p.datetime().nullable(),
    revokedAt: p.datetime().nullable(),
  },
});
export type Invitation = InferEntity<typeof InvitationSchema>;
