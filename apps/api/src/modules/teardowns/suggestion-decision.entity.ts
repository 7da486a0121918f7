import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { UserSchema } from '../users/user.entity';
import { TeardownSchema } from './teardown.entity';

/** What the engineer did with a suggested finding (calc rule key): accepted (became a finding) or dismissed. */
export const SuggestionDecisionSchema = defineEntity({
  name: 'SuggestionDecision',
  tableName: 'suggestion_decisions',
  uniques: [{ properties: ['teardown', 'key'] }],
  properties: {
    id: p.integer().primary().autoincrement(),
    teardown: () => p.manyToOne(TeardownSchema).deleteRule('cascade'),
    key: p.string().length(120),
    status: p.enum(['accepted', 'dismissed']),
    findingId: p.integer().nullable(),
    decidedBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    decidedAt: p.datetime().onCreate(() => new Date()),
  },
});
export type SuggestionDecision = InferEntity<typeof SuggestionDecisionSchema>;
