import type { EntityManager } from '@mikro-orm/sqlite';
import type { FilterQuery } from '@mikro-orm/core';
import type { Request } from 'express';
import { CONFIRM_UNPUBLISH_HEADER, type Role, type TeardownPermissions } from '@splitcase/contracts';
import { AppError, forbidden, notFound } from '../../http/errors';
import type { AuthUser } from '../../http/route';
import { recordAudit } from '../audit/audit.service';
import { TeardownSchema, type Teardown } from './teardown.entity';

/** Roles that edit teardown content (device, parts, photos, power system, measurements, runs, findings). */
export const CONTENT_EDITORS: readonly Role[] = ['admin', 'engineer'];
/** Roles that approve or send back. */
export const REVIEWERS: readonly Role[] = ['admin', 'lead'];
/** Roles that edit prices, rates and cost models. */
export const PRICE_EDITORS: readonly Role[] = ['admin', 'sourcing'];
/** Roles that comment. */
export const COMMENTERS: readonly Role[] = ['admin', 'engineer', 'sourcing', 'lead'];
/** Every role but viewer reads drafts and teardowns in review. */
export const DRAFT_READERS: readonly Role[] = ['admin', 'engineer', 'sourcing', 'lead'];

export const canSee = (user: AuthUser, t: Pick<Teardown, 'status'>) => t.status === 'published' || DRAFT_READERS.includes(user.role);

/** A filter that limits teardown queries to what this user may read. */
export function visibleTeardowns(user: AuthUser): FilterQuery<Teardown> {
  return DRAFT_READERS.includes(user.role) ? {} : { status: 'published' };
}

export function permissionsFor(user: AuthUser): TeardownPermissions {
  return {
    edit: CONTENT_EDITORS.includes(user.role),
    review: REVIEWERS.includes(user.role),
    comment: COMMENTERS.includes(user.role),
    editPrices: PRICE_EDITORS.includes(user.role),
  };
}

/** Load a teardown the user may read; a viewer asking for an unpublished one gets 404, as if it did not exist. */
export async function readableTeardown(em: EntityManager, user: AuthUser, id: number): Promise<Teardown> {
  const t = await em.findOne(TeardownSchema, { id }, { populate: ['device', 'engineer'] });
  if (!t || !canSee(user, t)) throw notFound('The teardown');
  return t;
}

/**
 * Load a teardown for a change by one of `roles` (default: content editors). A change to a
 * published teardown needs the confirm header and moves it back to draft (audited); the caller flushes.
 */
export async function editableTeardown(
  ctx: { em: EntityManager; user: AuthUser; req: Request },
  id: number,
  roles: readonly Role[] = CONTENT_EDITORS,
): Promise<Teardown> {
  const t = await readableTeardown(ctx.em, ctx.user, id);
  if (!roles.includes(ctx.user.role)) throw forbidden();
  if (t.status === 'published') {
    if (ctx.req.get(CONFIRM_UNPUBLISH_HEADER)?.toLowerCase() !== 'yes') {
      throw new AppError('conflict', 'This teardown is published. Changing it moves it back to draft; it will need review again.', undefined, {
        reason: 'published',
      });
    }
    t.status = 'draft';
    t.publishedAt = null;
    recordAudit(ctx.em, ctx.user, {
      action: 'teardown.unpublished',
      entityType: 'teardown',
      entityId: t.id,
      scope: { type: 'teardown', id: t.id },
      summary: 'Edited after publication: back to draft',
      changes: { status: { from: 'published', to: 'draft' } },
    });
  }
  return t;
}
