// Power system of a teardown: the pack (one per teardown), loads and converters.
// Numeric inputs take a number in SI or text with a unit ("2700 mAh", "3.65V", "3R0", "60 %"); the
// server stores SI and keeps the typed text in `entered`, keyed by the field name.
import { z } from 'zod';
import { patchOf, safeString } from './common';
import { CHEMISTRY, CONNECTION, CONVERTER_ROLE, CONVERTER_TOPOLOGY, ELEMENT_MATERIAL, JOINING, LOAD_KIND, SURFACE_MATERIAL } from './domain';

/** A number (SI) or text with a unit. Blank or null clears an optional value. */
/** A number in SI or a value with its unit ("2700 mAh"), parsed by the server. */
const powerQuantity = z.union([z.number(), safeString().trim().max(40, 'At most 40 characters')], {
  error: (issue) => (issue.input === undefined ? 'Required' : 'Enter a number or a value with its unit'),
});
const required = powerQuantity;
const optional = powerQuantity.nullable().optional();

const choice = <T extends readonly [string, ...string[]]>(values: T) => z.enum(values, { error: `Choose one of: ${values.join(', ')}` });

const label = (max: number) =>
  safeString()
    .trim()
    .max(max, `At most ${max} characters`)
    .nullable()
    .optional()
    .transform((v) => (v === '' ? null : v));

// ---- pack ----

export const packBody = z.object({
  chemistry: choice(CHEMISTRY.values),
  /** "18650", "pouch 503450"… */
  cellFormat: label(60),
  /** Cell nominal voltage. */
  nominalVolts: required,
  /** Cell charge (maximum) voltage. */
  maxVolts: optional,
  /** Rated capacity of one cell. */
  capacityAh: required,
  /** Measured capacity of one cell. */
  measuredCapacityAh: optional,
  series: powerQuantity.default(1),
  parallel: powerQuantity.default(1),
  /** Mass of the whole pack. */
  massKg: optional,
  protection: z.boolean({ error: 'Yes or no' }).default(false),
  joining: choice(JOINING.values).nullable().optional(),
  /** DC internal resistance of one cell ("50 mΩ"). */
  internalResistanceOhms: optional,
  /**
   * Or two readings of the DC method (IEC 61960-3): the cell voltage at a low and at a high current;
   * the server works out (U₁ − U₂) / (I₂ − I₁). Given, it replaces internalResistanceOhms.
   */
  internalResistanceReadings: z.object({ lowAmps: required, lowVolts: required, highAmps: required, highVolts: required }).nullable().optional(),
});
export type PackBody = z.input<typeof packBody>;

export const packSchema = z.object({
  id: z.number().int(),
  teardownId: z.number().int(),
  chemistry: choice(CHEMISTRY.values),
  cellFormat: safeString().nullable(),
  nominalVolts: z.number(),
  maxVolts: z.number().nullable(),
  capacityAh: z.number(),
  measuredCapacityAh: z.number().nullable(),
  series: z.number().int(),
  parallel: z.number().int(),
  massKg: z.number().nullable(),
  protection: z.boolean(),
  joining: choice(JOINING.values).nullable(),
  /** DC internal resistance of one cell (Ω). */
  internalResistanceOhms: z.number().nullable(),
  /** The two readings it was worked out from, when it was (SI). */
  internalResistanceReadings: z.object({ lowAmps: z.number(), lowVolts: z.number(), highAmps: z.number(), highVolts: z.number() }).nullable(),
  /** What the user typed, by field ("capacityAh": "2700 mAh"). */
  entered: z.record(safeString(), safeString()),
  /** A lithium chemistry: the section shows the lithium cautions. */
  lithium: z.boolean(),
  updatedAt: safeString(),
});
export type PackDto = z.infer<typeof packSchema>;
export const packResponse = z.object({ pack: packSchema.nullable() });

export const LITHIUM_CHEMISTRIES: readonly string[] = ['li-ion', 'li-po', 'lifepo4', 'lto'];

// ---- converters ----

const converterFields = {
  label: label(120),
  topology: choice(CONVERTER_TOPOLOGY.values),
  role: choice(CONVERTER_ROLE.values),
  inputVolts: required,
  outputVolts: required,
  ratedCurrentAmps: optional,
  /** For a charge converter: the constant-current phase current into the pack. */
  chargeCurrentAmps: optional,
  /** 0..1, or "88 %". Absent: the figures assume 0.90 and say so. */
  efficiency: optional,
  efficiencySource: choice(['measured', 'assumed'] as const),
};
export const createConverterBody = z.object({
  ...converterFields,
  role: converterFields.role.default('load'),
  efficiencySource: converterFields.efficiencySource.default('assumed'),
});
export type CreateConverterBody = z.input<typeof createConverterBody>;
export const updateConverterBody = patchOf(converterFields);
export type UpdateConverterBody = z.input<typeof updateConverterBody>;

export const converterSchema = z.object({
  id: z.number().int(),
  teardownId: z.number().int(),
  label: safeString(),
  topology: choice(CONVERTER_TOPOLOGY.values),
  role: choice(CONVERTER_ROLE.values),
  inputVolts: z.number(),
  outputVolts: z.number(),
  ratedCurrentAmps: z.number().nullable(),
  chargeCurrentAmps: z.number().nullable(),
  efficiency: z.number().nullable(),
  efficiencySource: z.enum(['measured', 'assumed']),
  entered: z.record(safeString(), safeString()),
  createdAt: safeString(),
});
export type ConverterDto = z.infer<typeof converterSchema>;
export const converterResponse = z.object({ converter: converterSchema });
export const convertersResponse = z.object({ converters: z.array(converterSchema) });

// ---- loads ----

const loadFields = {
  kind: choice(LOAD_KIND.values),
  label: label(120),
  /** Per element. */
  resistanceOhms: optional,
  /** Per element. */
  currentAmps: optional,
  /** Per element. */
  powerWatts: optional,
  /** Voltage across the load; absent: the converter's output or the pack's nominal voltage. */
  supplyVolts: optional,
  count: powerQuantity,
  connection: choice(CONNECTION.values),
  /** PWM duty 0..1, or "60 %". */
  duty: powerQuantity,
  /** The converter the load is fed through (same teardown); null: straight from the pack. */
  converterId: z.number({ error: 'Choose a converter of this teardown' }).int().positive().nullable().optional(),
  /** Area that sheds the heat. */
  heatedAreaM2: optional,
  surfaceMaterial: choice(SURFACE_MATERIAL.values).nullable().optional(),
  /** Copper elements get their resistance at operating temperature. */
  elementMaterial: choice(ELEMENT_MATERIAL.values).nullable().optional(),
  /** Mass that heats with the element (pad, plate, shell), for the thermal time constant. */
  heatedMassKg: optional,
};
export const createLoadBody = z.object({
  ...loadFields,
  count: loadFields.count.default(1),
  connection: loadFields.connection.default('parallel'),
  duty: loadFields.duty.default(1),
});
export type CreateLoadBody = z.input<typeof createLoadBody>;
export const updateLoadBody = patchOf(loadFields);
export type UpdateLoadBody = z.input<typeof updateLoadBody>;

export const loadSchema = z.object({
  id: z.number().int(),
  teardownId: z.number().int(),
  kind: choice(LOAD_KIND.values),
  label: safeString(),
  resistanceOhms: z.number().nullable(),
  currentAmps: z.number().nullable(),
  powerWatts: z.number().nullable(),
  supplyVolts: z.number().nullable(),
  count: z.number().int(),
  connection: choice(CONNECTION.values),
  duty: z.number(),
  converterId: z.number().int().nullable(),
  heatedAreaM2: z.number().nullable(),
  surfaceMaterial: choice(SURFACE_MATERIAL.values).nullable(),
  elementMaterial: choice(ELEMENT_MATERIAL.values).nullable(),
  heatedMassKg: z.number().nullable(),
  entered: z.record(safeString(), safeString()),
  createdAt: safeString(),
});
export type LoadDto = z.infer<typeof loadSchema>;
export const loadResponse = z.object({ load: loadSchema });
export const loadsResponse = z.object({ loads: z.array(loadSchema) });

// ---- operating modes ----

const modeFields = {
  name: safeString({ error: 'Required' }).trim().min(1, 'Give the mode a name').max(80, 'At most 80 characters'),
  note: label(300),
  /** The loads active in the mode, each at its PWM duty in it (0..1 or "60 %"). */
  loads: z
    .array(
      z.object({
        loadId: z.number({ error: 'Choose a load of this teardown' }).int().positive('Choose a load of this teardown'),
        duty: powerQuantity.default(1),
      }),
      { error: 'A list of loads' },
    )
    .max(50, 'At most 50 loads'),
  /** Current the electronics draw in the mode besides the loads ("20 µA"): standby is a mode with no loads and this. */
  quiescentAmps: optional,
};
export const createModeBody = z.object({ ...modeFields, loads: modeFields.loads.default([]) });
export type CreateModeBody = z.input<typeof createModeBody>;
export const updateModeBody = patchOf(modeFields);
export type UpdateModeBody = z.input<typeof updateModeBody>;

export const modeSchema = z.object({
  id: z.number().int(),
  teardownId: z.number().int(),
  name: safeString(),
  note: safeString().nullable(),
  position: z.number().int(),
  loads: z.array(z.object({ loadId: z.number().int(), duty: z.number() })),
  quiescentAmps: z.number().nullable(),
  entered: z.record(safeString(), safeString()),
  createdAt: safeString(),
});
export type ModeDto = z.infer<typeof modeSchema>;
export const modeResponse = z.object({ mode: modeSchema });
export const modesResponse = z.object({ modes: z.array(modeSchema) });

// ---- forms: the power cards' fields as typed (react-hook-form + zodResolver) ----
// A form checks what is required and the text's shape; the server is the one reader of quantities
// (its units, ranges and messages). The output of each form schema is the request body.

/** A quantity as typed ("2700 mAh"), sent as text for the server to read. */
const typedText = safeString().trim().max(40, 'At most 40 characters');
const typedRequired = typedText.min(1, 'Required');
const typedOptional = typedText.transform((v) => (v === '' ? null : v));
const typedOr = (blank: string) => typedText.transform((v) => (v === '' ? blank : v));
/** A select with a "not recorded" option (''). */
const optionalChoice = <T extends readonly [string, ...string[]]>(values: T) => z.union([z.literal(''), choice(values)]).transform((v) => (v === '' ? null : v));

const READING_KEYS = ['lowAmps', 'lowVolts', 'highAmps', 'highVolts'] as const;

export const packFormSchema = z.object({
  chemistry: packBody.shape.chemistry,
  cellFormat: packBody.shape.cellFormat,
  joining: optionalChoice(JOINING.values),
  protection: z.boolean(),
  nominalVolts: typedRequired,
  maxVolts: typedOptional,
  capacityAh: typedRequired,
  measuredCapacityAh: typedOptional,
  series: typedOr('1'),
  parallel: typedOr('1'),
  massKg: typedOptional,
  internalResistanceOhms: typedOptional,
  /** All four readings of the DC method, or none. */
  internalResistanceReadings: z
    .object({ lowAmps: typedText, lowVolts: typedText, highAmps: typedText, highVolts: typedText })
    .superRefine((r, ctx) => {
      if (READING_KEYS.every((k) => r[k] === '')) return;
      for (const k of READING_KEYS) if (r[k] === '') ctx.addIssue({ code: 'custom', path: [k], message: 'Required: give all four readings, or none' });
    })
    .transform((r) => (READING_KEYS.every((k) => r[k] === '') ? null : r)),
});
export type PackFormValues = z.input<typeof packFormSchema>;
export type PackForm = z.output<typeof packFormSchema>;

export const loadFormSchema = z.object({
  kind: loadFields.kind,
  label: loadFields.label,
  connection: loadFields.connection,
  /** The converter's id as the select gives it; '' is straight from the pack. */
  converterId: safeString().transform((v) => (v === '' ? null : Number(v))),
  surfaceMaterial: optionalChoice(SURFACE_MATERIAL.values),
  elementMaterial: optionalChoice(ELEMENT_MATERIAL.values),
  resistanceOhms: typedOptional,
  currentAmps: typedOptional,
  powerWatts: typedOptional,
  supplyVolts: typedOptional,
  count: typedOr('1'),
  duty: typedOr('100 %'),
  heatedAreaM2: typedOptional,
  heatedMassKg: typedOptional,
});
export type LoadFormValues = z.input<typeof loadFormSchema>;
export type LoadForm = z.output<typeof loadFormSchema>;

export const converterFormSchema = z.object({
  label: converterFields.label,
  topology: converterFields.topology,
  role: converterFields.role,
  efficiencySource: converterFields.efficiencySource,
  inputVolts: typedRequired,
  outputVolts: typedRequired,
  ratedCurrentAmps: typedOptional,
  chargeCurrentAmps: typedOptional,
  efficiency: typedOptional,
});
export type ConverterFormValues = z.input<typeof converterFormSchema>;
export type ConverterForm = z.output<typeof converterFormSchema>;

export const dutyForTargetQuery = z.object({
  /** Target surface temperature ("45 °C" or 45). */
  target: safeString().trim().min(1, 'Required').max(40, 'At most 40 characters').default('45 °C'),
});

export const powerSystemResponse = z.object({
  pack: packSchema.nullable(),
  loads: z.array(loadSchema),
  converters: z.array(converterSchema),
  modes: z.array(modeSchema),
});
export type PowerSystemDto = z.infer<typeof powerSystemResponse>;

export const childIdParams = z.object({
  id: z.coerce.number().int().positive('Must be a positive whole number'),
  childId: z.coerce.number().int().positive('Must be a positive whole number'),
});
