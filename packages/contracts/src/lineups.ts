// Lineups: a named set of devices compared side by side in one reporting currency, with metric
// weights for a ranking. Every figure of the comparison is computed on the server.
import { z } from 'zod';
import { optionalText, text, safeString } from './common';
import { DEVICE_CATEGORY, TEARDOWN_STATUS } from './domain';
import { clearableText } from './inputs';
import { currencyCode } from './settings';

/**
 * The metrics of a lineup comparison, in table order. The same keys as calc's METRICS (the API
 * test checks that they agree); labels, units and directions come from the API.
 */
export const LINEUP_METRIC_KEYS = [
  'retailPrice',
  'packWh',
  'capacityVsLabel',
  'runtimeH',
  'whPerCurrency',
  'whPerKg',
  'heaterWPerCm2',
  'shouldCost',
  'impliedMargin',
  'findingsCritical',
  'findingsMajor',
  'findingsMinor',
  'findingsNote',
] as const;
export type LineupMetricKey = (typeof LINEUP_METRIC_KEYS)[number];
export const lineupMetricKey = z.enum(LINEUP_METRIC_KEYS, { error: `Use one of ${LINEUP_METRIC_KEYS.join(', ')}` });

export const LINEUP_STATUS = {
  values: ['draft', 'published'] as const,
  labels: { draft: 'Draft', published: 'Published' } as Record<'draft' | 'published', string>,
};
export type LineupStatus = (typeof LINEUP_STATUS.values)[number];
export const lineupStatus = z.enum(LINEUP_STATUS.values, { error: 'Use draft or published' });

/** Weights run from 0 (left out of the ranking) to this. */
export const LINEUP_WEIGHT_MAX = 10;
/** A lineup compares at least this many devices, and at most LINEUP_MAX_DEVICES. */
export const LINEUP_MIN_DEVICES = 2;
export const LINEUP_MAX_DEVICES = 30;

/** Weights of a new lineup when none are given: energy for the money, honest labels, few serious findings. */
export const DEFAULT_LINEUP_WEIGHTS: Record<LineupMetricKey, number> = {
  retailPrice: 1,
  packWh: 1,
  capacityVsLabel: 2,
  runtimeH: 1,
  whPerCurrency: 3,
  whPerKg: 1,
  heaterWPerCm2: 0,
  shouldCost: 0,
  impliedMargin: 0,
  findingsCritical: 2,
  findingsMajor: 1,
  findingsMinor: 0,
  findingsNote: 0,
};

const KEYS = new Set<string>(LINEUP_METRIC_KEYS);

/** Metric → weight 0..10; a metric left out weighs 0; at least one weight above 0. */
export const lineupWeights = z
  .record(safeString(), z.number({ error: 'Enter a number from 0 to 10' }).min(0, 'At least 0').max(LINEUP_WEIGHT_MAX, `At most ${LINEUP_WEIGHT_MAX}`))
  .superRefine((w, ctx) => {
    for (const key of Object.keys(w)) {
      if (!KEYS.has(key)) ctx.addIssue({ code: 'custom', path: [key], message: `Unknown metric; use one of ${LINEUP_METRIC_KEYS.join(', ')}` });
    }
    if (!Object.values(w).some((v) => v > 0)) ctx.addIssue({ code: 'custom', path: [], message: 'Give at least one metric a weight above zero' });
  });
export type LineupWeights = z.infer<typeof lineupWeights>;

const deviceIds = z
  .array(z.number({ error: 'A device id is a whole number' }).int('A device id is a whole number').positive('A device id is a whole number'), {
    error: 'Pick the devices to compare',
  })
  .min(LINEUP_MIN_DEVICES, `Pick at least ${LINEUP_MIN_DEVICES} devices to compare`)
  .max(LINEUP_MAX_DEVICES, `At most ${LINEUP_MAX_DEVICES} devices in one lineup`)
  .superRefine((ids, ctx) => {
    const seen = new Set<number>();
    ids.forEach((id, k) => {
      if (seen.has(id)) ctx.addIssue({ code: 'custom', path: [k], message: `Device ${id} is already in the lineup` });
      seen.add(id);
    });
  });

/** Which operating mode of each device the lineup compares (its runtime comes from that mode). */
export const LINEUP_MODE_RULE = {
  values: ['highest', 'lowest', 'power-bank', 'named'] as const,
  labels: {
    highest: 'Most power at the main load (e.g. highest heat)',
    lowest: 'Least power at the main load, still on',
    'power-bank': 'Power-bank output',
    named: 'A mode by name',
  },
} as const;
export const lineupModeChoice = z
  .object({
    rule: z.enum(LINEUP_MODE_RULE.values, { error: `Choose one of: ${LINEUP_MODE_RULE.values.join(', ')}` }),
    name: safeString().trim().max(80, 'At most 80 characters').optional(),
  })
  .refine((m) => m.rule !== 'named' || (m.name ?? '') !== '', { path: ['name'], message: 'Give the mode name to compare' });
export type LineupModeChoice = z.infer<typeof lineupModeChoice>;
export const DEFAULT_LINEUP_MODE: LineupModeChoice = { rule: 'highest' };

/** POST /api/lineups. Currency defaults to the workspace reporting currency, weights to DEFAULT_LINEUP_WEIGHTS. */
export const createLineupBody = z.object({
  name: text(160),
  description: optionalText(2000),
  deviceIds,
  currency: currencyCode.optional(),
  weights: lineupWeights.optional(),
  mode: lineupModeChoice.optional(),
});
export type CreateLineupBody = z.infer<typeof createLineupBody>;

/** PATCH /api/lineups/:id: any subset; deviceIds replaces the set (in the order given); status needs a lead or admin. */
export const updateLineupBody = z
  .object({
    name: text(160).optional(),
    description: clearableText(2000),
    deviceIds: deviceIds.optional(),
    currency: currencyCode.optional(),
    weights: lineupWeights.optional(),
    mode: lineupModeChoice.optional(),
    status: lineupStatus.optional(),
    /** The version the edit started from: a stale one gets 409 stale_version. */
    version: z.number({ error: 'Send the version you edited' }).int().positive().optional(),
  })
  .refine((b) => Object.entries(b).some(([k, v]) => k !== 'version' && v !== undefined), { message: 'Change at least one field' });
export type UpdateLineupBody = z.infer<typeof updateLineupBody>;
/** What a client sends to PATCH a lineup. */
export type UpdateLineupInput = z.input<typeof updateLineupBody>;

export const lineupListQuery = z.object({ status: lineupStatus.optional() });
/** GET /api/lineups/metrics: the catalogue with money metrics in this currency (default: the reporting currency). */
export const lineupMetricsQuery = z.object({ currency: currencyCode.optional() });

/** Axes of the scatter chart. Defaults: retail price against pack energy. */
export const comparisonQuery = z
  .object({ x: lineupMetricKey.optional(), y: lineupMetricKey.optional() })
  .refine((q) => !q.x || !q.y || q.x !== q.y, { path: ['y'], message: 'Pick two different metrics for the axes' });
export type ComparisonQuery = z.infer<typeof comparisonQuery>;

/** POST /api/lineups/:id/comparison: the ranking with these weights, without saving them. */
export const comparisonPreviewBody = z
  .object({ weights: lineupWeights, mode: lineupModeChoice.optional(), x: lineupMetricKey.optional(), y: lineupMetricKey.optional() })
  .refine((q) => !q.x || !q.y || q.x !== q.y, { path: ['y'], message: 'Pick two different metrics for the axes' });
export type ComparisonPreviewBody = z.infer<typeof comparisonPreviewBody>;

export const lineupDeviceSchema = z.object({
  id: z.number().int(),
  maker: safeString(),
  model: safeString(),
  category: DEVICE_CATEGORY.schema,
  position: z.number().int(),
});
export type LineupDeviceDto = z.infer<typeof lineupDeviceSchema>;

export const lineupSchema = z.object({
  id: z.number().int(),
  name: safeString(),
  description: safeString().nullable(),
  currency: safeString(),
  weights: z.record(safeString(), z.number()),
  mode: lineupModeChoice,
  status: lineupStatus,
  devices: z.array(lineupDeviceSchema),
  /** Devices of the lineup the caller cannot see (a viewer: devices without a published teardown). */
  hiddenDevices: z.number().int(),
  createdBy: z.object({ id: z.number().int(), name: safeString() }).nullable(),
  createdAt: safeString(),
  updatedAt: safeString(),
  publishedAt: safeString().nullable(),
  publishedBy: safeString().nullable(),
  version: z.number().int(),
  permissions: z.object({ edit: z.boolean(), publish: z.boolean(), delete: z.boolean() }),
});
export type LineupDto = z.infer<typeof lineupSchema>;
export const lineupResponse = z.object({ lineup: lineupSchema });
export const lineupsResponse = z.object({ lineups: z.array(lineupSchema), canCreate: z.boolean() });

/** How the web app shows a metric's values. */
export const METRIC_FORMAT = ['money', 'percent', 'quantity', 'count'] as const;

export const comparisonMetricSchema = z.object({
  key: lineupMetricKey,
  label: safeString(),
  /** A short label for narrow places (table headers, axis pickers). */
  short: safeString(),
  /** Unit as shown (the lineup currency for money, '%' for fractions shown as percentages, 'Wh/USD'…). */
  unit: safeString(),
  better: z.enum(['high', 'low']),
  format: z.enum(METRIC_FORMAT),
  description: safeString(),
  /** Formula and the label of its source (REFERENCES.md labels). */
  formula: safeString(),
  source: safeString(),
  /** False when the metric applies to no device of the lineup (heater power density in a lineup without heaters). */
  applies: z.boolean(),
});
export type ComparisonMetricDto = z.infer<typeof comparisonMetricSchema>;
export const lineupMetricsResponse = z.object({ metrics: z.array(comparisonMetricSchema), defaults: z.record(safeString(), z.number()), weightMax: z.number() });

const metricValues = z.record(safeString(), z.number().nullable());

export const comparisonRowSchema = z.object({
  deviceId: z.number().int(),
  device: z.object({ maker: safeString(), model: safeString(), category: DEVICE_CATEGORY.schema, label: safeString() }),
  /** The teardown whose figures the row uses: the device's latest the caller can see. */
  teardown: z.object({ id: z.number().int(), date: safeString(), unitLabel: safeString().nullable(), status: TEARDOWN_STATUS.schema }).nullable(),
  metrics: metricValues,
  /** Why a metric is missing (null), per metric key. */
  missing: z.record(safeString(), safeString()),
  /** Where each present value comes from, per metric key. */
  sources: z.record(safeString(), safeString()),
  /** Weighted score 0..100 (null: none of the weighted metrics is known). */
  score: z.number().nullable(),
  rank: z.number().int(),
  /** How much of the ranking the score rests on: weighted metrics known for this device, of those weighted, and their share of the total weight. */
  coverage: z.object({ known: z.number().int(), weighted: z.number().int(), weightShare: z.number() }),
  /** Min-max normalised value 0..1 (1 = best in the lineup) of each weighted metric the row has. */
  normalised: z.record(safeString(), z.number()),
  /** Retail price as seen, before conversion. */
  retail: z.object({ amount: z.number(), currency: safeString(), seenOn: safeString().nullable(), rate: z.number().nullable() }).nullable(),
  /** The operating mode the row's runtime comes from; null when the teardown records no modes (main load at its own duty). */
  mode: z.object({ id: z.number().int(), name: safeString(), reason: safeString() }).nullable(),
  /** False when the row lacks a weighted metric: it ranks after the rows that have them all. */
  complete: z.boolean(),
  /** Weighted metrics the row lacks. */
  incompleteMetrics: z.array(lineupMetricKey),
  notes: z.array(safeString()),
});
export type ComparisonRowDto = z.infer<typeof comparisonRowSchema>;

export const paretoSchema = z.object({
  x: lineupMetricKey,
  y: lineupMetricKey,
  /** The devices no other device beats on both axes (each axis in its better direction), in ascending x. */
  deviceIds: z.array(z.number().int()),
  points: z.array(z.object({ deviceId: z.number().int(), x: z.number(), y: z.number(), onFrontier: z.boolean() })),
  /** Devices left off the chart, and why (a value is missing). */
  leftOut: z.array(z.object({ deviceId: z.number().int(), reason: safeString() })),
});
export type ParetoDto = z.infer<typeof paretoSchema>;

export const comparisonResponse = z.object({
  lineupId: z.number().int(),
  currency: safeString(),
  rateTable: z.object({ id: z.number().int(), date: safeString(), source: safeString(), base: safeString() }).nullable(),
  /** Date of the rates used to convert money (null: no rate table). */
  rateDate: safeString().nullable(),
  weights: z.record(safeString(), z.number()),
  /** 'saved': the lineup's weights; 'preview': the weights sent, not saved. */
  weightsFrom: z.enum(['saved', 'preview']),
  /** The operating mode compared for every device. */
  mode: lineupModeChoice,
  metrics: z.array(comparisonMetricSchema),
  rows: z.array(comparisonRowSchema),
  pareto: paretoSchema,
  /** Devices of the lineup the caller cannot see, left out of the comparison. */
  hiddenDevices: z.number().int(),
  /** Cautions and the nature of the figures. */
  notes: z.array(safeString()),
  computedAt: safeString(),
});
export type ComparisonDto = z.infer<typeof comparisonResponse>;
