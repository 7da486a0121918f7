// Bench tools: marking decoder, heater-trace calculator and runtime calculator. Inputs are typed
// quantities ("2700 mAh", "3R0", "35 µm", "1 oz") or plain SI numbers; the server parses them and
// answers with explained figures (value, unit, formula, source, inputs, assumptions, warnings).
import { z } from 'zod';
import { safeString } from './common';
import { CHEMISTRY } from './domain';

/** A quantity as typed (with or without its unit) or a plain number in the stored unit. */
export const toolQuantity = z.union([safeString().trim().min(1, 'Required').max(40, 'At most 40 characters'), z.number().finite()], {
  error: (issue) => (issue.input === undefined ? 'Required' : 'Enter a number or a quantity with its unit'),
});
/** An optional quantity: absent, null or '' all mean "not given". */
export const optionalToolQuantity = z.union([toolQuantity, z.literal(''), z.null()]).optional();

export const MARKING_KINDS = ['auto', 'resistor', 'capacitor'] as const;
export type MarkingKindInput = (typeof MARKING_KINDS)[number];
export const MARKING_KIND_LABELS: Record<MarkingKindInput, string> = { auto: 'Either', resistor: 'Resistor', capacitor: 'Capacitor' };

/** Colour names of the IEC 60062 code, in band order of use (digits, then gold, silver, pink). */
export const BAND_COLOURS = ['black', 'brown', 'red', 'orange', 'yellow', 'green', 'blue', 'violet', 'grey', 'white', 'gold', 'silver', 'pink'] as const;
export type BandColour = (typeof BAND_COLOURS)[number];

const bandColour = safeString()
  .trim()
  .toLowerCase()
  .refine((v) => v === 'gray' || (BAND_COLOURS as readonly string[]).includes(v), { message: `Use a colour name: ${BAND_COLOURS.join(', ')}` });

export const markingToolBody = z
  .object({
    code: safeString().trim().min(1, 'Enter a marking such as 472, 4R7 or 68X').max(12, 'At most 12 characters').optional(),
    kind: z.enum(MARKING_KINDS, { error: 'Choose resistor, capacitor or auto' }).default('auto'),
    bands: z.array(bandColour).optional(),
  })
  .superRefine((b, ctx) => {
    if (b.code === undefined && b.bands === undefined) {
      ctx.addIssue({ code: 'custom', path: ['code'], message: 'Enter a marking, or give colour bands' });
    } else if (b.code !== undefined && b.bands !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['bands'], message: 'Give a marking or colour bands, not both' });
    } else if (b.bands !== undefined && b.bands.length !== 1 && (b.bands.length < 3 || b.bands.length > 6)) {
      ctx.addIssue({ code: 'custom', path: ['bands'], message: 'A colour code has 3, 4, 5 or 6 bands (or one black band for a 0 Ω link)' });
    }
  });
export type MarkingToolBody = z.input<typeof markingToolBody>;

export const TRACE_LAYERS = ['external', 'internal'] as const;
export const TRACE_LAYER_LABELS: Record<(typeof TRACE_LAYERS)[number], string> = { external: 'External layer', internal: 'Internal layer' };

export const heaterTraceToolBody = z.object({
  length: toolQuantity,
  width: toolQuantity,
  /** Copper thickness, or copper weight such as "1 oz". */
  thickness: toolQuantity,
  temperature: optionalToolQuantity,
  supplyVoltage: optionalToolQuantity,
  current: optionalToolQuantity,
  temperatureRise: optionalToolQuantity,
  layer: z.enum(TRACE_LAYERS, { error: 'Choose external or internal' }),
  area: optionalToolQuantity,
});
export type HeaterTraceToolBody = z.input<typeof heaterTraceToolBody>;

export const runtimeToolBody = z.object({
  cellNominalVoltage: toolQuantity,
  cellCapacity: toolQuantity,
  series: optionalToolQuantity,
  parallel: optionalToolQuantity,
  loadPower: optionalToolQuantity,
  loadResistance: optionalToolQuantity,
  supplyVoltage: optionalToolQuantity,
  loadCurrent: optionalToolQuantity,
  efficiency: optionalToolQuantity,
  usableFraction: optionalToolQuantity,
  duty: optionalToolQuantity,
  /** Mass of one cell, for specific energy and the label check. */
  cellMass: optionalToolQuantity,
  chemistry: CHEMISTRY.schema.optional(),
});
export type RuntimeToolBody = z.input<typeof runtimeToolBody>;

/** What the server read from one typed field: the text, and the value in the stored unit. */
export const parsedToolInput = z.object({ entered: safeString(), value: z.number(), unit: safeString() });
export type ParsedToolInput = z.infer<typeof parsedToolInput>;
const parsedInputs = z.record(safeString(), parsedToolInput);

export const figureInput = z.object({ label: safeString(), value: z.union([z.number(), safeString(), z.boolean(), z.null()]), unit: safeString().optional() });

/** A figure with what it takes to show how it was computed. */
export const explainedFigure = z.object({
  key: safeString(),
  label: safeString(),
  value: z.union([z.number(), safeString()]),
  unit: safeString(),
  formula: safeString(),
  source: safeString(),
  inputs: z.array(figureInput),
  assumptions: z.array(safeString()),
  warnings: z.array(safeString()),
});
export type ExplainedFigure = z.infer<typeof explainedFigure>;

export const figuresToolResponse = z.object({
  parsed: parsedInputs,
  figures: z.array(explainedFigure),
  warnings: z.array(safeString()),
});
export type FiguresToolResponse = z.infer<typeof figuresToolResponse>;

export const toleranceReading = z.object({
  letter: safeString().nullable(),
  plus: z.number(),
  minus: z.number(),
  kind: z.enum(['percent', 'absolute']),
  text: safeString(),
  source: safeString(),
});

export const preferredValueReading = z.object({
  series: z.enum(['E6', 'E12', 'E24', 'E48', 'E96', 'E192']),
  tolerancePercent: z.number(),
  nearest: z.number(),
  deviationPercent: z.number(),
  member: z.boolean(),
});
export type PreferredValueReading = z.infer<typeof preferredValueReading>;

export const markingReading = z.object({
  component: z.enum(['resistor', 'capacitor']),
  /** The rule (code form) that gives this reading: "letter-and-digit", "eia-96", "three-digit", … */
  scheme: safeString(),
  schemeLabel: safeString(),
  /** The rule in a word or two, for a table cell ("EIA-96"). */
  schemeShortLabel: safeString(),
  /** 1 for the most likely reading of the code on this kind of part, 2 for the next. */
  rank: z.number().int(),
  /** The rule that ranks the readings when the code has more than one on this kind of part. */
  rankReason: safeString().nullable(),
  value: z.number(),
  unit: safeString(),
  formula: safeString(),
  source: safeString(),
  inputs: z.array(figureInput),
  assumptions: z.array(safeString()),
  warnings: z.array(safeString()),
  meaning: z.array(safeString()),
  tolerance: toleranceReading.nullable(),
  range: z.object({ low: z.number(), high: z.number() }).nullable(),
  temperatureCoefficientPpmPerK: z.number().nullable(),
  preferred: z.array(preferredValueReading),
});
export type MarkingReadingDto = z.infer<typeof markingReading>;

export const markingToolResponse = z.object({
  /** Every valid reading: resistor readings first, each kind of part ranked most likely first. */
  readings: z.array(markingReading),
  /** More than one reading: on a resistor and on a capacitor, or two ways on one kind of part. */
  ambiguous: z.boolean(),
  note: safeString().nullable(),
});
export type MarkingToolResponse = z.infer<typeof markingToolResponse>;
