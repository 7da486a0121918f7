import type { EntityManager } from '@mikro-orm/sqlite';
import type { AuthUser } from '../../http/route';
import { UserSchema } from '../users/user.entity';
import { AuditEntrySchema } from './audit-entry.entity';

export type Changes = Record<string, { from: unknown; to: unknown }>;

/** Field-by-field differences between two plain snapshots (only the keys given). */
export function diffChanges<T extends Record<string, unknown>>(before: T, after: Partial<T>, keys?: (keyof T)[]): Changes {
  const out: Changes = {};
  for (const key of keys ?? (Object.keys(after) as (keyof T)[])) {
    if (!(key in after)) continue;
    const a = normalise(before[key]);
    const b = normalise(after[key]);
    if (JSON.stringify(a) !== JSON.stringify(b)) out[String(key)] = { from: a, to: b };
  }
  return out;
}

function normalise(v: unknown): unknown {
  if (v instanceof Date) return v.toISOString();
  return v ?? null;
}

/** Queue an audit entry in the unit of work; the caller's flush writes it with the change. */
export function recordAudit(
  em: EntityManager,
  actor: AuthUser | null,
  entry: {
    action: string;
    entityType: string;
    entityId: string | number;
    summary: string;
    changes?: Changes | null;
    scope?: { type: string; id: string | number };
  },
): void {
  em.create(AuditEntrySchema, {
    actor: actor ? em.getReference(UserSchema, actor.id) : null,
    action: entry.action,
    entityType: entry.entityType,
    entityId: String(entry.entityId),
    scopeType: entry.scope?.type ?? null,
    scopeId: entry.scope ? String(entry.scope.id) : null,
    summary: entry.summary.slice(0, 500),
    changes: entry.changes && Object.keys(entry.changes).length ? entry.changes : null,
  });
}
