/**
 * Landed cost and the markup/margin relations [S: customs-valuation guides;
 * marketing dictionaries; C].
 */
import { requireFinite, requireFraction, requireNonNegative } from '../shared/validate';

export interface LandedCostInput {
  /** Goods value free on board, in any one currency. */
  fob: number;
  /** International freight, same currency. */
  freight: number;
  /** Insurance rate (0.5–2 % of the goods value typical [S/CP]). */
  insuranceFraction: number;
  /** What the rate applies to: 'goods' (default, FOB alone, as the REFERENCES §10 worked example) or 'cif' (FOB + freight). */
  insuranceBasis?: 'goods' | 'cif';
  /** Import duty as a fraction of the CIF value. */
  dutyFraction: number;
  /** Import VAT as a fraction of CIF + duty. */
  vatFraction: number;
  /** Customs brokerage, added after VAT; default 0. */
  brokerage?: number;
}

export interface LandedCostResult {
  fob: number;
  freight: number;
  insurance: number;
  cif: number;
  duty: number;
  /** CIF + duty: the VAT base. */
  dutyPaid: number;
  vat: number;
  brokerage: number;
  landed: number;
}

/**
 * Landed cost on a CIF duty basis (EU, UK and most of Asia [S]): insurance =
 * fraction × FOB (or × (FOB + freight) on a 'cif' insurance basis), CIF = FOB + freight + insurance, duty on CIF, VAT on CIF +
 * duty, landed = CIF + duty + VAT + brokerage. (The US levies duty on the
 * transaction value without international freight [M]; not modelled here.)
 */
export function landedCost(input: LandedCostInput): LandedCostResult {
  const fob = requireNonNegative(input.fob, 'fob');
  const freight = requireNonNegative(input.freight, 'freight');
  const basis = input.insuranceBasis ?? 'goods';
  if (basis !== 'goods' && basis !== 'cif') throw new RangeError(`insuranceBasis must be goods or cif (got ${JSON.stringify(basis)}).`);
  const insurance = requireFraction(input.insuranceFraction, 'insuranceFraction') * (basis === 'cif' ? fob + freight : fob);
  const dutyFraction = requireFraction(input.dutyFraction, 'dutyFraction');
  const vatFraction = requireFraction(input.vatFraction, 'vatFraction');
  const brokerage = requireNonNegative(input.brokerage ?? 0, 'brokerage');
  const cif = fob + freight + insurance;
  const duty = dutyFraction * cif;
  const dutyPaid = cif + duty;
  const vat = vatFraction * dutyPaid;
  return { fob, freight, insurance, cif, duty, dutyPaid, vat, brokerage, landed: dutyPaid + vat + brokerage };
}

/** Margin (share of the price) from markup (share of the cost): m / (1 + m); keystone markup 1 → margin 0.5. */
export function marginFromMarkup(markup: number): number {
  requireFinite(markup, 'markup');
  if (markup <= -1) throw new RangeError(`markup must be above −1 (−100 %) (got ${markup}).`);
  return markup / (1 + markup);
}

/** Markup from margin: g / (1 − g); margin 0.5 → markup 1 (keystone). */
export function markupFromMargin(margin: number): number {
  requireFinite(margin, 'margin');
  if (margin >= 1) throw new RangeError(`margin must be below 1 (100 %) (got ${margin}).`);
  return margin / (1 - margin);
}
