// The costed BOM as CSV, and prices read back from a CSV with the same columns.
import Papa from 'papaparse';
import { COSTED_BOM_COLUMNS, PRICE_CONFIDENCE, PRICE_SOURCE, partPriceBody, type CostRollUpDto, type PriceBreakDto, type PriceConfidence, type PriceSource } from '@splitcase/contracts';
import { toCsv, unguardCell } from '../../lib/csv';
import type { Part } from '../parts/part.entity';
import { readBreaks, type TypedBreak } from './price-input';

/** Six significant digits, no exponent for everyday sizes, no trailing zeros. */
const num = (x: number | null | undefined) => (x === null || x === undefined ? '' : String(Number(x.toPrecision(6))));

/** Breaks as `minQty@unitPrice` pairs separated by `;` (a spreadsheet keeps it as text). */
export const formatBreaks = (breaks: PriceBreakDto[]) => breaks.map((b) => `${num(b.minQty)}@${num(b.unitPrice)}`).join(';');

/** The costed BOM with the shared CSV rule (lib/csv toCsv: BOM, CRLF, quoted, formula-safe); numbers go out as numbers. */
export function costedBomCsv(cost: CostRollUpDto): string {
  const n = (x: number | null | undefined) => (x === null || x === undefined ? null : Number(x.toPrecision(6)));
  const data = cost.lines.map((l) => {
    const row: Record<(typeof COSTED_BOM_COLUMNS)[number], string | number | null> = {
      designators: l.designators,
      maker_part_number: l.makerPartNumber,
      description: l.description,
      category: l.category,
      mount: l.mount,
      quantity: n(l.quantity),
      currency: l.price?.currency ?? null,
      breaks: l.price ? formatBreaks(l.price.breaks) : null,
      source: l.price?.source ?? null,
      confidence: l.price?.confidence ?? null,
      price_date: l.price?.priceDate ?? null,
      note: l.price?.note ?? null,
      volume: cost.volume,
      report_currency: cost.currency,
      rate_date: cost.rateDate,
      unit_price: n(l.unitPrice),
      attrition_pct: n(l.attrition * 100),
      extended: n(l.extended),
    };
    return COSTED_BOM_COLUMNS.map((c) => row[c]);
  });
  return toCsv([...COSTED_BOM_COLUMNS], data);
}

export interface PriceRow {
  line: number;
  part: Part;
  matchedBy: 'designators' | 'makerPartNumber' | 'description';
  price: { currency: string; breaks: PriceBreakDto[]; source: PriceSource; confidence: PriceConfidence; priceDate: string; note: string | null };
}

export interface PriceCsvResult {
  rows: PriceRow[];
  skipped: { line: number; reason: string }[];
  /** `lines.<line>.<column>` (or `file`, `columns`) → message; empty when the file can be saved. */
  errors: Record<string, string>;
}

const ALIASES: Record<string, string> = {
  designator: 'designators',
  ref: 'designators',
  refs: 'designators',
  mpn: 'maker_part_number',
  part_number: 'maker_part_number',
  date: 'price_date',
  price_breaks: 'breaks',
};
const header = (h: string) => {
  const k = h
    .trim()
    .toLowerCase()
    .replace(/[\s-]+/g, '_');
  return ALIASES[k] ?? k;
};
const designatorKey = (s: string) =>
  s
    .split(/[\s,;]+/)
    .map((d) => d.trim().toUpperCase())
    .filter(Boolean)
    .sort()
    .join(',');
const same = (a: string | null | undefined, b: string) => !!a && a.trim().toLowerCase() === b.trim().toLowerCase();

function choice<T extends string>(text: string, values: readonly T[], labels: Record<T, string>): T | null {
  const t = text.trim().toLowerCase();
  return values.find((v) => v === t || labels[v].toLowerCase() === t) ?? null;
}

const FIELD_COLUMN: Record<string, string> = { currency: 'currency', breaks: 'breaks', source: 'source', confidence: 'confidence', priceDate: 'price_date', note: 'note' };
const MAX_ERRORS = 50;

/**
 * Reads prices from CSV text for the parts of one teardown. A line is matched by its designators,
 * else its maker part number, else (when it has neither) its description; each part once. Lines
 * with no price columns filled are skipped. Every problem is named by line and column.
 */
export function readPriceCsv(text: string, parts: Part[], opts: { hasRate: (code: string) => boolean; today: string }): PriceCsvResult {
  const errors: Record<string, string> = {};
  const fail = (key: string, message: string) => {
    if (Object.keys(errors).length < MAX_ERRORS) errors[key] ??= message;
  };
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { header: false, skipEmptyLines: false });
  const table = parsed.data;
  if (table.length === 0 || (table.length === 1 && table[0]!.every((c) => c.trim() === ''))) {
    return { rows: [], skipped: [], errors: { file: 'The file is empty. Export the costed BOM for the columns to use.' } };
  }
  const columns = table[0]!.map(header);
  const col = (name: string) => columns.indexOf(name);
  const missing = ['currency', 'breaks', 'source', 'confidence'].filter((c) => col(c) === -1);
  if (col('designators') === -1 && col('maker_part_number') === -1) missing.unshift('designators or maker_part_number');
  if (missing.length) {
    return {
      rows: [],
      skipped: [],
      errors: { columns: `The header (line 1) has no column ${missing.map((m) => `"${m}"`).join(', ')}. Columns found: ${columns.join(', ') || 'none'}.` },
    };
  }

  const rows: PriceRow[] = [];
  const skipped: PriceCsvResult['skipped'] = [];
  const claimed = new Map<number, number>();
  for (let k = 1; k < table.length; k++) {
    const cells = table[k]!;
    const line = k + 1;
    if (cells.every((c) => c.trim() === '')) continue;
    const cell = (name: string) => {
      const i = col(name);
      return i === -1 ? '' : unguardCell((cells[i] ?? '').trim());
    };
    const at = (column: string) => `lines.${line}.${column}`;
    const say = (column: string, message: string) => fail(at(column), `Line ${line}, column ${column}: ${message}`);
    const designators = cell('designators');
    const mpn = cell('maker_part_number');
    const description = cell('description');
    const priceCells = ['currency', 'breaks', 'source', 'confidence'].map(cell);
    if (priceCells.every((c) => c === '')) {
      skipped.push({ line, reason: `No price on this line (${designators || mpn || description || 'no designators'}).` });
      continue;
    }

    // Which part?
    let part: Part | undefined;
    let matchedBy: PriceRow['matchedBy'] = 'designators';
    if (designators) {
      const key = designatorKey(designators);
      const hits = parts.filter((p) => p.designators && designatorKey(p.designators) === key);
      if (hits.length > 1) say('designators', `${hits.length} parts have the designators "${designators}".`);
      part = hits[0];
    }
    if (!part && mpn) {
      const hits = parts.filter((p) => same(p.makerPartNumber, mpn));
      if (hits.length > 1) say('maker_part_number', `${hits.length} parts have the maker part number "${mpn}"; give their designators.`);
      else {
        part = hits[0];
        matchedBy = 'makerPartNumber';
      }
    }
    if (!part && !designators && !mpn && description) {
      const hits = parts.filter((p) => same(p.description, description));
      if (hits.length === 1) {
        part = hits[0];
        matchedBy = 'description';
      } else if (hits.length > 1) say('description', `${hits.length} parts have the description "${description}"; give designators or a maker part number.`);
    }
    if (!part) {
      if (designators || mpn)
        say(
          designators ? 'designators' : 'maker_part_number',
          `no part of this teardown has ${[designators && `designators "${designators}"`, mpn && `maker part number "${mpn}"`].filter(Boolean).join(' or ')}.`,
        );
      else if (!description) say('designators', 'give designators or a maker part number to say which part this price is for.');
      else if (!errors[at('description')]) say('description', `no part of this teardown is described as "${description}".`);
      continue;
    }
    const earlier = claimed.get(part.id);
    if (earlier !== undefined) {
      say(matchedBy === 'makerPartNumber' ? 'maker_part_number' : matchedBy, `this prices the same part as line ${earlier}.`);
      continue;
    }
    claimed.set(part.id, line);

    // The price itself.
    // Each pair through the one reader, against the line's currency ("5k@$0.12", "1000@0,12 €").
    const typed: TypedBreak[] = [];
    let breaksOk = true;
    for (const [j, pair] of cell('breaks')
      .split(/[;|]/)
      .map((s) => s.trim())
      .filter(Boolean)
      .entries()) {
      const m = pair.match(/^([^@]+)@([^@]+)$/);
      if (!m) {
        say('breaks', `break ${j + 1} "${pair}" is not minQty@unitPrice (e.g. 1000@0.12; 5000@0.10).`);
        breaksOk = false;
        break;
      }
      typed.push({ minQty: m[1]!.trim(), unitPrice: m[2]!.trim() });
    }
    if (!breaksOk) continue;
    const read = readBreaks(typed, cell('currency').toUpperCase());
    const breaks: PriceBreakDto[] = read.breaks;
    const breakError = Object.entries(read.errors).find(([key]) => /^breaks\.\d+\./.test(key));
    if (breakError) {
      const [, index, sub] = breakError[0].split('.');
      say('breaks', `break ${Number(index) + 1} (${sub}): ${breakError[1]}`);
      continue;
    }
    const source = choice(cell('source'), PRICE_SOURCE.values, PRICE_SOURCE.labels);
    const confidence = choice(cell('confidence'), PRICE_CONFIDENCE.values, PRICE_CONFIDENCE.labels);
    if (!source) say('source', `"${cell('source')}" is not a price source; use ${PRICE_SOURCE.values.join(', ')}.`);
    if (!confidence) say('confidence', `"${cell('confidence')}" is not a confidence; use ${PRICE_CONFIDENCE.values.join(', ')}.`);
    const body = partPriceBody.safeParse({
      currency: cell('currency'),
      breaks,
      source: source ?? 'estimate',
      confidence: confidence ?? 'low',
      priceDate: cell('price_date') || undefined,
      note: cell('note') || undefined,
    });
    if (!body.success) {
      for (const issue of body.error.issues) {
        const [field, index, sub] = issue.path;
        const column = FIELD_COLUMN[String(field)] ?? String(field);
        const where = field === 'breaks' && typeof index === 'number' ? `break ${index + 1}${sub ? ` (${String(sub)})` : ''}: ` : '';
        say(column, `${where}${issue.message}`);
      }
      continue;
    }
    if (!source || !confidence) continue;
    if (!opts.hasRate(body.data.currency)) {
      say('currency', `no exchange rate for ${body.data.currency} in the current rate table; add it on the Rates page first.`);
      continue;
    }
    rows.push({
      line,
      part,
      matchedBy,
      price: {
        currency: body.data.currency,
        breaks: body.data.breaks,
        source,
        confidence,
        priceDate: body.data.priceDate ?? opts.today,
        note: body.data.note ?? null,
      },
    });
  }
  if (rows.length === 0 && Object.keys(errors).length === 0) errors.file = 'No line of the file carries a price.';
  return { rows, skipped, errors };
}
