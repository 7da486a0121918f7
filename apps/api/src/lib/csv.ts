// CSV in and out, for files that round-trip through spreadsheets (papaparse).
import Papa from 'papaparse';

/**
 * The one rule for text cells of every CSV export (CSV injection): a cell whose first character
 * that is not blank could start a formula (= + - @, their full-width forms, or a tab or line break
 * before one) gets a single quote in front, so a spreadsheet shows it as text. Only numbers written
 * as numbers (a JavaScript number, see toCsv) are exempt — never text that merely starts like one,
 * such as `-2+3+cmd|' /C calc'!A0`. A cell that already starts with a quote before such a character
 * gets one more, so that unguardCell gives back exactly what was stored.
 */
const FORMULA_START = /^[\s\u00A0\u3000]*[=+\-@\uFF1D\uFF0B\uFF0D\uFF20]/u;
const startsFormula = (value: string) => FORMULA_START.test(value);

export function guardCell(value: string): string {
  return startsFormula(value) || (value.startsWith("'") && startsFormula(value.slice(1))) ? `'${value}` : value;
}

/** Undo guardCell on import: the quote it added is dropped. */
export function unguardCell(value: string): string {
  return value.startsWith("'") && (startsFormula(value.slice(1)) || (value[1] === "'" && startsFormula(value.slice(2)))) ? value.slice(1) : value;
}

/**
 * A CSV that opens cleanly in a spreadsheet: UTF-8 BOM (so accents and Ω survive), CRLF line ends,
 * every field quoted, text that starts like a formula neutralised. Numbers are written as numbers.
 */
export function toCsv(header: string[], rows: (string | number | null | undefined)[][]): string {
  const data = rows.map((r) => r.map((v) => (v === null || v === undefined ? '' : typeof v === 'number' ? String(v) : guardCell(v))));
  return '\uFEFF' + Papa.unparse({ fields: header.map(guardCell), data }, { quotes: true, newline: '\r\n', delimiter: ',' }) + '\r\n';
}

export interface ParsedCsv {
  header: string[];
  /** Rows as arrays of cells; `line` is the row number a spreadsheet shows (header = 1). */
  rows: { line: number; cells: string[] }[];
  delimiter: string;
  /** Parse problems per row (unbalanced quotes…). */
  problems: { line: number; message: string }[];
}

/**
 * Read CSV text: strips a UTF-8 BOM, detects comma, semicolon or tab separators (spreadsheets in
 * some locales write semicolons), honours quoted fields with embedded separators, quotes and line
 * breaks, and skips blank lines. Row numbers are those a spreadsheet shows (header = row 1; a
 * multi-line quoted cell is one row; blank lines count).
 */
export function parseCsv(text: string): ParsedCsv {
  const clean = text.replace(/^\uFEFF/, '');
  const records: { line: number; cells: string[] }[] = [];
  const problems: ParsedCsv['problems'] = [];
  let delimiter = ',';
  let embedded = 0;
  let newlines = 0;
  let counted = 0;
  Papa.parse<string[]>(clean, {
    header: false,
    skipEmptyLines: 'greedy',
    delimitersToGuess: [',', ';', '\t'],
    step: (result) => {
      delimiter = result.meta.delimiter || delimiter;
      const cursor = result.meta.cursor;
      for (let i = counted; i < cursor; i++) if (clean.charCodeAt(i) === 10) newlines++;
      counted = cursor;
      const endsWithBreak = clean[cursor - 1] === '\n' && !/\n$/.test(result.data.at(-1) ?? '');
      const lastLine = endsWithBreak ? newlines : newlines + 1;
      const inside = result.data.reduce((n, cell) => n + ((cell ?? '').match(/\n/g) ?? []).length, 0);
      // A spreadsheet shows a multi-line quoted cell as one row: count rows, not text lines.
      const line = Math.max(1, lastLine - inside - embedded);
      embedded += inside;
      records.push({ line, cells: result.data.map((c) => (c ?? '').trim()) });
      for (const e of result.errors) if (e.code !== 'UndetectableDelimiter') problems.push({ line, message: e.message });
    },
  });
  const [header, ...rows] = records;
  return { header: (header?.cells ?? []).map((h) => h.trim()), rows, delimiter, problems };
}
