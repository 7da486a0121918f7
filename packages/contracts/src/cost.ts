// Should-cost: part prices, currency rate tables, cost models and the roll-up of a teardown.
// Shares are fractions (0.03 = 3 %); money is in the currency named beside it.
import { z } from 'zod';
import { percentInput } from './inputs';
import { optionalText, safeString } from './common';
import { PART_CATEGORY, MOUNT_TYPE } from './domain';
import { currencyCode } from './settings';

const labelled = <const T extends readonly string[]>(values: T, labels: Record<T[number], string>) => ({ values, labels, schema: z.enum(values) });

export const PRICE_SOURCE = labelled(['quote', 'catalogue', 'marketplace', 'estimate'] as const, {
  quote: 'Supplier quote',
  catalogue: 'Distributor catalogue',
  marketplace: 'Marketplace listing',
  estimate: 'Estimate',
});
export type PriceSource = (typeof PRICE_SOURCE.values)[number];

export const PRICE_CONFIDENCE = labelled(['high', 'medium', 'low'] as const, { high: 'High', medium: 'Medium', low: 'Low' });
export type PriceConfidence = (typeof PRICE_CONFIDENCE.values)[number];

/** What the insurance rate applies to (the cost model's insurance basis). */
export const INSURANCE_BASIS = labelled(['cif', 'goods'] as const, {
  cif: 'Goods + freight (CIF)',
  goods: 'Goods only (ex-works)',
});
export type InsuranceBasisKey = (typeof INSURANCE_BASIS.values)[number];

/** Where the sales-tax rate of a retail price came from. */
export const SALES_TAX_SOURCE = labelled(['device', 'workspace'] as const, {
  device: 'Set on the device',
  workspace: 'Workspace default for the currency',
});
export type SalesTaxSource = (typeof SALES_TAX_SOURCE.values)[number];

export const RATE_TABLE_KIND = labelled(['import', 'manual', 'demo'] as const, {
  import: 'Reference-rate file',
  manual: 'Entered by hand',
  demo: 'Demo (invented)',
});
export type RateTableKind = (typeof RATE_TABLE_KIND.values)[number];

/** A calendar date YYYY-MM-DD that exists. */
export const isoDate = safeString()
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use the form YYYY-MM-DD')
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, 'Not a calendar date');

/** A number as a form has it typed ("0,012" reads as 0.012); blank is null and unreadable text NaN, so the rule after it names the field. */
const typedNumber = z.union([z.number(), safeString()]).transform((v) => (typeof v === 'number' ? v : v.trim() === '' ? null : Number(v.trim().replace(',', '.'))));

/** Largest amount of money, quantity or rate accepted anywhere in costing (1e9): sane bounds for any currency. */
export const COST_MAX = 1_000_000_000;
const AT_MOST = 'At most 1 000 000 000';
const money = (what: string) =>
  z
    .number({ error: `${what} must be a number` })
    .min(0, `${what} must not be negative`)
    .max(COST_MAX, AT_MOST);
const fraction = (what: string) =>
  z
    .number({ error: `${what} must be a number` })
    .min(0, `${what} must not be below 0 %`)
    .max(1, `${what} must not be above 100 %`);

export const priceBreakSchema = z.object({
  minQty: z.number({ error: 'Minimum quantity must be a number' }).gt(0, 'Minimum quantity must be greater than zero').max(COST_MAX, AT_MOST),
  unitPrice: money('Unit price'),
});
export type PriceBreakDto = z.infer<typeof priceBreakSchema>;

/** Price breaks by increasing minimum quantity, each quantity once (no overlap). */
export const priceBreaksSchema = z
  .array(priceBreakSchema)
  .min(1, 'Give at least one price break')
  .max(20, 'At most 20 price breaks')
  .superRefine((breaks, ctx) => {
    for (let k = 1; k < breaks.length; k++) {
      const prev = breaks[k - 1]!.minQty;
      const cur = breaks[k]!.minQty;
      if (cur <= prev) {
        ctx.addIssue({
          code: 'custom',
          path: [k, 'minQty'],
          message: `Price breaks overlap or are out of order: ${cur} comes after ${prev}. List them by increasing quantity, each once.`,
        });
      }
    }
  });

export const partPriceBody = z.object({
  currency: currencyCode,
  breaks: priceBreaksSchema,
  source: PRICE_SOURCE.schema,
  confidence: PRICE_CONFIDENCE.schema,
  /** The day the price was seen or quoted; today when left out. */
  priceDate: isoDate.optional(),
  note: optionalText(300),
});
export type PartPriceBody = z.input<typeof partPriceBody>;

/**
 * PUT /api/parts/:id/price as forms send it: each break's minimum quantity and unit price typed as
 * text ("5k", "$0.12", "0,12 €") or given as numbers (pieces; an amount in `currency`). The server reads
 * the text with the one unit reader, then checks the breaks as `partPriceBody` does.
 */
const typedAmount = z.union([z.number(), safeString().trim().max(40, 'At most 40 characters')], { error: 'Enter a number' });
export const setPartPriceBody = partPriceBody.extend({
  breaks: z
    .array(z.object({ minQty: typedAmount, unitPrice: typedAmount }))
    .min(1, 'Give at least one price break')
    .max(20, 'At most 20 price breaks'),
});
export type SetPartPriceBody = z.input<typeof setPartPriceBody>;
/** The price editor's form as checked (the body sent). */
export type SetPartPriceForm = z.output<typeof setPartPriceBody>;

export const partPriceSchema = z.object({
  partId: z.number().int(),
  currency: safeString(),
  breaks: z.array(priceBreakSchema),
  source: PRICE_SOURCE.schema,
  confidence: PRICE_CONFIDENCE.schema,
  priceDate: safeString(),
  note: safeString().nullable(),
  updatedBy: safeString().nullable(),
  updatedAt: safeString(),
});
export type PartPriceDto = z.infer<typeof partPriceSchema>;
export const partPriceResponse = z.object({ price: partPriceSchema });

// ---- Rate tables ----

export const rateTableSchema = z.object({
  id: z.number().int(),
  base: safeString(),
  /** The day the rates are for. */
  date: safeString(),
  source: safeString(),
  kind: RATE_TABLE_KIND.schema,
  /** Units of each currency per 1 unit of base (the base itself is 1 and not listed). */
  rates: z.record(safeString(), z.number()),
  note: safeString().nullable(),
  createdBy: safeString().nullable(),
  createdAt: safeString(),
  /** The latest saved table is the current one. */
  current: z.boolean(),
});
export type RateTableDto = z.infer<typeof rateTableSchema>;
export const ratesListResponse = z.object({ current: rateTableSchema.nullable(), history: z.array(rateTableSchema) });
export type RatesList = z.infer<typeof ratesListResponse>;
export const rateTableResponse = z.object({
  rates: rateTableSchema,
  /** Things to know about the new table, e.g. a currency in use that it has no rate for. */
  warnings: z.array(safeString()),
});
export type RateTableResponse = z.infer<typeof rateTableResponse>;

/** A manual rate table: saved as a new version; the history keeps the old ones. */
export const manualRatesBody = z
  .object({
    base: currencyCode,
    date: isoDate,
    source: safeString().trim().min(1, 'Say where the rates come from').max(200, 'At most 200 characters'),
    rates: z.record(
      safeString()
        .trim()
        .toUpperCase()
        .regex(/^[A-Z]{3}$/, 'Currency codes have three letters'),
      z.number({ error: 'A rate must be a number' }).gt(0, 'A rate must be greater than zero').max(COST_MAX, AT_MOST),
    ),
    note: optionalText(300),
  })
  .superRefine((b, ctx) => {
    if (b.base in b.rates && b.rates[b.base] !== 1) {
      ctx.addIssue({ code: 'custom', path: ['rates', b.base], message: `${b.base} is the base: its rate is 1 by definition` });
    }
  });
export type ManualRatesBody = z.input<typeof manualRatesBody>;

/**
 * Rates typed by hand, one row per currency (a row without a code is left out): it becomes
 * `manualRatesBody`, whose messages name each rate as `rates.<code>`.
 */
export const manualRatesFormSchema = z
  .object({
    base: safeString(),
    date: safeString(),
    source: safeString(),
    rows: z.array(z.object({ code: safeString(), rate: typedNumber })),
  })
  .transform(({ rows, ...rest }) => ({ ...rest, rates: Object.fromEntries(rows.filter((r) => r.code.trim() !== '').map((r) => [r.code.trim().toUpperCase(), r.rate])) }) as ManualRatesBody)
  .pipe(manualRatesBody);
export type ManualRatesFormValues = z.input<typeof manualRatesFormSchema>;

// ---- Cost models ----

export const manualOperationSchema = z.object({
  label: safeString().trim().min(1, 'Name the operation').max(120, 'At most 120 characters'),
  minutes: z.number({ error: 'Minutes must be a number' }).min(0, 'Minutes must not be negative').max(600, 'At most 600 minutes'),
});

export const costModelSchema = z.object({
  /** Currency of the money amounts of the model (placement, joint, labour rate, packaging). */
  currency: currencyCode,
  /** Production volumes for the volume table, increasing. */
  volumes: z
    .array(z.number({ error: 'A volume must be a number' }).int('A volume is a whole number of units').min(1, 'A volume must be at least 1 unit').max(100_000_000, 'At most 100 million units'))
    .min(1, 'Give at least one volume')
    .max(8, 'At most 8 volumes')
    .superRefine((v, ctx) => {
      for (let k = 1; k < v.length; k++) {
        if (v[k]! <= v[k - 1]!) ctx.addIssue({ code: 'custom', path: [k], message: 'List volumes from small to large, each once' });
      }
    }),
  /** Extra parts bought per category to cover losses [CP: passives 1–5 %, ICs 0.5–1 %]. */
  attritionByCategory: z.partialRecord(PART_CATEGORY.schema, fraction('Attrition')),
  /** Attrition of categories not listed. */
  defaultAttrition: fraction('Attrition'),
  smtCostPerPlacement: money('Cost per placement'),
  thtCostPerJoint: money('Cost per joint'),
  thtJointsPerPart: z.number().min(0, 'Must not be negative').max(200, 'At most 200').default(2),
  manualOperations: z.array(manualOperationSchema).max(20, 'At most 20 operations'),
  labourRatePerHour: money('Labour rate'),
  testMinutes: z.number({ error: 'Test minutes must be a number' }).min(0, 'Must not be negative').max(600, 'At most 600 minutes'),
  packagingCost: money('Packaging'),
  /** Share of units passing first time [CP: 95–99 %]. */
  firstPassYield: z.number().gt(0, 'Yield must be above 0 %').max(1, 'Yield must not be above 100 %').default(1),
  overheadFraction: fraction('Overhead'),
  freightFraction: fraction('Freight'),
  insuranceFraction: fraction('Insurance').default(0),
  /** cif: insurance on goods + freight, the CIF value duty is levied on [S]; goods: on the ex-works value alone. */
  insuranceBasis: INSURANCE_BASIS.schema.default('cif'),
  dutyFraction: fraction('Duty'),
  retailMarginFraction: fraction('Retailer margin'),
  platformMarginFraction: fraction('Platform fee'),
  /** ± share of the unit price per confidence level, for the low/high band. */
  confidenceBand: z.object({ high: fraction('Band'), medium: fraction('Band'), low: fraction('Band') }),
});
export type CostModelDto = z.output<typeof costModelSchema>;
export type CostModelBody = z.input<typeof costModelSchema>;

/** A volume as typed: 5000, 5k, 1.5k or 2M units (NaN when unreadable: the model's rule names it). */
export function readVolume(typed: string): number {
  const m = typed.trim().match(/^([\d.]+)\s*([kKmM]?)$/);
  if (!m) return Number.NaN;
  if (m[2] === '') return Number(m[1]);
  // Round away float noise of the prefix (1.1k → 1100, not 1100.0000000000002).
  return Number((Number(m[1]) * (m[2]!.toLowerCase() === 'k' ? 1e3 : 1e6)).toPrecision(12));
}

/**
 * The cost-model form (workspace defaults and a teardown's own model): the fields of `costModelSchema`
 * under the same names, money and minutes typed as numbers, shares as percentages ("2.7" = 2.7 %),
 * the volumes as one line ("1k, 10k, 100k"), a blank attrition category meaning the default. It
 * becomes the model, checked by `costModelSchema`, whose messages name the form's fields.
 */
export const costModelFormSchema = z
  .object({
    currency: safeString(),
    volumes: safeString(),
    attritionByCategory: z.partialRecord(PART_CATEGORY.schema, percentInput('the attrition')),
    defaultAttrition: percentInput('the attrition'),
    smtCostPerPlacement: typedNumber,
    thtCostPerJoint: typedNumber,
    thtJointsPerPart: typedNumber,
    manualOperations: z.array(z.object({ label: safeString(), minutes: typedNumber })),
    labourRatePerHour: typedNumber,
    testMinutes: typedNumber,
    packagingCost: typedNumber,
    firstPassYield: percentInput('the yield'),
    overheadFraction: percentInput('the overhead'),
    freightFraction: percentInput('the freight'),
    insuranceFraction: percentInput('the insurance'),
    insuranceBasis: INSURANCE_BASIS.schema,
    dutyFraction: percentInput('the duty'),
    retailMarginFraction: percentInput('the retailer margin'),
    platformMarginFraction: percentInput('the platform fee'),
    confidenceBand: z.object({ high: percentInput('the band'), medium: percentInput('the band'), low: percentInput('the band') }),
  })
  .transform(
    (f) =>
      // A blank field goes on as null (typed: a number) for the model's rule to name it.
      ({
        ...f,
        volumes: f.volumes
          .split(/[,;\s]+/)
          .filter(Boolean)
          .map(readVolume),
        attritionByCategory: Object.fromEntries(Object.entries(f.attritionByCategory).filter(([, v]) => v !== null && v !== undefined)),
      }) as CostModelBody,
  )
  .pipe(costModelSchema);
export type CostModelFormValues = z.input<typeof costModelFormSchema>;

export const costModelResponse = z.object({ model: costModelSchema, updatedAt: safeString().nullable(), updatedBy: safeString().nullable() });
export const teardownCostModelResponse = z.object({
  /** The model the teardown is costed with. */
  model: costModelSchema,
  source: z.enum(['workspace', 'teardown']),
  defaults: costModelSchema,
  updatedAt: safeString().nullable(),
  updatedBy: safeString().nullable(),
});
export type TeardownCostModel = z.infer<typeof teardownCostModelResponse>;

// ---- The roll-up ----

export const costQuery = z.object({
  volume: z.coerce
    .number({ error: 'The volume must be a number' })
    .int('The volume is a whole number of units')
    .min(1, 'The volume must be at least 1 unit')
    .max(100_000_000, 'At most 100 million units')
    .optional(),
  currency: currencyCode.optional(),
});
export type CostQuery = z.infer<typeof costQuery>;

const figureInput = z.object({ label: safeString(), value: z.union([z.number(), safeString(), z.boolean(), z.null()]), unit: safeString().optional() });

export const costLineSchema = z.object({
  partId: z.number().int(),
  position: z.number().int(),
  designators: safeString().nullable(),
  description: safeString(),
  category: PART_CATEGORY.schema,
  makerPartNumber: safeString().nullable(),
  mount: MOUNT_TYPE.schema,
  quantity: z.number(),
  /** The quantity bought, attrition included: ceil(quantity × volume × (1 + attrition)); it picks the price break. */
  buyQuantity: z.number(),
  /** Price of the break at this volume, converted to the reporting currency, before attrition. */
  unitPrice: z.number().nullable(),
  /** quantity × unitPrice × (1 + attrition). */
  extended: z.number().nullable(),
  attrition: z.number(),
  priced: z.boolean(),
  breakMinQty: z.number().nullable(),
  belowMinimumOrder: z.boolean(),
  price: partPriceSchema.nullable(),
});
export type CostLine = z.infer<typeof costLineSchema>;

export const costStepSchema = z.object({ key: safeString(), label: safeString(), value: z.number(), formula: safeString(), inputs: z.array(figureInput) });
export type CostStepDto = z.infer<typeof costStepSchema>;

export const waterfallBarSchema = z.object({
  key: safeString(),
  label: safeString(),
  kind: z.enum(['step', 'subtotal', 'total']),
  value: z.number(),
  start: z.number(),
  end: z.number(),
});
export type WaterfallBarDto = z.infer<typeof waterfallBarSchema>;

/** The sales tax taken out of the retail price: its rate, the amount, and where the rate came from. */
export const salesTaxSchema = z.object({
  /** Share of sales tax in the price (0.2 = 20 %; 0 for a price quoted before tax). */
  rate: z.number(),
  /** retail − retail / (1 + rate), in the reporting currency. */
  amount: z.number(),
  source: SALES_TAX_SOURCE.schema,
  /** The price's currency: the workspace default is set per currency. */
  currency: safeString(),
});
export type SalesTaxDto = z.infer<typeof salesTaxSchema>;

/**
 * The form behind the workspace's sales-tax defaults: one row per currency, the rate typed as a
 * percentage; it becomes settings' `salesTaxByCurrency` (currency → fraction).
 */
export const salesTaxFormSchema = z.object({
  rows: z
    .array(
      z.object({
        currency: currencyCode,
        rate: percentInput('the sales tax').refine((v) => v !== null && v !== undefined, 'Give the rate, 0 % for prices quoted before tax'),
      }),
    )
    .max(60, 'At most 60 currencies')
    .superRefine((rows, ctx) => {
      const seen = new Set<string>();
      rows.forEach((r, k) => {
        if (seen.has(r.currency)) ctx.addIssue({ code: 'custom', path: [k, 'currency'], message: `${r.currency} is listed twice` });
        seen.add(r.currency);
      });
    }),
});
export type SalesTaxFormValues = z.input<typeof salesTaxFormSchema>;
export type SalesTaxForm = z.output<typeof salesTaxFormSchema>;

/**
 * Net to maker − landed cost. While any BOM line is unpriced (or there are none) the margin is
 * incomplete: amount and fraction are null and `reason` says why ("3 of 13 lines priced: …").
 */
const impliedMargin = z
  .object({
    amount: z.number().nullable(),
    fraction: z.number().nullable(),
    complete: z.boolean(),
    reason: safeString().nullable(),
    pricedLines: z.number().int(),
    totalLines: z.number().int(),
    /** The sales tax taken out of the retail price first; null when its rate is not known. */
    salesTax: salesTaxSchema.nullable(),
  })
  .nullable();
export type ImpliedMarginDto = z.infer<typeof impliedMargin>;

export const volumeRowSchema = z.object({
  volume: z.number().int(),
  partsTotal: z.number(),
  exWorks: z.number(),
  landed: z.number(),
  low: z.number(),
  high: z.number(),
  impliedMargin,
});
export type VolumeRow = z.infer<typeof volumeRowSchema>;

/**
 * What the caller sees of prices: 'detail' (admin, engineer, sourcing, lead) or 'totals' (the others:
 * should-cost totals only; each line's unitPrice, extended, breakMinQty and price are null).
 */
export const PRICE_VIEW = ['detail', 'totals'] as const;
export const priceViewSchema = z.enum(PRICE_VIEW);
export type PriceView = z.infer<typeof priceViewSchema>;
/** Said where a 'totals' view leaves the line prices out. */
export const PRICE_VIEW_NOTE = 'Line prices, price breaks and quote sources are shown to engineers, sourcing, leads and admins; you see the should-cost totals.';

export const costResponse = z.object({
  teardownId: z.number().int(),
  priceView: priceViewSchema,
  volume: z.number().int(),
  currency: safeString(),
  /** Date of the rate table every converted figure used; null when nothing needed converting and no table exists. */
  rateDate: safeString().nullable(),
  rateTable: z.object({ id: z.number().int(), base: safeString(), date: safeString(), source: safeString() }).nullable(),
  /** Rates of the currencies this teardown uses: per 1 base, and the cross rate into the reporting currency. */
  ratesUsed: z.array(z.object({ currency: safeString(), perBase: z.number(), toReporting: z.number() })),
  model: z.object({ source: z.enum(['workspace', 'teardown']), currency: safeString(), volumes: z.array(z.number().int()) }),
  lines: z.array(costLineSchema),
  partsTotal: z.number(),
  /** Subtotals per part category; empty in the 'totals' view (a category of one line is that line's price). */
  byCategory: z.array(z.object({ category: PART_CATEGORY.schema, total: z.number(), share: z.number().nullable(), lines: z.number().int() })),
  placements: z.number(),
  joints: z.number(),
  assembly: z.number(),
  labour: z.number(),
  test: z.number(),
  packaging: z.number(),
  yieldLoss: z.number(),
  overhead: z.number(),
  exWorks: z.number(),
  freight: z.number(),
  insurance: z.number(),
  duty: z.number(),
  landed: z.number(),
  low: z.number(),
  high: z.number(),
  retail: z
    .object({
      /** The retail price as seen (sales tax included when its rate is above 0), in the reporting currency. */
      amount: z.number(),
      /** amount / (1 + sales-tax rate). */
      beforeTax: z.number(),
      salesTax: salesTaxSchema,
      retailerShare: z.number(),
      platformShare: z.number(),
      netToMaker: z.number(),
      seen: z.object({ amount: z.number(), currency: safeString(), on: safeString().nullable() }),
    })
    .nullable(),
  impliedMargin,
  steps: z.array(costStepSchema),
  waterfall: z.array(waterfallBarSchema),
  volumes: z.array(volumeRowSchema),
  unpricedPartIds: z.array(z.number().int()),
  warnings: z.array(safeString()),
});
export type CostRollUpDto = z.infer<typeof costResponse>;

// ---- Price CSV import ----

export const priceImportQuery = z.object({
  /** preview: check and show what would change, save nothing; apply: save all rows or none. */
  mode: z.enum(['preview', 'apply']).default('preview'),
});

export const priceImportRowSchema = z.object({
  /** Line number in the file (the header is line 1). */
  line: z.number().int(),
  partId: z.number().int(),
  description: safeString(),
  designators: safeString().nullable(),
  matchedBy: z.enum(['designators', 'makerPartNumber', 'description']),
  before: partPriceSchema.omit({ partId: true, updatedBy: true, updatedAt: true }).nullable(),
  after: partPriceSchema.omit({ partId: true, updatedBy: true, updatedAt: true }),
});
export type PriceImportRow = z.infer<typeof priceImportRowSchema>;

export const priceImportResponse = z.object({
  mode: z.enum(['preview', 'apply']),
  rows: z.array(priceImportRowSchema),
  /** Lines left alone because they carry no price (e.g. unpriced lines of an export). */
  skipped: z.array(z.object({ line: z.number().int(), reason: safeString() })),
  saved: z.number().int(),
});
export type PriceImportResult = z.infer<typeof priceImportResponse>;

/** Columns of the costed-BOM CSV; the price import reads the same names (others are ignored). */
export const COSTED_BOM_COLUMNS = [
  'designators',
  'maker_part_number',
  'description',
  'category',
  'mount',
  'quantity',
  'currency',
  'breaks',
  'source',
  'confidence',
  'price_date',
  'note',
  'volume',
  'report_currency',
  'rate_date',
  'unit_price',
  'attrition_pct',
  'extended',
] as const;
