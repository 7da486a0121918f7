import { z } from 'zod';
import { text, patchOf, safeString } from './common';
import { DEVICE_CATEGORY, TEARDOWN_STATUS } from './domain';
import { clearableDay, clearableText, percentInput, priceInput, quantityInput } from './inputs';
import { DEVICE_CLAIM_QUANTITY_FIELDS, type QuantityField } from './quantity-fields';
import { currencyCode } from './settings';

/**
 * Label claims a device carries, typed with units. Each maps to the stored value (Ah, Wh, W, h) and
 * the text typed is kept in `entered` under the same name. Label, kind and example come from the
 * field declarations (quantity-fields.ts); `unit` is the stored unit.
 */
const STORED_CLAIM_UNIT = { claimCapacityAh: 'Ah', claimCapacityWh: 'Wh', claimOutputWatts: 'W', claimRuntimeH: 'h', claimPowerW: 'W' } as const;
export const DEVICE_CLAIM_FIELDS = Object.fromEntries(
  (Object.keys(STORED_CLAIM_UNIT) as (keyof typeof STORED_CLAIM_UNIT)[]).map((k) => [k, { ...DEVICE_CLAIM_QUANTITY_FIELDS[k], unit: STORED_CLAIM_UNIT[k] }]),
) as { [K in keyof typeof STORED_CLAIM_UNIT]: QuantityField & { unit: (typeof STORED_CLAIM_UNIT)[K] } };
export type DeviceClaimField = keyof typeof DEVICE_CLAIM_FIELDS;

const currencyInput = z
  .union([z.literal(''), z.null(), currencyCode])
  .optional()
  .transform((v) => (v === '' ? null : v));

const deviceFields = z.object({
  maker: text(120),
  model: text(160),
  category: DEVICE_CATEGORY.schema,
  /** "24.99", "$24.99", "24,99 €": the server reads it with the currency (or takes the currency from it). */
  retailPrice: priceInput,
  currency: currencyInput,
  /**
   * Share of sales tax (VAT) in the retail price, as a fraction (0.2 = 20 %) or typed as a percentage
   * ("20 %"). 0: the price is quoted before tax. Blank/null: the workspace default for the price's currency.
   */
  salesTaxRate: percentInput('the sales tax'),
  priceSeenOn: clearableDay,
  whereBought: clearableText(300),
  claimCapacityAh: quantityInput,
  claimCapacityWh: quantityInput,
  claimOutputWatts: quantityInput,
  claimRuntimeH: quantityInput,
  claimPowerW: quantityInput,
  claimOutputText: clearableText(200),
  notes: clearableText(5000),
});

/** POST /api/devices. A price needs its currency: a number needs the currency field; text may carry it (the server checks). */
export const createDeviceBody = deviceFields.superRefine((b, ctx) => {
  if (typeof b.retailPrice === 'number' && !b.currency) {
    ctx.addIssue({ code: 'custom', path: ['currency'], message: 'Give the currency of the price, such as USD' });
  }
});
export type CreateDeviceBody = z.infer<typeof createDeviceBody>;
export type DeviceFormValues = z.input<typeof createDeviceBody>;

/** PATCH /api/devices/:id: any subset of the fields. */
export const updateDeviceBody = patchOf(deviceFields.shape);
export type UpdateDeviceBody = z.infer<typeof updateDeviceBody>;

export const deviceListQuery = z.object({
  category: DEVICE_CATEGORY.schema.optional(),
  maker: safeString().trim().max(120).optional(),
  /** Free text over maker and model. */
  q: safeString().trim().max(120).optional(),
});
export type DeviceListQuery = z.infer<typeof deviceListQuery>;

export const teardownBriefSchema = z.object({
  id: z.number().int(),
  date: safeString(),
  unitLabel: safeString().nullable(),
  status: TEARDOWN_STATUS.schema,
});

export const deviceSchema = z.object({
  id: z.number().int(),
  maker: safeString(),
  model: safeString(),
  category: DEVICE_CATEGORY.schema,
  retailPrice: z.number().nullable(),
  currency: safeString().nullable(),
  /** Share of sales tax in the retail price (0.2 = 20 %); null: the workspace default for the currency applies. */
  salesTaxRate: z.number().nullable(),
  priceSeenOn: safeString().nullable(),
  whereBought: safeString().nullable(),
  claimCapacityAh: z.number().nullable(),
  claimCapacityWh: z.number().nullable(),
  claimOutputWatts: z.number().nullable(),
  claimRuntimeH: z.number().nullable(),
  claimPowerW: z.number().nullable(),
  claimOutputText: safeString().nullable(),
  /** The text typed for each claim, by field name (e.g. claimCapacityAh → "5000 mAh"). */
  entered: z.record(safeString(), safeString()),
  notes: safeString().nullable(),
  createdAt: safeString(),
  updatedAt: safeString(),
  /** The latest teardown the caller may see (viewers: published only). */
  latestTeardown: teardownBriefSchema.nullable(),
  teardownCount: z.number().int(),
});
export type DeviceDto = z.infer<typeof deviceSchema>;

export const deviceTeardownSchema = teardownBriefSchema.extend({
  engineer: z.object({ id: z.number().int(), name: safeString() }),
  summary: safeString().nullable(),
  findingCount: z.number().int(),
  updatedAt: safeString(),
});
export type DeviceTeardown = z.infer<typeof deviceTeardownSchema>;

export const devicesResponse = z.object({ devices: z.array(deviceSchema) });
export const deviceResponse = z.object({ device: deviceSchema });
export const deviceDetailResponse = z.object({ device: deviceSchema, teardowns: z.array(deviceTeardownSchema) });
