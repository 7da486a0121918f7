import type { EntityManager } from '@mikro-orm/sqlite';
import {
  MOUNT_TYPE,
  PART_CATEGORY,
  PART_CSV_COLUMNS,
  PART_CSV_COMPUTED,
  defaultMountFor,
  partFormSchema,
  type PartForm,
  type CsvRowError,
  type ImportPreviewRow,
  type MountType,
  type PartCategory,
  type PartCsvKey,
  type PartDto,
} from '@splitcase/contracts';
import { parseCsv, toCsv, unguardCell } from '../../lib/csv';
import { PartSchema, type Part } from './part.entity';
import type { Teardown } from '../teardowns/teardown.entity';
import { decodePartMarking } from './decode';

/** A part as the API sends it. The decoded value and readings are worked out from the marking here, by the decoder of today. */
export function toPartDto(p: Part): PartDto {
  const decoded = decodePartMarking(p);
  return {
    id: p.id,
    teardownId: typeof p.teardown === 'object' ? p.teardown.id : (p.teardown as number),
    position: p.position,
    designators: p.designators ?? null,
    category: p.category,
    description: p.description,
    marking: p.marking ?? null,
    decodedValue: decoded.value,
    decodedUnit: decoded.unit,
    decodeNote: decoded.note,
    decodedReadings: decoded.readings,
    makerPartNumber: p.makerPartNumber ?? null,
    package: p.package ?? null,
    quantity: p.quantity,
    mount: p.mount,
    notes: p.notes ?? null,
    updatedAt: p.updatedAt.toISOString(),
  };
}

/** The mount a line gets when none is given. */
export const defaultMount = defaultMountFor;

/** The values a part line holds (what create, update and import write). */
export interface PartValues {
  designators: string | null;
  category: PartCategory;
  description: string;
  marking: string | null;
  makerPartNumber: string | null;
  package: string | null;
  quantity: number;
  mount: MountType;
  notes: string | null;
}

/** Apply values to a part and refresh the decoded value from its marking (the stored columns; the DTO and CSV decode again). */
export function applyPartValues(part: Part, values: Partial<PartValues>): void {
  Object.assign(part, values);
  Object.assign(part, decodedColumns(part));
}

/** A new part line at `position` with its values and the decoded columns of its marking. */
export const newPart = (em: EntityManager, teardown: Teardown, position: number, values: PartValues): Part => em.create(PartSchema, { teardown, position, ...values, ...decodedColumns(values) });

const decodedColumns = (part: Parameters<typeof decodePartMarking>[0]) => {
  const decoded = decodePartMarking(part);
  return { decodedValue: decoded.value, decodedUnit: decoded.unit };
};

export async function nextPosition(em: EntityManager, teardownId: number): Promise<number> {
  const last = await em.findOne(PartSchema, { teardown: teardownId }, { orderBy: { position: 'desc' }, fields: ['position'] });
  return (last?.position ?? 0) + 1;
}

export const partSummary = (p: { designators?: string | null; description: string }) => (p.designators ? `${p.designators} (${p.description})` : p.description);

// ---- CSV ----

const squash = (s: string) => s.toLowerCase().replace(/[\s_\-.]/g, '');

const HEADER_LOOKUP = new Map<string, PartCsvKey>();
for (const c of PART_CSV_COLUMNS) for (const name of [c.key, c.header, ...c.aliases]) HEADER_LOOKUP.set(squash(name), c.key);

const CATEGORY_LOOKUP = new Map<string, PartCategory>();
for (const v of PART_CATEGORY.values) {
  CATEGORY_LOOKUP.set(squash(v), v);
  CATEGORY_LOOKUP.set(squash(PART_CATEGORY.labels[v]).replace(/[^a-z0-9]/g, ''), v);
}
const CATEGORY_WORDS: Record<string, PartCategory> = {
  resistor: 'passive',
  capacitor: 'passive',
  passives: 'passive',
  battery: 'cell',
  cells: 'cell',
  pack: 'cell',
  integratedcircuit: 'ic',
  chip: 'ic',
  diode: 'semiconductor',
  transistor: 'semiconductor',
  mosfet: 'semiconductor',
  discrete: 'semiconductor',
  thermistor: 'sensor',
  ntc: 'sensor',
  button: 'switch',
  cable: 'wire',
  screw: 'fastener',
  housing: 'enclosure',
  case: 'enclosure',
  board: 'pcb',
  heaterelement: 'heater',
};
for (const [word, cat] of Object.entries(CATEGORY_WORDS)) CATEGORY_LOOKUP.set(word, cat);

const MOUNT_LOOKUP = new Map<string, MountType>([
  ['smt', 'smt'],
  ['smd', 'smt'],
  ['surfacemount', 'smt'],
  ['tht', 'tht'],
  ['th', 'tht'],
  ['pth', 'tht'],
  ['throughhole', 'tht'],
  ['manual', 'manual'],
  ['hand', 'manual'],
  ['handassembled', 'manual'],
]);
for (const v of MOUNT_TYPE.values) MOUNT_LOOKUP.set(squash(MOUNT_TYPE.labels[v]), v);

const MAX_IMPORT_ROWS = 5000;
type PartLineKey = keyof PartForm;
const COLUMN_ORDER: readonly string[] = PART_CSV_COLUMNS.map((c) => c.key);

export interface ImportPlan {
  delimiter: string;
  recognised: string[];
  ignored: string[];
  rows: ImportPreviewRow[];
  errors: CsvRowError[];
  warnings: string[];
  /** The values to save, row by row (only meaningful when there are no errors). */
  values: PartValues[];
}

/**
 * Read a parts CSV and check every row; nothing is saved here. Errors name the spreadsheet row
 * (header = row 1) and the column as headed in the file.
 */
export function planPartsImport(csv: string): ImportPlan {
  const parsed = parseCsv(csv);
  const errors: CsvRowError[] = [];
  const warnings: string[] = [];
  if (csv.includes('\uFFFD')) warnings.push('The file has characters that are not UTF-8 (shown as �). Save it as "CSV UTF-8" and import again if names look wrong.');

  const columnOf = new Map<PartCsvKey, number>();
  const recognised: string[] = [];
  const ignored: string[] = [];
  parsed.header.forEach((h, index) => {
    const key = HEADER_LOOKUP.get(squash(h));
    if (!h) return;
    if (!key) {
      ignored.push(h);
      return;
    }
    if (columnOf.has(key)) {
      errors.push({ row: 1, column: h, message: `Two columns mean "${PART_CSV_COLUMNS.find((c) => c.key === key)!.header}"; keep one.` });
      return;
    }
    columnOf.set(key, index);
    recognised.push(h);
  });
  if (ignored.length) warnings.push(`Ignored column${ignored.length > 1 ? 's' : ''} ${ignored.map((c) => `"${c}"`).join(', ')}: not a parts column.`);
  if (columnOf.has('decodedValue') || columnOf.has('decodedUnit')) warnings.push('Decoded values are worked out again from the markings; the decoded columns of the file are not read.');
  for (const c of PART_CSV_COLUMNS) {
    if (c.required && !columnOf.has(c.key)) errors.push({ row: 1, column: c.header, message: `Missing column: add a "${c.header}" column to the header row.` });
  }
  if (parsed.header.length === 0) errors.push({ row: 1, column: '(header)', message: 'The file is empty: the first row must name the columns.' });
  if (parsed.rows.length === 0 && parsed.header.length > 0) errors.push({ row: 2, column: '(row)', message: 'No part rows under the header.' });
  if (parsed.rows.length > MAX_IMPORT_ROWS) errors.push({ row: parsed.rows[MAX_IMPORT_ROWS]!.line, column: '(row)', message: `At most ${MAX_IMPORT_ROWS} parts per import.` });
  for (const p of parsed.problems) errors.push({ row: p.line, column: '(row)', message: `${p.message}: check the quotes in this row.` });
  if (errors.some((e) => e.row === 1)) {
    return { delimiter: parsed.delimiter, recognised, ignored, rows: [], errors, warnings, values: [] };
  }

  const headerName = (key: PartCsvKey) => parsed.header[columnOf.get(key)!] ?? PART_CSV_COLUMNS.find((c) => c.key === key)!.header;
  const rows: ImportPreviewRow[] = [];
  const values: PartValues[] = [];
  for (const { line, cells } of parsed.rows.slice(0, MAX_IMPORT_ROWS)) {
    const rowErrors: CsvRowError[] = [];
    const fail = (key: PartCsvKey | '(row)', message: string) => rowErrors.push({ row: line, column: key === '(row)' ? key : headerName(key), message });
    const cell = (key: PartCsvKey): string | undefined => {
      if (PART_CSV_COMPUTED.includes(key)) return undefined;
      const i = columnOf.get(key);
      if (i === undefined) return undefined;
      const raw = unguardCell((cells[i] ?? '').trim());
      return raw === '' ? undefined : raw;
    };
    if (cells.length > parsed.header.length) fail('(row)', `This row has ${cells.length} cells but the header has ${parsed.header.length}: check the separator and the quotes.`);

    // The cells as a part line: words the trade uses for a category or a mount ("resistor", "SMD")
    // are read as ours; every rule is the contracts' part schema, as in the parts editor.
    const categoryText = cell('category');
    const mountText = cell('mount');
    const input: Record<PartLineKey, string | undefined> = {
      designators: cell('designators'),
      category: categoryText === undefined ? undefined : (CATEGORY_LOOKUP.get(squash(categoryText).replace(/[^a-z0-9]/g, '')) ?? categoryText),
      description: cell('description'),
      marking: cell('marking'),
      makerPartNumber: cell('makerPartNumber'),
      package: cell('package'),
      quantity: cell('quantity'),
      mount: mountText === undefined ? undefined : (MOUNT_LOOKUP.get(squash(mountText)) ?? mountText),
      notes: cell('notes'),
    };
    const read = partFormSchema.safeParse(input);
    const failed = new Set<PartLineKey>();
    for (const issue of read.success ? [] : read.error.issues.toSorted((a, b) => COLUMN_ORDER.indexOf(a.path[0] as PartLineKey) - COLUMN_ORDER.indexOf(b.path[0] as PartLineKey))) {
      const key = issue.path[0] as PartLineKey;
      if (failed.has(key)) continue;
      failed.add(key);
      fail(key, issue.message);
    }
    // A row with errors is previewed field by field (nothing is saved unless every row is valid).
    const field = <K extends PartLineKey>(key: K): PartForm[K] | null => {
      if (read.success) return read.data[key];
      const one = partFormSchema.shape[key].safeParse(input[key]);
      return one.success ? (one.data as PartForm[K]) : null;
    };
    const category = field('category');
    const description = field('description');
    const quantity = field('quantity');
    const mount = failed.has('mount') ? null : (field('mount') ?? (category ? defaultMount(category) : 'smt'));
    const v: PartValues = {
      designators: field('designators') ?? null,
      category: category ?? 'other',
      description: description ?? '',
      marking: field('marking') ?? null,
      makerPartNumber: field('makerPartNumber') ?? null,
      package: field('package') ?? null,
      quantity: quantity ?? 1,
      mount: mount ?? 'smt',
      notes: field('notes') ?? null,
    };
    const decoded = category && description ? decodePartMarking(v) : { value: null, unit: null, readings: [] };
    rows.push({
      row: line,
      part: {
        designators: v.designators,
        category: category ?? categoryText ?? '',
        description: description ?? '',
        marking: v.marking,
        decodedValue: decoded.value,
        decodedUnit: decoded.unit,
        decodedReadings: decoded.readings,
        makerPartNumber: v.makerPartNumber,
        package: v.package,
        quantity,
        mount: mount ?? mountText ?? '',
        notes: v.notes,
      },
      errors: rowErrors,
    });
    values.push(v);
    errors.push(...rowErrors);
  }
  return { delimiter: parsed.delimiter, recognised, ignored, rows, errors, warnings, values };
}

export function partsCsv(parts: Part[]): string {
  const header = PART_CSV_COLUMNS.map((c) => c.header);
  const rows = parts.map((p) => {
    const decoded = decodePartMarking(p);
    return PART_CSV_COLUMNS.map((c) => {
      switch (c.key) {
        case 'designators':
          return p.designators ?? null;
        case 'category':
          return p.category;
        case 'description':
          return p.description;
        case 'marking':
          return p.marking ?? null;
        case 'decodedValue':
          return decoded.value;
        case 'decodedUnit':
          return decoded.unit;
        case 'makerPartNumber':
          return p.makerPartNumber ?? null;
        case 'package':
          return p.package ?? null;
        case 'quantity':
          return p.quantity;
        case 'mount':
          return p.mount;
        case 'notes':
          return p.notes ?? null;
      }
    });
  });
  return toCsv(header, rows);
}

/** A file name safe in a Content-Disposition header. */
export function csvFileName(...parts: string[]): string {
  return (
    parts
      .join('-')
      .normalize('NFKD')
      .replace(/[^\w.-]+/g, '-')
      .replace(/-+/g, '-')
      .replace(/^-|-$/g, '')
      .toLowerCase() + '.csv'
  );
}
