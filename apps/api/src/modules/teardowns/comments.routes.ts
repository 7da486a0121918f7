import { commentResponse, commentsResponse, createCommentBody, idParam, teardownHistoryResponse } from '@splitcase/contracts';
import { route, type RouteDef } from '../../http/route';
import { AuditEntrySchema } from '../audit/audit-entry.entity';
import { recordAudit } from '../audit/audit.service';
import { historyCondition } from '../cost/price-visibility';
import { toAuditDto } from '../audit/routes';
import { UserSchema } from '../users/user.entity';
import { COMMENTERS, readableTeardown } from './access';
import { CommentSchema, type Comment } from './comment.entity';
import { teardownRead } from './teardown-routes';

export const toCommentDto = (c: Comment) => ({
  id: c.id,
  kind: c.kind,
  body: c.body,
  author: c.author ? { id: c.author.id, name: c.author.name } : null,
  createdAt: c.createdAt.toISOString(),
});

export const commentRoutes: RouteDef[] = [
  teardownRead(
    {
      path: '/api/teardowns/:id/comments',
      tag: 'Teardowns',
      summary: 'Comments on a teardown, oldest first (review decisions are comments of their kind)',
      response: commentsResponse,
    },
    async ({ em }, t) => {
      const rows = await em.find(CommentSchema, { teardown: t.id }, { orderBy: { createdAt: 'asc', id: 'asc' }, populate: ['author'] });
      return { comments: rows.map(toCommentDto) };
    },
  ),
  route(
    {
      method: 'post',
      path: '/api/teardowns/:id/comments',
      tag: 'Teardowns',
      summary: 'Comment on a teardown (every role but viewer)',
      access: COMMENTERS,
      params: idParam,
      body: createCommentBody,
      response: commentResponse,
      status: 201,
    },
    async ({ em, user, params, body }) => {
      const t = await readableTeardown(em, user, params.id);
      const comment = await em.transactional(async (tx) => {
        const c = tx.create(CommentSchema, { teardown: t.id, author: tx.getReference(UserSchema, user.id), kind: 'comment', body: body.body });
        await tx.flush();
        recordAudit(tx, user, {
          action: 'comment.created',
          entityType: 'comment',
          entityId: c.id,
          scope: { type: 'teardown', id: t.id },
          summary: `Commented: ${body.body.length > 120 ? `${body.body.slice(0, 117)}…` : body.body}`,
        });
        return c;
      });
      await em.populate(comment, ['author']);
      return { comment: toCommentDto(comment) };
    },
  ),
  teardownRead(
    {
      path: '/api/teardowns/:id/history',
      tag: 'Teardowns',
      summary: 'Every change to a teardown and its records (who, when, what), newest first; price entries only for the roles that see prices',
      response: teardownHistoryResponse,
      prices: 'by-role',
    },
    async ({ em, priceView }, t) => {
      const where = { scopeType: 'teardown', scopeId: String(t.id), ...historyCondition(priceView) };
      const rows = await em.find(AuditEntrySchema, where, { orderBy: { at: 'desc', id: 'desc' }, limit: 1000, populate: ['actor'] });
      return { entries: rows.map(toAuditDto) };
    },
  ),
];
