import { z } from 'zod';
import { safeString } from './common';

/** Every error the API sends has this one shape. */
export const ERROR_CODES = [
  'validation_failed',
  'invalid_json',
  'unauthenticated',
  'forbidden',
  'csrf_invalid',
  'not_found',
  'conflict',
  'stale_version',
  'payload_too_large',
  'unsupported_media_type',
  'unprocessable',
  'rate_limited',
  'token_invalid',
  'token_expired',
  'token_used',
  'account_inactive',
  'invalid_credentials',
  'internal',
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];

export const errorBodySchema = z.object({
  error: z.object({
    code: z.enum(ERROR_CODES),
    message: safeString(),
    /** field path (dot-separated) → message, for form fields and CSV rows/columns */
    fields: z.record(safeString(), safeString()).optional(),
    /** extra data for the client, e.g. the current record on a 409 */
    details: z.unknown().optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;
