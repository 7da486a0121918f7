import { auditQuery, auditResponse } from '@splitcase/contracts';
import type { FilterQuery } from '@mikro-orm/core';
import { route } from '../../http/route';
import { AuditEntrySchema, type AuditEntry } from './audit-entry.entity';

export const auditRoutes = [
  route(
    {
      method: 'get',
      path: '/api/audit',
      tag: 'Admin',
      summary: 'The audit log: every change made through the API, newest first',
      access: ['admin'],
      query: auditQuery,
      response: auditResponse,
    },
    async ({ em, query }) => {
      const where: FilterQuery<AuditEntry> = {};
      if (query.entityType) where.entityType = query.entityType;
      if (query.entityId) where.entityId = query.entityId;
      if (query.before) where.id = { $lt: query.before };
      const rows = await em.find(AuditEntrySchema, where, {
        orderBy: { id: 'desc' },
        limit: query.limit,
        populate: ['actor'],
      });
      return { entries: rows.map(toAuditDto) };
    },
  ),
];

export function toAuditDto(a: AuditEntry) {
  return {
    id: a.id,
    at: a.at.toISOString(),
    actor: a.actor ? (a.actor.name ?? a.actor.email) : null,
    action: a.action,
    entityType: a.entityType,
    entityId: a.entityId,
    summary: a.summary,
    changes: a.changes ?? null,
  };
}
