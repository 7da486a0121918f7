// Input helpers shared by the workspace payloads (devices, teardowns, findings). Forms send strings;
// the server accepts strings or numbers. In a PATCH, an absent field is left alone and '' or null clears it.
import { z } from 'zod';

/** A calendar day as YYYY-MM-DD that exists on the calendar. */
export const calendarDay = z
  .string()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date such as 2026-10-12')
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, 'This date does not exist');

/** Text that may be cleared: '' and null become null. */
export const clearableText = (max: number) =>
  z
    .union([z.string().trim().max(max, `At most ${max} characters`), z.null()])
    .optional()
    .transform((v) => (v === '' ? null : v));

/** A calendar day that may be cleared ('' → null). */
export const clearableDay = z
  .union([z.literal(''), z.null(), calendarDay])
  .optional()
  .transform((v) => (v === '' ? null : v));

/**
 * A quantity as typed ("5000 mAh", "18.5 Wh", "6 h"), or a number in the stored unit. The server
 * parses it with its units library, stores SI and keeps the text typed; '' or null clears it.
 */
export const quantityInput = z
  .union([z.number(), z.string().trim().max(60, 'At most 60 characters'), z.null()])
  .optional()
  .transform((v) => (v === '' ? null : v));

/**
 * A money amount as typed ("24.99", "$24.99", "24,99 €", "USD 24.99"), or a number in the currency
 * beside it. The server reads it with the currency; '' or null clears it.
 */
export const priceInput = z
  .union([z.number(), z.string().trim().max(40, 'At most 40 characters').regex(/^$|\d/, 'Enter an amount such as 24.99'), z.null()])
  .optional()
  .transform((v) => (v === '' ? null : v));

/** A plain number typed in a form ('' → null), with bounds and a message naming what is expected. */
export const clearableNumber = (opts: { min: number; max: number; integer?: boolean; what: string }) =>
  z
    .union([z.number(), z.string().trim(), z.null()])
    .optional()
    .transform((v, ctx) => {
      if (v === undefined || v === null || v === '') return v === undefined ? undefined : null;
      const n = typeof v === 'number' ? v : Number(v.replace(',', '.'));
      if (!Number.isFinite(n)) {
        ctx.addIssue({ code: 'custom', message: `Enter ${opts.what}` });
        return z.NEVER;
      }
      if (opts.integer && !Number.isInteger(n)) {
        ctx.addIssue({ code: 'custom', message: 'Enter a whole number' });
        return z.NEVER;
      }
      if (n < opts.min) {
        ctx.addIssue({ code: 'custom', message: `At least ${opts.min}` });
        return z.NEVER;
      }
      if (n > opts.max) {
        ctx.addIssue({ code: 'custom', message: `At most ${opts.max}` });
        return z.NEVER;
      }
      return n;
    });
