// Input helpers shared by the workspace payloads (devices, teardowns, findings). Forms send strings;
// the server accepts strings or numbers. In a PATCH, an absent field is left alone and '' or null clears it.
import { z } from 'zod';
import { safeString } from './common';

/** A calendar day as YYYY-MM-DD that exists on the calendar. */
export const calendarDay = safeString()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date such as 2026-10-12')
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, 'This date does not exist');

/** Text that may be cleared: '' and null become null. */
export const clearableText = (max: number) =>
  z
    .union([safeString().trim().max(max, `At most ${max} characters`), z.null()])
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
  .union([z.number(), safeString().trim().max(60, 'At most 60 characters'), z.null()])
  .optional()
  .transform((v) => (v === '' ? null : v));

/**
 * A money amount as typed ("24.99", "$24.99", "24,99 €", "USD 24.99"), or a number in the currency
 * beside it. The server reads it with the currency; '' or null clears it.
 */
export const priceInput = z
  .union([z.number(), safeString().trim().max(40, 'At most 40 characters').regex(/^$|\d/, 'Enter an amount such as 24.99'), z.null()])
  .optional()
  .transform((v) => (v === '' ? null : v));

/** A plain number typed in a form ('' → null), with bounds and a message naming what is expected. */
export const clearableNumber = (opts: { min: number; max: number; integer?: boolean; what: string }) =>
  z
    .union([z.number(), safeString().trim(), z.null()])
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
    .union([z.number(), safeString().trim().max(20, 'At most 20 characters'), z.null()])
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

/** Units a duration may be typed in, with their length in seconds. */
const DURATION_UNITS: Record<string, number> = { s: 1, sec: 1, secs: 1, second: 1, seconds: 1, min: 60, mins: 60, minute: 60, minutes: 60, h: 3600, hr: 3600, hrs: 3600, hour: 3600, hours: 3600 };

/**
 * Read a duration as typed — "10 min", "8 h", "60 s", "1 h 30 min", "1,5 h" — into whole seconds.
 * A bare number is refused (its unit would be a guess). Throws a RangeError whose message names
 * what to type.
 */
export function readDurationSeconds(typed: string): number {
  const text = typed
    .trim()
    .toLowerCase()
    .replace(/(\d),(\d)/g, '$1.$2');
  const part = /(\d+(?:\.\d+)?|\.\d+)\s*([a-z]+)\s*/gy;
  let seconds = 0;
  let read = 0;
  let m: RegExpExecArray | null;
  while ((m = part.exec(text)) !== null) {
    const factor = DURATION_UNITS[m[2]!];
    if (factor === undefined) throw new RangeError(`“${m[2]}” is not a unit of time: use s, min or h, such as 10 min`);
    seconds += Number(m[1]) * factor;
    read = part.lastIndex;
  }
  if (text === '' || read !== text.length) {
    throw new RangeError(/^\s*[\d.]+\s*$/.test(text) ? 'Give the unit too, such as 10 min, 8 h or 60 s' : 'Enter a time such as 10 min, 8 h or 60 s');
  }
  const whole = Math.round(seconds);
  if (Math.abs(seconds - whole) > 1e-6) throw new RangeError('Give a whole number of seconds');
  return whole;
}

/** A duration typed in a form ("10 min"), read into whole seconds within bounds; '' or null clears it. */
export const durationInput = (opts: { min: number; max: number }) =>
  z
    .union([safeString().trim().max(40, 'At most 40 characters'), z.null()])
    .optional()
    .transform((v, ctx) => {
      if (v === undefined || v === null || v === '') return v === undefined ? undefined : null;
      let s: number;
      try {
        s = readDurationSeconds(v);
      } catch (err) {
        ctx.addIssue({ code: 'custom', message: (err as Error).message });
        return z.NEVER;
      }
      if (s < opts.min) {
        ctx.addIssue({ code: 'custom', message: `At least ${durationText(opts.min)}` });
        return z.NEVER;
      }
      if (s > opts.max) {
        ctx.addIssue({ code: 'custom', message: `At most ${durationText(opts.max)}` });
        return z.NEVER;
      }
      return s;
    });

/** Whole seconds as people say them, in the units durationInput reads back: "10 min", "8 h", "1 h 30 min", "45 s". */
export function durationText(seconds: number): string {
  const s = Math.round(seconds);
  const h = Math.floor(s / 3600);
  const min = Math.floor((s % 3600) / 60);
  const sec = s % 60;
  const parts = [h ? `${h} h` : '', min ? `${min} min` : '', sec ? `${sec} s` : ''].filter(Boolean);
  return parts.length ? parts.join(' ') : '0 s';
}
