// Server logs: JSON lines through pino, one per request through pino-http (method, route pattern,
// status, duration, user id) at the level LOG_LEVEL sets. Nothing from the request is logged
// beyond those: no URL (ids, query strings, reset tokens), no headers (cookies, CSRF tokens), no
// body (passwords). A server error is logged with its stack on its request's line, never sent.
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Request } from 'express';
import { pino, type DestinationStream, type Logger } from 'pino';
import { pinoHttp, type HttpLogger } from 'pino-http';
import type { LogLevel } from '../config/env';

/** The server's logger: JSON lines on stdout (or `destination`, e.g. a test's capture). */
export function createLogger(level: LogLevel, destination?: DestinationStream): Logger {
  const options = { level, base: { service: 'splitcase-api' }, serializers: { err: errorFields } };
  return destination ? pino(options, destination) : pino(options);
}

/** What is kept of an error: its type, message, code and stack (never its other properties, which may hold a request body). */
export function errorFields(err: unknown): Record<string, unknown> {
  if (!(err instanceof Error)) return { message: String(err) };
  const code = (err as { code?: unknown }).code;
  return { type: err.name, message: err.message, ...(typeof code === 'string' || typeof code === 'number' ? { code } : {}), stack: err.stack };
}

/** `log(message, ...details)` for code that reports a problem in passing (a failed e-mail, a file left behind): one error line. */
export function logFunction(logger: Logger): (...args: unknown[]) => void {
  return (...args) => {
    const message = args.filter((a) => typeof a === 'string').join(' ') || 'Error';
    const err = args.find((a) => a instanceof Error);
    const details = args.filter((a) => typeof a !== 'string' && !(a instanceof Error));
    logger.error({ ...(err ? { err } : {}), ...(details.length ? { details } : {}) }, message);
  };
}

/** The route pattern a request matched (`/api/teardowns/:id/runs`), or null when none did. */
function routeOf(req: IncomingMessage): string | null {
  const r = req as Request;
  const path = r.route?.path as unknown;
  return typeof path === 'string' ? `${r.baseUrl ?? ''}${path}` : null;
}

function requestFields(req: IncomingMessage, res: ServerResponse, durationMs: number) {
  return {
    method: req.method,
    route: routeOf(req),
    status: res.statusCode,
    durationMs,
    userId: (req as Request).authUser?.id ?? null,
  };
}

/** One line per request, at info (error for a 5xx, with the error's stack when the error handler passed it on in `res.err`). */
export function requestLogging(logger: Logger): HttpLogger {
  return pinoHttp({
    logger,
    quietReqLogger: true,
    quietResLogger: true,
    customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : 'info'),
    customSuccessObject: (req, res, val: { responseTime: number }) => requestFields(req, res, val.responseTime),
    customErrorObject: (req, res, err, val: { responseTime: number }) => ({ ...requestFields(req, res, val.responseTime), err }),
    customSuccessMessage: (req, res) => `${req.method} ${routeOf(req) ?? '(no route)'} ${res.statusCode}`,
    customErrorMessage: (req, res) => `${req.method} ${routeOf(req) ?? '(no route)'} ${res.statusCode}`,
  });
}
