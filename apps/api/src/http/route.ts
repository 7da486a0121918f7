import type { EntityManager } from '@mikro-orm/sqlite';
import type { Request, RequestHandler, Response, Router } from 'express';
import { CONFIRM_UNPUBLISH_HEADER, type PriceView, type Role } from '@splitcase/contracts';
import { z, type ZodType } from 'zod';
import { AppError, forbidden, validationError, zodFields } from './errors';
import type { AppDeps } from './deps';
import { priceViewFor } from '../modules/cost/price-visibility';

/** Who may call a route. There is no default: every route says it (deny by default). */
export type Access = 'public' | 'signed-in' | readonly Role[];

export interface AuthUser {
  id: number;
  email: string;
  name: string;
  role: Role;
}

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteSpec<B extends ZodType, Q extends ZodType, P extends ZodType> {
  method: Method;
  /** Express path, e.g. `/api/users/:id`. */
  path: string;
  summary: string;
  tag: string;
  access: Access;
  body?: B;
  query?: Q;
  params?: P;
  /** Documented success body (OpenAPI). */
  response?: ZodType;
  /** Success status when the handler returns a value (default 200). */
  status?: number;
  /** multipart/form-data fields, documented in OpenAPI; parsing is done by `before`. */
  multipart?: Record<string, 'file' | 'string'>;
  /** Extra middleware run after the access check and before validation (e.g. multer). */
  before?: RequestHandler[];
  /** Responses other than JSON (files, CSV): documented content type. */
  produces?: string;
  /**
   * The answer can carry supplier price detail (breaks, quote sources and confidence, line prices,
   * price history): the handler gets the caller's `priceView` from the one rule
   * (modules/cost/price-visibility.ts) and leaves the detail out of a 'totals' view.
   */
  prices?: 'by-role';
}

export interface RouteContext<B, Q, P> {
  req: Request;
  res: Response;
  body: B;
  query: Q;
  params: P;
  em: EntityManager;
  deps: AppDeps;
  /** The signed-in user; throws on public routes without one. */
  user: AuthUser;
  maybeUser: AuthUser | null;
  /** 'detail' or 'totals' for this caller; only on routes that declare `prices` in the route table. */
  priceView: PriceView;
  /** The request carries `X-Confirm-Unpublish: yes`: a write may move a published teardown back to draft. */
  confirmUnpublish: boolean;
}

/** The one reading of the confirm header (handlers get it as `ctx.confirmUnpublish`). */
export const confirmsUnpublish = (req: Request): boolean => req.get(CONFIRM_UNPUBLISH_HEADER)?.toLowerCase() === 'yes';

export interface RouteDef {
  spec: RouteSpec<ZodType, ZodType, ZodType>;
  handler: (ctx: RouteContext<unknown, unknown, unknown>) => unknown;
}

export function route<B extends ZodType = ZodType<undefined>, Q extends ZodType = ZodType<undefined>, P extends ZodType = ZodType<undefined>>(
  spec: RouteSpec<B, Q, P>,
  handler: (ctx: RouteContext<z.output<B>, z.output<Q>, z.output<P>>) => unknown,
): RouteDef {
  return { spec, handler } as unknown as RouteDef;
}

/** Role check shared by routes and services. */
export function allows(access: Access, user: AuthUser | null): boolean {
  if (access === 'public') return true;
  if (!user) return false;
  if (access === 'signed-in') return true;
  return access.includes(user.role);
}

function parsePart<T extends ZodType>(schema: T | undefined, value: unknown, where: string) {
  if (!schema) return undefined;
  const result = schema.safeParse(value ?? {});
  if (!result.success) throw validationError(zodFields(result.error, where === 'body' ? undefined : where));
  return result.data;
}

export function mountRoutes(router: Router, defs: RouteDef[], deps: AppDeps, getEm: () => EntityManager): void {
  const seen = new Set<string>();
  for (const def of defs) {
    const { spec } = def;
    const key = `${spec.method} ${spec.path}`;
    if (seen.has(key)) throw new Error(`Route defined twice: ${key}`);
    seen.add(key);
    if (!spec.access) throw new Error(`Route ${key} does not say who may call it`);

    const guard: RequestHandler = (req, _res, next) => {
      const user = req.authUser ?? null;
      if (spec.access !== 'public' && !user) return next(new AppError('unauthenticated', 'Sign in to continue.'));
      if (!allows(spec.access, user)) return next(forbidden());
      next();
    };
    const run: RequestHandler = async (req, res) => {
      const body = parsePart(spec.body, req.body, 'body');
      const query = parsePart(spec.query, req.query, 'query');
      const params = parsePart(spec.params, req.params, 'params');
      const maybeUser = req.authUser ?? null;
      const ctx: RouteContext<unknown, unknown, unknown> = {
        req,
        res,
        body,
        query,
        params,
        em: getEm(),
        deps,
        maybeUser,
        confirmUnpublish: confirmsUnpublish(req),
        get user() {
          if (!maybeUser) throw new AppError('unauthenticated', 'Sign in to continue.');
          return maybeUser;
        },
        get priceView() {
          if (!spec.prices) throw new Error(`Route ${key} reads price detail but does not declare prices in the route table`);
          return priceViewFor(maybeUser);
        },
      };
      const result = await def.handler(ctx);
      if (res.headersSent) return;
      if (result === undefined) res.status(204).end();
      else res.status(spec.status ?? 200).json(result);
    };
    router[spec.method](spec.path, guard, ...(spec.before ?? []), run);
  }
}

declare module 'express-serve-static-core' {
  interface Request {
    authUser?: AuthUser | null;
  }
}
