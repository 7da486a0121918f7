// Column preview: from the first kilobytes of a log, the delimiter, the header row, the first rows
// and a guess at the mapping, for the engineer to check before the real upload.
import Papa from 'papaparse';
import type { RunDelimiter, RunKind, RunPreview, TimeUnit } from '@splitcase/contracts';
import { cellUnit, detectDelimiter, headText, looksBinary, LogError, parseTimestampMs } from './parse';

const PREVIEW_ROWS = 20;

const NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;
const NUMBER_WITH_UNIT = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*([^\d\s].*)$/;

/** The first line (1-based) whose field count is the usual one: loggers often write a preamble before the header. */
function findHeaderRow(lines: string[][], fields: number): number {
  for (let k = 0; k < lines.length; k++) if (lines[k]!.length === fields) return k + 1;
  return 1;
}

type Guess = RunPreview['guess'];
type Quantity = 'time' | 'voltage' | 'current' | 'power' | 'temperature';

/** Header words that name each quantity (English words and the usual symbols of loggers). */
const NAME_PATTERNS: Record<Quantity, RegExp> = {
  time: /^(t|time|elapsed|timestamp|date ?time|datetime|seconds?|secs?|runtime|test ?time|zeit)\b|time|elapsed|timestamp/i,
  voltage: /volt|^v\b|^u\b|^vbat|^vbus|^vout|^vin|spannung|\bv\s*[([]/i,
  current: /curr|amp(?!bient)|^i\b|^ibat|^ibus|^iout|^iin|strom|\bi\s*[([]/i,
  power: /power|watt|^p\b|^pout|^pin|leistung/i,
  temperature: /temp|°c|°f|thermo|^tc\d*\b|^t\d\b|surface|ambient|^ntc/i,
};

/** A unit written in a header, e.g. "Current (mA)", "volts_mV", "Temp [°F]", "time_s". */
function unitInHeader(name: string, q: Quantity): string | undefined {
  const tokens = name.split(/[\s_()[\]/,-]+/).filter(Boolean);
  for (let k = tokens.length - 1; k >= 0; k--) {
    const token = tokens[k]!;
    if (q === 'time') {
      const t = token.toLowerCase();
      if (['s', 'sec', 'secs', 'seconds'].includes(t)) return 's';
      if (['ms', 'msec', 'millis', 'milliseconds'].includes(t)) return 'ms';
      if (['min', 'mins', 'minutes'].includes(t)) return 'min';
      if (['h', 'hr', 'hrs', 'hours'].includes(t)) return 'h';
      continue;
    }
    if (q === 'temperature' && /^(fahrenheit)$/i.test(token)) return '°F';
    if (q === 'temperature' && /^(celsius)$/i.test(token)) return '°C';
    const unit = token.length <= 4 ? cellUnit(q, token) : undefined;
    if (unit) return unit;
  }
  return undefined;
}

function unitInCells(cells: string[], q: Quantity): string | undefined {
  for (const cell of cells) {
    const m = NUMBER_WITH_UNIT.exec(cell.trim());
    if (m) {
      const unit = cellUnit(q, m[2]!);
      if (unit) return unit;
    }
  }
  return undefined;
}

function numbers(cells: string[], decimalComma: boolean): number[] {
  const out: number[] = [];
  for (const cell of cells) {
    const text = (decimalComma ? cell.replace(',', '.') : cell).trim();
    if (NUMBER.test(text)) out.push(Number(text));
    else {
      const m = NUMBER_WITH_UNIT.exec(text);
      if (m) out.push(Number(m[1]));
    }
  }
  return out;
}

/** Guesses which column is which, and in which unit, from the header names and the first values. */
export function guessMapping(header: string[], rows: string[][], decimalComma: boolean): Guess {
  const used = new Set<number>();
  const column = (k: number) => rows.map((r) => r[k] ?? '');
  const pick = (q: Quantity): number | undefined => {
    for (let k = 0; k < header.length; k++) if (!used.has(k) && NAME_PATTERNS[q].test(header[k]!)) return k;
    return undefined;
  };
  const guess: Guess = { kind: 'discharge' };

  // Time first: a named column, else the first column of timestamps or increasing numbers.
  let timeIndex = pick('time');
  if (timeIndex === undefined) {
    for (let k = 0; k < header.length; k++) {
      const cells = column(k);
      const values = numbers(cells, decimalComma);
      const timestamps = cells.filter((c) => Number.isFinite(parseTimestampMs(c))).length;
      if (timestamps === cells.length && cells.length > 0) {
        timeIndex = k;
        break;
      }
      if (values.length === cells.length && values.length > 1 && values.every((v, j) => j === 0 || v > values[j - 1]!)) {
        timeIndex = k;
        break;
      }
    }
  }
  if (timeIndex !== undefined) {
    used.add(timeIndex);
    const cells = column(timeIndex);
    const values = numbers(cells, decimalComma);
    let unit: TimeUnit;
    if (cells.length > 0 && cells.every((c) => Number.isFinite(parseTimestampMs(c)))) unit = 'iso';
    else if (values.length > 0 && values[0]! > 1e12) unit = 'epoch-ms';
    else if (values.length > 0 && values[0]! > 1e9) unit = 'epoch-s';
    else unit = (unitInHeader(header[timeIndex]!, 'time') ?? unitInCells(cells, 'time') ?? 's') as TimeUnit;
    guess.time = { column: header[timeIndex]!, unit };
  }

  // Temperature before voltage and current, so a "temp" column is not taken for anything else.
  for (const q of ['temperature', 'voltage', 'current', 'power'] as const) {
    const k = pick(q);
    if (k === undefined) continue;
    used.add(k);
    const cells = column(k);
    const values = numbers(cells, decimalComma);
    const typical = values.length ? Math.max(...values.map(Math.abs)) : 0;
    const stated = unitInHeader(header[k]!, q) ?? unitInCells(cells, q);
    if (q === 'temperature') guess.temperature = { column: header[k]!, unit: (stated as '°C' | '°F' | undefined) ?? (typical > 130 ? '°F' : '°C') };
    // Values above 100 in a voltage or current column of these devices are millivolts or milliamps.
    if (q === 'voltage') guess.voltage = { column: header[k]!, unit: (stated as 'V' | 'mV' | undefined) ?? (typical > 100 ? 'mV' : 'V') };
    if (q === 'current') guess.current = { column: header[k]!, unit: (stated as 'A' | 'mA' | undefined) ?? (typical > 100 ? 'mA' : 'A') };
    if (q === 'power') guess.power = { column: header[k]!, unit: (stated as 'W' | 'mW' | undefined) ?? (typical > 500 ? 'mW' : 'W') };
  }

  let kind: RunKind = 'discharge';
  if (guess.temperature && !guess.voltage) kind = 'thermal';
  else if (guess.voltage && guess.current) {
    // A current that ends much lower than it starts, at a high voltage, is a CC-CV charge.
    const volts = numbers(column(header.indexOf(guess.voltage.column)), decimalComma);
    const vMax = Math.max(...volts) * (guess.voltage.unit === 'mV' ? 1e-3 : 1);
    const vFirst = (volts[0] ?? 0) * (guess.voltage.unit === 'mV' ? 1e-3 : 1);
    const vLast = (volts.at(-1) ?? 0) * (guess.voltage.unit === 'mV' ? 1e-3 : 1);
    if (vLast > vFirst && vMax >= 3.5 && vMax <= 4.5) kind = 'charge';
    else if (vFirst >= 4.5 && vFirst <= 21) kind = 'power-bank';
  }
  guess.kind = kind;
  return guess;
}

/** Preview of the head of a log (the web app sends at most RUN_PREVIEW_BYTES of it). */
export function previewLog(head: Buffer, complete: boolean): RunPreview {
  if (head.length === 0) throw new LogError('The file is empty.', { row: 1 });
  if (looksBinary(head)) throw new LogError('This is not a text file (a spreadsheet or an image?). Export the log as CSV or TSV and upload that.', { row: 1 });
  const { text } = headText(head, complete);
  const { delimiter, fields } = detectDelimiter(text);
  const lines = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: 'greedy', preview: 200 }).data;
  if (fields <= 1) {
    throw new LogError('No delimiter splits the rows of this file into columns (tried comma, semicolon, tab and vertical bar). A bench log needs one column per quantity.', {
      row: 1,
      column: (lines[0]?.[0] ?? '').slice(0, 60),
    });
  }
  const headerRow = findHeaderRow(lines, fields);
  const header = (lines[headerRow - 1] ?? []).map((c) => c.trim());
  const rows = lines.slice(headerRow, headerRow + PREVIEW_ROWS);
  const decimalComma = delimiter !== ',' && rows.some((r) => r.some((c) => /^[-+]?\d+,\d+$/.test(c.trim()))) && !rows.some((r) => r.some((c) => /^[-+]?\d+\.\d+$/.test(c.trim())));
  if (rows.length === 0) throw new LogError(`No numeric rows: the file has a header (row ${headerRow}) but no data rows under it.`, { row: headerRow + 1 });
  return {
    delimiter: delimiter as RunDelimiter,
    decimalComma,
    headerRow,
    columns: header,
    rows,
    guess: guessMapping(header, rows, decimalComma),
  };
}
