import { z } from 'zod';
import { DEVICE_CATEGORY, TEARDOWN_STATUS } from './domain';

/** What the signed-in user may do with a teardown (computed by the server). */
export const teardownPermissionsSchema = z.object({
  edit: z.boolean(),
  review: z.boolean(),
  comment: z.boolean(),
  editPrices: z.boolean(),
});
export type TeardownPermissions = z.infer<typeof teardownPermissionsSchema>;

export const teardownSchema = z.object({
  id: z.number().int(),
  device: z.object({ id: z.number().int(), maker: z.string(), model: z.string(), category: DEVICE_CATEGORY.schema }),
  engineer: z.object({ id: z.number().int(), name: z.string() }),
  unitLabel: z.string().nullable(),
  date: z.string(),
  status: TEARDOWN_STATUS.schema,
  summary: z.string().nullable(),
  safetyNotes: z.string().nullable(),
  contactSeconds: z.number().int().nullable(),
  version: z.number().int(),
  submittedAt: z.string().nullable(),
  publishedAt: z.string().nullable(),
  lastReviewNote: z.string().nullable(),
  updatedAt: z.string(),
  permissions: teardownPermissionsSchema,
});
export type TeardownDto = z.infer<typeof teardownSchema>;
export const teardownResponse = z.object({ teardown: teardownSchema });

/**
 * Writes to a published teardown move it back to draft. The server refuses them with 409
 * (`details.reason = 'published'`) unless the request carries this header with the value `yes`.
 */
export const CONFIRM_UNPUBLISH_HEADER = 'X-Confirm-Unpublish';
