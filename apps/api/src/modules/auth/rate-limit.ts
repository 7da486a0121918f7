import type { Request, RequestHandler } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { AppError } from '../../http/errors';

function limited(req: Request): AppError {
  const reset = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
  const retryAfterS = Math.max(1, Math.ceil(((reset?.getTime() ?? Date.now() + 60_000) - Date.now()) / 1000));
  return new AppError('rate_limited', `Too many attempts. Try again in ${retryAfterS} s.`, undefined, { retryAfterS });
}

const WINDOW_MS = 15 * 60 * 1000;

/**
 * Sign-in limit per client address: failed attempts only, 429 past the limit. The address is the
 * socket's unless `trust proxy` is configured (env SPLITCASE_TRUST_PROXY), so a forged
 * X-Forwarded-For cannot spread guesses over made-up addresses. Accounts are never locked: they get a
 * progressive delay instead (login-throttle.ts).
 */
export function loginIpLimiter(perIp: number): RequestHandler {
  return rateLimit({
    windowMs: WINDOW_MS,
    limit: perIp,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
    // Without a configured proxy the header is ignored on purpose; no warning for it.
    validate: { xForwardedForHeader: false },
    handler: (req, _res, next) => next(limited(req)),
  });
}

/** A general limit for e-mail-sending public endpoints (reset requests). */
export function mailLimiter(limit: number): RequestHandler {
  return rateLimit({
    windowMs: WINDOW_MS,
    limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    validate: { xForwardedForHeader: false },
    handler: (req, _res, next) => next(limited(req)),
  });
}
