import { z } from 'zod';

/** Trimmed, non-empty text with a length cap. */
export const text = (max = 200) => z.string().trim().min(1, 'Required').max(max, `At most ${max} characters`);
export const optionalText = (max = 2000) =>
  z
    .string()
    .trim()
    .max(max, `At most ${max} characters`)
    .optional()
    .transform((v) => (v === '' ? undefined : v));
export const email = z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address').max(254));
export const idParam = z.object({ id: z.coerce.number().int().positive('Must be a positive whole number') });
export type IdParam = z.infer<typeof idParam>;
export const isoDateTime = z.string();
export const password = z
  .string()
  .min(10, 'At least 10 characters')
  .max(200, 'At most 200 characters');

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
