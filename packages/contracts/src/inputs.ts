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

/**
 * A rate typed as a percentage in a form ("20", "20 %", "8,1%"), or a fraction as a number (0.2 =
 * 20 %); '' or null clears it. The result is a fraction 0..1 (null when cleared).
 */
export const percentInput = (what: string) =>
  z
    .union([z.number(), z.string().trim().max(20, 'At most 20 characters'), z.null()])
    .optional()
    .transform((v, ctx) => {
      if (v === undefined || v === null || v === '') return v === undefined ? undefined : null;
      if (typeof v === 'number') {
        if (!Number.isFinite(v) || v < 0 || v > 1) {
          ctx.addIssue({ code: 'custom', message: `Give ${what} as a fraction from 0 to 1 (0.2 = 20 %), or as text such as "20 %"` });
          return z.NEVER;
        }
        return v;
      }
      const typed = v.replace(/\s*%$/, '').replace(',', '.').trim();
      const n = /^[+-]?(\d+\.?\d*|\.\d+)$/.test(typed) ? Number(typed) : Number.NaN;
      if (!Number.isFinite(n)) {
        ctx.addIssue({ code: 'custom', message: `Enter ${what} as a percentage such as "20 %"` });
        return z.NEVER;
      }
      if (n < 0) {
        ctx.addIssue({ code: 'custom', message: 'At least 0 %' });
        return z.NEVER;
      }
      if (n > 100) {
        ctx.addIssue({ code: 'custom', message: 'At most 100 %' });
        return z.NEVER;
      }
      return Number((n / 100).toPrecision(12));
    });
