import { z } from 'zod';
import { patchOf, safeString } from './common';

export const currencyCode = safeString()
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
  /** A sign-in lasts at most this long, however active (h). */
  sessionMaxHours: z.number().int('Whole hours').min(1, 'At least 1 h').max(168, 'At most 168 h (7 days)').default(12),
  /** A session unused this long ends (min). */
  sessionIdleMinutes: z.number().int('Whole minutes').min(5, 'At least 5 min').max(1440, 'At most 1440 min (24 h)').default(60),
});
/** Labels of the settings as the screens show them. */
export const SETTING_LABELS: Record<keyof z.infer<typeof workspaceSettingsSchema>, string> = {
  reportingCurrency: 'Reporting currency',
  capacityWarnFraction: 'Capacity warning level',
  defaultContactSeconds: 'Default contact time',
  sessionMaxHours: 'Longest sign-in',
  sessionIdleMinutes: 'Sign out after inactivity',
};
export type WorkspaceSettings = z.infer<typeof workspaceSettingsSchema>;
export const settingsResponse = z.object({ settings: workspaceSettingsSchema });
/** PATCH /api/settings: the settings sent change, the others stay as they are. */
export const updateSettingsBody = patchOf(workspaceSettingsSchema.shape, 'Change at least one setting');
export type UpdateSettingsBody = z.infer<typeof updateSettingsBody>;
