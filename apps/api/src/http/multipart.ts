// One-file multipart uploads (multer + busboy) with every way a body can be wrong turned into the
// standard error shape: a body announced over the limit is refused before it is read (413), a
// malformed body (no boundary, cut short, a garbled or oversized part header, a control character
// such as NUL in a file name) is a 400 naming the file field, and the form's own limits are 400s.
// Anything else (a disk error while storing) stays a 500.
import { rmSync } from 'node:fs';
import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError, validationError } from './errors';

export interface UploadOptions {
  /** The multipart field that carries the file. */
  field: string;
  /** Largest file accepted (413 above it). */
  maxBytes: number;
  storage: multer.StorageEngine;
  /** Text fields the form may carry beside the file, and the longest each may be (bytes). */
  fields?: number;
  fieldSize?: number;
}

/** Control characters other than tab; a file name never needs one. */
const CONTROL = /[\u0000-\u0008\u000a-\u001f\u007f]/;

const BUSBOY_ERRORS: [RegExp, string][] = [
  [/^Multipart: Boundary not found/, 'the Content-Type has no boundary'],
  [/^Malformed part header/, 'a part header is malformed or too long; a file name with a control character such as NUL is refused'],
  [/^Unexpected end of (form|file)/, 'the body ends before the form does: the upload was cut short'],
  [/^(Malformed content type|Missing Content-Type|Unsupported content type)/, 'the Content-Type is not multipart/form-data'],
  [/^Malformed urlencoded form/, 'the body is not a well-formed form'],
];

const mbText = (bytes: number) => `${Math.round((bytes / 1024 / 1024) * 10) / 10} MB`;

export function tooLarge(field: string, maxBytes: number): AppError {
  return new AppError('payload_too_large', `The file is larger than the upload limit (${mbText(maxBytes)}).`, { [field]: `Larger than ${mbText(maxBytes)}` }, { maxBytes });
}

/** Turns what multer and busboy report into an AppError; errors of the storage itself are left alone (500). */
export function uploadError(err: unknown, opts: Pick<UploadOptions, 'field' | 'maxBytes' | 'fieldSize'>): unknown {
  if (err instanceof AppError) return err;
  if (err instanceof multer.MulterError) {
    const name = err.field ?? opts.field;
    switch (err.code) {
      case 'LIMIT_FILE_SIZE':
        return tooLarge(opts.field, opts.maxBytes);
      case 'LIMIT_FIELD_VALUE':
        return validationError({ [name]: `At most ${opts.fieldSize ?? 1024 * 1024} characters` });
      case 'LIMIT_UNEXPECTED_FILE':
        return validationError({ [name]: `Send one file, in the "${opts.field}" field` }, err.message);
      case 'LIMIT_FILE_COUNT':
        return validationError({ [opts.field]: 'Send one file' }, err.message);
      default:
        // Too many parts or fields, a field name too long, nested or missing.
        return validationError({ form: `${err.message}: this upload takes the file and its few fields only` }, `The form is not the one this upload takes (${err.message.toLowerCase()}).`);
    }
  }
  const e = err as { code?: unknown; message?: unknown } | null;
  if (e && typeof e.message === 'string' && e.code === undefined) {
    const known = BUSBOY_ERRORS.find(([re]) => re.test(e.message as string));
    if (known) {
      const message = `The upload is not a well-formed multipart/form-data body: ${known[1]}. Choose the file again.`;
      return validationError({ [opts.field]: message }, message);
    }
  }
  return err;
}

/**
 * Middleware for an upload of one file in `field`: refuses a body announced over the limit before
 * reading it, parses the form with multer, and translates its errors (see uploadError).
 */
export function uploadOne(opts: UploadOptions): RequestHandler {
  const fields = opts.fields ?? 0;
  const fieldSize = opts.fieldSize ?? 4000;
  const parse = multer({
    storage: opts.storage,
    limits: { fileSize: opts.maxBytes, files: 1, fields, fieldSize, parts: fields + 1 },
  }).single(opts.field);
  // Room for the boundaries, the part headers and the text fields beside the file.
  const allowance = 64 * 1024 + fields * fieldSize;
  return (req, res, next) => {
    const declared = Number(req.get('content-length'));
    if (req.is('multipart') && Number.isFinite(declared) && declared > opts.maxBytes + allowance) return next(tooLarge(opts.field, opts.maxBytes));
    parse(req, res, (err?: unknown) => {
      if (err) return next(uploadError(err, { ...opts, fieldSize }));
      const name = req.file?.originalname;
      if (name !== undefined && CONTROL.test(name)) {
        if (req.file?.path) rmSync(req.file.path, { force: true });
        return next(validationError({ [opts.field]: 'The file name contains a control character (such as NUL): rename the file and upload it again' }));
      }
      next();
    });
  };
}
