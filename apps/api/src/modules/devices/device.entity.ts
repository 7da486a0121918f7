import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { DEVICE_CATEGORY } from '@splitcase/contracts';
import { UserSchema } from '../users/user.entity';

/** A product on the market: what it claims on the label and what it sold for. */
export const DeviceSchema = defineEntity({
  name: 'Device',
  tableName: 'devices',
  indexes: [{ properties: ['category'] }, { properties: ['maker'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    maker: p.string().length(120),
    model: p.string().length(160),
    category: p.enum([...DEVICE_CATEGORY.values]),
    retailPrice: p.double().nullable(),
    retailCurrency: p.string().length(3).nullable(),
    /** Share of sales tax in the retail price (0.2 = 20 %); 0 before tax; null: the workspace default for the currency. */
    salesTaxRate: p.double().nullable(),
    priceSeenOn: p.string().length(10).nullable(),
    whereBought: p.string().length(300).nullable(),
    /** Label claims, as printed on the device or its box (SI: Ah, Wh, W, h). */
    claimCapacityAh: p.double().nullable(),
    claimCapacityWh: p.double().nullable(),
    claimOutputText: p.string().length(200).nullable(),
    claimOutputWatts: p.double().nullable(),
    claimRuntimeH: p.double().nullable(),
    claimPowerW: p.double().nullable(),
    /** The text the user typed for each claim, e.g. { claimCapacityAh: "5000 mAh" }. */
    entered: p.json<Record<string, string>>().nullable(),
    notes: p.text().nullable(),
    createdBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type Device = InferEntity<typeof DeviceSchema>;
