import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { CHEMISTRY, JOINING } from '@splitcase/contracts';
import { TeardownSchema } from '../teardowns/teardown.entity';

/** The cells / pack of a teardown (one per teardown). Values in SI; `entered` keeps what the user typed. */
export const PackSchema = defineEntity({
  name: 'Pack',
  tableName: 'packs',
  properties: {
    id: p.integer().primary().autoincrement(),
    teardown: () => p.oneToOne(TeardownSchema).owner().unique().deleteRule('cascade'),
    chemistry: p.enum([...CHEMISTRY.values]),
    cellFormat: p.string().length(60).nullable(),
    cellNominalVolts: p.double(),
    cellMaxVolts: p.double().nullable(),
    cellRatedAh: p.double(),
    cellMeasuredAh: p.double().nullable(),
    series: p.integer().default(1),
    parallel: p.integer().default(1),
    packMassKg: p.double().nullable(),
    protection: p.boolean().default(false),
    joining: p.enum([...JOINING.values]).nullable(),
    /** DC internal resistance of one cell (Ω). */
    internalOhms: p.double().nullable(),
    /** The two DC-method readings it was worked out from (SI), when it was. */
    internalReadings: p.json<{ lowAmps: number; lowVolts: number; highAmps: number; highVolts: number }>().nullable(),
    entered: p.json<Record<string, string>>().nullable(),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type Pack = InferEntity<typeof PackSchema>;
