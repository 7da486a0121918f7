/**
 * Currency conversion with reference rates in the ECB convention [S: ECB rate
 * page]: each rate is units of that currency per 1 unit of the base currency
 * (1 EUR = 1.0856 USD). A cross rate goes through the base:
 * 1 A = (rate_B / rate_A) B. Nothing is rounded here [CP: round only at the end].
 */
import { requireFinite } from '../shared/validate';

/** Reference rates: units of each currency per 1 unit of base; the base itself is 1 whether listed or not. */
export interface RateTable {
  base: string;
  rates: Record<string, number>;
}

const CODE = /^[A-Z]{3}$/;

/** Upper-cased, trimmed currency code; RangeError naming the field unless it is three letters. */
export function normaliseCurrency(code: string, field = 'currency'): string {
  const normal = typeof code === 'string' ? code.trim().toUpperCase() : '';
  if (!CODE.test(normal)) {
    throw new RangeError(`${field} must be a three-letter currency code such as EUR (got ${JSON.stringify(code)}).`);
  }
  return normal;
}

function checkTable(table: RateTable): string {
  if (table === null || typeof table !== 'object' || table.rates === null || typeof table.rates !== 'object') {
    throw new RangeError('rates must be a rate table { base, rates }.');
  }
  return normaliseCurrency(table.base, 'rates.base');
}

/**
 * Units of `code` per 1 unit of the table's base. Throws a RangeError naming
 * the currency and the field it came from when the table has no usable rate.
 */
export function rateFor(table: RateTable, code: string, field = 'currency'): number {
  const base = checkTable(table);
  const wanted = normaliseCurrency(code, field);
  let found: number | undefined;
  let key = wanted;
  for (const [k, value] of Object.entries(table.rates)) {
    if (k.trim().toUpperCase() === wanted) {
      found = value;
      key = k;
      break;
    }
  }
  if (wanted === base) {
    if (found !== undefined && found !== 1) {
      throw new RangeError(`rates.rates.${key}: the base currency ${base} must have rate 1 (got ${String(found)}).`);
    }
    return 1;
  }
  if (found === undefined) {
    throw new RangeError(`${field}: no exchange rate for ${wanted} in the rate table (base ${base}); add its rate or use another currency.`);
  }
  requireFinite(found, `rates.rates.${key}`);
  if (found <= 0) throw new RangeError(`rates.rates.${key} must be greater than zero (got ${found}).`);
  return found;
}

/** Converts amount between currencies through the table's base (amount / rate_from × rate_to); same currency needs no rate. */
export function convertCurrency(amount: number, from: string, to: string, table: RateTable): number {
  requireFinite(amount, 'amount');
  const a = normaliseCurrency(from, 'from');
  const b = normaliseCurrency(to, 'to');
  if (a === b) return amount;
  return (amount / rateFor(table, a, 'from')) * rateFor(table, b, 'to');
}

/** Units of `to` per 1 unit of `from`, through the base: rate_to / rate_from [S: ECB convention; C]. */
export function crossRate(table: RateTable, from: string, to: string): number {
  const a = normaliseCurrency(from, 'from');
  const b = normaliseCurrency(to, 'to');
  if (a === b) return 1;
  return rateFor(table, b, 'to') / rateFor(table, a, 'from');
}
