import { z } from 'zod';
import { FINDING_KIND, SEVERITY } from './domain';

export const figureInputSchema = z.object({
  /** Stable name of the input within its figure: read inputs by key, never by label. */
  key: z.string(),
  label: z.string(),
  value: z.union([z.number(), z.string(), z.boolean(), z.null()]),
  unit: z.string().optional(),
});
export type FigureInputDto = z.infer<typeof figureInputSchema>;

/** A derived figure with how it was obtained (computed on the server by packages/calc). */
export const figureSchema = z.object({
  key: z.string(),
  label: z.string(),
  value: z.union([z.number(), z.string()]),
  unit: z.string(),
  formula: z.string(),
  source: z.string(),
  inputs: z.array(figureInputSchema),
  assumptions: z.array(z.string()),
  warnings: z.array(z.string()),
  /** A safety caution to show beside this figure (e.g. hot surface next to touch-temperature figures). */
  caution: z.string().nullable(),
  /** The operating mode a per-mode figure describes (keys `mode.*`); null for whole-device figures. */
  modeId: z.number().int().nullable(),
  /** Outside what the physics or the chemistry allows: shown flagged, never as good. */
  implausible: z.boolean(),
});
export type FigureDto = z.infer<typeof figureSchema>;

export const SUGGESTION_STATUS = ['open', 'accepted', 'dismissed'] as const;
export type SuggestionStatus = (typeof SUGGESTION_STATUS)[number];

export const suggestionSchema = z.object({
  key: z.string(),
  title: z.string(),
  kind: FINDING_KIND.schema,
  severity: SEVERITY.schema,
  detail: z.string(),
  status: z.enum(SUGGESTION_STATUS),
  /** The finding made when it was accepted. */
  findingId: z.number().int().nullable(),
  decidedBy: z.string().nullable(),
  decidedAt: z.string().nullable(),
});
export type SuggestionDto = z.infer<typeof suggestionSchema>;

export const figuresResponse = z.object({
  figures: z.array(figureSchema),
  /** The recorded modes, in order, for the per-mode figures; empty: all loads at once. */
  modes: z.array(z.object({ id: z.number().int(), name: z.string(), note: z.string().nullable() })),
  suggestions: z.array(suggestionSchema),
  /** "Engineering estimates, not certification results" — shown with the figures. */
  note: z.string(),
});
export type FiguresResponse = z.infer<typeof figuresResponse>;

export const suggestionParams = z.object({
  id: z.coerce.number().int().positive('Must be a positive whole number'),
  key: z
    .string()
    .max(120, 'At most 120 characters')
    .regex(/^[a-z0-9][a-z0-9.-]*$/i, 'Not a suggestion key'),
});
export const suggestionResponse = z.object({ suggestion: suggestionSchema });
