import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { PRICE_CONFIDENCE, PRICE_SOURCE, type PriceBreakDto } from '@splitcase/contracts';
import { PartSchema } from '../parts/part.entity';
import { UserSchema } from '../users/user.entity';

/** The price of one BOM line: breaks (minimum quantity → unit price) in one currency, where it came from and how sure we are. */
export const PartPriceSchema = defineEntity({
  name: 'PartPrice',
  tableName: 'part_prices',
  properties: {
    id: p.integer().primary().autoincrement(),
    part: () => p.oneToOne(PartSchema).owner().unique().deleteRule('cascade'),
    currency: p.string().length(3),
    /** By increasing minQty, each once. */
    breaks: p.json<PriceBreakDto[]>(),
    source: p.enum([...PRICE_SOURCE.values]),
    confidence: p.enum([...PRICE_CONFIDENCE.values]),
    /** The day the price was seen or quoted (YYYY-MM-DD). */
    priceDate: p.string().length(10),
    note: p.string().length(300).nullable(),
    updatedBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type PartPrice = InferEntity<typeof PartPriceSchema>;
