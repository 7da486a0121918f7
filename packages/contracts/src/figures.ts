import { z } from 'zod';
import { safeString } from './common';
import { FINDING_KIND, SEVERITY } from './domain';

export const figureInputSchema = z.object({
  /** Stable name of the input within its figure: read inputs by key, never by label. */
  key: safeString(),
  label: safeString(),
  value: z.union([z.number(), safeString(), z.boolean(), z.null()]),
  unit: safeString().optional(),
});
export type FigureInputDto = z.infer<typeof figureInputSchema>;

/** A derived figure with how it was obtained (computed on the server by packages/calc). */
export const figureSchema = z.object({
  key: safeString(),
  label: safeString(),
  value: z.union([z.number(), safeString()]),
  unit: safeString(),
  formula: safeString(),
  source: safeString(),
  inputs: z.array(figureInputSchema),
  assumptions: z.array(safeString()),
  warnings: z.array(safeString()),
  /** A safety caution to show beside this figure (e.g. hot surface next to touch-temperature figures). */
  caution: safeString().nullable(),
  /** The operating mode a per-mode figure describes (keys `mode.*`); null for whole-device figures. */
  modeId: z.number().int().nullable(),
  /** Outside what the physics or the chemistry allows: shown flagged, never as good. */
  implausible: z.boolean(),
});
export type FigureDto = z.infer<typeof figureSchema>;

export const SUGGESTION_STATUS = ['open', 'accepted', 'dismissed'] as const;
export type SuggestionStatus = (typeof SUGGESTION_STATUS)[number];

export const suggestionSchema = z.object({
  key: safeString(),
  title: safeString(),
  kind: FINDING_KIND.schema,
  severity: SEVERITY.schema,
  detail: safeString(),
  status: z.enum(SUGGESTION_STATUS),
  /** The finding made when it was accepted. */
  findingId: z.number().int().nullable(),
  decidedBy: safeString().nullable(),
  decidedAt: safeString().nullable(),
});
export type SuggestionDto = z.infer<typeof suggestionSchema>;

export const figuresResponse = z.object({
  figures: z.array(figureSchema),
  /** The recorded modes, in order, for the per-mode figures; empty: all loads at once. */
  modes: z.array(z.object({ id: z.number().int(), name: safeString(), note: safeString().nullable() })),
  suggestions: z.array(suggestionSchema),
  /** "Engineering estimates, not certification results" — shown with the figures. */
  note: safeString(),
});
export type FiguresResponse = z.infer<typeof figuresResponse>;

export const suggestionParams = z.object({
  id: z.coerce.number().int().positive('Must be a positive whole number'),
  key: safeString()
    .max(120, 'At most 120 characters')
    .regex(/^[a-z0-9][a-z0-9.-]*$/i, 'Not a suggestion key'),
});
export const suggestionResponse = z.object({ suggestion: suggestionSchema });
