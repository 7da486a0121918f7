import type { EntityManager } from '@mikro-orm/sqlite';
import type { FilterQuery } from '@mikro-orm/core';
import type { Role, TeardownPermissions } from '@splitcase/contracts';
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

/** Its engineer, or an admin, may take a teardown back out of review to edit it. */
export const mayWithdraw = (user: AuthUser, t: Pick<Teardown, 'engineer'>) => user.role === 'admin' || t.engineer.id === user.id;

/** What the user may do with this teardown now: a teardown in review is read-only until withdrawn. */
export function permissionsFor(user: AuthUser, t: Pick<Teardown, 'status' | 'engineer'>): TeardownPermissions {
  const inReview = t.status === 'in_review';
  return {
    edit: CONTENT_EDITORS.includes(user.role) && !inReview,
    review: REVIEWERS.includes(user.role),
    comment: COMMENTERS.includes(user.role),
    editPrices: PRICE_EDITORS.includes(user.role),
    withdraw: inReview && mayWithdraw(user, t),
  };
}

/** Load a teardown the user may read; a viewer asking for an unpublished one gets 404, as if it did not exist. */
export async function readableTeardown(em: EntityManager, user: AuthUser, id: number): Promise<Teardown> {
  const t = await em.findOne(TeardownSchema, { id }, { populate: ['device', 'engineer'] });
  if (!t || !canSee(user, t)) throw notFound('The teardown');
  return t;
}

/** Who is changing a teardown, and whether they confirmed moving a published one back to draft. */
export interface TeardownWriter {
  em: EntityManager;
  user: AuthUser;
  /** `ctx.confirmUnpublish` of the route (the X-Confirm-Unpublish header). */
  confirmUnpublish: boolean;
}

/**
 * The one rule for a write to a teardown's content: a teardown in review is read-only (409,
 * `details.reason = 'in_review'`; its engineer withdraws it first), a published one needs the
 * confirm (409, `details.reason = 'published'`). Also run before an upload's body is read.
 */
export function assertWritable(t: Pick<Teardown, 'status'>, confirmUnpublish: boolean): void {
  if (t.status === 'in_review') {
    throw new AppError('conflict', 'This teardown is in review, so it is read-only. Withdraw it from review to edit it.', undefined, { reason: 'in_review' });
  }
  if (t.status === 'published' && !confirmUnpublish) {
    throw new AppError('conflict', 'This teardown is published. Changing it moves it back to draft; it will need review again.', undefined, { reason: 'published' });
  }
}

/**
 * Load a teardown for a change by one of `roles` (default: content editors). A teardown in review
 * is refused; a change to a published teardown needs the confirm and moves it back to draft
 * (audited); the caller flushes.
 */
export async function editableTeardown(ctx: TeardownWriter, id: number, roles: readonly Role[] = CONTENT_EDITORS): Promise<Teardown> {
  const t = await readableTeardown(ctx.em, ctx.user, id);
  if (!roles.includes(ctx.user.role)) throw forbidden();
  assertWritable(t, ctx.confirmUnpublish);
  if (t.status === 'published') {
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
