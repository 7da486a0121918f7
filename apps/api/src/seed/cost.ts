// Demo should-cost data: two rate tables (invented rates), the workspace cost model, and an
// invented price for every part that exists when this step runs. It creates no parts.
import type { PartCategory, PriceConfidence, PriceSource } from '@splitcase/contracts';
import { CostModelSchema } from '../modules/cost/cost-model.entity';
import { BUILT_IN_COST_MODEL } from '../modules/cost/defaults';
import { PartPriceSchema } from '../modules/cost/part-price.entity';
import { RateTableSchema } from '../modules/cost/rate-table.entity';
import { PartSchema } from '../modules/parts/part.entity';
import type { SeedContext } from './context';

/** Invented demo rates, units per 1 EUR (the shape of the euro reference rates; not published values). */
export const DEMO_RATES = {
  older: { date: '2026-10-30', rates: { USD: 1.0915, GBP: 0.8524, CNY: 7.842, JPY: 163.4, CHF: 0.9541, HKD: 8.497, KRW: 1512.6, SGD: 1.4398 } },
  current: { date: '2026-11-27', rates: { USD: 1.0822, GBP: 0.8463, CNY: 7.791, JPY: 161.85, CHF: 0.9487, HKD: 8.425, KRW: 1497.3, SGD: 1.4321 } },
};

/** Typical demo unit price at 1 000 pieces (USD), currency, source and confidence by category (all invented). */
const BY_CATEGORY: Record<PartCategory, { usd: number; currency: 'USD' | 'CNY'; source: PriceSource; confidence: PriceConfidence }> = {
  cell: { usd: 1.85, currency: 'CNY', source: 'quote', confidence: 'medium' },
  ic: { usd: 0.32, currency: 'USD', source: 'catalogue', confidence: 'high' },
  passive: { usd: 0.0042, currency: 'USD', source: 'catalogue', confidence: 'high' },
  inductor: { usd: 0.065, currency: 'USD', source: 'catalogue', confidence: 'high' },
  semiconductor: { usd: 0.048, currency: 'USD', source: 'catalogue', confidence: 'high' },
  connector: { usd: 0.085, currency: 'CNY', source: 'marketplace', confidence: 'medium' },
  pcb: { usd: 0.42, currency: 'CNY', source: 'quote', confidence: 'medium' },
  heater: { usd: 0.58, currency: 'CNY', source: 'estimate', confidence: 'low' },
  sensor: { usd: 0.075, currency: 'USD', source: 'catalogue', confidence: 'high' },
  switch: { usd: 0.045, currency: 'CNY', source: 'marketplace', confidence: 'medium' },
  led: { usd: 0.021, currency: 'CNY', source: 'marketplace', confidence: 'medium' },
  motor: { usd: 0.52, currency: 'CNY', source: 'quote', confidence: 'medium' },
  wire: { usd: 0.028, currency: 'CNY', source: 'marketplace', confidence: 'medium' },
  enclosure: { usd: 0.68, currency: 'CNY', source: 'estimate', confidence: 'low' },
  fastener: { usd: 0.009, currency: 'CNY', source: 'marketplace', confidence: 'medium' },
  label: { usd: 0.018, currency: 'CNY', source: 'estimate', confidence: 'low' },
  packaging: { usd: 0.24, currency: 'CNY', source: 'quote', confidence: 'medium' },
  other: { usd: 0.1, currency: 'CNY', source: 'estimate', confidence: 'low' },
};

/** A steady spread of 0.8–1.25 per part, so lines of one category differ (deterministic). */
const spread = (id: number) => 0.8 + (((id * 2654435761) >>> 0) % 1000) / 2222;
const round4 = (x: number) => Number(x.toPrecision(4));

export async function seedCost(ctx: SeedContext): Promise<void> {
  const { em } = ctx;
  const sourcing = ctx.users.sourcing;
  em.create(RateTableSchema, {
    base: 'EUR',
    date: DEMO_RATES.older.date,
    source: 'Demo rates (invented)',
    kind: 'demo',
    rates: DEMO_RATES.older.rates,
    note: 'Invented demo rates. Import the euro reference-rate file for real ones.',
    createdBy: sourcing,
    createdAt: new Date(`${DEMO_RATES.older.date}T17:00:00Z`),
  } as never);
  em.create(RateTableSchema, {
    base: 'EUR',
    date: DEMO_RATES.current.date,
    source: 'Demo rates (invented)',
    kind: 'demo',
    rates: DEMO_RATES.current.rates,
    note: 'Invented demo rates. Import the euro reference-rate file for real ones.',
    createdBy: sourcing,
    createdAt: new Date(`${DEMO_RATES.current.date}T17:00:00Z`),
  } as never);
  em.create(CostModelSchema, { teardown: null, model: BUILT_IN_COST_MODEL, updatedBy: sourcing } as never);

  // Prices for the parts that exist (another step or feature makes the parts).
  const usdToCny = DEMO_RATES.current.rates.CNY / DEMO_RATES.current.rates.USD;
  const parts = await em.find(PartSchema, {}, { orderBy: { id: 'asc' } });
  for (const part of parts) {
    const c = BY_CATEGORY[part.category] ?? BY_CATEGORY.other;
    const atThousand = c.usd * spread(part.id) * (c.currency === 'CNY' ? usdToCny : 1);
    const breaks =
      c.source === 'estimate'
        ? [{ minQty: 1000, unitPrice: round4(atThousand) }]
        : [
            { minQty: 1, unitPrice: round4(atThousand * 1.6) },
            { minQty: 1000, unitPrice: round4(atThousand) },
            { minQty: 10_000, unitPrice: round4(atThousand * 0.86) },
            { minQty: 100_000, unitPrice: round4(atThousand * 0.76) },
          ];
    em.create(PartPriceSchema, {
      part,
      currency: c.currency,
      breaks,
      source: c.source,
      confidence: c.confidence,
      priceDate: DEMO_RATES.current.date,
      note: 'Demo price (invented).',
      updatedBy: sourcing,
    } as never);
  }
  ctx.log(`demo cost: 2 rate tables, the workspace cost model, prices for ${parts.length} parts`);
}
