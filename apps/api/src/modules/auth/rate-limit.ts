import type { Request, RequestHandler } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { AppError } from '../../http/errors';

function limited(req: Request): AppError {
  const reset = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
  const retryAfterS = Math.max(1, Math.ceil(((reset?.getTime() ?? Date.now() + 60_000) - Date.now()) / 1000));
  return new AppError('rate_limited', `Too many attempts. Try again in ${retryAfterS} s.`, undefined, { retryAfterS });
}

const WINDOW_MS = 15 * 60 * 1000;

/** Sign-in limits: per client address, and per account (failed attempts only). */
export function loginLimiters(perIp: number, perAccount: number): RequestHandler[] {
  const byIp = rateLimit({
    windowMs: WINDOW_MS,
    limit: perIp,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (req, _res, next) => next(limited(req)),
  });
  const byAccount = rateLimit({
    windowMs: WINDOW_MS,
    limit: perAccount,
    standardHeaders: false,
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    keyGenerator: (req) => {
      const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
      return email ? `account:${email}` : `ip:${ipKeyGenerator(req.ip ?? '')}`;
    },
    handler: (req, _res, next) => next(limited(req)),
  });
  return [byIp, byAccount];
}

/** A general limit for e-mail-sending public endpoints (reset requests). */
export function mailLimiter(limit: number): RequestHandler {
  return rateLimit({
    windowMs: WINDOW_MS,
    limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (req, _res, next) => next(limited(req)),
  });
}
