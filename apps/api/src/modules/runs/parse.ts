// Streaming parser of bench logs (CSV or TSV): papaparse reads the file from disk chunk by chunk,
// the mapped columns go straight into growing Float64Arrays (a 1,000,000-row log costs a few
// typed arrays, never an object per row), and anything wrong stops the parse with a message
// naming the row (the line of the file) and the column.
import { closeSync, createReadStream, openSync, readSync, statSync } from 'node:fs';
import { Transform, type TransformCallback } from 'node:stream';
import Papa from 'papaparse';
import { convertColumnInPlace, type RunQuantity } from '@splitcase/calc';
import { RUN_DELIMITER, RUN_QUANTITIES, type RunDelimiter, type RunMapping, type RunQuantityName } from '@splitcase/contracts';
import { AppError } from '../../http/errors';
import type { StoredSeries } from './storage';

/** A bad file: 422 naming the row and column, with both in details for the client. */
export class LogError extends AppError {
  constructor(message: string, where: { row?: number; column?: string; field?: string } = {}) {
    super('unprocessable', message, { [where.field ?? 'file']: message }, { row: where.row ?? null, column: where.column ?? null });
  }
}

/**
 * The longest line a log may have. A logger writes one reading per line (a few dozen bytes; a wide
 * one a few kilobytes); a longer line is not a log, and a parser that has to hold a line until it
 * ends would cost time and memory growing with the square of its length.
 */
export const MAX_LINE_BYTES = 64 * 1024;

/**
 * Passes the bytes through unchanged and fails at the first line longer than `max` bytes (CR, LF
 * and CRLF all end a line), naming it, so an over-long line is refused as soon as it is seen.
 */
export class LineLengthGuard extends Transform {
  private run = 0;
  private line = 1;
  private afterCr = false;
  constructor(private readonly max: number) {
    super();
  }
  override _transform(chunk: Buffer, _encoding: BufferEncoding, done: TransformCallback): void {
    let { run, line, afterCr } = this;
    for (let k = 0; k < chunk.length; k++) {
      const b = chunk[k];
      if (b === 0x0a) {
        if (!afterCr) line++;
        run = 0;
        afterCr = false;
      } else if (b === 0x0d) {
        line++;
        run = 0;
        afterCr = true;
      } else {
        afterCr = false;
        if (++run > this.max) {
          done(
            new LogError(
              `Row ${line} is longer than ${this.max / 1024} KiB without a line break. A bench log has one reading per line: check that this is the logger's CSV or TSV export and that its line breaks survived.`,
              { row: line },
            ),
          );
          return;
        }
      }
    }
    Object.assign(this, { run, line, afterCr });
    done(null, chunk);
  }
}

const SERIES_KEY: Record<Exclude<RunQuantityName, 'time'>, 'v' | 'i' | 'p' | 'temp'> = { voltage: 'v', current: 'i', power: 'p', temperature: 'temp' };

/** Strictly a decimal number: digits, one point, optional exponent (no hex, no "Infinity", no empty text). */
const NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;
/** A number followed by a unit, e.g. "3.7 V", "3700mV", "45.2 °C". */
const NUMBER_WITH_UNIT = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*([^\d\s].*)$/;

/** Unit words a cell may carry, per quantity, normalised to the unit names of the mapping. */
const CELL_UNITS: Record<RunQuantityName, Record<string, string>> = {
  time: { s: 's', sec: 's', ms: 'ms', min: 'min', h: 'h' },
  voltage: { v: 'V', mv: 'mV' },
  current: { a: 'A', ma: 'mA' },
  power: { w: 'W', mw: 'mW' },
  temperature: { '°c': '°C', c: '°C', degc: '°C', '℃': '°C', '°f': '°F', f: '°F', degf: '°F', '℉': '°F' },
};

export function cellUnit(quantity: RunQuantityName, suffix: string): string | undefined {
  return CELL_UNITS[quantity][
    suffix
      .trim()
      .toLowerCase()
      .replace(/^deg\s+/, 'deg')
  ];
}

const quote = (text: string) => `"${text.length > 40 ? `${text.slice(0, 40)}…` : text}"`;
const delimiterWord = (d: string) => (d in RUN_DELIMITER.labels ? RUN_DELIMITER.labels[d as RunDelimiter] : JSON.stringify(d));

/** A Float64Array that grows by doubling; `done()` returns an exact-length copy. */
class ColumnBuilder {
  private data: Float64Array;
  length = 0;
  constructor(initial: number) {
    this.data = new Float64Array(Math.max(16, initial));
  }
  push(x: number): void {
    if (this.length === this.data.length) {
      const bigger = new Float64Array(this.data.length * 2);
      bigger.set(this.data);
      this.data = bigger;
    }
    this.data[this.length++] = x;
  }
  last(): number {
    return this.data[this.length - 1] as number;
  }
  /** The values pushed; a view when the slack is small, else an exact copy (so a grown buffer is not kept). */
  done(): Float64Array {
    const out = this.data.length - this.length <= this.data.length / 10 ? this.data.subarray(0, this.length) : this.data.slice(0, this.length);
    this.data = new Float64Array(0);
    return out;
  }
}

/** Time as written in an ISO 8601-like timestamp → ms. A timestamp without a zone is read as UTC (only differences matter). */
export function parseTimestampMs(text: string): number {
  let s = text.trim();
  if (/^\d{4}-\d{2}-\d{2}[ T]\d{1,2}:\d{2}/.test(s)) {
    s = s.replace(' ', 'T');
    if (!/(Z|[+-]\d{2}:?\d{2})$/i.test(s)) s += 'Z';
  }
  return /^\d{4}-\d{2}-\d{2}/.test(s) ? Date.parse(s) : Number.NaN;
}

interface ColumnPlan {
  quantity: RunQuantityName;
  name: string;
  index: number;
  unit: string;
  builder: ColumnBuilder;
  /** First unit word seen in a cell of this column (for the mixed-units check). */
  seenUnit: string | null;
  seenUnitRow: number;
}

export interface ParseOutcome {
  series: StoredSeries;
  samples: number;
  delimiter: RunDelimiter;
  header: string[];
}

/** Reads the first bytes of a file (for delimiter detection and the preview). */
export function readHead(path: string, bytes: number): Buffer {
  const fd = openSync(path, 'r');
  try {
    const buf = Buffer.alloc(bytes);
    const got = readSync(fd, buf, 0, bytes, 0);
    return buf.subarray(0, got);
  } finally {
    closeSync(fd);
  }
}

/** True when the bytes look like a binary file (a spreadsheet, an image) rather than text. */
export function looksBinary(head: Buffer): boolean {
  const sample = head.subarray(0, 4096);
  if (sample.includes(0)) return true;
  // Zip containers (xlsx, ods) start with "PK\x03\x04".
  return sample.length >= 4 && sample[0] === 0x50 && sample[1] === 0x4b && sample[2] === 0x03 && sample[3] === 0x04;
}

/** Text of the head of a file without a cut multi-byte character at the end and without a BOM. */
export function headText(head: Buffer, complete: boolean): { text: string; truncated: boolean } {
  let text = head.toString('utf8');
  if (!complete) text = text.replace(/\uFFFD+$/, '');
  text = text.replace(/^\uFEFF/, '');
  const endsWithNewline = /\r?\n$/.test(text);
  if (!complete && !endsWithNewline) {
    // Drop the last, probably cut, line.
    const cut = Math.max(text.lastIndexOf('\n'), 0);
    if (cut > 0) text = text.slice(0, cut + 1);
  }
  return { text, truncated: !complete };
}

/** Splits the first lines with a delimiter (papaparse, so quotes are honoured). */
function splitLines(text: string, delimiter: string, maxLines: number): string[][] {
  return Papa.parse<string[]>(text, { delimiter, preview: maxLines, skipEmptyLines: false }).data;
}

/**
 * The delimiter that splits the lines most consistently into more than one field: for each
 * candidate, the share of non-empty lines with the most common field count, then the count.
 */
export function detectDelimiter(text: string): { delimiter: RunDelimiter; fields: number } {
  let best: { delimiter: RunDelimiter; fields: number; share: number } = { delimiter: ',', fields: 1, share: 0 };
  for (const delimiter of RUN_DELIMITER.values) {
    const rows = splitLines(text, delimiter, 60).filter((r) => !(r.length === 1 && r[0]!.trim() === ''));
    if (rows.length === 0) continue;
    const counts = new Map<number, number>();
    for (const r of rows) counts.set(r.length, (counts.get(r.length) ?? 0) + 1);
    let fields = 1;
    let freq = 0;
    for (const [count, f] of counts) if (f > freq || (f === freq && count > fields)) [fields, freq] = [count, f];
    const share = freq / rows.length;
    if (fields > 1 && (share > best.share + 1e-9 || (Math.abs(share - best.share) < 1e-9 && fields > best.fields))) best = { delimiter, fields, share };
  }
  return { delimiter: best.delimiter, fields: best.fields };
}

/** The most likely delimiter among the others when a line did not split (for the wrong-delimiter message). */
function otherDelimiterIn(line: string, used: string): RunDelimiter | null {
  for (const d of RUN_DELIMITER.values) if (d !== used && line.includes(d)) return d;
  return null;
}

/**
 * Parses a log file with its mapping into typed columns in stored units (s from the first row, V, A, W, °C).
 * Throws LogError naming the row and column for anything it cannot read.
 */
export async function parseRunFile(path: string, mapping: RunMapping): Promise<ParseOutcome> {
  const HEAD_BYTES = 64 * 1024;
  const head = readHead(path, HEAD_BYTES);
  if (head.length === 0) throw new LogError('The file is empty.', { row: 1 });
  if (looksBinary(head)) throw new LogError('This is not a text file (a spreadsheet or an image?). Export the log as CSV or TSV and upload that.', { row: 1 });
  const { text: sample } = headText(head, head.length < HEAD_BYTES);
  const delimiter: RunDelimiter = mapping.delimiter ?? detectDelimiter(sample).delimiter;
  const headerRow = mapping.headerRow ?? 1;
  const decimalComma = mapping.decimalComma ?? false;
  const fileSize = statSync(path).size;

  const plans: ColumnPlan[] = [];
  let timePlan: ColumnPlan | null = null;
  let header: string[] = [];
  let maxIndex = -1;
  let row = 0;
  let samples = 0;
  let firstTime = Number.NaN;
  let prevTimeText = '';
  let failure: LogError | null = null;
  // Rows expected, from the bytes per line of the head of the file (the columns then rarely need to grow).
  const sampleLines = Math.max(1, (sample.match(/\n/g) ?? []).length);
  const estimate = Math.min(Math.ceil((fileSize / Math.max(1, Buffer.byteLength(sample) / sampleLines)) * 1.05) + 16, 8_000_000);

  const fail = (message: string, where: { row?: number; column?: string; field?: string }): never => {
    throw new LogError(message, where);
  };

  const setUpColumns = (cells: string[]) => {
    header = cells.map((c, k) => (k === 0 ? c.replace(/^\uFEFF/, '') : c).trim());
    if (header.length === 1) {
      const other = otherDelimiterIn(cells[0] ?? '', delimiter);
      fail(
        other
          ? `Row ${row} has a single column ${quote(header[0] ?? '')}: the file looks ${delimiterWord(other)}-separated, not ${delimiterWord(delimiter)}-separated. Choose the ${delimiterWord(other)} as the delimiter.`
          : `Row ${row} has a single column ${quote(header[0] ?? '')}: the ${delimiterWord(delimiter)} does not split it. Check the delimiter and the header row.`,
        { row, column: header[0] ?? '', field: 'mapping.delimiter' },
      );
    }
    for (const quantity of RUN_QUANTITIES) {
      const m = mapping[quantity];
      if (!m) continue;
      const index = header.indexOf(m.column.trim());
      if (index === -1) {
        const shown = header.slice(0, 12).map(quote).join(', ') + (header.length > 12 ? ` and ${header.length - 12} more` : '');
        fail(`Column ${quote(m.column)} (mapped to ${quantity}) is not in the header (row ${row}), which has: ${shown}.`, {
          row,
          column: m.column,
          field: `mapping.${quantity}.column`,
        });
      }
      const plan: ColumnPlan = { quantity, name: m.column, index, unit: m.unit, builder: new ColumnBuilder(estimate), seenUnit: null, seenUnitRow: 0 };
      if (quantity === 'time') timePlan = plan;
      else plans.push(plan);
      maxIndex = Math.max(maxIndex, index);
    }
  };

  /** One cell of a numeric column → number in the column's logged unit. */
  const numberIn = (plan: ColumnPlan, raw: string): number => {
    let text = raw.trim();
    if (text === '') fail(`Row ${row}, column ${quote(plan.name)}: the cell is empty; every row needs a ${plan.quantity} value.`, { row, column: plan.name });
    if (decimalComma) text = text.replace(',', '.');
    if (NUMBER.test(text)) return Number(text);
    const m = NUMBER_WITH_UNIT.exec(text);
    if (m) {
      const unit = cellUnit(plan.quantity, m[2]!);
      if (unit !== undefined) {
        if (plan.seenUnit !== null && unit !== plan.seenUnit) {
          fail(
            `Row ${row}, column ${quote(plan.name)}: ${quote(raw.trim())} is in ${unit} but row ${plan.seenUnitRow} is in ${plan.seenUnit}: mixed units in one column. Convert the column to one unit and upload again.`,
            { row, column: plan.name },
          );
        }
        if (unit !== plan.unit) {
          fail(`Row ${row}, column ${quote(plan.name)}: ${quote(raw.trim())} is in ${unit} but the column is mapped as ${plan.unit}. Choose ${unit} for this column.`, {
            row,
            column: plan.name,
            field: `mapping.${plan.quantity}.unit`,
          });
        }
        if (plan.seenUnit === null) {
          plan.seenUnit = unit;
          plan.seenUnitRow = row;
        }
        return Number(m[1]);
      }
    }
    const firstData = samples === 0;
    return fail(
      `Row ${row}, column ${quote(plan.name)}: ${quote(raw.trim())} is not a number${plan.unit ? ` in ${plan.unit}` : ''}.${firstData ? ' If the file has more than one header line, set the header row.' : ''}`,
      { row, column: plan.name },
    );
  };

  const readRow = (cells: string[]) => {
    const tp = timePlan as ColumnPlan | null;
    if (!tp) return;
    if (cells.length <= maxIndex) {
      // Name the first mapped column the row is too short for.
      const plan = [tp, ...plans].filter((p) => p.index >= cells.length).sort((a, b) => a.index - b.index)[0]!;
      fail(`Row ${row} has ${cells.length} field${cells.length === 1 ? '' : 's'}, so column ${quote(plan.name)} (field ${plan.index + 1}) is missing.`, { row, column: plan.name });
    }
    // Time: elapsed in the mapped unit, or a timestamp turned into seconds from the first row.
    const timeText = cells[tp.index] as string;
    let t: number;
    if (tp.unit === 'iso') {
      const ms = parseTimestampMs(timeText);
      if (!Number.isFinite(ms)) {
        fail(`Row ${row}, column ${quote(tp.name)}: ${quote(timeText.trim())} is not a timestamp (ISO 8601, e.g. 2026-10-12T14:03:21.5Z).`, { row, column: tp.name });
      }
      if (samples === 0) firstTime = ms;
      t = (ms - firstTime) / 1000;
    } else if (tp.unit === 'epoch-s' || tp.unit === 'epoch-ms') {
      const text = timeText.trim();
      if (!NUMBER.test(text)) {
        fail(`Row ${row}, column ${quote(tp.name)}: ${quote(text)} is not a Unix timestamp in ${tp.unit === 'epoch-s' ? 'seconds' : 'milliseconds'}.`, { row, column: tp.name });
      }
      const value = Number(text);
      if (samples === 0) firstTime = value;
      t = tp.unit === 'epoch-ms' ? (value - firstTime) / 1000 : value - firstTime;
    } else {
      t = numberIn(tp, timeText);
    }
    if (samples > 0 && !(t > tp.builder.last())) {
      fail(
        `Row ${row}, column ${quote(tp.name)}: time ${quote(timeText.trim())} is not later than the row before (${quote(prevTimeText)}). The time column must increase from row to row; sort the log or remove repeated rows.`,
        { row, column: tp.name },
      );
    }
    tp.builder.push(t);
    prevTimeText = timeText.trim();
    for (const plan of plans) plan.builder.push(numberIn(plan, cells[plan.index] as string));
    samples++;
  };

  await new Promise<void>((resolve, reject) => {
    const file = createReadStream(path, { highWaterMark: 1 << 16 });
    const stream = file.pipe(new LineLengthGuard(MAX_LINE_BYTES));
    stream.setEncoding('utf8');
    let settled = false;
    const finish = (err?: unknown) => {
      if (settled) return;
      settled = true;
      file.destroy();
      stream.destroy();
      if (err) reject(err);
      else resolve();
    };
    // Before papaparse's own listeners, so an over-long line is reported as itself.
    file.on('error', (err) => finish(err));
    stream.on('error', (err) => finish(err));
    Papa.parse<string[]>(stream as unknown as NodeJS.ReadableStream, {
      delimiter,
      skipEmptyLines: false,
      chunk: (results, parser) => {
        if (failure) return;
        try {
          for (const cells of results.data) {
            row++;
            if (cells.length === 1 && (cells[0] ?? '').trim() === '') continue;
            if (row < headerRow) continue;
            if (row === headerRow) setUpColumns(cells);
            else readRow(cells);
          }
        } catch (err) {
          failure = err instanceof LogError ? err : new LogError(`Row ${row}: ${(err as Error).message}`, { row });
          parser.abort();
          finish(failure);
        }
      },
      complete: () => finish(failure ?? undefined),
      error: (err) => finish(new LogError(`The file could not be read: ${err.message}`)),
    });
  });

  if (header.length === 0) {
    throw new LogError(`The file has fewer than ${headerRow} non-empty rows, so there is no header at row ${headerRow}.`, { row: headerRow, field: 'mapping.headerRow' });
  }
  const tp = timePlan as ColumnPlan | null;
  if (!tp) throw new LogError('Map a time column.', { field: 'mapping.time.column' });
  if (samples === 0) {
    throw new LogError(`No numeric rows: the file has a header (row ${headerRow}) but no data rows under it.`, { row: headerRow + 1, column: tp.name });
  }
  if (samples < 2) {
    throw new LogError(`Only one data row (row ${row}): a run needs at least two samples.`, { row, column: tp.name });
  }

  const t = tp.builder.done();
  if (tp.unit === 's' || tp.unit === 'ms' || tp.unit === 'min' || tp.unit === 'h') {
    // Elapsed time from the first row, in seconds.
    convertColumnInPlace(t, 'time', tp.unit);
    const t0 = t[0] as number;
    if (t0 !== 0) for (let k = 0; k < t.length; k++) t[k] = (t[k] as number) - t0;
  }
  const series: StoredSeries = { t };
  for (const plan of plans) {
    const column = plan.builder.done();
    convertColumnInPlace(column, plan.quantity as Exclude<RunQuantity, 'time'>, plan.unit);
    series[SERIES_KEY[plan.quantity as Exclude<RunQuantityName, 'time'>]] = column;
  }
  return { series, samples, delimiter, header };
}
