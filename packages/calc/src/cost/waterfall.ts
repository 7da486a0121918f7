/**
 * A waterfall from parts to retail price, read off a roll-up: each cost adds a step on top of
 * the last, subtotals (ex-works, landed, net to maker) and the retail price stand on zero;
 * sales tax in the price sits on top of the retailer's margin.
 * start/end are the bar's bottom and top edges in the reporting currency; nothing is recomputed
 * but the running sum [C].
 */
import type { CostRollUp } from './roll-up';

export interface WaterfallBar {
  key: string;
  label: string;
  /** 'step' adds value on top of the running total; 'subtotal' and 'total' stand on zero. */
  kind: 'step' | 'subtotal' | 'total';
  value: number;
  start: number;
  end: number;
}

export function costWaterfall(r: CostRollUp): WaterfallBar[] {
  const bars: WaterfallBar[] = [];
  let running = 0;
  const step = (key: string, label: string, value: number) => {
    bars.push({ key, label, kind: 'step', value, start: running, end: running + value });
    running += value;
  };
  const subtotal = (key: string, label: string, value: number, kind: 'subtotal' | 'total' = 'subtotal') => {
    bars.push({ key, label, kind, value, start: 0, end: value });
    running = value;
  };
  step('parts', 'Parts', r.partsTotal);
  step('assembly', 'Assembly', r.assembly);
  step('labour', 'Labour', r.labour);
  step('test', 'Test', r.test);
  step('packaging', 'Packaging', r.packaging);
  step('yieldLoss', 'Yield loss', r.yieldLoss);
  step('overhead', 'Overhead', r.overhead);
  subtotal('exWorks', 'Ex-works', r.exWorks);
  step('freight', 'Freight', r.freight);
  step('insurance', 'Insurance', r.insurance);
  step('duty', 'Duty', r.duty);
  subtotal('landed', 'Landed', r.landed);
  // An incomplete margin (a line unpriced) is not drawn: the chart stops at landed cost.
  if (r.retail && r.impliedMargin && r.impliedMargin.amount !== null) {
    step('impliedMargin', 'Maker margin', r.impliedMargin.amount);
    subtotal('netToMaker', 'Net to maker', r.retail.netToMaker);
    step('platform', 'Platform fee', r.retail.platformShare);
    step('retailer', 'Retailer margin', r.retail.retailerShare);
    if (r.retail.salesTax > 0) step('salesTax', 'Sales tax', r.retail.salesTax);
    subtotal('retail', 'Retail price', r.retail.amount, 'total');
  }
  return bars;
}
