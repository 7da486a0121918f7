import { CONTROL_CHARACTERS_MESSAGE, type ErrorCode } from '@splitcase/contracts';
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { OptimisticLockError, UniqueConstraintViolationException } from '@mikro-orm/core';
import { ZodError } from 'zod';

const STATUS: Record<ErrorCode, number> = {
  validation_failed: 400,
  invalid_json: 400,
  unauthenticated: 401,
  forbidden: 403,
  csrf_invalid: 403,
  not_found: 404,
  conflict: 409,
  stale_version: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  rate_limited: 429,
  token_invalid: 400,
  token_expired: 410,
  token_used: 410,
  account_inactive: 403,
  invalid_credentials: 401,
  internal: 500,
};

/** The one error type handlers throw; the error middleware turns it into the standard body. */
export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
    readonly details?: unknown,
    status?: number,
  ) {
    super(message);
    this.status = status ?? STATUS[code];
  }
}

export const notFound = (what: string) => new AppError('not_found', `${what} was not found.`);
export const forbidden = (message = 'Your role does not allow this.') => new AppError('forbidden', message);

type Issue = ZodError['issues'][number];

/** A field that takes text or something else (a number, null) says "Invalid input" for any refused text: say why when it held control characters. */
function issueMessage(issue: Issue): string {
  if (issue.code === 'invalid_union' && issue.errors.some((branch) => branch.some((i) => i.message === CONTROL_CHARACTERS_MESSAGE))) return CONTROL_CHARACTERS_MESSAGE;
  return issue.message;
}

/** Turn a ZodError into field → message pairs (the first message per field). */
export function zodFields(err: ZodError, prefix?: string): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    const key = [prefix, ...issue.path.map(String)].filter(Boolean).join('.') || '_';
    fields[key] ??= issueMessage(issue);
  }
  return fields;
}

export function validationError(fields: Record<string, string>, message?: string): AppError {
  const names = Object.keys(fields);
  return new AppError('validation_failed', message ?? `Check ${names.length === 1 ? 'the field' : 'these fields'}: ${names.join(', ')}.`, fields);
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError('not_found', `No API route for ${req.method} ${req.path}.`));
};

/** The standard error body; a server error goes to the request's log line with its stack (`res.err`, http/logging.ts), never into the body. */
export function errorHandler(): ErrorRequestHandler {
  return (err, _req, res, _next) => {
    const body = toAppError(err);
    if (body.status >= 500) res.err = err instanceof Error ? err : new Error(String(err));
    if (body.code === 'rate_limited' && body.details && typeof body.details === 'object' && 'retryAfterS' in body.details) {
      res.setHeader('Retry-After', String((body.details as { retryAfterS: number }).retryAfterS));
    }
    if (res.headersSent) return;
    res.status(body.status).json({
      error: {
        code: body.code,
        message: body.message,
        ...(body.fields ? { fields: body.fields } : {}),
        ...(body.details !== undefined ? { details: body.details } : {}),
      },
    });
  };
}

function toAppError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  if (err instanceof ZodError) return validationError(zodFields(err));
  if (err instanceof OptimisticLockError) {
    return new AppError('stale_version', 'Someone else changed this record since you opened it.');
  }
  // Two requests creating the same record at once (e.g. two first prices of a part): the second loses.
  if (err instanceof UniqueConstraintViolationException) {
    return new AppError('conflict', 'Someone else saved the same record at the same moment, so this change was not saved. Reload and try again.');
  }
  if (err instanceof RangeError) return new AppError('unprocessable', err.message);
  const e = err as { type?: string; status?: number; code?: string; message?: string; field?: string };
  if (e?.type === 'entity.parse.failed') return new AppError('invalid_json', 'The request body is not valid JSON.');
  if (e?.type === 'entity.too.large' || e?.code === 'LIMIT_FILE_SIZE') {
    return new AppError('payload_too_large', e.code === 'LIMIT_FILE_SIZE' ? 'The file is larger than the upload limit.' : 'The request body is too large.');
  }
  if (e?.code === 'LIMIT_UNEXPECTED_FILE' || e?.code === 'LIMIT_FILE_COUNT' || e?.code === 'LIMIT_FIELD_VALUE') {
    return new AppError('validation_failed', e.message ?? 'Unexpected upload field.', e.field ? { [e.field]: e.message ?? 'Unexpected' } : undefined);
  }
  if (e?.code === 'EBADCSRFTOKEN' || (e?.status === 403 && /csrf/i.test(e.message ?? ''))) {
    return new AppError('csrf_invalid', 'The security token is missing or out of date. Reload the page and try again.');
  }
  if (e?.type === 'encoding.unsupported' || e?.type === 'charset.unsupported') {
    return new AppError('unsupported_media_type', e.message ?? 'Unsupported encoding.');
  }
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
    return new AppError('validation_failed', e.message ?? 'Bad request.', undefined, undefined, e.status);
  }
  return new AppError('internal', 'Something went wrong on the server. The error has been logged.');
}
