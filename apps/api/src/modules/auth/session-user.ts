import type { EntityManager } from '@mikro-orm/sqlite';
import type { RequestHandler } from 'express';
import { getSettings } from '../settings/settings.service';
import { UserSchema } from '../users/user.entity';
import { cookieMaxAge, SEEN_RESOLUTION_MS, sessionExpiry } from './sessions';

/**
 * Loads the signed-in user for every request. A session ends here (destroyed, the request is
 * anonymous) when its user was deactivated or removed, when the user's sessions were ended since it
 * began (password reset or change: the epoch moved), and past the workspace's absolute or idle limit.
 */
export function loadSessionUser(getEm: () => EntityManager): RequestHandler {
  return async (req, _res, next) => {
    req.authUser = null;
    const id = req.session?.userId;
    if (!id) return next();
    try {
      const em = getEm();
      const user = await em.findOne(UserSchema, { id });
      const settings = await getSettings(em);
      const limits = { maxHours: settings.sessionMaxHours, idleMinutes: settings.sessionIdleMinutes };
      const now = Date.now();
      if (!user || !user.active || (req.session.epoch ?? 0) !== user.sessionEpoch || sessionExpiry(req.session, limits, now)) {
        req.session.destroy(() => next());
        return;
      }
      if (now - (req.session.lastSeenAt ?? 0) >= SEEN_RESOLUTION_MS) req.session.lastSeenAt = now;
      req.session.cookie.maxAge = cookieMaxAge(req.session, limits, now);
      req.authUser = { id: user.id, email: user.email, name: user.name, role: user.role };
      next();
    } catch (err) {
      next(err);
    }
  };
}
