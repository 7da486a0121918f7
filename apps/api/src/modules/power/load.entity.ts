import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { CONNECTION, ELEMENT_MATERIAL, LOAD_KIND, SURFACE_MATERIAL } from '@splitcase/contracts';
import { TeardownSchema } from '../teardowns/teardown.entity';
import { ConverterSchema } from './converter.entity';

/** A load: heater element, motor, LED, USB output… Per-element values; `count` elements in series or parallel. */
export const LoadSchema = defineEntity({
  name: 'Load',
  tableName: 'loads',
  properties: {
    id: p.integer().primary().autoincrement(),
    teardown: () => p.manyToOne(TeardownSchema).deleteRule('cascade'),
    kind: p.enum([...LOAD_KIND.values]),
    label: p.string().length(120),
    resistanceOhms: p.double().nullable(),
    currentAmps: p.double().nullable(),
    powerWatts: p.double().nullable(),
    supplyVolts: p.double().nullable(),
    count: p.integer().default(1),
    connection: p.enum([...CONNECTION.values]).default('parallel'),
    duty: p.double().default(1),
    converter: () => p.manyToOne(ConverterSchema).nullable().deleteRule('set null'),
    heatedAreaM2: p.double().nullable(),
    surfaceMaterial: p.enum([...SURFACE_MATERIAL.values]).nullable(),
    elementMaterial: p.enum([...ELEMENT_MATERIAL.values]).nullable(),
    heatedMassKg: p.double().nullable(),
    entered: p.json<Record<string, string>>().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type Load = InferEntity<typeof LoadSchema>;
