import { z } from 'zod';
import { DEVICE_CATEGORY, type DeviceCategory } from './domain';
import { durationInput, percentInput } from './inputs';
import { patchOf, safeString } from './common';

export const currencyCode = safeString()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z]{3}$/, 'Use a three-letter ISO 4217 code such as USD');

/**
 * Default share of sales tax (VAT, GST) in a retail price, by the price's currency, used when a
 * device does not set its own. Rates differ by country inside one currency and change over time:
 * each workspace should set its own. Defaults:
 * - USD 0, CAD 0: shop prices there are usually quoted before sales tax [CP: REFERENCES §12].
 * - EUR 0.20: a round value inside the euro area's standard VAT rates (about 17 % to 25.5 %) [CP; M for the range].
 * - GBP 0.20 (UK standard VAT rate), CHF 0.081, JPY 0.10 (consumption tax), CNY 0.13, AUD 0.10 (GST),
 *   HKD 0 (no sales tax) [M: standard rates as remembered; check before relying on them].
 */
export const DEFAULT_SALES_TAX_BY_CURRENCY: Readonly<Record<string, number>> = {
  USD: 0,
  CAD: 0,
  EUR: 0.2,
  GBP: 0.2,
  CHF: 0.081,
  JPY: 0.1,
  CNY: 0.13,
  AUD: 0.1,
  HKD: 0,
};

/** Sales tax in retail prices by currency: currency code → fraction 0..1. */
export const salesTaxByCurrencySchema = z.record(
  safeString()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{3}$/, 'Use a three-letter ISO 4217 code such as EUR'),
  z.number({ error: 'The sales tax must be a number' }).min(0, 'The sales tax must not be below 0 %').max(1, 'The sales tax must not be above 100 %'),
);

/** Workspace-wide settings, with their defaults. */
export const workspaceSettingsSchema = z.object({
  /** Currency that cost figures and comparisons are reported in. */
  reportingCurrency: currencyCode.default('USD'),
  /** Measured capacity below this fraction of the label capacity raises a warning (0..1). */
  capacityWarnFraction: z.number().min(0.5, 'At least 0.5').max(1, 'At most 1').default(0.9),
  /** Contact time assumed for touch-temperature figures when a teardown does not set its own (s). */
  defaultContactSeconds: z.number().int().min(1, 'At least 1 s').max(28800, 'At most 8 h').default(60),
  /**
   * Contact time by device category, before the default above: what is held or worn for long is judged
   * at 10 min or 8 h, not 1 min (REFERENCES §6 [CP]). A teardown can set its own.
   */
  contactSecondsByCategory: z
    .partialRecord(DEVICE_CATEGORY.schema, z.number().int().min(1, 'At least 1 s').max(28800, 'At most 8 h'))
    .default({ 'pocket-heater': 600, headlamp: 600, toothbrush: 600 }),
  /** Share of the rated energy usable to cut-off, for runtimes when no discharge run measured it (0.5..1). */
  usableFraction: z.number().min(0.5, 'At least 0.5').max(1, 'At most 1').default(0.9),
  /** A discharge ends at its cut-off voltage only once the voltage stays at or below it this long (s); shorter sags at a load step are ignored. */
  cutoffDebounceSeconds: z.number({ error: 'A number of seconds' }).min(0, 'At least 0 s').max(600, 'At most 600 s').default(5),
  /** Share of sales tax in retail prices by currency, for devices that do not set their own (0.2 = 20 %). */
  salesTaxByCurrency: salesTaxByCurrencySchema.default(() => ({ ...DEFAULT_SALES_TAX_BY_CURRENCY })),
  /** A sign-in lasts at most this long, however active (h). */
  sessionMaxHours: z.number().int('Whole hours').min(1, 'At least 1 h').max(168, 'At most 168 h (7 days)').default(12),
  /** A session unused this long ends (min). */
  sessionIdleMinutes: z.number().int('Whole minutes').min(5, 'At least 5 min').max(1440, 'At most 1440 min (24 h)').default(60),
});
/** Labels of the settings as the screens show them. */
export const SETTING_LABELS: Record<keyof z.infer<typeof workspaceSettingsSchema>, string> = {
  reportingCurrency: 'Reporting currency',
  capacityWarnFraction: 'Capacity warning level',
  defaultContactSeconds: 'Workspace default contact time',
  contactSecondsByCategory: 'Contact time by device category',
  usableFraction: 'Usable share of the rated energy',
  cutoffDebounceSeconds: 'Cut-off debounce',
  salesTaxByCurrency: 'Sales tax by currency',
  sessionMaxHours: 'Longest sign-in',
  sessionIdleMinutes: 'Sign out after inactivity',
};
export type WorkspaceSettings = z.infer<typeof workspaceSettingsSchema>;
/** The cut-off debounce on its own, for the bench-runs page's setting form. */
export const cutoffDebounceSettingBody = workspaceSettingsSchema.pick({ cutoffDebounceSeconds: true });
export type CutoffDebounceSettingForm = z.input<typeof cutoffDebounceSettingBody>;
export type CutoffDebounceSettingBody = z.output<typeof cutoffDebounceSettingBody>;
/** Contact times are whole seconds from 1 s to 8 h, as in the settings above. */
const contactTime = durationInput({ min: 1, max: 28_800 });

/**
 * The figures and safety settings as an admin types them (Admin → Figures & safety): contact times
 * as durations ("10 min", "8 h", "60 s"; a blank category uses the workspace default) and the usable
 * share of the rated energy in per cent. The output is the settings fields, in seconds and a fraction.
 */
export const figureSettingsFormSchema = z
  .object({
    defaultContact: contactTime.refine((v) => v !== null && v !== undefined, 'Give the default contact time, such as 1 min'),
    byCategory: z.partialRecord(DEVICE_CATEGORY.schema, contactTime),
    usablePercent: percentInput('the usable share')
      .refine((v) => v !== null && v !== undefined, 'Give the usable share, such as 90 %')
      .refine((v) => v === null || v === undefined || v >= 0.5, 'At least 50 %'),
  })
  .transform((f) => ({
    defaultContactSeconds: f.defaultContact!,
    contactSecondsByCategory: Object.fromEntries(Object.entries(f.byCategory).filter(([, v]) => typeof v === 'number')) as Partial<Record<DeviceCategory, number>>,
    usableFraction: f.usablePercent!,
  }));
export type FigureSettingsFormValues = z.input<typeof figureSettingsFormSchema>;
export type FigureSettingsForm = z.output<typeof figureSettingsFormSchema>;
export const settingsResponse = z.object({ settings: workspaceSettingsSchema });
/** PATCH /api/settings: the settings sent change, the others stay as they are. */
export const updateSettingsBody = patchOf(workspaceSettingsSchema.shape, 'Change at least one setting');
export type UpdateSettingsBody = z.infer<typeof updateSettingsBody>;
