// Bench runs: logs from an electronic load, a USB meter or a thermocouple logger, uploaded to a
// teardown with a column mapping, analysed on the server and plotted from downsampled series.
import { z } from 'zod';
import { safeString } from './common';
import { SURFACE_MATERIAL } from './domain';

const labelled = <const T extends readonly string[]>(values: T, labels: Record<T[number], string>) => ({ values, labels, schema: z.enum(values) });

export const RUN_KIND = labelled(['discharge', 'charge', 'thermal', 'power-bank'] as const, {
  discharge: 'Discharge',
  charge: 'Charge',
  thermal: 'Thermal',
  'power-bank': 'Power-bank output',
});
export type RunKind = (typeof RUN_KIND.values)[number];

/** What each kind of run is, in one line (shown beside the kind picker). */
export const RUN_KIND_HINTS: Record<RunKind, string> = {
  discharge: 'Cell or pack on an electronic load down to its cut-off: delivered Ah and Wh.',
  charge: 'Charger log (USB meter or charger output): constant-current and constant-voltage phases.',
  thermal: 'Thermocouple on a surface: peak, time to a temperature, steady state, burn-threshold margin.',
  'power-bank': 'Load on the USB output until the bank shuts off: energy out versus the energy of its cells.',
};

/** Units a column may be logged in. Time may also be a timestamp (ISO 8601, or Unix epoch in s or ms). */
export const TIME_UNIT = labelled(['s', 'ms', 'min', 'h', 'iso', 'epoch-s', 'epoch-ms'] as const, {
  s: 'seconds elapsed',
  ms: 'milliseconds elapsed',
  min: 'minutes elapsed',
  h: 'hours elapsed',
  iso: 'timestamp (ISO 8601)',
  'epoch-s': 'timestamp (Unix seconds)',
  'epoch-ms': 'timestamp (Unix milliseconds)',
});
export const VOLTAGE_UNIT = labelled(['V', 'mV'] as const, { V: 'V', mV: 'mV' });
export const CURRENT_UNIT = labelled(['A', 'mA'] as const, { A: 'A', mA: 'mA' });
export const POWER_UNIT = labelled(['W', 'mW'] as const, { W: 'W', mW: 'mW' });
export const TEMPERATURE_UNIT = labelled(['°C', '°F'] as const, { '°C': '°C', '°F': '°F' });
export type TimeUnit = (typeof TIME_UNIT.values)[number];

export const RUN_DELIMITER = labelled([',', ';', '\t', '|'] as const, { ',': 'comma', ';': 'semicolon', '\t': 'tab', '|': 'vertical bar' });
export type RunDelimiter = (typeof RUN_DELIMITER.values)[number];

/** The quantities a column can be mapped to, in the order the mapping form shows them. */
export const RUN_QUANTITIES = ['time', 'voltage', 'current', 'power', 'temperature'] as const;
export type RunQuantityName = (typeof RUN_QUANTITIES)[number];
export const RUN_QUANTITY_LABELS: Record<RunQuantityName, string> = {
  time: 'Time',
  voltage: 'Voltage',
  current: 'Current',
  power: 'Power',
  temperature: 'Temperature',
};

const columnName = safeString().trim().min(1, 'Choose a column').max(200, 'At most 200 characters');
const mapped = <U extends z.ZodType>(unit: U) => z.object({ column: columnName, unit });

/** Analysis settings a run can have; which kind reads which is in RUN_KIND_NEEDS. */
export const RUN_OPTION_KEYS = ['cutoffVolts', 'cutoffDebounceSeconds', 'cvVolts', 'terminationFraction', 'material', 'contactSeconds', 'thresholdC', 'cellEnergyWh'] as const;
export type RunOptionKey = (typeof RUN_OPTION_KEYS)[number];

/** The run options as the forms label them. */
export const RUN_OPTION_LABELS: Record<RunOptionKey, string> = {
  cutoffVolts: 'Cut-off voltage (V)',
  cutoffDebounceSeconds: 'Cut-off debounce (s)',
  cvVolts: 'Charge voltage (V)',
  terminationFraction: 'Termination (C)',
  material: 'Surface touched',
  contactSeconds: 'Contact time (s)',
  thresholdC: 'Time to a temperature (°C)',
  cellEnergyWh: 'Cell energy (Wh)',
};

/**
 * What each kind of run needs, the one list the forms show and the server checks: the columns
 * besides time (each group is one column, any of the group will do) and the analysis options the
 * kind reads, in the order the forms show them.
 */
export const RUN_KIND_NEEDS = {
  discharge: { columns: [['voltage'], ['current', 'power']], options: ['cutoffVolts', 'cutoffDebounceSeconds'] },
  charge: { columns: [['voltage'], ['current']], options: ['cvVolts', 'terminationFraction'] },
  thermal: { columns: [['temperature']], options: ['material', 'contactSeconds', 'thresholdC'] },
  'power-bank': { columns: [['voltage'], ['current', 'power']], options: ['cellEnergyWh'] },
} as const satisfies Record<RunKind, { columns: readonly (readonly RunQuantityName[])[]; options: readonly RunOptionKey[] }>;

/** The columns a kind needs, in words: "time, voltage, and current or power". */
export function runNeedsText(kind: RunKind): string {
  const items = ['time', ...RUN_KIND_NEEDS[kind].columns.map((group) => group.map((q) => RUN_QUANTITY_LABELS[q].toLowerCase()).join(' or '))];
  if (items.length === 1) return items[0]!;
  // A comma before the last item when it is a choice, so "voltage, and current or power" reads one way.
  const last = items.pop()!;
  return `${items.join(', ')}${last.includes(' or ') ? ',' : ''} and ${last}`;
}

/** Which column holds which quantity, in which unit; plus how the file is laid out. */
export const runMappingSchema = z
  .object({
    kind: RUN_KIND.schema,
    time: mapped(TIME_UNIT.schema),
    voltage: mapped(VOLTAGE_UNIT.schema).optional(),
    current: mapped(CURRENT_UNIT.schema).optional(),
    power: mapped(POWER_UNIT.schema).optional(),
    temperature: mapped(TEMPERATURE_UNIT.schema).optional(),
    /** Field separator; detected from the file when absent. */
    delimiter: RUN_DELIMITER.schema.optional(),
    /** Numbers written with a decimal comma ("3,712"); needs a delimiter other than the comma. */
    decimalComma: z.boolean().optional(),
    /** Line of the file that holds the column names (loggers often write a preamble first); default 1. */
    headerRow: z.number().int().min(1, 'At least 1').max(1000, 'At most 1000').optional(),
  })
  .superRefine((m, ctx) => {
    const kindName = RUN_KIND.labels[m.kind].toLowerCase();
    for (const group of RUN_KIND_NEEDS[m.kind].columns) {
      if (group.some((q) => m[q])) continue;
      const [first, ...others] = group;
      const message =
        others.length === 0
          ? `A ${kindName} run needs a ${RUN_QUANTITY_LABELS[first!].toLowerCase()} column`
          : `Map a ${RUN_QUANTITY_LABELS[first!].toLowerCase()} column (or a ${others.map((q) => RUN_QUANTITY_LABELS[q].toLowerCase()).join(' or ')} column)`;
      ctx.addIssue({ code: 'custom', path: [first!, 'column'], message });
    }
    const seen = new Map<string, RunQuantityName>();
    for (const q of RUN_QUANTITIES) {
      const c = m[q];
      if (!c) continue;
      const other = seen.get(c.column);
      if (other) ctx.addIssue({ code: 'custom', path: [q, 'column'], message: `"${c.column}" is already mapped to ${RUN_QUANTITY_LABELS[other].toLowerCase()}` });
      seen.set(c.column, q);
    }
    if (m.decimalComma && (m.delimiter ?? ',') === ',') {
      ctx.addIssue({ code: 'custom', path: ['decimalComma'], message: 'A decimal comma needs a delimiter other than the comma (usually a semicolon)' });
    }
  });
export type RunMapping = z.infer<typeof runMappingSchema>;

/** Analysis settings the engineer chooses; changing them re-analyses the stored series. */
export const runOptionsSchema = z.object({
  /** Discharge: end-of-discharge voltage (V). Without it the run ends where the load stops. */
  cutoffVolts: z.number().positive('Must be above 0 V').max(100, 'At most 100 V').nullable().optional(),
  /** Charge: charge (CV) voltage (V); estimated from the log when absent. */
  cvVolts: z.number().positive('Must be above 0 V').max(100, 'At most 100 V').nullable().optional(),
  /** Discharge: how long the voltage must stay at or below the cut-off to end the run (s); default the workspace setting. */
  cutoffDebounceSeconds: z.number().min(0, 'At least 0 s').max(600, 'At most 600 s').nullable().optional(),
  /** Charge: termination current in C, a fraction of the pack's rated capacity (of the CC current without a pack record); default 0.05 C. */
  terminationFraction: z.number().gt(0, 'Must be above 0 C').max(0.5, 'At most 0.5 C').nullable().optional(),
  /** Thermal: the surface material touched. */
  material: SURFACE_MATERIAL.schema.nullable().optional(),
  /** Thermal: contact time for the burn threshold (s); default the teardown's, else the workspace's. */
  contactSeconds: z.number().int('Whole seconds').min(1, 'At least 1 s').max(28800, 'At most 8 h').nullable().optional(),
  /** Thermal: a temperature whose first crossing is timed (°C). */
  thresholdC: z.number().min(-50, 'At least −50 °C').max(500, 'At most 500 °C').nullable().optional(),
  /** Power bank: energy of the cells (Wh); default from the pack record or the label. */
  cellEnergyWh: z.number().positive('Must be above 0 Wh').max(10000, 'At most 10 000 Wh').nullable().optional(),
});
export type RunOptions = z.infer<typeof runOptionsSchema>;

/**
 * The options a kind of run reads (RUN_KIND_NEEDS), each with its own rule; another kind's option is
 * refused, naming it, so a stored run says only what its analysis used. The server checks uploads and
 * changes with it.
 */
export const runOptionsFor = (kind: RunKind) =>
  runOptionsSchema.superRefine((o, ctx) => {
    const reads: readonly RunOptionKey[] = RUN_KIND_NEEDS[kind].options;
    for (const key of RUN_OPTION_KEYS) {
      if (o[key] === undefined || o[key] === null || reads.includes(key)) continue;
      const takes = reads.map((k) => RUN_OPTION_LABELS[k].replace(/ \(.*\)$/, '').toLowerCase()).join(', ');
      ctx.addIssue({ code: 'custom', path: [key], message: `${RUN_OPTION_LABELS[key]}: not a setting of a ${RUN_KIND.labels[kind].toLowerCase()} run (it takes ${takes})` });
    }
  });

/** A run option as a form has it typed: "3,0" reads as 3.0, blank clears it (null); then the option's own rule. */
const typedOption = <T extends z.ZodType<unknown, number | null | undefined>>(rule: T) =>
  z
    .union([z.number(), safeString().trim(), z.null()])
    .optional()
    .transform((v, ctx): number | null | undefined => {
      if (v === undefined || v === null || v === '') return null;
      const n = typeof v === 'number' ? v : Number(v.replace(',', '.'));
      if (!Number.isFinite(n)) {
        ctx.addIssue({ code: 'custom', message: 'Enter a number' });
        return z.NEVER;
      }
      return n;
    })
    .pipe(rule);

const runOptionsForm = z.object({
  cutoffVolts: typedOption(runOptionsSchema.shape.cutoffVolts),
  cutoffDebounceSeconds: typedOption(runOptionsSchema.shape.cutoffDebounceSeconds),
  cvVolts: typedOption(runOptionsSchema.shape.cvVolts),
  terminationFraction: typedOption(runOptionsSchema.shape.terminationFraction),
  material: z
    .union([z.literal(''), z.null(), SURFACE_MATERIAL.schema])
    .optional()
    .transform((v) => v || null),
  contactSeconds: typedOption(runOptionsSchema.shape.contactSeconds),
  thresholdC: typedOption(runOptionsSchema.shape.thresholdC),
  cellEnergyWh: typedOption(runOptionsSchema.shape.cellEnergyWh),
} satisfies Record<RunOptionKey, z.ZodType>);
export type RunOptionsFormValues = z.input<typeof runOptionsForm>;

/** The options form of a kind of run: its options as typed (blank = not set), the others left out. */
export const runOptionsFormSchema = (kind: RunKind): z.ZodType<RunOptions, RunOptionsFormValues> =>
  runOptionsForm.pick(Object.fromEntries(RUN_KIND_NEEDS[kind].options.map((k) => [k, true])) as Record<RunOptionKey, true>);

const columnChoice = z.object({ column: safeString(), unit: safeString() });

/**
 * The column mapping as the upload form holds it: every quantity with a column ('' = not logged) and a
 * unit, the header row typed; it becomes `runMappingSchema`, whose messages name the form's fields.
 */
export const runMappingFormSchema = z
  .object({
    kind: RUN_KIND.schema,
    time: columnChoice,
    voltage: columnChoice,
    current: columnChoice,
    power: columnChoice,
    temperature: columnChoice,
    delimiter: RUN_DELIMITER.schema,
    decimalComma: z.boolean(),
    headerRow: z.union([safeString(), z.number()]),
  })
  .transform((m, ctx) => {
    const out: Record<string, unknown> = { kind: m.kind, time: m.time, delimiter: m.delimiter, decimalComma: m.decimalComma };
    for (const q of RUN_QUANTITIES) if (q !== 'time' && m[q].column !== '') out[q] = m[q];
    const row = typeof m.headerRow === 'number' ? m.headerRow : m.headerRow.trim() === '' ? 1 : Number(m.headerRow.trim());
    if (!Number.isInteger(row)) ctx.addIssue({ code: 'custom', path: ['headerRow'], message: 'Enter a whole number, such as 1' });
    else out.headerRow = row;
    return out;
  })
  .pipe(runMappingSchema);
export type RunMappingFormValues = z.input<typeof runMappingFormSchema>;

/** The upload form (the multipart fields `label`, `mapping`, `options`): field names as the server names its errors. */
export const runUploadFormSchema = (kind: RunKind) =>
  z.object({
    label: safeString()
      .transform((s) => s.trim() || undefined)
      .pipe(runLabel.optional()),
    mapping: runMappingFormSchema,
    options: runOptionsFormSchema(kind),
  });
export type RunUploadFormValues = z.input<ReturnType<typeof runUploadFormSchema>>;
export type RunUploadForm = z.output<ReturnType<typeof runUploadFormSchema>>;

export const runLabel = safeString().trim().min(1, 'Required').max(160, 'At most 160 characters');

export const updateRunBody = z
  .object({ label: runLabel.optional(), options: runOptionsSchema.optional() })
  .refine((b) => b.label !== undefined || b.options !== undefined, { message: 'Change the label or the options' });
export type UpdateRunBody = z.infer<typeof updateRunBody>;

/** A run's settings form: its label and the options of its kind (PATCH /api/runs/:id). */
export const runEditFormSchema = (kind: RunKind) => z.object({ label: runLabel, options: runOptionsFormSchema(kind) });
export type RunEditFormValues = z.input<ReturnType<typeof runEditFormSchema>>;

const cutoffSchema = z.object({ index: z.number().int(), t: z.number(), volts: z.number(), reason: z.enum(['cutoff-voltage', 'current-stopped', 'end-of-run']) });

/** Results of the analysis. Totals are at the top; each kind adds its own block. */
export const runAnalysisSchema = z.object({
  /** Delivered (or taken-in) charge, Ah; null when the log has no current or power with voltage. */
  ampHours: z.number().nullable(),
  wattHours: z.number().nullable(),
  durationS: z.number(),
  /** Charge-weighted mean voltage Wh/Ah, V. */
  averageVolts: z.number().nullable(),
  endVolts: z.number().nullable(),
  samples: z.number().int(),
  discharge: z
    .object({
      cutoffVolts: z.number().nullable(),
      cutoff: cutoffSchema.nullable(),
      minVolts: z.number(),
      timeAverageVolts: z.number(),
      averageCurrentA: z.number(),
      averagePowerW: z.number(),
      /** Time up to which the totals run, s. */
      analysedToS: z.number(),
      /** How long the voltage had to stay at or below the cut-off, and whether the run or the workspace set it. Absent on runs analysed before it existed. */
      cutoffDebounce: z.object({ seconds: z.number(), source: z.enum(['run', 'workspace']) }).optional(),
      /** Sags below the cut-off shorter than the debounce, which did not end the run. */
      ignoredDips: z.object({ count: z.number().int(), firstAtS: z.number(), longestS: z.number() }).nullable().optional(),
      /** ∫V² dt / duration over the analysed part, V²: a fixed resistance R takes mean(V²)/R on average. */
      meanSquareVolts: z.number().optional(),
      /** DC internal resistance from the first current pulse of the log (at the pack terminals): R = (U₁ − U₂) / (I₂ − I₁). */
      internalResistance: z
        .object({
          ohms: z.number(),
          lowAmps: z.number(),
          lowVolts: z.number(),
          highAmps: z.number(),
          highVolts: z.number(),
          /** First sample at the high current, s. */
          atSeconds: z.number(),
          /** Sample U₂ is read at, s. */
          readAtSeconds: z.number(),
        })
        .nullable()
        .optional(),
    })
    .optional(),
  charge: z
    .object({
      cc: z.object({ startS: z.number(), endS: z.number(), currentA: z.number() }),
      cv: z.object({ startS: z.number(), endS: z.number(), volts: z.number() }).nullable(),
      transitionS: z.number().nullable(),
      terminationCurrentA: z.number(),
      /** Termination in C of the rated capacity (or, without one, the fraction of the CC current). */
      terminationFraction: z.number(),
      /** What the fraction multiplied, in words and numbers. Absent on runs analysed before it existed. */
      termination: z.object({ basis: z.enum(['rated-capacity', 'cc-current']), ratedAh: z.number().nullable(), description: safeString() }).optional(),
      terminated: z.boolean(),
      chargeTimeS: z.number(),
      plateauVolts: z.number(),
    })
    .optional(),
  thermal: z
    .object({
      startC: z.number(),
      maxC: z.number(),
      maxAtS: z.number(),
      thresholdC: z.number().nullable(),
      timeToThresholdS: z.number().nullable(),
      steadyState: z.object({
        reached: z.boolean(),
        temperatureC: z.number().nullable(),
        fromS: z.number().nullable(),
        toS: z.number().nullable(),
        criterion: safeString(),
      }),
      burnThreshold: z.object({ temperatureC: z.number(), material: SURFACE_MATERIAL.schema, contactSeconds: z.number(), listedSeconds: z.number(), source: safeString() }),
      /** Burn threshold − peak surface temperature, °C; below zero the surface got hot enough to burn for that contact. */
      marginC: z.number(),
      timeToBurnThresholdS: z.number().nullable(),
    })
    .optional(),
  powerBank: z
    .object({
      ampHoursAt5V: z.number(),
      cellEnergyWh: z.number(),
      cellEnergySource: safeString(),
      efficiency: z.number(),
    })
    .optional(),
  /** Assumptions the analysis made, in words. */
  notes: z.array(safeString()),
  warnings: z.array(safeString()),
});
export type RunAnalysis = z.infer<typeof runAnalysisSchema>;

/** Measured against what the label (and the cell ratings) claim; computed at read time with the current settings. */
export const runComparisonSchema = z.object({
  warnBelowPercent: z.number(),
  /**
   * Measured against the label in Wh: the label's Wh, else its Ah × the cell nominal voltage (labels
   * quote mAh at the cell voltage whatever the series count); the measured Wh at the pack terminals.
   */
  label: z
    .object({
      claimedAh: z.number().nullable(),
      measuredAh: z.number(),
      claimedWh: z.number(),
      measuredWh: z.number(),
      labelBasis: z.enum(['label-wh', 'label-ah-at-cell-volts']),
      measuredBasis: z.enum(['measured-wh', 'measured-ah-at-pack-volts']),
      /** The comparison's basis in words. */
      basis: safeString(),
      percent: z.number(),
      warning: z.boolean(),
    })
    .nullable(),
  rated: z.object({ ratedAh: z.number(), measuredAh: z.number(), percent: z.number(), warning: z.boolean(), basis: safeString() }).nullable(),
  labelEnergy: z.object({ claimedWh: z.number(), measuredWh: z.number(), percent: z.number(), warning: z.boolean(), basis: safeString() }).nullable(),
});
export type RunComparison = z.infer<typeof runComparisonSchema>;

export const runColumnsSchema = z.object({ v: z.boolean(), i: z.boolean(), p: z.boolean(), temp: z.boolean() });

export const runSchema = z.object({
  id: z.number().int(),
  teardownId: z.number().int(),
  device: z.object({ id: z.number().int(), maker: safeString(), model: safeString() }),
  unitLabel: safeString().nullable(),
  teardownStatus: safeString(),
  kind: RUN_KIND.schema,
  label: safeString(),
  fileName: safeString(),
  fileBytes: z.number().int(),
  mapping: z.record(safeString(), z.unknown()),
  samples: z.number().int(),
  durationS: z.number(),
  columns: runColumnsSchema,
  options: runOptionsSchema,
  analysis: runAnalysisSchema,
  comparison: runComparisonSchema,
  createdBy: z.object({ id: z.number().int(), name: safeString() }).nullable(),
  createdAt: safeString(),
  updatedAt: safeString(),
});
export type RunDto = z.infer<typeof runSchema>;
export const runResponse = z.object({ run: runSchema });
export const runListResponse = z.object({ runs: z.array(runSchema) });

export const runListQuery = z.object({
  kind: RUN_KIND.schema.optional(),
  /** Words to find in the device, unit or run label. */
  q: safeString().trim().max(100, 'At most 100 characters').optional(),
});

export const MAX_SERIES_POINTS = 5000;
export const DEFAULT_SERIES_POINTS = 2000;

export const runSeriesQuery = z
  .object({
    maxPoints: z.coerce.number().int('A whole number').min(10, 'At least 10').max(MAX_SERIES_POINTS, `At most ${MAX_SERIES_POINTS}`).default(DEFAULT_SERIES_POINTS),
    from: z.coerce.number().min(0, 'At least 0 s').optional(),
    to: z.coerce.number().min(0, 'At least 0 s').optional(),
  })
  .refine((q) => q.from === undefined || q.to === undefined || q.to > q.from, { path: ['to'], message: 'Must be later than from' });
export type RunSeriesQuery = z.infer<typeof runSeriesQuery>;

/** The chart's window form: a start and a later end as typed ("1,5" reads as 1.5), in the unit of the time axis. */
export const seriesWindowFormSchema = z.object({ from: safeString(), to: safeString() }).transform((w, ctx) => {
  const read = (s: string) => (s.trim() === '' ? Number.NaN : Number(s.trim().replace(',', '.')));
  const from = read(w.from);
  const to = read(w.to);
  if (!Number.isFinite(from) || !Number.isFinite(to) || from < 0 || to <= from) {
    ctx.addIssue({ code: 'custom', path: ['to'], message: 'Give a start and a later end' });
    return z.NEVER;
  }
  return { from, to };
});
export type SeriesWindowFormValues = z.input<typeof seriesWindowFormSchema>;
export type SeriesWindowForm = z.output<typeof seriesWindowFormSchema>;

const trace = z.object({ t: z.array(z.number()), y: z.array(z.number()) });
export const runSeriesResponse = z.object({
  runId: z.number().int(),
  kind: RUN_KIND.schema,
  /** The whole run, s. */
  range: z.object({ fromS: z.number(), toS: z.number() }),
  /** The window returned, s. */
  window: z.object({ fromS: z.number(), toS: z.number() }),
  /** Samples in the window on the server; each trace has at most maxPoints of them (LTTB). */
  samplesInWindow: z.number().int(),
  maxPoints: z.number().int(),
  traces: z.object({ v: trace.optional(), i: trace.optional(), p: trace.optional(), temp: trace.optional() }),
  units: z.object({ t: z.literal('s'), v: z.literal('V'), i: z.literal('A'), p: z.literal('W'), temp: z.literal('°C') }),
});
export type RunSeries = z.infer<typeof runSeriesResponse>;

export const runPreviewResponse = z.object({
  delimiter: RUN_DELIMITER.schema,
  decimalComma: z.boolean(),
  headerRow: z.number().int(),
  columns: z.array(safeString()),
  /** The first data rows (at most 20), as text. */
  rows: z.array(z.array(safeString())),
  /** A first guess at the mapping, for the user to check. */
  guess: z.object({
    kind: RUN_KIND.schema,
    time: mapped(TIME_UNIT.schema).optional(),
    voltage: mapped(VOLTAGE_UNIT.schema).optional(),
    current: mapped(CURRENT_UNIT.schema).optional(),
    power: mapped(POWER_UNIT.schema).optional(),
    temperature: mapped(TEMPERATURE_UNIT.schema).optional(),
  }),
});
export type RunPreview = z.infer<typeof runPreviewResponse>;

/** Bytes of the start of a file the preview needs; the web app sends only this much. */
export const RUN_PREVIEW_BYTES = 64 * 1024;
