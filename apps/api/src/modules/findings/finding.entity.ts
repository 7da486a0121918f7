import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { FINDING_KIND, SEVERITY } from '@splitcase/contracts';
import { PartSchema } from '../parts/part.entity';
import { PhotoSchema } from '../photos/photo.entity';
import { TeardownSchema } from '../teardowns/teardown.entity';
import { UserSchema } from '../users/user.entity';

/** An observation: cost-down, safety, reliability… with a severity, tags and links to parts and photos. */
export const FindingSchema = defineEntity({
  name: 'Finding',
  tableName: 'findings',
  indexes: [{ properties: ['kind'] }, { properties: ['severity'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    teardown: () => p.manyToOne(TeardownSchema).deleteRule('cascade'),
    kind: p.enum([...FINDING_KIND.values]),
    severity: p.enum([...SEVERITY.values]),
    text: p.text(),
    tags: p.json<string[]>(),
    /** The suggestion rule this finding was accepted from, if any. */
    suggestionKey: p.string().length(120).nullable(),
    parts: () => p.manyToMany(PartSchema).pivotTable('finding_parts'),
    photos: () => p.manyToMany(PhotoSchema).pivotTable('finding_photos'),
    createdBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type Finding = InferEntity<typeof FindingSchema>;
