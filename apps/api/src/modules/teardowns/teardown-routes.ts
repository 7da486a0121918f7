// The one shape of the routes of a teardown's records (parts, pack, loads, converters, modes,
// readings…): a read of a teardown the caller may read, and a change to its content in one
// transaction (access, the in-review and published rule of access.ts, the change and its audit
// entries together). A record of the teardown is found by id within it, or 404.
import type { EntityManager } from '@mikro-orm/sqlite';
import type { EntityName, FilterQuery } from '@mikro-orm/core';
import { idParam } from '@splitcase/contracts';
import type { z, ZodType } from 'zod';
import { notFound } from '../../http/errors';
import { route, type Access, type RouteContext, type RouteDef, type RouteSpec } from '../../http/route';
import { CONTENT_EDITORS, readableTeardown } from './access';
import { changeTeardownContent } from './content-change';
import type { Teardown } from './teardown.entity';

type None = ZodType<undefined>;
type TeardownParams = ZodType<{ id: number }>;
type Spec<B extends ZodType, Q extends ZodType, P extends ZodType> = Omit<RouteSpec<B, Q, P>, 'access' | 'params'> & { access?: Access; params?: P };

/** GET of a teardown's records (signed in; viewers: published teardowns only). The handler gets the teardown. */
export function teardownRead<Q extends ZodType = None, P extends TeardownParams = typeof idParam>(
  spec: Omit<Spec<None, Q, P>, 'method'>,
  handler: (ctx: RouteContext<undefined, z.output<Q>, z.output<P>>, t: Teardown) => unknown,
): RouteDef {
  return route<None, Q, P>({ method: 'get', access: 'signed-in', params: idParam as unknown as P, ...spec }, async (ctx) => handler(ctx, await readableTeardown(ctx.em, ctx.user, ctx.params.id)));
}

/** A change to the content of the teardown `:id` (content editors unless `access` says otherwise); `undefined` answers 204. */
export function teardownWrite<B extends ZodType = None, P extends TeardownParams = typeof idParam>(
  spec: Spec<B, None, P>,
  handler: (ctx: RouteContext<z.output<B>, undefined, z.output<P>>, tx: EntityManager, t: Teardown) => Promise<unknown>,
): RouteDef {
  const roles = spec.access ?? CONTENT_EDITORS;
  return route<B, None, P>({ access: CONTENT_EDITORS, params: idParam as unknown as P, ...spec }, (ctx) =>
    changeTeardownContent(ctx, ctx.params.id, (tx, t) => handler(ctx, tx, t), roles === 'public' || roles === 'signed-in' ? CONTENT_EDITORS : roles),
  );
}

/**
 * A change to one record addressed by its own id (`/api/parts/:id`): the record's teardown is
 * changed as by `teardownWrite`, and the handler gets the record loaded again inside the transaction.
 */
export function recordWrite<T extends { teardown: { id: number } }, B extends ZodType = None>(
  spec: Spec<B, None, typeof idParam>,
  record: { entity: EntityName<T>; what: string; populate?: readonly string[] },
  handler: (ctx: RouteContext<z.output<B>, undefined, { id: number }>, tx: EntityManager, t: Teardown, found: T) => Promise<unknown>,
): RouteDef {
  return route<B, None, typeof idParam>({ access: CONTENT_EDITORS, params: idParam, ...spec }, async (ctx) => {
    const where = { id: ctx.params.id } as FilterQuery<T>;
    const found = await ctx.em.findOne(record.entity, where);
    if (!found) throw notFound(record.what);
    return changeTeardownContent(ctx, found.teardown.id, async (tx, t) => handler(ctx, tx, t, (await tx.findOneOrFail(record.entity, where, { populate: (record.populate ?? []) as never })) as T));
  });
}

/** The record `id` of teardown `t`, or 404 naming it ("The load"). */
export async function recordOf<T extends object>(em: EntityManager, entity: EntityName<T>, id: number, t: Pick<Teardown, 'id'>, what: string): Promise<T> {
  const found = await em.findOne(entity, { id, teardown: t.id } as FilterQuery<T>);
  if (!found) throw notFound(what);
  return found as T;
}
