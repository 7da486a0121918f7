import { z } from 'zod';
import { text, patchOf, safeString } from './common';
import { FINDING_KIND, PART_CATEGORY, SEVERITY } from './domain';

/** A tag: lower-case words, digits and '-', e.g. "thermal", "cost-down", "usb-c". */
export const findingTag = safeString()
  .trim()
  .toLowerCase()
  .min(1, 'A tag cannot be empty')
  .max(40, 'A tag has at most 40 characters')
  .regex(/^[\p{L}\p{N}][\p{L}\p{N} ._+-]*$/u, 'Tags use letters, digits, spaces and - . _ +');

const ids = (what: string) =>
  z
    .array(
      z
        .number({ error: `Give ${what} ids as numbers` })
        .int()
        .positive(),
      { error: `Give a list of ${what} ids` },
    )
    .max(200, `At most 200 ${what}s`);

const tagList = z
  .array(findingTag, { error: 'Give the tags as a list' })
  .max(20, 'At most 20 tags')
  .transform((t) => [...new Set(t)]);

const findingFields = z.object({
  kind: FINDING_KIND.schema,
  severity: SEVERITY.schema,
  text: text(10_000),
  tags: tagList,
  partIds: ids('part').optional(),
  photoIds: ids('photo').optional(),
});

/** POST /api/teardowns/:id/findings (tags may be left out: none). */
export const createFindingBody = findingFields.extend({ tags: tagList.default([]) });
export type CreateFindingBody = z.infer<typeof createFindingBody>;
export type FindingFormValues = z.input<typeof createFindingBody>;
/** PATCH /api/teardowns/:id/findings/:findingId */
export const updateFindingBody = patchOf(findingFields.shape);
export type UpdateFindingBody = z.infer<typeof updateFindingBody>;

export const findingParams = z.object({
  id: z.coerce.number().int().positive('Must be a positive whole number'),
  findingId: z.coerce.number().int().positive('Must be a positive whole number'),
});

export const linkablePartSchema = z.object({
  id: z.number().int(),
  designators: safeString().nullable(),
  description: safeString(),
  category: PART_CATEGORY.schema,
});
export type LinkablePart = z.infer<typeof linkablePartSchema>;
export const linkablePhotoSchema = z.object({ id: z.number().int(), caption: safeString().nullable(), layer: z.number().int() });
export type LinkablePhoto = z.infer<typeof linkablePhotoSchema>;

export const findingSchema = z.object({
  id: z.number().int(),
  teardownId: z.number().int(),
  kind: FINDING_KIND.schema,
  severity: SEVERITY.schema,
  text: safeString(),
  tags: z.array(safeString()),
  /** The suggested-finding rule this finding was accepted from, if any. */
  suggestionKey: safeString().nullable(),
  parts: z.array(linkablePartSchema),
  photos: z.array(linkablePhotoSchema),
  createdBy: z.object({ id: z.number().int(), name: safeString() }).nullable(),
  createdAt: safeString(),
  updatedAt: safeString(),
});
export type FindingDto = z.infer<typeof findingSchema>;
export const findingResponse = z.object({ finding: findingSchema });
/** The findings of a teardown, and the parts and photos a finding may link to. */
export const findingsResponse = z.object({
  findings: z.array(findingSchema),
  parts: z.array(linkablePartSchema),
  photos: z.array(linkablePhotoSchema),
});
