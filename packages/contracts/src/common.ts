import { z } from 'zod';

/**
 * Control characters a text field may not hold: C0 (NUL, bell, escape…) other than tab and line feed,
 * a carriage return that does not start a CRLF line break, DEL, and the C1 range.
 */
const CONTROL_CHARACTERS = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]|\r(?!\n)/;
export const CONTROL_CHARACTERS_MESSAGE = 'Remove the control characters (only tabs and line breaks may be in text)';
export const hasControlCharacters = (value: string) => CONTROL_CHARACTERS.test(value);

/**
 * The one string schema of contracts: every text a client sends goes through it, so NUL and other
 * control characters are a 400 naming the field instead of reaching the database.
 */
export const safeString = (params?: Parameters<typeof z.string>[0]) => z.string(params).refine((v) => !CONTROL_CHARACTERS.test(v), { message: CONTROL_CHARACTERS_MESSAGE, abort: true });

/** Trimmed, non-empty text with a length cap. */
export const text = (max = 200) => safeString().trim().min(1, 'Required').max(max, `At most ${max} characters`);
export const optionalText = (max = 2000) =>
  safeString()
    .trim()
    .max(max, `At most ${max} characters`)
    .optional()
    .transform((v) => (v === '' ? undefined : v));
export const email = safeString().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address').max(254));
export const idParam = z.object({ id: z.coerce.number().int().positive('Must be a positive whole number') });
export type IdParam = z.infer<typeof idParam>;
export const isoDateTime = safeString();
/** The password rule as the forms show it; the server also checks it against a common-password list. */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_RULE = `At least ${PASSWORD_MIN_LENGTH} characters, not your e-mail address or name, and not a common password. A phrase of a few unrelated words works well.`;
export const password = safeString().min(PASSWORD_MIN_LENGTH, `At least ${PASSWORD_MIN_LENGTH} characters`).max(200, 'At most 200 characters');

/** A field without its `.default()`: in a PATCH, a field left out stays as it is, it is not reset. */
const withoutDefault = (field: z.ZodType): z.ZodType => (field instanceof z.ZodDefault ? withoutDefault(field.unwrap() as z.ZodType) : field);

/**
 * A PATCH body: any subset of the fields, but at least one of them (400 otherwise). Defaults of the
 * fields are dropped, so a field that is not sent is not changed (zod's `.partial()` alone would
 * fill it with its default).
 */
export const patchOf = <S extends z.ZodRawShape>(shape: S, message = 'Change at least one field') =>
  z
    .object(Object.fromEntries(Object.entries(shape).map(([k, v]) => [k, withoutDefault(v as z.ZodType)])) as unknown as S)
    .partial()
    .refine((b) => Object.values(b).some((v) => v !== undefined), { message });
