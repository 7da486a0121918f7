import { z } from 'zod';
import { safeString } from './common';

/** The image variants the server keeps for every photo. */
export const PHOTO_VARIANTS = ['thumb', 'display', 'original'] as const;
export type PhotoVariant = (typeof PHOTO_VARIANTS)[number];

/** Longest side of the derivatives (px). The original keeps its own size. */
export const PHOTO_THUMB_PX = 320;
export const PHOTO_DISPLAY_PX = 1600;

const whole = (field: string, max: number) =>
  z.coerce
    .number({ error: `${field} must be a whole number` })
    .int(`${field} must be a whole number`)
    .min(1, `${field} starts at 1`)
    .max(max, `${field} is at most ${max}`);

export const photoLayer = whole('Layer', 99);
export const photoStep = whole('Step', 999);
const caption = safeString().trim().max(500, 'At most 500 characters');

/** Text fields sent with the file in `POST /api/teardowns/:id/photos` (multipart). */
export const uploadPhotoFields = z.object({
  caption: caption.optional().transform((v) => (v ? v : undefined)),
  layer: photoLayer.optional(),
  step: photoStep.optional(),
});
export type UploadPhotoFields = z.input<typeof uploadPhotoFields>;

export const updatePhotoBody = z
  .object({
    caption: caption
      .nullable()
      .optional()
      .transform((v) => (v === '' ? null : v)),
    layer: photoLayer.optional(),
    step: photoStep.optional(),
  })
  .strict()
  .refine((b) => Object.keys(b).length > 0, { message: 'Change at least one of caption, layer, step' });
export type UpdatePhotoBody = z.input<typeof updatePhotoBody>;

const relative = (axis: 'x' | 'y') =>
  z
    .number({ error: `${axis} must be a number between 0 and 1 (a fraction of the photo's ${axis === 'x' ? 'width' : 'height'})` })
    .min(0, `${axis} must be between 0 and 1`)
    .max(1, `${axis} must be between 0 and 1`);
const linkId = (what: string) => z.number().int(`${what} must be a whole number`).positive(`${what} must be a positive id`);
const label = safeString().trim().min(1, 'Give the pin a label').max(200, 'At most 200 characters');

export const createCalloutBody = z
  .object({
    x: relative('x'),
    y: relative('y'),
    label,
    partId: linkId('partId').nullable().optional(),
    findingId: linkId('findingId').nullable().optional(),
  })
  .strict();
export type CreateCalloutBody = z.input<typeof createCalloutBody>;

export const updateCalloutBody = z
  .object({
    x: relative('x').optional(),
    y: relative('y').optional(),
    label: label.optional(),
    partId: linkId('partId').nullable().optional(),
    findingId: linkId('findingId').nullable().optional(),
  })
  .strict()
  .refine((b) => Object.keys(b).length > 0, { message: 'Change at least one of x, y, label, partId, findingId' });
export type UpdateCalloutBody = z.input<typeof updateCalloutBody>;

export const photoVariantParams = z.object({
  id: z.coerce.number().int().positive('Must be a positive whole number'),
  variant: z.enum(PHOTO_VARIANTS, { error: `Variant is one of ${PHOTO_VARIANTS.join(', ')}` }),
});

const optionalId = z.preprocess((v) => (v === '' ? undefined : v), z.coerce.number().int().positive('Must be a positive whole number').optional());
export const teardownCalloutsQuery = z.object({ partId: optionalId, findingId: optionalId });
export type TeardownCalloutsQuery = z.infer<typeof teardownCalloutsQuery>;

export const calloutLinkSchema = z.object({ id: z.number().int(), label: safeString() });

export const calloutSchema = z.object({
  id: z.number().int(),
  photoId: z.number().int(),
  number: z.number().int(),
  x: z.number(),
  y: z.number(),
  label: safeString(),
  part: calloutLinkSchema.nullable(),
  finding: calloutLinkSchema.nullable(),
});
export type CalloutDto = z.infer<typeof calloutSchema>;

export const photoUrlsSchema = z.object({ thumb: safeString(), display: safeString(), original: safeString() });

export const photoSchema = z.object({
  id: z.number().int(),
  teardownId: z.number().int(),
  /** The client's file name after sanitising; for display only (files are stored under random names). */
  name: safeString(),
  mime: safeString(),
  width: z.number().int(),
  height: z.number().int(),
  bytes: z.number().int(),
  caption: safeString().nullable(),
  layer: z.number().int(),
  step: z.number().int(),
  uploadedBy: z.object({ id: z.number().int(), name: safeString() }).nullable(),
  createdAt: safeString(),
  urls: photoUrlsSchema,
  callouts: z.array(calloutSchema),
});
export type PhotoDto = z.infer<typeof photoSchema>;

/** What the server accepts, so the client can check before sending (the server still decides). */
export const uploadLimitsSchema = z.object({
  maxBytes: z.number().int(),
  maxPixels: z.number().int(),
  types: z.array(z.object({ mime: safeString(), extensions: z.array(safeString()) })),
});
export type UploadLimits = z.infer<typeof uploadLimitsSchema>;

export const photosResponse = z.object({
  photos: z.array(photoSchema),
  limits: uploadLimitsSchema,
});
export type PhotosResponse = z.infer<typeof photosResponse>;
export const photoResponse = z.object({ photo: photoSchema });
export const calloutResponse = z.object({ callout: calloutSchema });
export const calloutsResponse = z.object({ callouts: z.array(calloutSchema) });

/** A pin together with the photo it sits on (pins of one part or finding across the teardown). */
export const placedCalloutSchema = calloutSchema.extend({
  photo: z.object({
    id: z.number().int(),
    caption: safeString().nullable(),
    width: z.number().int(),
    height: z.number().int(),
    layer: z.number().int(),
    step: z.number().int(),
    urls: photoUrlsSchema,
  }),
});
export type PlacedCalloutDto = z.infer<typeof placedCalloutSchema>;
export const placedCalloutsResponse = z.object({ callouts: z.array(placedCalloutSchema) });

export const calloutTargetsResponse = z.object({ parts: z.array(calloutLinkSchema), findings: z.array(calloutLinkSchema) });
export type CalloutTargets = z.infer<typeof calloutTargetsResponse>;
