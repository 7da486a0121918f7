import type { EntityManager } from '@mikro-orm/sqlite';
import { findingResponse, figuresResponse, suggestionParams, suggestionResponse } from '@splitcase/contracts';
import { AppError, notFound } from '../../http/errors';
import { route, type AuthUser, type RouteContext, type RouteDef } from '../../http/route';
import { recordAudit } from '../audit/audit.service';
import { createFinding, FINDING_POPULATE, toFindingDto } from '../findings/finding.service';
import { UserSchema } from '../users/user.entity';
import { CONTENT_EDITORS, editableTeardown } from '../teardowns/access';
import { SuggestionDecisionSchema } from '../teardowns/suggestion-decision.entity';
import { teardownFiguresFor } from './figures.service';
import { teardownRead } from '../teardowns/teardown-routes';

/**
 * The suggestion of the route's teardown (editable) and key, with its decision, when it is not
 * accepted: dismissing and reopening act on open and dismissed suggestions only.
 */
async function notAcceptedSuggestion(ctx: RouteContext<unknown, unknown, { id: number; key: string }>) {
  const t = await editableTeardown(ctx, ctx.params.id);
  const figures = await teardownFiguresFor(ctx.em, t);
  const s = figures.suggestions.find((x) => x.key === ctx.params.key);
  if (!s) throw notFound(`The suggestion "${ctx.params.key}" (the records of this teardown do not raise it)`);
  if (s.status === 'accepted') {
    throw new AppError('conflict', `This suggestion was accepted as finding #${s.findingId}; delete that finding to reopen it.`, undefined, { findingId: s.findingId });
  }
  return { t, s };
}

/** The audit entry of a decision on a suggestion. */
function suggestionAudit(em: EntityManager, user: AuthUser, teardownId: number, key: string, action: string, summary: string) {
  recordAudit(em, user, { action, entityType: 'suggestion', entityId: key, scope: { type: 'teardown', id: teardownId }, summary });
}

/** The route of dismissing or reopening a suggestion. */
const suggestionStep = (step: 'dismiss' | 'reopen', summary: string) =>
  ({ method: 'post', path: `/api/teardowns/:id/suggestions/:key/${step}`, tag: 'Figures', summary, access: CONTENT_EDITORS, params: suggestionParams, response: suggestionResponse }) as const;

export const figureRoutes: RouteDef[] = [
  teardownRead(
    {
      path: '/api/teardowns/:id/figures',
      tag: 'Figures',
      summary: 'Derived figures (value, unit, formula, source, inputs, assumptions, warnings) and suggested findings, computed from the stored records',
      response: figuresResponse,
    },
    async ({ em }, t) => {
      const { figures, modes, suggestions, note } = await teardownFiguresFor(em, t);
      return { figures, modes, suggestions, note };
    },
  ),
  route(
    {
      method: 'post',
      path: '/api/teardowns/:id/suggestions/:key/accept',
      tag: 'Figures',
      summary: 'Accept a suggested finding: it becomes a finding (kind, severity, text = the suggestion detail)',
      access: CONTENT_EDITORS,
      params: suggestionParams,
      response: findingResponse,
      status: 201,
    },
    async (ctx) => {
      const { em, user, params } = ctx;
      const t = await editableTeardown(ctx, params.id);
      const { raw } = await teardownFiguresFor(em, t);
      const s = raw.suggestions.find((x) => x.key === params.key);
      if (!s) throw notFound(`The suggestion "${params.key}" (the records of this teardown do not raise it)`);
      const decision = await em.findOne(SuggestionDecisionSchema, { teardown: t.id, key: s.key });
      if (decision?.status === 'accepted') {
        throw new AppError('conflict', `This suggestion was already accepted as finding #${decision.findingId}.`, undefined, { findingId: decision.findingId });
      }
      const finding = await em.transactional(async (tx) => {
        const f = await createFinding(tx, user, t, { kind: s.kind, severity: s.severity, text: s.detail, tags: [s.key.split('.')[0]!, 'suggested'], suggestionKey: s.key });
        if (decision) {
          decision.status = 'accepted';
          decision.findingId = f.id;
          decision.decidedBy = tx.getReference(UserSchema, user.id);
          decision.decidedAt = new Date();
        } else {
          tx.create(SuggestionDecisionSchema, { teardown: t, key: s.key, status: 'accepted', findingId: f.id, decidedBy: tx.getReference(UserSchema, user.id) });
        }
        suggestionAudit(tx, user, t.id, s.key, 'suggestion.accepted', `Accepted the suggestion "${s.title}" as finding #${f.id}`);
        return f;
      });
      await em.populate(finding, [...FINDING_POPULATE]);
      return { finding: toFindingDto(finding) };
    },
  ),
  route(suggestionStep('dismiss', 'Dismiss a suggested finding (remembered; reopen undoes it)'), async (ctx) => {
    const { em, user } = ctx;
    const { t, s } = await notAcceptedSuggestion(ctx);
    if (s.status === 'open') {
      em.create(SuggestionDecisionSchema, { teardown: t, key: s.key, status: 'dismissed', decidedBy: em.getReference(UserSchema, user.id) });
      suggestionAudit(em, user, t.id, s.key, 'suggestion.dismissed', `Dismissed the suggestion "${s.title}"`);
    }
    await em.flush();
    return { suggestion: { ...s, status: 'dismissed' as const, decidedBy: s.decidedBy ?? user.name, decidedAt: s.decidedAt ?? new Date().toISOString() } };
  }),
  route(suggestionStep('reopen', 'Reopen a dismissed suggestion'), async (ctx) => {
    const { em, user } = ctx;
    const { t, s } = await notAcceptedSuggestion(ctx);
    if (s.status === 'dismissed') {
      await em.transactional(async (tx) => {
        await tx.nativeDelete(SuggestionDecisionSchema, { teardown: t.id, key: s.key });
        suggestionAudit(tx, user, t.id, s.key, 'suggestion.reopened', `Reopened the suggestion "${s.title}"`);
      });
    } else await em.flush();
    return { suggestion: { ...s, status: 'open' as const, decidedBy: null, decidedAt: null, findingId: null } };
  }),
];
