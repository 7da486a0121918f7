import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { DeviceSchema } from '../devices/device.entity';
import { LineupSchema } from './lineup.entity';

/** A device in a lineup, at a position (the order the lineup was built in). */
export const LineupDeviceSchema = defineEntity({
  name: 'LineupDevice',
  tableName: 'lineup_devices',
  uniques: [{ properties: ['lineup', 'device'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    lineup: () => p.manyToOne(LineupSchema).deleteRule('cascade'),
    device: () => p.manyToOne(DeviceSchema).deleteRule('cascade'),
    position: p.integer(),
  },
});
export type LineupDevice = InferEntity<typeof LineupDeviceSchema>;
