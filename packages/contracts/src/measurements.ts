// Raw readings at the bench: a quantity, the value typed with its unit, what was measured and how.
import { z } from 'zod';
import { patchOf, safeString } from './common';
import { MEASURED_QUANTITY } from './domain';

const text = (max: number) =>
  safeString()
    .trim()
    .max(max, `At most ${max} characters`)
    .nullable()
    .optional()
    .transform((v) => (v === '' ? null : v));

const fields = {
  quantity: z.enum(MEASURED_QUANTITY.values, { error: `Choose a quantity: ${MEASURED_QUANTITY.values.join(', ')}` }),
  /**
   * "3.02 Ω", "350 mA", "4R7". A JSON number is in the quantity's stored unit; a bare number typed as
   * text follows the quantity's field in MEASUREMENT_FIELDS (read in its example's unit, or refused).
   */
  value: z.union([z.number(), safeString().trim().min(1, 'Required').max(60, 'At most 60 characters')], {
    error: (issue) => (issue.input === undefined ? 'Required' : 'Enter the value with its unit'),
  }),
  /** What was measured ("Heater element, front"). */
  subject: safeString({ error: 'Required' }).trim().min(1, 'Say what was measured').max(300, 'At most 300 characters'),
  conditions: text(300),
  instrument: text(160),
  /** As the instrument states it, e.g. "±(0.8 % + 3 digits)". */
  uncertainty: text(60),
};

export const createMeasurementBody = z.object(fields);
export type CreateMeasurementBody = z.input<typeof createMeasurementBody>;
export const updateMeasurementBody = patchOf(fields);
export type UpdateMeasurementBody = z.input<typeof updateMeasurementBody>;

export const measurementSchema = z.object({
  id: z.number().int(),
  teardownId: z.number().int(),
  quantity: z.enum(MEASURED_QUANTITY.values),
  /** In the stored unit (SI; Wh, Ah and °C for energy, charge and temperature). */
  value: z.number(),
  unit: safeString(),
  /** The text typed. */
  entered: safeString(),
  subject: safeString(),
  conditions: safeString().nullable(),
  instrument: safeString().nullable(),
  uncertainty: safeString().nullable(),
  takenBy: z.object({ id: z.number().int(), name: safeString() }).nullable(),
  takenAt: safeString(),
});
export type MeasurementDto = z.infer<typeof measurementSchema>;
export const measurementResponse = z.object({ measurement: measurementSchema });
export const measurementsResponse = z.object({ measurements: z.array(measurementSchema) });
