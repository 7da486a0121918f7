/**
 * The euro reference-rate file (daily `eurofxref-daily.xml`, and the history files with one
 * day per `Cube time`) read from its element tree [S: ECB rate page; published sample files]:
 *
 *   gesmes:Envelope
 *     Cube
 *       Cube time="YYYY-MM-DD"
 *         Cube currency="USD" rate="1.0856"   (units of the currency per 1 EUR; EUR not listed)
 *
 * The tree is the usual JSON mapping of XML that an XML parser gives: child elements as
 * properties (a repeated element as an array), attributes as `@_name`, values as text. No I/O
 * and no XML parsing here: the API parses the upload and hands the tree over.
 */
import type { RateTable } from './currency';

export interface ReferenceRates extends RateTable {
  base: 'EUR';
  /** The day the rates are for (the latest `Cube time` in the file). */
  date: string;
  /** Units of each currency per 1 EUR. */
  rates: Record<string, number>;
  /** How many days the file held (1 for the daily file); only the latest is read. */
  days: number;
}

type Node = Record<string, unknown>;

const isNode = (v: unknown): v is Node => v !== null && typeof v === 'object' && !Array.isArray(v);
const list = (v: unknown): unknown[] => (v === undefined ? [] : Array.isArray(v) ? v : [v]);
const DATE = /^\d{4}-\d{2}-\d{2}$/;
const DECIMAL = /^\s*\d+(\.\d+)?\s*$/;
const CODE = /^[A-Z]{3}$/;

function notTheFormat(field: string, why: string): RangeError {
  return new RangeError(`${field}: this is not the euro reference-rate XML format: ${why}`);
}

function validDate(text: string): boolean {
  if (!DATE.test(text)) return false;
  const d = new Date(`${text}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === text;
}

/**
 * Reads the rates of the latest day in a reference-rate element tree. Throws a RangeError
 * that starts with `field` and names the element or attribute that is missing or wrong.
 */
export function referenceRatesFromTree(tree: unknown, field = 'file'): ReferenceRates {
  if (!isNode(tree)) throw notTheFormat(field, 'the document is empty.');
  const roots = Object.keys(tree).filter((k) => !k.startsWith('?') && !k.startsWith('#'));
  const envelope = tree['gesmes:Envelope'];
  if (!isNode(envelope)) {
    throw notTheFormat(field, `the root element must be gesmes:Envelope (found ${roots.length ? roots.map((r) => `<${r}>`).join(', ') : 'none'}).`);
  }
  const cubes = list(envelope.Cube);
  if (cubes.length === 0) throw notTheFormat(field, 'gesmes:Envelope has no Cube element.');
  // An empty <Cube/> comes through as text: treat it as a Cube with no children.
  const outer: Node = cubes.find(isNode) ?? {};
  const days = list(outer.Cube).filter(isNode);
  if (days.length === 0) throw notTheFormat(field, 'the Cube element has no Cube time="YYYY-MM-DD" children.');

  let latest: { date: string; node: Node } | null = null;
  days.forEach((day, k) => {
    const time = day['@_time'];
    if (typeof time !== 'string' || !validDate(time.trim())) {
      throw notTheFormat(field, `Cube[${k + 1}]@time must be a date YYYY-MM-DD (got ${JSON.stringify(time ?? null)}).`);
    }
    const date = time.trim();
    if (!latest || date > latest.date) latest = { date, node: day };
  });
  const { date, node } = latest as unknown as { date: string; node: Node };

  const entries = list(node.Cube).filter(isNode);
  if (entries.length === 0) throw notTheFormat(field, `Cube time="${date}" has no Cube currency/rate entries.`);
  const rates: Record<string, number> = {};
  entries.forEach((entry, k) => {
    const where = `Cube time="${date}" › Cube[${k + 1}]`;
    const currency = entry['@_currency'];
    const rate = entry['@_rate'];
    if (typeof currency !== 'string' || !CODE.test(currency.trim())) {
      throw notTheFormat(field, `${where}@currency must be a three-letter code (got ${JSON.stringify(currency ?? null)}).`);
    }
    const code = currency.trim();
    if (typeof rate !== 'string' || !DECIMAL.test(rate)) {
      throw notTheFormat(field, `${where}@rate for ${code} must be a decimal number (got ${JSON.stringify(rate ?? null)}).`);
    }
    const value = Number(rate);
    if (!(value > 0)) throw new RangeError(`${field}: ${where}@rate for ${code} must be greater than zero (got ${rate.trim()}).`);
    if (code in rates) throw new RangeError(`${field}: ${where}: ${code} is listed twice for ${date}.`);
    if (code === 'EUR' && value !== 1) throw new RangeError(`${field}: ${where}: EUR is the base and must not have a rate other than 1 (got ${rate.trim()}).`);
    if (code !== 'EUR') rates[code] = value;
  });
  return { base: 'EUR', date, rates, days: days.length };
}
