// Price breaks as typed ("5k" pieces at "$0.12", "0,12 €"): each read by the one unit reader against
// the price's currency, then checked as the contract checks breaks (order, overlap, negatives).
import { MIN_QTY_FIELD, PRICE_FIELDS, priceBreaksSchema, type PriceBreakDto } from '@splitcase/contracts';
import { validationError, zodFields } from '../../http/errors';
import { QuantityError, readPrice, readQuantity } from '../../lib/units';

export interface TypedBreak {
  minQty: string | number;
  unitPrice: string | number;
}

/**
 * Reads the breaks of one price. Returns the breaks (numbers: pieces, amounts in `currency`) or the
 * errors by `breaks.<k>.<field>`; a currency typed with an amount must be the price's currency.
 */
export function readBreaks(typed: TypedBreak[], currency: string): { breaks: PriceBreakDto[]; errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  const breaks: PriceBreakDto[] = [];
  typed.forEach((b, k) => {
    let minQty = Number.NaN;
    let unitPrice = Number.NaN;
    try {
      minQty = readQuantity(b.minQty, MIN_QTY_FIELD).value;
    } catch (err) {
      if (!(err instanceof QuantityError)) throw err;
      errors[`breaks.${k}.minQty`] = err.message;
    }
    try {
      unitPrice = readPrice(b.unitPrice, PRICE_FIELDS.unitPrice, currency).amount;
    } catch (err) {
      if (!(err instanceof QuantityError)) throw err;
      errors[`breaks.${k}.unitPrice`] = err.message;
    }
    breaks.push({ minQty, unitPrice });
  });
  if (Object.keys(errors).length) return { breaks, errors };
  const checked = priceBreaksSchema.safeParse(breaks);
  if (!checked.success) return { breaks, errors: zodFields(checked.error, 'breaks') };
  return { breaks: checked.data, errors };
}

/** readBreaks for a request: a 400 naming every bad break field. */
export function readBreaksOrThrow(typed: TypedBreak[], currency: string): PriceBreakDto[] {
  const { breaks, errors } = readBreaks(typed, currency);
  if (Object.keys(errors).length) throw validationError(errors);
  return breaks;
}
