/**
 * Quantity price breaks: the unit price at a quantity is that of the break
 * with the largest minimum quantity not above it.
 */
import { requirePositive } from '../shared/validate';

export interface PriceBreak {
  minQty: number;
  unitPrice: number;
}

/** One thing wrong with a list of price breaks; index is null for the list as a whole. */
export interface PriceBreakProblem {
  index: number | null;
  field: 'breaks' | 'minQty' | 'unitPrice';
  message: string;
}

/**
 * Every problem in a list of price breaks, so a form can mark each field:
 * at least one break, minQty finite and above zero, unitPrice finite and not
 * negative, minQty strictly increasing (no duplicates). `path` prefixes messages.
 */
export function validatePriceBreaks(breaks: PriceBreak[], path = 'breaks'): PriceBreakProblem[] {
  if (!Array.isArray(breaks)) {
    return [{ index: null, field: 'breaks', message: `${path} must be a list of { minQty, unitPrice }.` }];
  }
  if (breaks.length === 0) {
    return [{ index: null, field: 'breaks', message: `${path} needs at least one price break.` }];
  }
  const problems: PriceBreakProblem[] = [];
  let prevQty: number | null = null;
  breaks.forEach((b, index) => {
    if (b === null || typeof b !== 'object') {
      problems.push({ index, field: 'breaks', message: `${path}[${index}] must be an object { minQty, unitPrice }.` });
      prevQty = null;
      return;
    }
    const qtyOk = typeof b.minQty === 'number' && Number.isFinite(b.minQty) && b.minQty > 0;
    if (!qtyOk) {
      problems.push({
        index,
        field: 'minQty',
        message: `${path}[${index}].minQty must be a number greater than zero (got ${String(b.minQty)}).`,
      });
    } else if (prevQty !== null && b.minQty <= prevQty) {
      problems.push({
        index,
        field: 'minQty',
        message: `${path}[${index}].minQty: price breaks overlap or are out of order (minQty ${b.minQty} after ${prevQty}); list them by increasing quantity, each once.`,
      });
    }
    if (typeof b.unitPrice !== 'number' || !Number.isFinite(b.unitPrice) || b.unitPrice < 0) {
      problems.push({
        index,
        field: 'unitPrice',
        message: `${path}[${index}].unitPrice must be a number not below zero (got ${String(b.unitPrice)}).`,
      });
    }
    prevQty = qtyOk ? Math.max(b.minQty, prevQty ?? -Infinity) : prevQty;
  });
  return problems;
}

/** Throws the first problem of a list of price breaks as a RangeError. */
export function assertPriceBreaks(breaks: PriceBreak[], path = 'breaks'): void {
  const problems = validatePriceBreaks(breaks, path);
  if (problems.length > 0) throw new RangeError((problems[0] as PriceBreakProblem).message);
}

/** Index of the break that applies at qty (qty already checked), or -1 below the first break. */
export function breakIndexAt(breaks: PriceBreak[], qty: number): number {
  let found = -1;
  for (let k = 0; k < breaks.length; k++) {
    if ((breaks[k] as PriceBreak).minQty <= qty) found = k;
    else break;
  }
  return found;
}

/** Unit price of the break with the largest minQty ≤ qty; RangeError for bad breaks or a qty below the first break. */
export function unitPriceAtQuantity(breaks: { minQty: number; unitPrice: number }[], qty: number): number {
  assertPriceBreaks(breaks);
  requirePositive(qty, 'quantity');
  const k = breakIndexAt(breaks, qty);
  if (k === -1) {
    throw new RangeError(`quantity ${qty} is below the smallest price break (minQty ${(breaks[0] as PriceBreak).minQty}); no price applies.`);
  }
  return (breaks[k] as PriceBreak).unitPrice;
}
