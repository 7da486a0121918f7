// GET /api/home on the demo workspace: each role gets its own blocks, computed on the server.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { homeResponse, RATES_STALE_AFTER_DAYS, type HomeResponse } from '@splitcase/contracts';
import { PartPriceSchema } from '../../apps/api/src/modules/cost/part-price.entity';
import { FindingSchema } from '../../apps/api/src/modules/findings/finding.entity';
import { PartSchema } from '../../apps/api/src/modules/parts/part.entity';
import { TeardownSchema } from '../../apps/api/src/modules/teardowns/teardown.entity';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const agents: Record<string, Agent> = {};
const as = async (role: string) => (agents[role] ??= await t.as(role));
/** The caller's home, checked against the published response schema. */
const home = async (role: string): Promise<HomeResponse> => homeResponse.parse((await (await as(role)).get('/api/home').expect(200)).body);
const name = (x: { device: { maker: string; model: string } }) => `${x.device.maker} ${x.device.model}`;

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
});
afterAll(() => t.close());

/** Parts and unpriced parts of every teardown, counted straight from the tables. */
async function directUnpricedCounts(): Promise<Map<number, { parts: number; unpriced: number }>> {
  const em = t.orm.em.fork();
  const out = new Map<number, { parts: number; unpriced: number }>();
  for (const td of await em.find(TeardownSchema, {})) {
    const parts = await em.count(PartSchema, { teardown: td.id });
    const priced = await em.count(PartPriceSchema, { part: { teardown: td.id } });
    if (parts - priced > 0) out.set(td.id, { parts, unpriced: parts - priced });
  }
  return out;
}

describe('GET /api/home', () => {
  it('asks for a sign-in', async () => {
    const res = await (await t.anonymous()).get('/api/home').expect(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('gives each role its own blocks and no one else’s', async () => {
    const blocks = (h: HomeResponse) => (['engineer', 'lead', 'sourcing', 'admin'] as const).filter((k) => h[k] !== null);
    expect(blocks(await home('engineer'))).toEqual(['engineer']);
    expect(blocks(await home('lead'))).toEqual(['lead']);
    expect(blocks(await home('sourcing'))).toEqual(['sourcing']);
    expect(blocks(await home('admin'))).toEqual(['admin']);
    expect(blocks(await home('viewer'))).toEqual([]);
  });

  it('lead: the two demo teardowns in review, oldest submission first, with who submitted them; major and critical findings, newest first', async () => {
    const h = await home('lead');
    expect(h.lead!.waiting.map(name)).toEqual(['Halvix HandGlow Pro 2', 'Corvane Breeze Neck 2']);
    expect(h.lead!.waiting.map((w) => w.submittedBy?.name)).toEqual(['Tomas Reyne', 'Rafael Okonkwo-Lind']);
    // [C] the demo resubmission of the HandGlow Pro 2 is at 16:00 UTC on its teardown date
    expect(h.lead!.waiting[0]!.submittedAt).toBe('2026-11-14T16:00:00.000Z');
    expect(h.needs.items).toEqual([{ key: 'reviews', count: 2, label: '2 teardowns waiting for your review' }]);
    expect(h.needs.total).toBe(2);

    const em = t.orm.em.fork();
    const severe = await em.find(FindingSchema, { severity: { $in: ['major', 'critical'] } }, { orderBy: { createdAt: 'desc', id: 'desc' } });
    expect(severe.length).toBeGreaterThan(0);
    expect(h.lead!.severeFindings.map((f) => f.id)).toEqual(severe.slice(0, 8).map((f) => f.id));
    expect(h.lead!.severeFindings.every((f) => f.severity === 'major' || f.severity === 'critical')).toBe(true);
  });

  it('engineer: their own drafts and teardowns in review, not a colleague’s', async () => {
    const h = await home('engineer');
    expect(h.engineer!.drafts.map(name)).toEqual(['Pellam Works Stackcell 20 PD']);
    expect(h.engineer!.drafts.every((d) => d.engineer.name === 'Tomas Reyne' && d.status === 'draft')).toBe(true);
    expect(h.engineer!.inReview.map(name)).toEqual(['Halvix HandGlow Pro 2']);
    // Resubmitted after the demo send-back: no longer "sent back".
    expect(h.engineer!.sentBack).toEqual([]);
    expect(h.needs.items.map((i) => i.key)).toEqual(['drafts']);
  });

  it('engineer: a teardown sent back shows up with the reviewer’s note, and leaves the lead’s queue', async () => {
    const lead = await as('lead');
    const pro = (await home('lead')).lead!.waiting.find((w) => w.device.model === 'HandGlow Pro 2')!;
    const note = 'Add the thermal run of the rear flex before this goes out.';
    await lead.post(`/api/teardowns/${pro.id}/send-back`, { comment: note }).expect(200);

    const h = await home('engineer');
    expect(h.engineer!.sentBack).toHaveLength(1);
    expect(h.engineer!.sentBack[0]).toMatchObject({ id: pro.id, note, by: 'Jonah Velde', status: 'draft' });
    expect(h.engineer!.drafts.map((d) => d.id)).not.toContain(pro.id);
    expect(h.engineer!.inReview).toEqual([]);
    expect(h.needs.items[0]).toEqual({ key: 'sent-back', count: 1, label: '1 teardown sent back to you' });
    expect(h.needs.total).toBe(2);

    const after = await home('lead');
    expect(after.lead!.waiting.map(name)).toEqual(['Corvane Breeze Neck 2']);

    // Resubmitted: back in the lead's queue, out of the engineer's "sent back".
    await (await as('engineer')).post(`/api/teardowns/${pro.id}/submit`, { note: 'Thermal run added.' }).expect(200);
    expect((await home('engineer')).engineer!.sentBack).toEqual([]);
    expect((await home('lead')).lead!.waiting.map(name)).toEqual(['Corvane Breeze Neck 2', 'Halvix HandGlow Pro 2']);
  });

  it('sourcing: unpriced parts per teardown match a direct count, also after a price is removed', async () => {
    const before = await home('sourcing');
    const direct = await directUnpricedCounts();
    expect(before.sourcing!.unpricedTeardowns).toBe(direct.size);
    for (const row of before.sourcing!.unpriced) expect(direct.get(row.id)).toEqual({ parts: row.parts, unpriced: row.unpriced });

    // Remove the price of one priced part of a published teardown.
    const em = t.orm.em.fork();
    const price = await em.findOneOrFail(PartPriceSchema, { part: { teardown: { status: 'published' } } }, { populate: ['part'] });
    const teardownId = price.part.teardown.id;
    const was = direct.get(teardownId) ?? { parts: await em.count(PartSchema, { teardown: teardownId }), unpriced: 0 };
    await (await as('sourcing')).delete(`/api/parts/${price.part.id}/price`).expect(204);

    const after = await home('sourcing');
    const again = await directUnpricedCounts();
    const row = after.sourcing!.unpriced.find((r) => r.id === teardownId);
    expect(row).toBeDefined();
    expect({ parts: row!.parts, unpriced: row!.unpriced }).toEqual({ parts: was.parts, unpriced: was.unpriced + 1 });
    expect(again.get(teardownId)).toEqual({ parts: row!.parts, unpriced: row!.unpriced });
    expect(after.sourcing!.unpricedTeardowns).toBe(again.size);
    // Most unpriced first.
    const counts = after.sourcing!.unpriced.map((r) => r.unpriced);
    expect([...counts].sort((a, b) => b - a)).toEqual(counts);
  });

  it('sourcing: the age of the current rate table in days', async () => {
    const h = await home('sourcing');
    const rates = (await (await as('sourcing')).get('/api/rates').expect(200)).body.current;
    const now = new Date();
    // [C] whole days from the rate date to today, UTC
    const expected = Math.round((Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate()) - Date.parse(`${rates.date}T00:00:00Z`)) / 86_400_000);
    expect(h.sourcing!.rates).toMatchObject({ id: rates.id, date: rates.date, ageDays: expected, stale: expected > RATES_STALE_AFTER_DAYS, staleAfterDays: RATES_STALE_AFTER_DAYS });
    expect(h.needs.items.some((i) => i.key === 'rates')).toBe(expected > RATES_STALE_AFTER_DAYS);
  });

  it('admin: users by role, pending invitations (also one just made) and the outbox', async () => {
    const admin = await as('admin');
    const before = await home('admin');
    // [C] the demo team: one user per role and a second engineer
    expect(before.admin!.usersByRole).toEqual({ admin: 1, engineer: 2, sourcing: 1, lead: 1, viewer: 1 });
    expect(before.admin!.recentlyActive.map((u) => u.name)).toContain('Priya Castell');
    const pendingBefore = before.admin!.pendingInvitations.length;

    await admin.post('/api/invitations', { email: 'new.tester@splitcase.test', role: 'sourcing' }).expect(201);
    await t.waitForMail('new.tester@splitcase.test');
    const after = await home('admin');
    expect(after.admin!.pendingInvitations).toHaveLength(pendingBefore + 1);
    expect(after.admin!.pendingInvitations[0]).toMatchObject({ email: 'new.tester@splitcase.test', role: 'sourcing', invitedBy: 'Priya Castell' });
    expect(after.needs.items).toContainEqual({ key: 'invitations', count: pendingBefore + 1, label: `${pendingBefore + 1} invitation${pendingBefore + 1 === 1 ? '' : 's'} not accepted yet` });
    expect(after.admin!.outbox.enabled).toBe(true);
    expect(after.admin!.outbox.messages[0]).toMatchObject({ to: 'new.tester@splitcase.test', subject: 'Priya Castell invited you to Splitcase' });

    // Revoked: no longer pending.
    const id = after.admin!.pendingInvitations[0]!.id;
    await admin.delete(`/api/invitations/${id}`).expect(204);
    expect((await home('admin')).admin!.pendingInvitations.map((i) => i.id)).not.toContain(id);
  });

  it('viewer: published teardowns and their findings only, nothing that needs them', async () => {
    const h = await home('viewer');
    expect(h.needs).toEqual({ total: 0, items: [] });
    expect(h.recent.published.length).toBeGreaterThan(0);
    expect(h.recent.published.every((p) => p.status === 'published')).toBe(true);
    const em = t.orm.em.fork();
    const published = new Set((await em.find(TeardownSchema, { status: 'published' })).map((x) => x.id));
    expect(h.recent.findings.length).toBeGreaterThan(0);
    expect(h.recent.findings.every((f) => published.has(f.teardownId))).toBe(true);
    // Newest published first.
    const at = h.recent.published.map((p) => p.publishedAt!);
    expect([...at].sort().reverse()).toEqual(at);

    // A lead sees findings of drafts and teardowns in review as well.
    const lead = await home('lead');
    expect(lead.recent.findings.some((f) => !published.has(f.teardownId))).toBe(true);
  });
});
