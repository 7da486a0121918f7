import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { TeardownSchema } from '../teardowns/teardown.entity';

/** An operating mode of a teardown's device: a name, the loads active in it (mode_loads) and the standby draw. */
export const OperatingModeSchema = defineEntity({
  name: 'OperatingMode',
  tableName: 'operating_modes',
  properties: {
    id: p.integer().primary().autoincrement(),
    teardown: () => p.manyToOne(TeardownSchema).deleteRule('cascade'),
    name: p.string().length(80),
    note: p.string().length(300).nullable(),
    position: p.integer().default(0),
    quiescentAmps: p.double().nullable(),
    entered: p.json<Record<string, string>>().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type OperatingMode = InferEntity<typeof OperatingModeSchema>;
