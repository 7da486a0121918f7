import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { MOUNT_TYPE, PART_CATEGORY } from '@splitcase/contracts';
import { TeardownSchema } from '../teardowns/teardown.entity';

/** A bill-of-materials line of a teardown. Prices live in the cost module's own table. */
export const PartSchema = defineEntity({
  name: 'Part',
  tableName: 'parts',
  indexes: [{ properties: ['category'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    teardown: () => p.manyToOne(TeardownSchema).deleteRule('cascade'),
    position: p.integer().default(0),
    designators: p.string().length(300).nullable(),
    category: p.enum([...PART_CATEGORY.values]),
    description: p.string().length(500),
    marking: p.string().length(120).nullable(),
    /** Value decoded from the marking (Ω for resistors, F for capacitors), when it looks like a code. */
    decodedValue: p.double().nullable(),
    decodedUnit: p.string().length(4).nullable(),
    makerPartNumber: p.string().length(120).nullable(),
    package: p.string().length(80).nullable(),
    quantity: p.integer().default(1),
    mount: p.enum([...MOUNT_TYPE.values]).default('smt'),
    notes: p.text().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type Part = InferEntity<typeof PartSchema>;
