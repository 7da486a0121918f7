import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { LoadSchema } from './load.entity';
import { OperatingModeSchema } from './mode.entity';

/** A load active in a mode, at its PWM duty in that mode. Deleting the load or the mode removes it. */
export const ModeLoadSchema = defineEntity({
  name: 'ModeLoad',
  tableName: 'mode_loads',
  properties: {
    id: p.integer().primary().autoincrement(),
    mode: () => p.manyToOne(OperatingModeSchema).deleteRule('cascade'),
    load: () => p.manyToOne(LoadSchema).deleteRule('cascade'),
    duty: p.double().default(1),
    entered: p.string().length(40).nullable(),
  },
  uniques: [{ properties: ['mode', 'load'] }],
});
export type ModeLoad = InferEntity<typeof ModeLoadSchema>;
