import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { UserSchema } from '../users/user.entity';

/** One change made through the API: who, when, what. */
export const AuditEntrySchema = defineEntity({
  name: 'AuditEntry',
  tableName: 'audit_entries',
  indexes: [{ properties: ['entityType', 'entityId'] }, { properties: ['scopeType', 'scopeId'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    at: p.datetime().onCreate(() => new Date()),
    actor: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    action: p.string().length(60),
    entityType: p.string().length(60),
    entityId: p.string().length(60),
    /** The record this change belongs to for history pages (e.g. a teardown for a part change). */
    scopeType: p.string().length(60).nullable(),
    scopeId: p.string().length(60).nullable(),
    summary: p.string().length(500),
    changes: p.json<Record<string, { from: unknown; to: unknown }>>().nullable(),
  },
});
export type AuditEntry = InferEntity<typeof AuditEntrySchema>;
