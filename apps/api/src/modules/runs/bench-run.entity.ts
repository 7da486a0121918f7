import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { RUN_KIND, type RunAnalysis, type RunMapping, type RunOptions } from '@splitcase/contracts';
import { TeardownSchema } from '../teardowns/teardown.entity';
import { UserSchema } from '../users/user.entity';

/** Which value columns a run's stored series has. */
export interface RunColumns {
  v: boolean;
  i: boolean;
  p: boolean;
  temp: boolean;
}

/**
 * A bench run: an uploaded log (kept as it came under uploads/runs/<storageKey>/), its parsed series
 * (a binary file of Float64 columns beside it, never one row per sample) and its analysis.
 */
export const BenchRunSchema = defineEntity({
  name: 'BenchRun',
  tableName: 'bench_runs',
  indexes: [{ properties: ['kind'] }, { properties: ['createdAt'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    teardown: () => p.manyToOne(TeardownSchema).deleteRule('cascade'),
    kind: p.enum([...RUN_KIND.values]),
    label: p.string().length(160),
    fileName: p.string().length(255),
    fileBytes: p.integer(),
    /** Random folder name under uploads/runs/. */
    storageKey: p.string().length(64).unique(),
    mapping: p.json<RunMapping>(),
    samples: p.integer(),
    durationS: p.double(),
    columns: p.json<RunColumns>(),
    options: p.json<RunOptions>(),
    analysis: p.json<RunAnalysis>(),
    createdBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type BenchRun = InferEntity<typeof BenchRunSchema>;
