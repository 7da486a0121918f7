import { z } from 'zod';
import { auditEntrySchema } from './admin';
import { text, safeString } from './common';
import { CHEMISTRY, DEVICE_CATEGORY, TEARDOWN_STATUS } from './domain';
import { calendarDay, clearableNumber, clearableText } from './inputs';

/** What the signed-in user may do with a teardown (computed by the server). */
export const teardownPermissionsSchema = z.object({
  edit: z.boolean(),
  review: z.boolean(),
  comment: z.boolean(),
  editPrices: z.boolean(),
  /** In review, and the caller is its engineer or an admin: may withdraw it from review to edit it. */
  withdraw: z.boolean(),
});
export type TeardownPermissions = z.infer<typeof teardownPermissionsSchema>;

export const teardownSchema = z.object({
  id: z.number().int(),
  device: z.object({ id: z.number().int(), maker: safeString(), model: safeString(), category: DEVICE_CATEGORY.schema }),
  engineer: z.object({ id: z.number().int(), name: safeString() }),
  unitLabel: safeString().nullable(),
  date: safeString(),
  status: TEARDOWN_STATUS.schema,
  summary: safeString().nullable(),
  safetyNotes: safeString().nullable(),
  contactSeconds: z.number().int().nullable(),
  version: z.number().int(),
  submittedAt: safeString().nullable(),
  publishedAt: safeString().nullable(),
  lastReviewNote: safeString().nullable(),
  updatedAt: safeString(),
  permissions: teardownPermissionsSchema,
  /** The recorded cells, if any: lets the pages place the lithium cautions where they matter. */
  cell: z.object({ chemistry: CHEMISTRY.schema, lithium: z.boolean() }).nullable().default(null),
});
export type TeardownDto = z.infer<typeof teardownSchema>;
export const teardownResponse = z.object({ teardown: teardownSchema });

/**
 * Writes to a published teardown move it back to draft. The server refuses them with 409
 * (`details.reason = 'published'`) unless the request carries this header with the value `yes`.
 * Writes to a teardown in review are refused whatever the header (409, `details.reason = 'in_review'`).
 */
export const CONFIRM_UNPUBLISH_HEADER = 'X-Confirm-Unpublish';

const teardownFields = {
  date: calendarDay,
  unitLabel: clearableText(80),
  summary: clearableText(20_000),
  safetyNotes: clearableText(5_000),
  /** Contact time for the touch-temperature figures (s); empty = the workspace default. */
  contactSeconds: clearableNumber({ min: 1, max: 28_800, integer: true, what: 'a contact time in seconds, such as 60' }),
};

/** POST /api/teardowns: start a teardown of a device (the date defaults to today). */
export const createTeardownBody = z.object({
  deviceId: z.coerce.number({ error: 'Choose a device' }).int().positive('Choose a device'),
  ...teardownFields,
  date: calendarDay.optional(),
});
export type CreateTeardownBody = z.infer<typeof createTeardownBody>;
export type CreateTeardownForm = z.input<typeof createTeardownBody>;

/** PATCH /api/teardowns/:id: the version the edit started from, and any subset of the fields. */
export const updateTeardownBody = z
  .object({
    version: z.number({ error: 'Send the version you edited' }).int().positive(),
    date: teardownFields.date.optional(),
    unitLabel: teardownFields.unitLabel,
    summary: teardownFields.summary,
    safetyNotes: teardownFields.safetyNotes,
    contactSeconds: teardownFields.contactSeconds,
  })
  .refine((b) => Object.entries(b).some(([k, v]) => k !== 'version' && v !== undefined), { message: 'Change at least one field' });
export type UpdateTeardownBody = z.infer<typeof updateTeardownBody>;
export type UpdateTeardownForm = z.input<typeof updateTeardownBody>;

/** Teardown fields the overview edits, with their labels (used to show a version conflict field by field). */
export const TEARDOWN_FIELD_LABELS = {
  date: 'Date opened',
  unitLabel: 'Unit',
  contactSeconds: 'Contact time for touch figures',
  summary: 'Summary',
  safetyNotes: 'Safety notes',
} as const;
export type TeardownEditableField = keyof typeof TEARDOWN_FIELD_LABELS;

/** Body of a stale-version 409 on a teardown: the record as it is now. */
export const teardownConflictDetails = z.object({ current: teardownSchema });

export const submitTeardownBody = z.object({ note: clearableText(5_000) });
export const approveTeardownBody = z.object({ note: clearableText(5_000) });
export const sendBackTeardownBody = z.object({ comment: text(5_000) });
export type SendBackTeardownBody = z.infer<typeof sendBackTeardownBody>;

export const COMMENT_KIND = ['comment', 'submitted', 'sent-back', 'approved'] as const;
export type CommentKind = (typeof COMMENT_KIND)[number];
export const commentSchema = z.object({
  id: z.number().int(),
  kind: z.enum(COMMENT_KIND),
  body: safeString(),
  author: z.object({ id: z.number().int(), name: safeString() }).nullable(),
  createdAt: safeString(),
});
export type CommentDto = z.infer<typeof commentSchema>;
export const commentsResponse = z.object({ comments: z.array(commentSchema) });
export const commentResponse = z.object({ comment: commentSchema });
export const createCommentBody = z.object({ body: text(5_000) });
export type CreateCommentBody = z.infer<typeof createCommentBody>;

/** GET /api/teardowns/:id/history: the audit entries scoped to the teardown, newest first. */
export const teardownHistoryResponse = z.object({ entries: z.array(auditEntrySchema) });
