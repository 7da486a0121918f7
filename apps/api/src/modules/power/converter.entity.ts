import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { CONVERTER_ROLE, CONVERTER_TOPOLOGY } from '@splitcase/contracts';
import { TeardownSchema } from '../teardowns/teardown.entity';

/** A DC-DC stage: buck, boost or buck-boost, with its efficiency (measured or assumed). */
export const ConverterSchema = defineEntity({
  name: 'Converter',
  tableName: 'converters',
  properties: {
    id: p.integer().primary().autoincrement(),
    teardown: () => p.manyToOne(TeardownSchema).deleteRule('cascade'),
    label: p.string().length(120),
    topology: p.enum([...CONVERTER_TOPOLOGY.values]),
    role: p.enum([...CONVERTER_ROLE.values]),
    vin: p.double(),
    vout: p.double(),
    ratedCurrentA: p.double().nullable(),
    chargeCurrentA: p.double().nullable(),
    efficiency: p.double().nullable(),
    efficiencySource: p.enum(['measured', 'assumed']).default('assumed'),
    entered: p.json<Record<string, string>>().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type Converter = InferEntity<typeof ConverterSchema>;
