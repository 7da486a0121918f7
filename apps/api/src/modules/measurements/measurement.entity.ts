import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { MEASURED_QUANTITY } from '@splitcase/contracts';
import { TeardownSchema } from '../teardowns/teardown.entity';
import { UserSchema } from '../users/user.entity';

/** A raw reading at the bench: value in SI plus the text the user typed ("2700 mAh"). */
export const MeasurementSchema = defineEntity({
  name: 'Measurement',
  tableName: 'measurements',
  properties: {
    id: p.integer().primary().autoincrement(),
    teardown: () => p.manyToOne(TeardownSchema).deleteRule('cascade'),
    quantity: p.enum([...MEASURED_QUANTITY.values]),
    value: p.double(),
    unit: p.string().length(12),
    entered: p.string().length(60),
    subject: p.string().length(300),
    conditions: p.string().length(300).nullable(),
    instrument: p.string().length(160).nullable(),
    uncertainty: p.string().length(60).nullable(),
    takenBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    takenAt: p.datetime().onCreate(() => new Date()),
  },
});
export type Measurement = InferEntity<typeof MeasurementSchema>;
