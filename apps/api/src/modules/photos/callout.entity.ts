import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { FindingSchema } from '../findings/finding.entity';
import { PartSchema } from '../parts/part.entity';
import { PhotoSchema } from './photo.entity';

/** A numbered pin on a photo at relative x, y (0..1), optionally linked to a part or a finding. */
export const CalloutSchema = defineEntity({
  name: 'Callout',
  tableName: 'callouts',
  uniques: [{ properties: ['photo', 'number'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    photo: () => p.manyToOne(PhotoSchema).deleteRule('cascade'),
    number: p.integer(),
    x: p.double(),
    y: p.double(),
    label: p.string().length(200),
    part: () => p.manyToOne(PartSchema).nullable().deleteRule('set null'),
    finding: () => p.manyToOne(FindingSchema).nullable().deleteRule('set null'),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
export type Callout = InferEntity<typeof CalloutSchema>;
