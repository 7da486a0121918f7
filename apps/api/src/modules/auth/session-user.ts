import type { EntityManager } from '@mikro-orm/sqlite';
import type { RequestHandler } from 'express';
import { UserSchema } from '../users/user.entity';

declare module 'express-session' {
  interface SessionData {
    userId?: number;
  }
}

/**
 * Loads the signed-in user for every request. A session whose user was deactivated or removed
 * is destroyed here, so a deactivated user is signed out on their next request.
 */
export function loadSessionUser(getEm: () => EntityManager): RequestHandler {
  return async (req, _res, next) => {
    req.authUser = null;
    const id = req.session?.userId;
    if (!id) return next();
    try {
      const user = await getEm().findOne(UserSchema, { id });
      if (!user || !user.active) {
        req.session.destroy(() => next());
        return;
      }
      req.authUser = { id: user.id, email: user.email, name: user.name, role: user.role };
      next();
    } catch (err) {
      next(err);
    }
  };
}
