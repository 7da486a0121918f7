// The review workflow: draft → in_review (leads get an e-mail) → published, or back to draft with a
// comment (the engineer gets an e-mail). Each step is audited and kept as a comment of its kind.
// A teardown in review is read-only (access.ts `assertWritable`); its engineer or an admin
// withdraws it back to draft to edit it (audited).
import type { EntityManager } from '@mikro-orm/sqlite';
import { approveTeardownBody, idParam, sendBackTeardownBody, submitTeardownBody, teardownResponse, TEARDOWN_STATUS, type TeardownStatus } from '@splitcase/contracts';
import { AppError, forbidden } from '../../http/errors';
import type { AppDeps } from '../../http/deps';
import { route, type AuthUser, type RouteContext, type RouteDef } from '../../http/route';
import { recordAudit } from '../audit/audit.service';
import type { OutgoingMail } from '../mail/mailer';
import { linkMail } from '../mail/templates';
import { UserSchema } from '../users/user.entity';
import { CONTENT_EDITORS, mayWithdraw, readableTeardown, REVIEWERS } from './access';
import { CommentSchema } from './comment.entity';
import { teardownDto, teardownName } from './teardown.service';
import type { Teardown } from './teardown.entity';

function requireStatus(t: Teardown, wanted: TeardownStatus, action: string): void {
  if (t.status !== wanted) {
    throw new AppError(
      'conflict',
      `This teardown is ${TEARDOWN_STATUS.labels[t.status as TeardownStatus].toLowerCase()}; only a teardown that is ${TEARDOWN_STATUS.labels[wanted].toLowerCase()} can be ${action}.`,
      undefined,
      { status: t.status },
    );
  }
}

/**
 * Send after the commit; if the mail server refuses, put the teardown back as it was (and say so in
 * its history) so nothing is left half-done, then answer 502.
 */
async function sendOrUndo(deps: AppDeps, mail: OutgoingMail, undo: () => Promise<void>, what: string): Promise<void> {
  try {
    await deps.mailer.send(mail);
  } catch (err) {
    deps.log(`Review e-mail failed (${what})`, err);
    await undo();
    throw new AppError('internal', `The e-mail could not be sent, so the teardown was not ${what}. Check the mail settings and try again.`, undefined, undefined, 502);
  }
}

function addReviewComment(em: EntityManager, t: Teardown, user: AuthUser, kind: 'submitted' | 'approved' | 'sent-back', body: string) {
  return em.create(CommentSchema, { teardown: t, author: em.getReference(UserSchema, user.id), kind, body });
}

/** The audit entry of a review step: the teardown's status from → to. */
function statusAudit(em: EntityManager, user: AuthUser, t: Teardown, action: string, summary: string, from: TeardownStatus, to: TeardownStatus) {
  recordAudit(em, user, { action, entityType: 'teardown', entityId: t.id, scope: { type: 'teardown', id: t.id }, summary, changes: { status: { from, to } } });
}

const link = (deps: AppDeps, t: Teardown) => `${deps.env.publicUrl}/teardowns/${t.id}`;

/** What approving and sending back do to a teardown in review (the one handler below reads it). */
const DECISIONS = {
  approve: { kind: 'approved', to: 'published', verb: 'approved', noteDefault: 'Approved and published.', summary: (note: string | null) => `Approved and published${note ? `: ${note}` : ''}` },
  'send-back': { kind: 'sent-back', to: 'draft', verb: 'sent back', noteDefault: '', summary: (note: string | null) => `Sent back to draft: ${note}` },
} as const;

/**
 * Approve or send back a teardown in review: the status, the review note, a comment of its kind and
 * the audit entry; a send-back then e-mails the engineer (undone when the mail server refuses).
 */
async function decide(ctx: RouteContext<unknown, unknown, { id: number }>, which: keyof typeof DECISIONS, note: string | null) {
  const { em, user, deps } = ctx;
  const d = DECISIONS[which];
  const t = await readableTeardown(em, user, ctx.params.id);
  requireStatus(t, 'in_review', d.verb);
  const previousNote = t.lastReviewNote ?? null;
  t.status = d.to;
  t.lastReviewNote = note;
  if (which === 'approve') {
    t.publishedAt = new Date();
    t.publishedBy = em.getReference(UserSchema, user.id);
  }
  const comment = addReviewComment(em, t, user, d.kind, note ?? d.noteDefault);
  statusAudit(em, user, t, `teardown.${d.kind}`, d.summary(note), 'in_review', d.to);
  await em.flush();
  if (which === 'send-back' && t.engineer.active) {
    await sendOrUndo(
      deps,
      linkMail({
        to: t.engineer.email,
        subject: `Sent back: ${teardownName(t)}`,
        lines: [
          `Hello ${t.engineer.name.split(' ')[0]},`,
          `${user.name} sent your teardown of ${teardownName(t)} back to draft with this comment:`,
          `“${note}”`,
          'Make the changes, then submit it for review again.',
        ],
        linkLabel: 'Open the teardown',
        url: link(deps, t),
      }),
      async () => {
        t.status = 'in_review';
        t.lastReviewNote = previousNote;
        em.remove(comment);
        statusAudit(em, user, t, 'teardown.send-back-undone', 'Send-back undone: the e-mail to the engineer could not be sent', 'draft', 'in_review');
        await em.flush();
      },
      'sent back',
    );
  }
  return { teardown: await teardownDto(em, t, user) };
}

export const reviewRoutes: RouteDef[] = [
  route(
    {
      method: 'post',
      path: '/api/teardowns/:id/submit',
      tag: 'Teardowns',
      summary: 'Submit a draft for review; every active lead gets an e-mail with a link',
      access: CONTENT_EDITORS,
      params: idParam,
      body: submitTeardownBody,
      response: teardownResponse,
    },
    async ({ em, user, params, body, deps }) => {
      const t = await readableTeardown(em, user, params.id);
      requireStatus(t, 'draft', 'submitted for review');
      const previous = { submittedAt: t.submittedAt ?? null, lastReviewNote: t.lastReviewNote ?? null };
      t.status = 'in_review';
      t.submittedAt = new Date();
      const comment = addReviewComment(em, t, user, 'submitted', body.note ?? 'Submitted for review.');
      statusAudit(em, user, t, 'teardown.submitted', `Submitted for review${body.note ? `: ${body.note}` : ''}`, 'draft', 'in_review');
      await em.flush();
      const leads = await em.find(UserSchema, { role: 'lead', active: true }, { orderBy: { id: 'asc' } });
      if (leads.length > 0) {
        await sendOrUndo(
          deps,
          linkMail({
            to: leads.map((l) => l.email).join(', '),
            subject: `Review requested: ${teardownName(t)}`,
            lines: [
              'Hello,',
              `${user.name} submitted the teardown of ${teardownName(t)}, opened on ${t.date}, for review.`,
              ...(body.note ? [`Their note: “${body.note}”`] : []),
              'Open it to approve and publish it, or send it back with a comment.',
            ],
            linkLabel: 'Open the teardown',
            url: link(deps, t),
          }),
          async () => {
            t.status = 'draft';
            t.submittedAt = previous.submittedAt;
            em.remove(comment);
            statusAudit(em, user, t, 'teardown.submit-undone', 'Submission undone: the e-mail to the leads could not be sent', 'in_review', 'draft');
            await em.flush();
          },
          'submitted',
        );
      }
      return { teardown: await teardownDto(em, t, user) };
    },
  ),
  route(
    {
      method: 'post',
      path: '/api/teardowns/:id/withdraw',
      tag: 'Teardowns',
      summary: 'Withdraw a teardown from review back to draft to edit it (its engineer or an admin)',
      access: CONTENT_EDITORS,
      params: idParam,
      response: teardownResponse,
    },
    async ({ em, user, params }) => {
      const t = await readableTeardown(em, user, params.id);
      if (!mayWithdraw(user, t)) throw forbidden();
      requireStatus(t, 'in_review', 'withdrawn from review');
      t.status = 'draft';
      statusAudit(em, user, t, 'teardown.withdrawn', 'Withdrawn from review to edit', 'in_review', 'draft');
      await em.flush();
      return { teardown: await teardownDto(em, t, user) };
    },
  ),
  route(
    {
      method: 'post',
      path: '/api/teardowns/:id/approve',
      tag: 'Teardowns',
      summary: 'Approve a teardown in review: it is published (viewers can read it)',
      access: REVIEWERS,
      params: idParam,
      body: approveTeardownBody,
      response: teardownResponse,
    },
    (ctx) => decide(ctx, 'approve', ctx.body.note ?? null),
  ),
  route(
    {
      method: 'post',
      path: '/api/teardowns/:id/send-back',
      tag: 'Teardowns',
      summary: 'Send a teardown in review back to draft with a comment; its engineer gets an e-mail',
      access: REVIEWERS,
      params: idParam,
      body: sendBackTeardownBody,
      response: teardownResponse,
    },
    (ctx) => decide(ctx, 'send-back', ctx.body.comment),
  ),
];
