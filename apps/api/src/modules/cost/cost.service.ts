import type { EntityManager } from '@mikro-orm/sqlite';
import { costAtVolumes, costWaterfall, crossRate, rateFor, rollUpCost, type CostLineInput, type CostModel, type RateTable as CalcRateTable } from '@splitcase/calc';
import {
  SALES_TAX_SOURCE,
  type CostModelDto,
  type CostRollUpDto,
  type ImpliedMarginDto,
  type PartCategory,
  type PartPriceDto,
  type PriceView,
  type SalesTaxSource,
  type TeardownCostModel,
  type WorkspaceSettings,
} from '@splitcase/contracts';
import { AppError, validationError } from '../../http/errors';
import { PartSchema, type Part } from '../parts/part.entity';
import { getSettings } from '../settings/settings.service';
import type { Device } from '../devices/device.entity';
import type { Teardown } from '../teardowns/teardown.entity';
import { teardownModels } from './cost-model.service';
import { findInChunks, groupBy, refId } from '../../db/batch';
import { PartPriceSchema, type PartPrice } from './part-price.entity';
import { categoriesFor, totalsOnlyLine } from './price-visibility';
import { currentRateTable, hasRate } from './rates.service';
import type { RateTable } from './rate-table.entity';

export function toPartPriceDto(p: PartPrice): PartPriceDto {
  return {
    partId: p.part.id,
    currency: p.currency,
    breaks: p.breaks,
    source: p.source,
    confidence: p.confidence,
    priceDate: p.priceDate,
    note: p.note ?? null,
    updatedBy: p.updatedBy?.name ?? null,
    updatedAt: p.updatedAt.toISOString(),
  };
}

/** The calc model from the stored one (same names; shares are fractions). */
export function toCalcModel(m: CostModelDto): CostModel {
  return {
    currency: m.currency,
    attritionByCategory: { ...m.attritionByCategory } as Record<string, number>,
    defaultAttrition: m.defaultAttrition,
    smtCostPerPlacement: m.smtCostPerPlacement,
    thtCostPerJoint: m.thtCostPerJoint,
    thtJointsPerPart: m.thtJointsPerPart,
    manualOperations: m.manualOperations,
    labourRatePerHour: m.labourRatePerHour,
    testMinutes: m.testMinutes,
    packagingCost: m.packagingCost,
    firstPassYield: m.firstPassYield,
    overheadFraction: m.overheadFraction,
    freightFraction: m.freightFraction,
    insuranceFraction: m.insuranceFraction,
    insuranceBasis: m.insuranceBasis,
    dutyFraction: m.dutyFraction,
    retailMarginFraction: m.retailMarginFraction,
    platformMarginFraction: m.platformMarginFraction,
    confidenceBand: m.confidenceBand,
  };
}

/**
 * The share of sales tax in a device's retail price: the device's own rate, else the workspace
 * default for the price's currency; null when neither is set.
 */
export function salesTaxFor(
  device: Pick<Device, 'salesTaxRate' | 'retailCurrency'>,
  settings: Pick<WorkspaceSettings, 'salesTaxByCurrency'>,
): { rate: number; source: SalesTaxSource; currency: string } | null {
  const currency = device.retailCurrency;
  if (!currency) return null;
  if (device.salesTaxRate !== null && device.salesTaxRate !== undefined) return { rate: Number(device.salesTaxRate), source: 'device', currency };
  const rate = settings.salesTaxByCurrency[currency];
  return rate === undefined ? null : { rate, source: 'workspace', currency };
}

/** A part's name for messages: its designators, else its description. */
export const partName = (p: Pick<Part, 'designators' | 'description'>) => (p.designators ? `${p.designators} (${p.description})` : p.description);

const noRate = (code: string, table: RateTable | null) =>
  table
    ? `No exchange rate for ${code} in the current rate table (base ${table.base}, ${table.date}). Add it on the Rates page, or use another currency.`
    : `No rate table yet, so ${code} cannot be converted. Import the reference-rate file or enter rates on the Rates page.`;

/** The parts of a teardown in BOM order with their prices (price null when not priced). */
export async function pricedParts(em: EntityManager, teardownId: number): Promise<{ part: Part; price: PartPrice | null }[]> {
  return (await pricedPartsOf(em, [teardownId])).get(teardownId) ?? [];
}

/** The priced parts of many teardowns, keyed by teardown id (BOM order), in two queries whatever the count. */
async function pricedPartsOf(em: EntityManager, teardownIds: readonly number[]): Promise<Map<number, { part: Part; price: PartPrice | null }[]>> {
  const parts = await findInChunks(teardownIds, (chunk) => em.find(PartSchema, { teardown: { $in: chunk } }, { orderBy: { position: 'asc', id: 'asc' } }));
  const partIds = parts.map((p) => p.id);
  const prices = partIds.length ? await findInChunks(partIds, (chunk) => em.find(PartPriceSchema, { part: { $in: chunk } }, { populate: ['updatedBy'] })) : [];
  const byPart = new Map(prices.map((p) => [p.part.id, p]));
  return groupBy(
    parts.map((part) => ({ part, price: byPart.get(part.id) ?? null })),
    (i) => refId(i.part.teardown),
  );
}

/** What the should-cost of some teardowns is made from: read once for all of them (costReads), then costOf each. */
export interface CostReads {
  items: Map<number, { part: Part; price: PartPrice | null }[]>;
  models: Map<number, TeardownCostModel>;
  table: RateTable | null;
  settings: WorkspaceSettings;
}

/** The parts, prices, cost models, current rate table and settings of many teardowns, in a fixed number of queries. */
export async function costReads(em: EntityManager, teardowns: readonly Teardown[]): Promise<CostReads> {
  const ids = [...new Set(teardowns.map((t) => t.id))];
  const items = await pricedPartsOf(em, ids);
  const models = await teardownModels(em, ids);
  const table = await currentRateTable(em);
  const settings = await getSettings(em);
  return { items, models, table, settings };
}

/**
 * The should-cost of a teardown at a volume in a currency: the calc roll-up of its parts and
 * prices with its cost model and the current rate table, plus the volume table and waterfall.
 * Every currency it needs must have a rate: otherwise an error names each one. A 'totals' view
 * (price-visibility.ts) leaves out each line's price detail and the warnings about single lines.
 */
export async function teardownCost(em: EntityManager, teardown: Teardown, query: { volume?: number | undefined; currency?: string | undefined }, view: PriceView): Promise<CostRollUpDto> {
  return costOf(await costReads(em, [teardown]), teardown, query, view);
}

/** teardownCost from what costReads read (the teardown's device loaded). */
export function costOf(reads: CostReads, teardown: Teardown, query: { volume?: number | undefined; currency?: string | undefined }, view: PriceView): CostRollUpDto {
  const items = reads.items.get(teardown.id) ?? [];
  const modelInfo = reads.models.get(teardown.id)!;
  const { table, settings } = reads;
  const model = modelInfo.model;
  const currency = query.currency ?? settings.reportingCurrency;
  const volumes = model.volumes;
  const volume = query.volume ?? (volumes[Math.floor((volumes.length - 1) / 2)] as number);

  // Every currency must convert: the reporting one (a query mistake: 400), then stored data (422).
  if (currency !== model.currency || items.some((i) => i.price && i.price.currency !== currency)) {
    if (!hasRate(table, currency)) throw validationError({ currency: noRate(currency, table) });
  }
  const problems: Record<string, string> = {};
  if (model.currency !== currency && !hasRate(table, model.currency)) problems['model.currency'] = `The cost model is in ${model.currency}. ${noRate(model.currency, table)}`;
  for (const { part, price } of items) {
    if (price && price.currency !== currency && !hasRate(table, price.currency)) {
      problems[`parts.${part.id}.currency`] = `${partName(part)} is priced in ${price.currency}. ${noRate(price.currency, table)}`;
    }
  }
  if (Object.keys(problems).length) {
    throw new AppError('unprocessable', `Some prices cannot be converted to ${currency}: ${Object.values(problems)[0]}`, problems);
  }

  const rates: CalcRateTable = table ? { base: table.base, rates: table.rates } : { base: currency, rates: {} };
  const warnings: string[] = [];
  const device = teardown.device;
  let retail: { amount: number; currency: string; salesTaxRate: number } | null = null;
  const tax = salesTaxFor(device, settings);
  // Without a sales-tax rate the price cannot be netted: the margin is incomplete, with what to set.
  let noTaxRate: string | null = null;
  if (device.retailPrice && device.retailCurrency) {
    if (device.retailCurrency === currency || (hasRate(table, device.retailCurrency) && hasRate(table, currency))) {
      if (tax) retail = { amount: Number(device.retailPrice), currency: device.retailCurrency, salesTaxRate: tax.rate };
      else {
        noTaxRate = `No sales-tax rate for ${device.retailCurrency}: set "Sales tax in the price" on the device (0 % for a price quoted before tax), or a default for ${device.retailCurrency} under sales tax on the Rates & cost model page.`;
        warnings.push(noTaxRate);
      }
    } else warnings.push(`The retail price is in ${device.retailCurrency}, which the current rate table cannot convert: no implied margin.`);
  } else warnings.push('The device has no retail price: add it to see the implied margin.');

  const lines: CostLineInput[] = items.map(({ part, price }) => ({
    partId: String(part.id),
    category: part.category,
    quantity: part.quantity,
    mount: part.mount,
    price: price ? { currency: price.currency, breaks: price.breaks, confidence: price.confidence } : null,
  }));
  const input = { currency, rates, lines, model: toCalcModel(model), retail };
  const r = rollUpCost({ ...input, volume });
  const volumeList = [...new Set([...volumes, volume])].sort((a, b) => a - b);
  const atVolumes = costAtVolumes(volumeList, input);

  const byPart = new Map(items.map((i) => [String(i.part.id), i]));
  const partLabel = (id: string) => {
    const item = byPart.get(id);
    return item ? partName(item.part) : id;
  };
  // calc names lines by id; say which part a warning is about in words.
  if (view === 'detail') warnings.unshift(...r.warnings.map((w) => w.replace(/^(\d+):/, (_m, id: string) => `${partLabel(id)}:`)));
  if (r.unpricedPartIds.length) {
    const n = r.unpricedPartIds.length;
    warnings.push(
      `${n} of ${items.length} parts ${n === 1 ? 'has' : 'have'} no price and ${n === 1 ? 'adds' : 'add'} nothing to the totals${retail ? '; the implied margin stays incomplete until every line is priced' : ''}.`,
    );
  }

  const used = new Set<string>([model.currency, ...items.flatMap((i) => (i.price ? [i.price.currency] : [])), ...(retail ? [retail.currency] : [])]);
  used.delete(currency);
  const ratesUsed = [...used].sort().map((code) => ({ currency: code, perBase: rateFor(rates, code), toReporting: crossRate(rates, code, currency) }));

  const salesTax = (roll: typeof r) => (roll.retail && tax ? { rate: tax.rate, amount: roll.retail.salesTax, source: tax.source, currency: tax.currency } : null);
  const marginOf = (roll: typeof r): ImpliedMarginDto => {
    const pricedLines = roll.lines.length - roll.unpricedPartIds.length;
    if (noTaxRate) return { amount: null, fraction: null, complete: false, reason: noTaxRate, pricedLines, totalLines: roll.lines.length, salesTax: null };
    const tx = salesTax(roll);
    return roll.impliedMargin && tx ? { ...roll.impliedMargin, salesTax: tx } : null;
  };
  // Say where the sales-tax rate came from beside the step that uses it.
  const steps = r.steps.map((s) =>
    s.key === 'retailBeforeTax' && tax
      ? { ...s, inputs: [...s.inputs, { label: 'Rate from', value: tax.source === 'device' ? SALES_TAX_SOURCE.labels.device : `Workspace default for ${tax.currency}` }] }
      : s,
  );

  const categories = Object.entries(r.byCategory)
    .map(([category, total]) => ({
      category: category as PartCategory,
      total,
      share: r.partsTotal > 0 ? total / r.partsTotal : null,
      lines: r.lines.filter((l) => l.category === category).length,
    }))
    .sort((a, b) => b.total - a.total || a.category.localeCompare(b.category));

  const costLines = r.lines.map((l) => {
    const item = byPart.get(l.partId)!;
    return {
      partId: item.part.id,
      position: item.part.position,
      designators: item.part.designators ?? null,
      description: item.part.description,
      category: item.part.category,
      makerPartNumber: item.part.makerPartNumber ?? null,
      mount: item.part.mount,
      quantity: l.quantity,
      buyQuantity: l.buyQuantity,
      unitPrice: l.unitPrice,
      extended: l.extended,
      attrition: l.attrition,
      priced: l.priced,
      breakMinQty: l.breakMinQty,
      belowMinimumOrder: l.belowMinimumOrder,
      price: item.price ? toPartPriceDto(item.price) : null,
    };
  });

  return {
    teardownId: teardown.id,
    priceView: view,
    volume: r.volume,
    currency: r.currency,
    rateDate: table?.date ?? null,
    rateTable: table ? { id: table.id, base: table.base, date: table.date, source: table.source } : null,
    ratesUsed,
    model: { source: modelInfo.source, currency: model.currency, volumes },
    lines: view === 'detail' ? costLines : costLines.map(totalsOnlyLine),
    partsTotal: r.partsTotal,
    byCategory: categoriesFor(view, categories),
    placements: r.placements,
    joints: r.joints,
    assembly: r.assembly,
    labour: r.labour,
    test: r.test,
    packaging: r.packaging,
    yieldLoss: r.yieldLoss,
    overhead: r.overhead,
    exWorks: r.exWorks,
    freight: r.freight,
    insurance: r.insurance,
    duty: r.duty,
    landed: r.landed,
    low: r.low,
    high: r.high,
    retail:
      r.retail && retail
        ? {
            amount: r.retail.amount,
            beforeTax: r.retail.beforeTax,
            salesTax: salesTax(r)!,
            retailerShare: r.retail.retailerShare,
            platformShare: r.retail.platformShare,
            netToMaker: r.retail.netToMaker,
            seen: { amount: retail.amount, currency: retail.currency, on: device.priceSeenOn ?? null },
          }
        : null,
    impliedMargin: marginOf(r),
    steps,
    waterfall: costWaterfall(r),
    volumes: atVolumes.map((v) => ({ volume: v.volume, partsTotal: v.partsTotal, exWorks: v.exWorks, landed: v.landed, low: v.low, high: v.high, impliedMargin: marginOf(v) })),
    unpricedPartIds: r.unpricedPartIds.map(Number),
    warnings,
  };
}
