// The home page of each role: what needs the caller first, then what is new. Everything here reads
// through the records the other modules own (teardowns, comments, findings, part prices, rates,
// users, invitations, outbox) and respects who may read what (viewers: published only).
import type { EntityManager } from '@mikro-orm/sqlite';
import type { FilterQuery } from '@mikro-orm/core';
import {
  HOME_LIST_LIMIT,
  RATES_STALE_AFTER_DAYS,
  ROLES,
  type AdminHome,
  type EngineerHome,
  type HomeFinding,
  type HomeNeed,
  type HomeResponse,
  type HomeTeardown,
  type LeadHome,
  type RatesAge,
  type Role,
  type SourcingHome,
} from '@splitcase/contracts';
import type { AppDeps } from '../../http/deps';
import type { AuthUser } from '../../http/route';
import { InvitationSchema } from '../auth/invitation.entity';
import { currentRateTable } from '../cost/rates.service';
import { FindingSchema, type Finding } from '../findings/finding.entity';
import { OutboxMessageSchema } from '../mail/outbox-message.entity';
import { CommentSchema, type Comment } from '../teardowns/comment.entity';
import { DRAFT_READERS } from '../teardowns/access';
import { TeardownSchema, type Teardown } from '../teardowns/teardown.entity';
import { UserSchema } from '../users/user.entity';
import { refId } from '../../db/batch';

const DAY_MS = 86_400_000;

export function toHomeTeardown(t: Teardown): HomeTeardown {
  return {
    id: t.id,
    device: { id: t.device.id, maker: t.device.maker, model: t.device.model, category: t.device.category },
    unitLabel: t.unitLabel ?? null,
    date: t.date,
    status: t.status,
    engineer: { id: t.engineer.id, name: t.engineer.name },
    updatedAt: t.updatedAt.toISOString(),
    submittedAt: t.submittedAt?.toISOString() ?? null,
    publishedAt: t.publishedAt?.toISOString() ?? null,
  };
}

function toHomeFinding(f: Finding): HomeFinding {
  return {
    id: f.id,
    teardownId: f.teardown.id,
    device: { id: f.teardown.device.id, maker: f.teardown.device.maker, model: f.teardown.device.model },
    kind: f.kind,
    severity: f.severity,
    text: f.text,
    createdAt: f.createdAt.toISOString(),
  };
}

const TEARDOWN_POPULATE = ['device', 'engineer'] as const;

/** The last review step (submitted, sent back, approved) of each of these teardowns. */
async function lastReviewSteps(em: EntityManager, teardownIds: number[]): Promise<Map<number, Comment>> {
  const out = new Map<number, Comment>();
  if (!teardownIds.length) return out;
  const steps = await em.find(
    CommentSchema,
    { teardown: { $in: teardownIds }, kind: { $in: ['submitted', 'sent-back', 'approved'] } },
    { populate: ['author'], orderBy: { createdAt: 'desc', id: 'desc' } },
  );
  for (const c of steps) {
    const id = refId(c.teardown);
    if (!out.has(id)) out.set(id, c);
  }
  return out;
}

async function engineerHome(em: EntityManager, user: AuthUser): Promise<EngineerHome> {
  const mine = await em.find(TeardownSchema, { engineer: user.id, status: { $in: ['draft', 'in_review'] } }, { populate: [...TEARDOWN_POPULATE], orderBy: { updatedAt: 'desc', id: 'desc' } });
  const drafts = mine.filter((t) => t.status === 'draft');
  const steps = await lastReviewSteps(
    em,
    drafts.map((t) => t.id),
  );
  const sentBack: EngineerHome['sentBack'] = [];
  const plain: HomeTeardown[] = [];
  for (const t of drafts) {
    const step = steps.get(t.id);
    if (step?.kind === 'sent-back') sentBack.push({ ...toHomeTeardown(t), note: step.body, by: step.author?.name ?? null, at: step.createdAt.toISOString() });
    else plain.push(toHomeTeardown(t));
  }
  return {
    drafts: plain,
    sentBack,
    inReview: mine.filter((t) => t.status === 'in_review').map(toHomeTeardown),
  };
}

async function leadHome(em: EntityManager): Promise<LeadHome> {
  const inReview = await em.find(TeardownSchema, { status: 'in_review' }, { populate: [...TEARDOWN_POPULATE], orderBy: { submittedAt: 'asc', id: 'asc' } });
  const steps = await lastReviewSteps(
    em,
    inReview.map((t) => t.id),
  );
  const severe = await em.find(FindingSchema, { severity: { $in: ['major', 'critical'] } }, { populate: ['teardown.device'], orderBy: { createdAt: 'desc', id: 'desc' }, limit: HOME_LIST_LIMIT });
  return {
    waiting: inReview.map((t) => {
      const step = steps.get(t.id);
      const submitted = step?.kind === 'submitted' ? step : null;
      return {
        ...toHomeTeardown(t),
        submittedBy: submitted?.author ? { id: submitted.author.id, name: submitted.author.name } : null,
        submittedAt: t.submittedAt?.toISOString() ?? submitted?.createdAt.toISOString() ?? null,
      };
    }),
    severeFindings: severe.map(toHomeFinding),
  };
}

/** Whole days between a YYYY-MM-DD date and today (UTC). */
export function daysSince(day: string, now = new Date()): number {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number];
  const today = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate());
  return Math.round((today - Date.UTC(y, m - 1, d)) / DAY_MS);
}

/** Parts and unpriced parts per teardown (a part is priced when the cost module holds a price for it). */
export async function partPriceCounts(em: EntityManager): Promise<Map<number, { parts: number; unpriced: number }>> {
  const rows = (await em
    .getConnection()
    .execute('select p.teardown_id as teardown, count(p.id) as parts, count(pp.id) as priced from parts p left join part_prices pp on pp.part_id = p.id group by p.teardown_id')) as {
    teardown: number;
    parts: number;
    priced: number;
  }[];
  return new Map(rows.map((r) => [Number(r.teardown), { parts: Number(r.parts), unpriced: Number(r.parts) - Number(r.priced) }]));
}

async function sourcingHome(em: EntityManager): Promise<SourcingHome> {
  const counts = await partPriceCounts(em);
  const ids = [...counts.entries()].filter(([, c]) => c.unpriced > 0).map(([id]) => id);
  const teardowns = ids.length ? await em.find(TeardownSchema, { id: { $in: ids } }, { populate: [...TEARDOWN_POPULATE] }) : [];
  const unpriced = teardowns.map((t) => ({ ...toHomeTeardown(t), ...counts.get(t.id)! })).sort((a, b) => b.unpriced - a.unpriced || b.unpriced / b.parts - a.unpriced / a.parts || a.id - b.id);
  const table = await currentRateTable(em);
  let rates: RatesAge | null = null;
  if (table) {
    const ageDays = daysSince(table.date);
    rates = { id: table.id, base: table.base, date: table.date, source: table.source, ageDays, stale: ageDays > RATES_STALE_AFTER_DAYS, staleAfterDays: RATES_STALE_AFTER_DAYS };
  }
  return { unpriced: unpriced.slice(0, HOME_LIST_LIMIT), unpricedTeardowns: unpriced.length, rates };
}

async function adminHome(em: EntityManager, deps: AppDeps): Promise<AdminHome> {
  const users = await em.find(UserSchema, {}, { orderBy: { id: 'asc' } });
  const usersByRole = Object.fromEntries(ROLES.map((r) => [r, 0])) as Record<Role, number>;
  for (const u of users) if (u.active) usersByRole[u.role] += 1;
  const recentlyActive = users
    .filter((u) => u.active && u.lastSignInAt)
    .sort((a, b) => b.lastSignInAt!.getTime() - a.lastSignInAt!.getTime() || a.id - b.id)
    .slice(0, 5)
    .map((u) => ({ id: u.id, name: u.name, role: u.role, lastSignInAt: u.lastSignInAt!.toISOString() }));
  const pending = await em.find(InvitationSchema, { acceptedAt: null, revokedAt: null, expiresAt: { $gt: new Date() } }, { populate: ['invitedBy'], orderBy: { createdAt: 'desc', id: 'desc' } });
  const messages = deps.outboxEnabled ? await em.find(OutboxMessageSchema, {}, { orderBy: { id: 'desc' }, limit: 5 }) : [];
  return {
    usersByRole,
    inactiveUsers: users.filter((u) => !u.active).length,
    recentlyActive,
    pendingInvitations: pending.map((i) => ({
      id: i.id,
      email: i.email,
      role: i.role,
      invitedBy: i.invitedBy?.name ?? null,
      createdAt: i.createdAt.toISOString(),
      expiresAt: i.expiresAt.toISOString(),
    })),
    outbox: { enabled: deps.outboxEnabled, messages: messages.map((m) => ({ id: m.id, receivedAt: m.receivedAt.toISOString(), to: m.to, subject: m.subject })) },
  };
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

function needsOf(blocks: Pick<HomeResponse, 'engineer' | 'lead' | 'sourcing' | 'admin'>): HomeResponse['needs'] {
  const items: HomeNeed[] = [];
  const add = (key: HomeNeed['key'], count: number, label: string) => {
    if (count > 0) items.push({ key, count, label });
  };
  const { engineer, lead, sourcing, admin } = blocks;
  if (engineer) {
    add('sent-back', engineer.sentBack.length, `${plural(engineer.sentBack.length, 'teardown', 'teardowns')} sent back to you`);
    add('drafts', engineer.drafts.length, `${plural(engineer.drafts.length, 'draft', 'drafts')} to finish and submit`);
  }
  if (lead) add('reviews', lead.waiting.length, `${plural(lead.waiting.length, 'teardown', 'teardowns')} waiting for your review`);
  if (sourcing) {
    add('unpriced', sourcing.unpricedTeardowns, `${plural(sourcing.unpricedTeardowns, 'teardown', 'teardowns')} with unpriced parts`);
    if (!sourcing.rates) add('rates', 1, 'no rate table yet');
    else if (sourcing.rates.stale) add('rates', 1, `rate table ${sourcing.rates.ageDays} days old`);
  }
  if (admin) add('invitations', admin.pendingInvitations.length, `${plural(admin.pendingInvitations.length, 'invitation', 'invitations')} not accepted yet`);
  return { total: items.reduce((s, i) => s + i.count, 0), items };
}

/** The home of the signed-in user: the blocks of their role, what needs them, and what is new. */
export async function homeFor(em: EntityManager, user: AuthUser, deps: AppDeps): Promise<HomeResponse> {
  const blocks = {
    engineer: user.role === 'engineer' ? await engineerHome(em, user) : null,
    lead: user.role === 'lead' ? await leadHome(em) : null,
    sourcing: user.role === 'sourcing' ? await sourcingHome(em) : null,
    admin: user.role === 'admin' ? await adminHome(em, deps) : null,
  };
  const readsDrafts = DRAFT_READERS.includes(user.role);
  const published = await em.find(TeardownSchema, { status: 'published' }, { populate: [...TEARDOWN_POPULATE], orderBy: { publishedAt: 'desc', id: 'desc' }, limit: HOME_LIST_LIMIT });
  const findingsWhere: FilterQuery<Finding> = readsDrafts ? {} : { teardown: { status: 'published' } };
  const findings = await em.find(FindingSchema, findingsWhere, { populate: ['teardown.device'], orderBy: { createdAt: 'desc', id: 'desc' }, limit: HOME_LIST_LIMIT });
  return {
    role: user.role,
    needs: needsOf(blocks),
    ...blocks,
    recent: { published: published.map(toHomeTeardown), findings: findings.map(toHomeFinding) },
  };
}
