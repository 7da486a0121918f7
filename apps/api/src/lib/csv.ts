// CSV in and out, for files that round-trip through spreadsheets (papaparse).
import Papa from 'papaparse';

/** Cells a spreadsheet would run as a formula (CSV injection): prefixed with a single quote on export. */
const FORMULA_START = /^[=+\-@\t\r]/;

export function guardCell(value: string): string {
  return FORMULA_START.test(value) ? `'${value}` : value;
}

/** Undo guardCell on import: a quote before a formula-start character is dropped. */
export function unguardCell(value: string): string {
  return /^'[=+\-@\t\r]/.test(value) ? value.slice(1) : value;
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
