/**
 * Should-cost roll-up: a bill of materials with price breaks and a cost model
 * turned into parts, assembly, labour, test, packaging, overhead, ex-works,
 * freight, insurance, duty and landed cost at one production volume, in one
 * currency, with a confidence range and the margin implied by a retail price.
 */
import type { FigureInput } from '../shared/explained';
import { requireFraction, requireInteger, requireNonNegative, requirePositive } from '../shared/validate';
import { normaliseCurrency, rateFor, type RateTable } from './currency';
import { assertPriceBreaks, breakIndexAt, type PriceBreak } from './price-breaks';
import { plain } from '../shared/text';

export type PriceConfidence = 'high' | 'medium' | 'low';
export type MountKind = 'smt' | 'tht' | 'manual';
/** What insurance is a share of: goods + freight (CIF, the base duty is levied on) or the goods alone. */
export type InsuranceBasis = 'cif' | 'goods';

const CONFIDENCES: readonly PriceConfidence[] = ['high', 'medium', 'low'];
const MOUNTS: readonly MountKind[] = ['smt', 'tht', 'manual'];
const INSURANCE_BASES: readonly InsuranceBasis[] = ['cif', 'goods'];

/**
 * Assumptions that turn a BOM into a should-cost. Money amounts are in
 * `currency`; every share is a fraction 0..1 (0.03 = 3 %).
 */
export interface CostModel {
  currency: string;
  /** Extra parts bought per category to cover losses, e.g. { passive: 0.03, ic: 0.01 } [CP: passives 1–5 %, ICs 0.5–1 %]. */
  attritionByCategory: Record<string, number>;
  /** Attrition for categories not listed. */
  defaultAttrition: number;
  smtCostPerPlacement: number;
  thtCostPerJoint: number;
  /** Solder joints per through-hole part; default 2. */
  thtJointsPerPart?: number;
  manualOperations: { label: string; minutes: number }[];
  labourRatePerHour: number;
  testMinutes: number;
  packagingCost: number;
  /** Share of units passing first time (95–99 % typical [CP]); scrap cost = (parts + assembly + labour + test)·(1/yield − 1). Default 1. */
  firstPassYield?: number;
  /** Overhead on parts + assembly + labour + test + packaging + yield loss. */
  overheadFraction: number;
  /** Freight as a share of the ex-works cost. */
  freightFraction: number;
  /** Insurance rate (0.5–2 % of goods value typical [S/CP]); default 0. */
  insuranceFraction?: number;
  /**
   * What the insurance rate applies to: 'cif' (default) insures goods + freight, the CIF value the
   * duty is levied on [S: CIF = FOB + freight + insurance, REFERENCES §10]; 'goods' insures the
   * ex-works value alone, as the §10 worked example does.
   */
  insuranceBasis?: InsuranceBasis;
  /** Import duty on the CIF value (ex-works + freight + insurance) [S: CIF basis in the EU, UK and most of Asia]. */
  dutyFraction: number;
  /** Retailer's share of the retail price. */
  retailMarginFraction: number;
  /** Marketplace or platform fee as a share of what the retailer passes on. */
  platformMarginFraction: number;
  /** ± share applied to the unit price of lines of each confidence for the low/high range. */
  confidenceBand: Record<PriceConfidence, number>;
}

export interface CostLineInput {
  partId: string;
  category: string;
  /** Quantity per finished unit. */
  quantity: number;
  mount: MountKind;
  price?: { currency: string; breaks: PriceBreak[]; confidence: PriceConfidence } | null;
}

export interface RollUpInput {
  /** Units built. */
  volume: number;
  /** Reporting currency of the result. */
  currency: string;
  rates: RateTable;
  lines: CostLineInput[];
  model: CostModel;
  /**
   * The retail price as seen and the share of sales tax (VAT) in it (0.2 = 20 %; 0 for a price quoted
   * before tax, the usual US quote [CP]; default 0): net = amount / (1 + salesTaxRate) [CP; C].
   */
  retail?: { amount: number; currency: string; salesTaxRate?: number } | null;
}

export interface CostLineResult {
  partId: string;
  category: string;
  quantity: number;
  mount: MountKind;
  /** Quantity bought for the volume, attrition included: ceil(quantity × volume × (1 + attrition)); picks the price break. */
  buyQuantity: number;
  /** Price of the break for buyQuantity in the reporting currency, before attrition; null when unpriced. */
  unitPrice: number | null;
  /** quantity × unitPrice × (1 + attrition); null when unpriced. */
  extended: number | null;
  attrition: number;
  priced: boolean;
  confidence: PriceConfidence | null;
  /** True when buyQuantity is below the first break and the first break's price was used. */
  belowMinimumOrder: boolean;
  /** minQty of the break that set the price; null when unpriced. */
  breakMinQty: number | null;
}

export interface CostStep {
  key: string;
  label: string;
  value: number;
  formula: string;
  /** The numbers the formula used, each with its unit (the reporting currency, %, min…). */
  inputs: FigureInput[];
}

export interface CostRollUp {
  volume: number;
  currency: string;
  lines: CostLineResult[];
  partsTotal: number;
  byCategory: Record<string, number>;
  /** SMT placements per unit (Σ quantity of smt lines). */
  placements: number;
  /** Through-hole joints per unit (Σ quantity of tht lines × joints per part). */
  joints: number;
  assembly: number;
  labour: number;
  test: number;
  packaging: number;
  yieldLoss: number;
  overhead: number;
  exWorks: number;
  freight: number;
  insurance: number;
  duty: number;
  landed: number;
  /** Landed cost with every priced unit price × (1 − its confidence band). */
  low: number;
  /** Landed cost with every priced unit price × (1 + its confidence band). */
  high: number;
  /**
   * Retail price in the reporting currency as seen (tax included), split into sales tax, the
   * retailer's share, the platform's fee and what reaches the maker.
   */
  retail: {
    amount: number;
    salesTaxRate: number;
    salesTax: number;
    beforeTax: number;
    retailerShare: number;
    platformShare: number;
    netToMaker: number;
  } | null;
  impliedMargin: ImpliedMargin | null;
  unpricedPartIds: string[];
  warnings: string[];
  steps: CostStep[];
}

/**
 * Net to maker − landed cost. Incomplete (amount and fraction null, with the reason) while any BOM
 * line is unpriced or there are no lines: a cost that leaves parts out would overstate the margin.
 */
export interface ImpliedMargin {
  amount: number | null;
  /** amount / net to maker; null when incomplete or when nothing reaches the maker. */
  fraction: number | null;
  complete: boolean;
  /** Why the margin is incomplete ("3 of 13 lines priced: …"); null when complete. */
  reason: string | null;
  pricedLines: number;
  totalLines: number;
}

/** Short number for formulas: six significant digits, no trailing zeros. */
function fmt(x: number): string {
  return plain(x, 6);
}

function requireText(value: unknown, name: string): string {
  if (typeof value !== 'string' || value.trim() === '') throw new RangeError(`${name} must be non-empty text.`);
  return value;
}

interface CheckedModel {
  currency: string;
  attritionByCategory: Record<string, number>;
  defaultAttrition: number;
  smt: number;
  tht: number;
  jointsPerPart: number;
  manualMinutes: number;
  labourRate: number;
  testMinutes: number;
  packaging: number;
  yield: number;
  overhead: number;
  freight: number;
  insurance: number;
  insuranceBasis: InsuranceBasis;
  duty: number;
  retailMargin: number;
  platformMargin: number;
  band: Record<PriceConfidence, number>;
}

function checkModel(model: CostModel): CheckedModel {
  if (model === null || typeof model !== 'object') throw new RangeError('model must be a cost model.');
  const attrition = model.attritionByCategory ?? {};
  if (typeof attrition !== 'object') throw new RangeError('model.attritionByCategory must map categories to fractions.');
  const attritionByCategory: Record<string, number> = {};
  for (const [category, value] of Object.entries(attrition)) {
    attritionByCategory[category] = requireFraction(value, `model.attritionByCategory.${category}`);
  }
  if (!Array.isArray(model.manualOperations)) throw new RangeError('model.manualOperations must be a list (it may be empty).');
  let manualMinutes = 0;
  model.manualOperations.forEach((op, k) => {
    requireText(op?.label, `model.manualOperations[${k}].label`);
    manualMinutes += requireNonNegative(op.minutes, `model.manualOperations[${k}].minutes`);
  });
  const band = model.confidenceBand;
  if (band === null || typeof band !== 'object') throw new RangeError('model.confidenceBand must give high, medium and low fractions.');
  const yieldFraction = requireFraction(model.firstPassYield ?? 1, 'model.firstPassYield');
  const insuranceBasis = model.insuranceBasis ?? 'cif';
  if (!INSURANCE_BASES.includes(insuranceBasis)) {
    throw new RangeError(`model.insuranceBasis must be one of ${INSURANCE_BASES.join(', ')} (got ${JSON.stringify(insuranceBasis)}).`);
  }
  if (yieldFraction === 0) throw new RangeError('model.firstPassYield must be greater than zero (got 0).');
  return {
    currency: normaliseCurrency(model.currency, 'model.currency'),
    attritionByCategory,
    defaultAttrition: requireFraction(model.defaultAttrition, 'model.defaultAttrition'),
    smt: requireNonNegative(model.smtCostPerPlacement, 'model.smtCostPerPlacement'),
    tht: requireNonNegative(model.thtCostPerJoint, 'model.thtCostPerJoint'),
    jointsPerPart: requireNonNegative(model.thtJointsPerPart ?? 2, 'model.thtJointsPerPart'),
    manualMinutes,
    labourRate: requireNonNegative(model.labourRatePerHour, 'model.labourRatePerHour'),
    testMinutes: requireNonNegative(model.testMinutes, 'model.testMinutes'),
    packaging: requireNonNegative(model.packagingCost, 'model.packagingCost'),
    yield: yieldFraction,
    overhead: requireFraction(model.overheadFraction, 'model.overheadFraction'),
    freight: requireFraction(model.freightFraction, 'model.freightFraction'),
    insurance: requireFraction(model.insuranceFraction ?? 0, 'model.insuranceFraction'),
    insuranceBasis,
    duty: requireFraction(model.dutyFraction, 'model.dutyFraction'),
    retailMargin: requireFraction(model.retailMarginFraction, 'model.retailMarginFraction'),
    platformMargin: requireFraction(model.platformMarginFraction, 'model.platformMarginFraction'),
    band: {
      high: requireFraction(band.high, 'model.confidenceBand.high'),
      medium: requireFraction(band.medium, 'model.confidenceBand.medium'),
      low: requireFraction(band.low, 'model.confidenceBand.low'),
    },
  };
}

/** Everything after the parts total, for one parts total. */
function afterParts(parts: number, fixed: { assembly: number; labour: number; test: number; packaging: number }, m: CheckedModel) {
  const yieldLoss = (parts + fixed.assembly + fixed.labour + fixed.test) * (1 / m.yield - 1);
  const overhead = m.overhead * (parts + fixed.assembly + fixed.labour + fixed.test + fixed.packaging + yieldLoss);
  const exWorks = parts + fixed.assembly + fixed.labour + fixed.test + fixed.packaging + yieldLoss + overhead;
  const freight = m.freight * exWorks;
  const insured = m.insuranceBasis === 'cif' ? exWorks + freight : exWorks;
  const insurance = m.insurance * insured;
  const duty = m.duty * (exWorks + freight + insurance);
  return { yieldLoss, overhead, exWorks, freight, insured, insurance, duty, landed: exWorks + freight + insurance + duty };
}

/** Pieces bought: ceil(quantity × volume × (1 + attrition)), rounded to 12 digits first so 1000 × 1.07 is 1070, not 1071. */
function purchasedQuantity(quantity: number, volume: number, attrition: number): number {
  return Math.ceil(Number((quantity * volume * (1 + attrition)).toPrecision(12)));
}

/**
 * Should-cost of one unit at a production volume, in p.currency. Unit prices
 * come from the break for the purchased quantity, ceil(quantity × volume ×
 * (1 + attrition)) [CP: attrition is extra parts bought], converted before attrition;
 * model money amounts are converted from model.currency. Unpriced lines add
 * nothing to the parts total and are listed in unpricedPartIds.
 */
export function rollUpCost(p: RollUpInput): CostRollUp {
  if (p === null || typeof p !== 'object') throw new RangeError('The roll-up needs { volume, currency, rates, lines, model }.');
  const volume = requireInteger(p.volume, 'volume', 1);
  const currency = normaliseCurrency(p.currency, 'currency');
  const m = checkModel(p.model);
  // Amounts already in the reporting currency need no rate; others go through the table's base.
  const toReport = (amount: number, from: string, field: string) => (from === currency ? amount : (amount / rateFor(p.rates, from, field)) * rateFor(p.rates, currency, 'currency'));
  const modelFactor = toReport(1, m.currency, 'model.currency');

  if (!Array.isArray(p.lines)) throw new RangeError('lines must be a list of BOM lines (it may be empty).');
  const warnings: string[] = [];
  const lines: CostLineResult[] = [];
  const byCategory: Record<string, number> = {};
  const unpricedPartIds: string[] = [];
  let partsTotal = 0;
  let partsLow = 0;
  let partsHigh = 0;
  let placements = 0;
  let thtParts = 0;
  p.lines.forEach((line, k) => {
    const path = `lines[${k}]`;
    if (line === null || typeof line !== 'object') throw new RangeError(`${path} must be a BOM line.`);
    const partId = requireText(line.partId, `${path}.partId`);
    const category = requireText(line.category, `${path}.category`);
    const quantity = requirePositive(line.quantity, `${path}.quantity`);
    if (!MOUNTS.includes(line.mount)) {
      throw new RangeError(`${path}.mount must be one of ${MOUNTS.join(', ')} (got ${JSON.stringify(line.mount)}).`);
    }
    if (line.mount === 'smt') placements += quantity;
    if (line.mount === 'tht') thtParts += quantity;
    const attrition = m.attritionByCategory[category] ?? m.defaultAttrition;
    const buyQuantity = purchasedQuantity(quantity, volume, attrition);
    byCategory[category] ??= 0;
    const price = line.price;
    if (!price || (Array.isArray(price.breaks) && price.breaks.length === 0)) {
      unpricedPartIds.push(partId);
      lines.push({
        partId,
        category,
        quantity,
        mount: line.mount,
        buyQuantity,
        unitPrice: null,
        extended: null,
        attrition,
        priced: false,
        confidence: null,
        belowMinimumOrder: false,
        breakMinQty: null,
      });
      return;
    }
    if (!CONFIDENCES.includes(price.confidence)) {
      throw new RangeError(`${path}.price.confidence must be one of ${CONFIDENCES.join(', ')} (got ${JSON.stringify(price.confidence)}).`);
    }
    const priceCurrency = normaliseCurrency(price.currency, `${path}.price.currency`);
    assertPriceBreaks(price.breaks, `${path}.price.breaks`);
    let index = breakIndexAt(price.breaks, buyQuantity);
    const belowMinimumOrder = index === -1;
    if (belowMinimumOrder) {
      index = 0;
      warnings.push(`${partId}: ${fmt(buyQuantity)} pieces is below the smallest price break (${(price.breaks[0] as PriceBreak).minQty}); priced at that break.`);
    }
    const unitPrice = toReport((price.breaks[index] as PriceBreak).unitPrice, priceCurrency, `${path}.price.currency`);
    const extended = quantity * unitPrice * (1 + attrition);
    const band = m.band[price.confidence];
    partsTotal += extended;
    partsLow += extended * (1 - band);
    partsHigh += extended * (1 + band);
    byCategory[category] += extended;
    lines.push({
      partId,
      category,
      quantity,
      mount: line.mount,
      buyQuantity,
      unitPrice,
      extended,
      attrition,
      priced: true,
      confidence: price.confidence,
      belowMinimumOrder,
      breakMinQty: (price.breaks[index] as PriceBreak).minQty,
    });
  });

  const joints = thtParts * m.jointsPerPart;
  const smtCost = m.smt * modelFactor;
  const thtCost = m.tht * modelFactor;
  const labourRate = m.labourRate * modelFactor;
  const fixed = {
    assembly: placements * smtCost + joints * thtCost,
    labour: (m.manualMinutes / 60) * labourRate,
    test: (m.testMinutes / 60) * labourRate,
    packaging: m.packaging * modelFactor,
  };
  const { insured: _insured, ...mid } = afterParts(partsTotal, fixed, m);
  const insured = _insured;
  const low = afterParts(partsLow, fixed, m).landed;
  const high = afterParts(partsHigh, fixed, m).landed;

  const cur = currency;
  const pct = (f: number) => f * 100;
  const pricedCount = lines.length - unpricedPartIds.length;
  const steps: CostStep[] = [
    {
      key: 'parts',
      label: 'Parts with attrition',
      value: partsTotal,
      formula: `Σ quantity × unit price × (1 + attrition) over ${pricedCount} priced lines = ${fmt(partsTotal)}`,
      inputs: [
        { label: 'Priced lines', value: pricedCount, unit: '' },
        { label: 'Unpriced lines (left out)', value: unpricedPartIds.length, unit: '' },
        { label: 'Volume', value: volume, unit: 'units' },
      ],
    },
    {
      key: 'assembly',
      label: 'Assembly',
      value: fixed.assembly,
      formula: `${fmt(placements)} placements × ${fmt(smtCost)} + ${fmt(joints)} joints × ${fmt(thtCost)} = ${fmt(fixed.assembly)}`,
      inputs: [
        { label: 'SMT placements per unit', value: placements, unit: '' },
        { label: 'Cost per placement', value: smtCost, unit: cur },
        { label: 'Through-hole joints per unit', value: joints, unit: '' },
        { label: 'Cost per joint', value: thtCost, unit: cur },
      ],
    },
    {
      key: 'labour',
      label: 'Manual labour',
      value: fixed.labour,
      formula: `${fmt(m.manualMinutes)} min ÷ 60 × ${fmt(labourRate)} per hour = ${fmt(fixed.labour)}`,
      inputs: [
        { label: 'Manual operations', value: m.manualMinutes, unit: 'min' },
        { label: 'Labour rate', value: labourRate, unit: `${cur}/h` },
      ],
    },
    {
      key: 'test',
      label: 'Test',
      value: fixed.test,
      formula: `${fmt(m.testMinutes)} min ÷ 60 × ${fmt(labourRate)} per hour = ${fmt(fixed.test)}`,
      inputs: [
        { label: 'Test time', value: m.testMinutes, unit: 'min' },
        { label: 'Labour rate', value: labourRate, unit: `${cur}/h` },
      ],
    },
    {
      key: 'packaging',
      label: 'Packaging',
      value: fixed.packaging,
      formula: `${fmt(fixed.packaging)}`,
      inputs: [{ label: 'Packaging per unit', value: fixed.packaging, unit: cur }],
    },
    {
      key: 'yieldLoss',
      label: 'Yield loss',
      value: mid.yieldLoss,
      formula: `(parts + assembly + labour + test) × (1 ÷ ${fmt(m.yield)} − 1) = ${fmt(mid.yieldLoss)}`,
      inputs: [
        { label: 'Parts + assembly + labour + test', value: partsTotal + fixed.assembly + fixed.labour + fixed.test, unit: cur },
        { label: 'First-pass yield', value: pct(m.yield), unit: '%' },
      ],
    },
    {
      key: 'overhead',
      label: 'Overhead',
      value: mid.overhead,
      formula: `${fmt(m.overhead)} × (${fmt(partsTotal)} + ${fmt(fixed.assembly)} + ${fmt(fixed.labour)} + ${fmt(fixed.test)} + ${fmt(fixed.packaging)} + ${fmt(mid.yieldLoss)}) = ${fmt(mid.overhead)}`,
      inputs: [
        { label: 'Cost before overhead', value: mid.exWorks - mid.overhead, unit: cur },
        { label: 'Overhead', value: pct(m.overhead), unit: '%' },
      ],
    },
    {
      key: 'exWorks',
      label: 'Ex-works cost',
      value: mid.exWorks,
      formula: `parts + assembly + labour + test + packaging + yield loss + overhead = ${fmt(mid.exWorks)}`,
      inputs: [
        { label: 'Parts', value: partsTotal, unit: cur },
        { label: 'Assembly, labour and test', value: fixed.assembly + fixed.labour + fixed.test, unit: cur },
        { label: 'Packaging', value: fixed.packaging, unit: cur },
        { label: 'Yield loss', value: mid.yieldLoss, unit: cur },
        { label: 'Overhead', value: mid.overhead, unit: cur },
      ],
    },
    {
      key: 'freight',
      label: 'Freight',
      value: mid.freight,
      formula: `${fmt(m.freight)} × ${fmt(mid.exWorks)} = ${fmt(mid.freight)}`,
      inputs: [
        { label: 'Ex-works cost', value: mid.exWorks, unit: cur },
        { label: 'Freight', value: pct(m.freight), unit: '%' },
      ],
    },
    {
      key: 'insurance',
      label: m.insuranceBasis === 'cif' ? 'Insurance (CIF basis)' : 'Insurance (goods only)',
      value: mid.insurance,
      formula:
        m.insuranceBasis === 'cif' ? `${fmt(m.insurance)} × (${fmt(mid.exWorks)} + ${fmt(mid.freight)}) = ${fmt(mid.insurance)}` : `${fmt(m.insurance)} × ${fmt(mid.exWorks)} = ${fmt(mid.insurance)}`,
      inputs: [
        m.insuranceBasis === 'cif' ? { label: 'Goods + freight (CIF basis)', value: insured, unit: cur } : { label: 'Ex-works cost (goods only)', value: insured, unit: cur },
        { label: 'Insurance', value: pct(m.insurance), unit: '%' },
      ],
    },
    {
      key: 'duty',
      label: 'Duty (CIF basis)',
      value: mid.duty,
      formula: `${fmt(m.duty)} × (${fmt(mid.exWorks)} + ${fmt(mid.freight)} + ${fmt(mid.insurance)}) = ${fmt(mid.duty)}`,
      inputs: [
        { label: 'CIF value', value: mid.exWorks + mid.freight + mid.insurance, unit: cur },
        { label: 'Duty', value: pct(m.duty), unit: '%' },
      ],
    },
    {
      key: 'landed',
      label: 'Landed cost',
      value: mid.landed,
      formula: `ex-works + freight + insurance + duty = ${fmt(mid.landed)}`,
      inputs: [
        { label: 'Ex-works cost', value: mid.exWorks, unit: cur },
        { label: 'Freight', value: mid.freight, unit: cur },
        { label: 'Insurance', value: mid.insurance, unit: cur },
        { label: 'Duty', value: mid.duty, unit: cur },
      ],
    },
    {
      key: 'low',
      label: 'Landed cost, low',
      value: low,
      formula: `landed cost with each priced unit price × (1 − its confidence band) = ${fmt(low)}`,
      inputs: [
        { label: 'Band, high confidence', value: pct(m.band.high), unit: '%' },
        { label: 'Band, medium confidence', value: pct(m.band.medium), unit: '%' },
        { label: 'Band, low confidence', value: pct(m.band.low), unit: '%' },
      ],
    },
    {
      key: 'high',
      label: 'Landed cost, high',
      value: high,
      formula: `landed cost with each priced unit price × (1 + its confidence band) = ${fmt(high)}`,
      inputs: [
        { label: 'Band, high confidence', value: pct(m.band.high), unit: '%' },
        { label: 'Band, medium confidence', value: pct(m.band.medium), unit: '%' },
        { label: 'Band, low confidence', value: pct(m.band.low), unit: '%' },
      ],
    },
  ];

  let retail: CostRollUp['retail'] = null;
  let impliedMargin: CostRollUp['impliedMargin'] = null;
  if (p.retail) {
    const retailCurrency = normaliseCurrency(p.retail.currency, 'retail.currency');
    const amount = toReport(requirePositive(p.retail.amount, 'retail.amount'), retailCurrency, 'retail.currency');
    const salesTaxRate = requireFraction(p.retail.salesTaxRate ?? 0, 'retail.salesTaxRate');
    // A price quoted with sales tax holds net = gross / (1 + v) [CP; C: REFERENCES §12].
    const beforeTax = salesTaxRate === 0 ? amount : amount / (1 + salesTaxRate);
    const salesTax = amount - beforeTax;
    const retailerShare = beforeTax * m.retailMargin;
    const platformShare = (beforeTax - retailerShare) * m.platformMargin;
    const netToMaker = beforeTax * (1 - m.retailMargin) * (1 - m.platformMargin);
    retail = { amount, salesTaxRate, salesTax, beforeTax, retailerShare, platformShare, netToMaker };
    const totalLines = lines.length;
    const reason =
      totalLines === 0
        ? 'No parts listed yet: the margin needs a priced parts list.'
        : pricedCount < totalLines
          ? `${pricedCount} of ${totalLines} lines priced: price every line to see the margin (an unpriced line adds nothing to the cost, so the margin would be overstated).`
          : null;
    const marginAmount = netToMaker - mid.landed;
    impliedMargin =
      reason === null
        ? { amount: marginAmount, fraction: netToMaker > 0 ? marginAmount / netToMaker : null, complete: true, reason: null, pricedLines: pricedCount, totalLines }
        : { amount: null, fraction: null, complete: false, reason, pricedLines: pricedCount, totalLines };
    steps.push(
      {
        key: 'retailBeforeTax',
        label: 'Retail price before sales tax',
        value: beforeTax,
        formula: `${fmt(amount)} ÷ (1 + ${fmt(salesTaxRate)}) = ${fmt(beforeTax)}`,
        inputs: [
          { label: 'Retail price as seen', value: amount, unit: cur },
          { label: 'Sales tax in the price', value: pct(salesTaxRate), unit: '%' },
        ],
      },
      {
        key: 'netToMaker',
        label: 'Net to maker',
        value: netToMaker,
        formula: `${fmt(beforeTax)} × (1 − ${fmt(m.retailMargin)}) × (1 − ${fmt(m.platformMargin)}) = ${fmt(netToMaker)}`,
        inputs: [
          { label: 'Retail price', value: beforeTax, unit: cur },
          { label: 'Retailer margin', value: pct(m.retailMargin), unit: '%' },
          { label: 'Platform fee', value: pct(m.platformMargin), unit: '%' },
        ],
      },
    );
    if (impliedMargin.complete) {
      steps.push({
        key: 'impliedMargin',
        label: 'Implied margin',
        value: marginAmount,
        formula: `${fmt(netToMaker)} − ${fmt(mid.landed)} = ${fmt(marginAmount)}${impliedMargin.fraction === null ? '' : ` (${fmt(impliedMargin.fraction * 100)} % of net)`}`,
        inputs: [
          { label: 'Net to maker', value: netToMaker, unit: cur },
          { label: 'Landed cost', value: mid.landed, unit: cur },
        ],
      });
    }
  }

  return {
    volume,
    currency,
    lines,
    partsTotal,
    byCategory,
    placements,
    joints,
    ...fixed,
    ...mid,
    low,
    high,
    retail,
    impliedMargin,
    unpricedPartIds,
    warnings,
    steps,
  };
}

/** The roll-up at each of several volumes (in the order given), for the volume table. */
export function costAtVolumes(volumes: number[], p: Omit<RollUpInput, 'volume'>): CostRollUp[] {
  if (!Array.isArray(volumes) || volumes.length === 0) throw new RangeError('volumes needs at least one production volume.');
  volumes.forEach((v, k) => requireInteger(v, `volumes[${k}]`, 1));
  return volumes.map((volume) => rollUpCost({ ...p, volume }));
}
