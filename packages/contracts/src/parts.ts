// Bill of materials: one line per part of a teardown, CSV import/export.
import { z } from 'zod';
import { patchOf, safeString } from './common';
import { MOUNT_TYPE, PART_CATEGORY, type MountType, type PartCategory } from './domain';
import { toleranceReading } from './tools';

/** Categories put together by hand rather than placed on a board. */
const MANUAL_CATEGORIES: readonly PartCategory[] = ['cell', 'pcb', 'enclosure', 'fastener', 'label', 'packaging', 'wire', 'heater', 'motor'];
/** The mount a line gets when none is given: manual for cells, boards, heaters, motors, wires and mechanical parts; SMT otherwise. */
export const defaultMountFor = (category: PartCategory): MountType => (MANUAL_CATEGORIES.includes(category) ? 'manual' : 'smt');

const trimmed = (max: number) =>
  safeString()
    .trim()
    .max(max, `At most ${max} characters`)
    .optional()
    .nullable()
    .transform((v) => (v === '' ? null : v));

/** What was given, quoted for a message (`"gizmo"`), or null when nothing was. */
const given = (input: unknown) => (input === undefined || input === null || input === '' ? null : `"${String(input)}"`);

export const partCategorySchema = z.enum(PART_CATEGORY.values, {
  error: (issue) =>
    given(issue.input) === null
      ? 'Required: say what kind of part this is (e.g. passive, ic, connector).'
      : `Unknown category ${given(issue.input)}. Choose a category: ${PART_CATEGORY.values.join(', ')}.`,
});
export const mountTypeSchema = z.enum(MOUNT_TYPE.values, {
  error: (issue) => (given(issue.input) === null ? 'Choose smt, tht or manual' : `Unknown mount ${given(issue.input)}: choose smt, tht or manual.`),
});

const partFields = {
  /** Reference designators as printed on the board, e.g. "R1, R2" (free text). */
  designators: trimmed(300),
  /** The singular form is accepted too (same meaning). */
  designator: trimmed(300),
  category: partCategorySchema,
  description: safeString({ error: 'Required: describe the part.' }).trim().min(1, 'Required: describe the part.').max(500, 'At most 500 characters'),
  quantity: z
    .number({ error: (issue) => (given(issue.input) === null ? 'Enter a whole number of at least 1' : `${given(issue.input)} is not a number: enter a whole number of at least 1.`) })
    .int({ error: (issue) => `${String(issue.input)} is not a whole number.` })
    .min(1, { error: (issue) => `At least 1: ${String(issue.input)} is below 1 (a line needs at least one part).` })
    .max(100_000, 'At most 100 000'),
  mount: mountTypeSchema,
  /** The marking as read off the part ("472", "4R7", "68X", "104"). */
  marking: trimmed(120),
  makerPartNumber: trimmed(120),
  package: trimmed(80),
  notes: trimmed(4000),
};

/** `mount` defaults to manual for cells, boards, heaters, motors, wires, enclosures, fasteners, labels and packaging; SMT otherwise. */
export const createPartBody = z.object({ ...partFields, quantity: partFields.quantity.default(1), mount: partFields.mount.optional() });
export type CreatePartBody = z.input<typeof createPartBody>;

export const updatePartBody = patchOf(partFields);

/**
 * A quantity as typed (the editor's field, a CSV cell): a whole number, spaces allowed ("1 000");
 * not given (a blank CSV cell), 1. The number's own rules are the body's.
 */
const quantityText = safeString()
  .optional()
  .transform((v): unknown => {
    if (v === undefined) return 1;
    const t = v.replace(/\s/g, '');
    return /^[+-]?\d+(\.\d+)?$/.test(t) ? Number(t) : t;
  })
  .pipe(partFields.quantity);

/**
 * A part line as text: the parts editor's row (react-hook-form + zodResolver) and a row of the parts
 * CSV import are both read with it, so a line has the same rules wherever it is typed. The output is
 * a create/update body; a mount left out follows the category (`defaultMountFor`).
 */
export const partFormSchema = z.object({
  designators: partFields.designators,
  category: partCategorySchema,
  description: partFields.description,
  marking: partFields.marking,
  makerPartNumber: partFields.makerPartNumber,
  package: partFields.package,
  quantity: quantityText,
  mount: mountTypeSchema.optional(),
  notes: partFields.notes,
});
export type PartFormValues = z.input<typeof partFormSchema>;
export type PartForm = z.output<typeof partFormSchema>;
export type UpdatePartBody = z.input<typeof updatePartBody>;

export const reorderPartsBody = z.object({
  ids: z.array(z.number().int().positive()).min(1, 'Give the part ids in their new order').max(5000),
});
export type ReorderPartsBody = z.infer<typeof reorderPartsBody>;

/** One reading of a part's marking, by the same decoder as the bench tools' marking decoder. */
export const decodedReadingSchema = z.object({
  /** 1 for the most likely reading, 2 for the next. */
  rank: z.number().int(),
  value: z.number(),
  unit: z.enum(['Ω', 'F']),
  /** The rule (code form) that gives it: "letter-and-digit", "eia-96", "three-digit", … */
  scheme: safeString(),
  schemeLabel: safeString(),
  schemeShortLabel: safeString(),
  /** What the tolerance letter of the code means, when it has one ("102K" read as 1 kΩ: ±10 %). */
  tolerance: toleranceReading.nullable(),
  /** The rule that ranks the readings when there is more than one. */
  rankReason: safeString().nullable(),
});
export type DecodedReadingDto = z.infer<typeof decodedReadingSchema>;

export const partSchema = z.object({
  id: z.number().int(),
  teardownId: z.number().int(),
  position: z.number().int(),
  designators: safeString().nullable(),
  category: partCategorySchema,
  description: safeString(),
  marking: safeString().nullable(),
  /** Decoded from the marking (SI: Ω or F) when it reads as a resistor or capacitor code. */
  decodedValue: z.number().nullable(),
  decodedUnit: z.enum(['Ω', 'F']).nullable(),
  /** Why a resistor/capacitor marking gave no value (null when decoded or not applicable). */
  decodeNote: safeString().nullable(),
  /**
   * Every valid reading of the marking, most likely first; the first is decodedValue/decodedUnit. More
   * than one when the code reads two ways ("10R": 10 Ω, or 1.24 Ω as EIA-96). Empty when not decoded.
   */
  decodedReadings: z.array(decodedReadingSchema),
  makerPartNumber: safeString().nullable(),
  package: safeString().nullable(),
  quantity: z.number().int(),
  mount: mountTypeSchema,
  notes: safeString().nullable(),
  updatedAt: safeString(),
});
export type PartDto = z.infer<typeof partSchema>;
export const partResponse = z.object({ part: partSchema });
export const partsResponse = z.object({ parts: z.array(partSchema) });

// ---- CSV ----

/**
 * Columns of the parts CSV, in export order. Import matches headers case-insensitively, ignoring
 * spaces, '_', '-' and '.', and accepts the aliases listed.
 */
export const PART_CSV_COLUMNS = [
  { key: 'designators', header: 'Designators', aliases: ['designator', 'ref', 'refs', 'refdes', 'reference'], required: false },
  { key: 'category', header: 'Category', aliases: ['type'], required: true },
  { key: 'description', header: 'Description', aliases: ['desc', 'name'], required: true },
  { key: 'marking', header: 'Marking', aliases: ['code', 'markingcode'], required: false },
  { key: 'decodedValue', header: 'Decoded value', aliases: [], required: false },
  { key: 'decodedUnit', header: 'Decoded unit', aliases: [], required: false },
  { key: 'makerPartNumber', header: 'Maker part number', aliases: ['mpn', 'partnumber', 'pn', 'manufacturerpartnumber'], required: false },
  { key: 'package', header: 'Package', aliases: ['footprint', 'case'], required: false },
  { key: 'quantity', header: 'Quantity', aliases: ['qty', 'count'], required: false },
  { key: 'mount', header: 'Mount', aliases: ['mounting', 'mounttype', 'assembly'], required: false },
  { key: 'notes', header: 'Notes', aliases: ['note', 'comment', 'comments', 'remarks'], required: false },
] as const;
export type PartCsvKey = (typeof PART_CSV_COLUMNS)[number]['key'];
/** Export-only columns: read back on import, but recomputed from the marking. */
export const PART_CSV_COMPUTED: readonly PartCsvKey[] = ['decodedValue', 'decodedUnit'];

export const importPartsBody = z.object({
  /** The CSV text (UTF-8; a BOM is fine). Comma, semicolon or tab separated; quoted fields allowed. */
  csv: safeString({ error: 'Paste or upload a CSV file' }).min(1, 'The CSV is empty').max(900_000, 'The CSV is larger than 900 kB; split it'),
  /** append (default) keeps the current parts; replace swaps the whole list in one transaction. */
  mode: z.enum(['append', 'replace'], { error: 'Choose append or replace' }).default('append'),
});
export type ImportPartsBody = z.input<typeof importPartsBody>;
export const importPartsQuery = z.object({
  dryRun: z
    .enum(['1', '0', 'true', 'false'], { error: 'Use dryRun=1 for a preview' })
    .optional()
    .transform((v) => v === '1' || v === 'true'),
});

export const csvRowErrorSchema = z.object({
  /** Row number as a spreadsheet shows it: the header is row 1, the first part row 2. */
  row: z.number().int(),
  /** The column as headed in the file (or the expected header when it is missing). */
  column: safeString(),
  message: safeString(),
});
export type CsvRowError = z.infer<typeof csvRowErrorSchema>;

export const importPreviewRowSchema = z.object({
  row: z.number().int(),
  part: z.object({
    designators: safeString().nullable(),
    category: safeString(),
    description: safeString(),
    marking: safeString().nullable(),
    decodedValue: z.number().nullable(),
    decodedUnit: z.enum(['Ω', 'F']).nullable(),
    decodedReadings: z.array(decodedReadingSchema),
    makerPartNumber: safeString().nullable(),
    package: safeString().nullable(),
    quantity: z.number().nullable(),
    mount: safeString(),
    notes: safeString().nullable(),
  }),
  errors: z.array(csvRowErrorSchema),
});
export type ImportPreviewRow = z.infer<typeof importPreviewRowSchema>;

export const importPartsResponse = z.object({
  dryRun: z.boolean(),
  /** Nothing is saved unless every row is valid. */
  valid: z.boolean(),
  delimiter: safeString(),
  columns: z.object({ recognised: z.array(safeString()), ignored: z.array(safeString()) }),
  rows: z.array(importPreviewRowSchema),
  errors: z.array(csvRowErrorSchema),
  warnings: z.array(safeString()),
  /** Parts saved (0 on a dry run). */
  imported: z.number().int(),
  parts: z.array(partSchema).optional(),
});
export type ImportPartsResponse = z.infer<typeof importPartsResponse>;
