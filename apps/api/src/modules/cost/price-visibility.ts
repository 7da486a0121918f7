// Who sees supplier price detail. Supplier quotes are confidential: price breaks, quote sources and
// confidence, a line's unit and extended price, subtotals per part category (a category of one line
// is that line's price), and the price entries of a history are for the roles below. Everyone else
// (viewers) sees the should-cost totals of what they may read, nothing per line or per category.
// This file is the one place the rule lives; routes that answer with price detail say so in the route
// table (`prices: 'by-role'`) and get the caller's view as `ctx.priceView`.
import type { CostLine, PriceView, Role } from '@splitcase/contracts';
import type { AuthUser } from '../../http/route';

export const PRICE_READERS: readonly Role[] = ['admin', 'engineer', 'sourcing', 'lead'];

export const priceViewFor = (user: Pick<AuthUser, 'role'> | null): PriceView => (user && PRICE_READERS.includes(user.role) ? 'detail' : 'totals');

/** A cost line without its price detail: whether it is priced stays, what it costs does not. */
export function totalsOnlyLine(line: CostLine): CostLine {
  return { ...line, unitPrice: null, extended: null, breakMinQty: null, belowMinimumOrder: false, price: null };
}

/** Subtotals per part category, as the view may see them: none for 'totals'. */
export const categoriesFor = <T>(view: PriceView, categories: T[]): T[] => (view === 'detail' ? categories : []);

/** History entries about prices (set, changed, imported, removed) have actions `price.…`. */
const PRICE_ACTIONS = 'price.';
export const isPriceHistoryEntry = (action: string) => action.startsWith(PRICE_ACTIONS);

/** A condition on audit entries for a history read with this view: without the price entries for 'totals'. */
export const historyCondition = (view: PriceView) => (view === 'detail' ? {} : { $not: { action: { $like: `${PRICE_ACTIONS}%` } } });
