// Should-cost: currency conversion, price breaks, BOM roll-up, landed cost and margins.
export { convertCurrency, crossRate, rateFor, normaliseCurrency, type RateTable } from './currency';
export { referenceRatesFromTree, type ReferenceRates } from './reference-rates';
export { costWaterfall, type WaterfallBar } from './waterfall';
export { unitPriceAtQuantity, validatePriceBreaks, type PriceBreak, type PriceBreakProblem } from './price-breaks';
export { landedCost, marginFromMarkup, markupFromMargin, type LandedCostInput, type LandedCostResult } from './landed';
export {
  rollUpCost,
  costAtVolumes,
  type CostModel,
  type CostLineInput,
  type CostLineResult,
  type CostRollUp,
  type CostStep,
  type ImpliedMargin,
  type InsuranceBasis,
  type RollUpInput,
  type PriceConfidence,
  type MountKind,
} from './roll-up';
