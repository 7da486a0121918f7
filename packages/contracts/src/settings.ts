import { z } from 'zod';
import { DEVICE_CATEGORY } from './domain';

export const currencyCode = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z]{3}$/, 'Use a three-letter ISO 4217 code such as USD');

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
});
export type WorkspaceSettings = z.infer<typeof workspaceSettingsSchema>;
/** The cut-off debounce on its own, for the bench-runs page's setting form. */
export const cutoffDebounceSettingBody = workspaceSettingsSchema.pick({ cutoffDebounceSeconds: true });
export type CutoffDebounceSettingForm = z.input<typeof cutoffDebounceSettingBody>;
export type CutoffDebounceSettingBody = z.output<typeof cutoffDebounceSettingBody>;
export const settingsResponse = z.object({ settings: workspaceSettingsSchema });
export const updateSettingsBody = workspaceSettingsSchema.partial().refine((b) => Object.keys(b).length > 0, { message: 'Change at least one setting' });
export type UpdateSettingsBody = z.infer<typeof updateSettingsBody>;
