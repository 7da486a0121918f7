// Devices, teardowns, the review workflow, comments, history, findings and figures, through the API.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CONFIRM_UNPUBLISH_HEADER } from '@splitcase/contracts';
import { FIGURE_CONTRIBUTORS } from '../../apps/api/src/modules/figures/contributors';
import { PartSchema } from '../../apps/api/src/modules/parts/part.entity';
import { ConverterSchema } from '../../apps/api/src/modules/power/converter.entity';
import { LoadSchema } from '../../apps/api/src/modules/power/load.entity';
import { PackSchema } from '../../apps/api/src/modules/power/pack.entity';
import { linkIn, makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const agents: Record<string, Agent> = {};
const as = async (role: string) => (agents[role] ??= await t.as(role));

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
});
afterAll(() => t.close());

const NON_EDITORS = ['sourcing', 'lead', 'viewer'] as const;

async function newDevice(over: Record<string, unknown> = {}) {
  const eng = await as('engineer');
  const res = await eng.post('/api/devices', { maker: 'Testwright', model: `Bench ${Math.random().toString(36).slice(2, 8)}`, category: 'power-bank', ...over }).expect(201);
  return res.body.device as { id: number; maker: string; model: string };
}

async function newTeardown(deviceId?: number, over: Record<string, unknown> = {}) {
  const eng = await as('engineer');
  const id = deviceId ?? (await newDevice()).id;
  const res = await eng.post('/api/teardowns', { deviceId: id, ...over }).expect(201);
  return res.body.teardown as { id: number; version: number; status: string; date: string };
}

/** Find a demo teardown by its device. */
async function demoTeardown(maker: string, model: string) {
  const admin = await as('admin');
  const devices = (await admin.get(`/api/devices?maker=${encodeURIComponent(maker)}`).expect(200)).body.devices as { id: number; model: string; latestTeardown: { id: number; status: string } }[];
  const d = devices.find((x) => x.model === model)!;
  return { deviceId: d.id, teardownId: d.latestTeardown.id, status: d.latestTeardown.status };
}

describe('devices', () => {
  it('creates a device with label claims typed with units, stores SI and shows the text typed', async () => {
    const eng = await as('engineer');
    const res = await eng
      .post('/api/devices', {
        maker: 'Testwright',
        model: 'Claims 1',
        category: 'power-bank',
        retailPrice: '19.90',
        currency: 'eur',
        priceSeenOn: '2026-11-02',
        whereBought: 'Test bench (invented)',
        claimCapacityAh: '5000 mAh',
        claimCapacityWh: '18.5 Wh',
        claimOutputWatts: '10 W',
        claimRuntimeH: '90 min',
        claimPowerW: 9,
        claimOutputText: 'USB-A 5 V 2 A',
      })
      .expect(201);
    const d = res.body.device;
    // [C] 5000 mAh = 5.000 Ah; 90 min = 1.5 h
    expect(d).toMatchObject({ maker: 'Testwright', retailPrice: 19.9, currency: 'EUR', claimCapacityAh: 5, claimCapacityWh: 18.5, claimOutputWatts: 10, claimRuntimeH: 1.5, claimPowerW: 9 });
    expect(d.entered).toEqual({ claimCapacityAh: '5000 mAh', claimCapacityWh: '18.5 Wh', claimOutputWatts: '10 W', claimRuntimeH: '90 min' });
    const again = (await eng.get(`/api/devices/${d.id}`).expect(200)).body;
    expect(again.device.entered.claimCapacityAh).toBe('5000 mAh');
    expect(again.teardowns).toEqual([]);
  });

  it('a runtime typed as a bare number is in hours', async () => {
    const d = (await (await as('engineer')).post('/api/devices', { maker: 'Testwright', model: 'Runtime', category: 'usb-fan', claimRuntimeH: '6' }).expect(201)).body.device;
    expect(d.claimRuntimeH).toBe(6);
  });

  it('refuses bad input, naming every field', async () => {
    const eng = await as('engineer');
    const res = await eng.post('/api/devices', { maker: '', model: 'X', category: 'toaster' }).expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['category', 'maker']);

    const units = await eng.post('/api/devices', { maker: 'M', model: 'X', category: 'other', claimCapacityAh: '18.5 Wh', claimOutputWatts: 'lots', claimRuntimeH: 'soon' }).expect(400);
    expect(Object.keys(units.body.error.fields).sort()).toEqual(['claimCapacityAh', 'claimOutputWatts', 'claimRuntimeH']);
    expect(units.body.error.fields.claimCapacityAh).toMatch(/capacity/);

    const price = await eng.post('/api/devices', { maker: 'M', model: 'X', category: 'other', retailPrice: '12.50' }).expect(400);
    expect(price.body.error.fields).toEqual({ currency: expect.stringMatching(/currency/) });
    const bad = await eng.post('/api/devices', { maker: 'M', model: 'X', category: 'other', retailPrice: 'cheap', currency: 'US', priceSeenOn: '2026-02-30' }).expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['currency', 'priceSeenOn', 'retailPrice']);
    const zero = await eng.post('/api/devices', { maker: 'M', model: 'X', category: 'other', claimCapacityAh: '0 mAh' }).expect(400);
    expect(zero.body.error.fields.claimCapacityAh).toMatch(/more than zero/);
    // Nothing was half-saved.
    const list = (await eng.get('/api/devices?maker=M').expect(200)).body.devices as { maker: string }[];
    expect(list.filter((d) => d.maker === 'M')).toEqual([]);
  });

  it('only engineers and admins add devices', async () => {
    const body = { maker: 'Testwright', model: 'Roles', category: 'other' };
    await (await t.anonymous()).post('/api/devices', body).expect(401);
    for (const role of NON_EDITORS) {
      const res = await (await as(role)).post('/api/devices', body).expect(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    await (await as('admin')).post('/api/devices', body).expect(201);
  });

  it('lists devices with filters; each row carries its latest teardown; viewers see published ones only', async () => {
    const eng = await as('engineer');
    const all = (await eng.get('/api/devices').expect(200)).body.devices as { maker: string; model: string; category: string; latestTeardown: { id: number; status: string } | null }[];
    expect(all.length).toBeGreaterThanOrEqual(10);
    const duo = all.find((d) => d.model === 'HandGlow Duo 10')!;
    expect(duo.latestTeardown).toMatchObject({ id: expect.any(Number), status: 'published' });
    const heaters = (await eng.get('/api/devices?category=pocket-heater').expect(200)).body.devices as { category: string }[];
    expect(heaters.length).toBe(3);
    expect(heaters.every((d) => d.category === 'pocket-heater')).toBe(true);
    const corvane = (await eng.get('/api/devices?maker=Corvane').expect(200)).body.devices as { maker: string }[];
    expect(corvane.map((d) => d.maker)).toEqual(['Corvane', 'Corvane']);
    await eng.get('/api/devices?category=toaster').expect(400);

    const viewer = await as('viewer');
    const seen = (await viewer.get('/api/devices').expect(200)).body.devices as { model: string; latestTeardown: { status: string } }[];
    expect(seen.every((d) => d.latestTeardown.status === 'published')).toBe(true);
    expect(seen.map((d) => d.model)).not.toContain('Stackcell 20 PD'); // draft only
    expect(seen.map((d) => d.model)).toContain('HandGlow Duo 10');
    const draftOnly = await demoTeardown('Pellam Works', 'Stackcell 20 PD');
    await viewer.get(`/api/devices/${draftOnly.deviceId}`).expect(404);
    const duoDevice = await demoTeardown('Halvix', 'HandGlow Duo 10');
    const duoDetail = (await viewer.get(`/api/devices/${duoDevice.deviceId}`).expect(200)).body;
    expect(duoDetail.teardowns.every((x: { status: string }) => x.status === 'published')).toBe(true);
  });

  it('changes a device (clearing a claim) and audits it; only engineers and admins may', async () => {
    const eng = await as('engineer');
    const d = (await eng.post('/api/devices', { maker: 'Testwright', model: 'Patch', category: 'headlamp', claimCapacityAh: '1200 mAh' }).expect(201)).body.device;
    const res = await eng.patch(`/api/devices/${d.id}`, { retailPrice: 22, currency: 'USD', claimCapacityAh: '', claimCapacityWh: '4.4 Wh' }).expect(200);
    expect(res.body.device).toMatchObject({ retailPrice: 22, currency: 'USD', claimCapacityAh: null, claimCapacityWh: 4.4, entered: { claimCapacityWh: '4.4 Wh' } });
    await eng.patch(`/api/devices/${d.id}`, { retailPrice: 30, currency: '' }).expect(400);
    await eng.patch(`/api/devices/${d.id}`, {}).expect(400);
    for (const role of NON_EDITORS) await (await as(role)).patch(`/api/devices/${d.id}`, { model: 'Nope' }).expect(403);
    await eng.patch('/api/devices/999999', { model: 'Nope' }).expect(404);
    const audit = (await (await as('admin')).get(`/api/audit?entityType=device&entityId=${d.id}`).expect(200)).body.entries;
    expect(audit[0]).toMatchObject({ action: 'device.updated', changes: { retailPrice: { from: null, to: 22 }, claimCapacityAh: { from: 1.2, to: null } } });
  });

  it('deletes a device only as admin and only without teardowns', async () => {
    const d = await newDevice();
    await (await as('engineer')).delete(`/api/devices/${d.id}`).expect(403);
    await (await as('admin')).delete(`/api/devices/${d.id}`).expect(204);
    await (await as('admin')).get(`/api/devices/${d.id}`).expect(404);
    const withTeardown = await newDevice();
    await newTeardown(withTeardown.id);
    const res = await (await as('admin')).delete(`/api/devices/${withTeardown.id}`).expect(409);
    expect(res.body.error).toMatchObject({ code: 'conflict', message: expect.stringMatching(/1 teardown/) });
  });
});

describe('teardowns', () => {
  it('starts a draft with only a device id (date today, version 1) and lists it on the device', async () => {
    const d = await newDevice();
    const td = await newTeardown(d.id);
    expect(td).toMatchObject({ status: 'draft', version: 1, date: new Date().toISOString().slice(0, 10) });
    const detail = (await (await as('lead')).get(`/api/devices/${d.id}`).expect(200)).body;
    expect(detail.device.latestTeardown).toMatchObject({ id: td.id, status: 'draft' });
    expect(detail.teardowns[0]).toMatchObject({ id: td.id, engineer: { name: 'Tomas Reyne' }, findingCount: 0 });
  });

  it('refuses bad input naming the fields, and non-editors', async () => {
    const eng = await as('engineer');
    const res = await eng.post('/api/teardowns', { deviceId: 999999 }).expect(400);
    expect(res.body.error.fields).toEqual({ deviceId: 'No such device' });
    const d = await newDevice();
    const bad = await eng.post('/api/teardowns', { deviceId: d.id, date: '12/10/2026', contactSeconds: 0 }).expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['contactSeconds', 'date']);
    await (await t.anonymous()).post('/api/teardowns', { deviceId: d.id }).expect(401);
    for (const role of NON_EDITORS) await (await as(role)).post('/api/teardowns', { deviceId: d.id }).expect(403);
  });

  it('edits with the version; a stale version gets 409 with the current record', async () => {
    const td = await newTeardown(undefined, { unitLabel: 'Unit A' });
    const eng = await as('engineer');
    const first = (await eng.patch(`/api/teardowns/${td.id}`, { version: 1, summary: 'First look: one cell, one boost stage.', contactSeconds: '600' }).expect(200)).body.teardown;
    expect(first).toMatchObject({ version: 2, summary: 'First look: one cell, one boost stage.', contactSeconds: 600 });
    const stale = await (await as('admin')).patch(`/api/teardowns/${td.id}`, { version: 1, summary: 'Edited from an old tab' }).expect(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect(stale.body.error.details.current).toMatchObject({ id: td.id, version: 2, summary: 'First look: one cell, one boost stage.' });
    // Nothing was lost: the first edit stands.
    expect((await eng.get(`/api/teardowns/${td.id}`).expect(200)).body.teardown.summary).toBe('First look: one cell, one boost stage.');
    // Re-applied on the current version it goes through.
    await (await as('admin')).patch(`/api/teardowns/${td.id}`, { version: 2, safetyNotes: 'Cell discharged to 3.0 V first.' }).expect(200);

    const invalid = await eng.patch(`/api/teardowns/${td.id}`, { version: 3, contactSeconds: 99999, date: '2026-13-01' }).expect(400);
    expect(Object.keys(invalid.body.error.fields).sort()).toEqual(['contactSeconds', 'date']);
    const nothing = await eng.patch(`/api/teardowns/${td.id}`, { version: 3 }).expect(400);
    expect(nothing.body.error.message).toMatch(/Check/);
    const noVersion = await eng.patch(`/api/teardowns/${td.id}`, { summary: 'x' }).expect(400);
    expect(noVersion.body.error.fields).toHaveProperty('version');
    await (await t.anonymous()).patch(`/api/teardowns/${td.id}`, { version: 3, summary: 'x' }).expect(401);
    for (const role of NON_EDITORS) await (await as(role)).patch(`/api/teardowns/${td.id}`, { version: 3, summary: 'x' }).expect(403);
  });

  it('viewers cannot see drafts (404) but see published teardowns', async () => {
    const viewer = await as('viewer');
    const draft = await demoTeardown('Pellam Works', 'Stackcell 20 PD');
    const res = await viewer.get(`/api/teardowns/${draft.teardownId}`).expect(404);
    expect(res.body.error.code).toBe('not_found');
    await viewer.get(`/api/teardowns/${draft.teardownId}/findings`).expect(404);
    await viewer.get(`/api/teardowns/${draft.teardownId}/figures`).expect(404);
    await viewer.get(`/api/teardowns/${draft.teardownId}/comments`).expect(404);
    const published = await demoTeardown('Zestora', 'Pocketsun S');
    const ok = (await viewer.get(`/api/teardowns/${published.teardownId}`).expect(200)).body.teardown;
    expect(ok).toMatchObject({ status: 'published', permissions: { edit: false, review: false, comment: false } });
  });

  it('editing a published teardown needs the confirm header and moves it back to draft', async () => {
    const pub = await demoTeardown('Nordwick Outdoor', 'Ridgeline 400');
    const eng = await as('engineer');
    const current = (await eng.get(`/api/teardowns/${pub.teardownId}`).expect(200)).body.teardown;
    expect(current.status).toBe('published');
    const refused = await eng.patch(`/api/teardowns/${pub.teardownId}`, { version: current.version, unitLabel: 'Unit A (rev 2)' }).expect(409);
    expect(refused.body.error).toMatchObject({ code: 'conflict', details: { reason: 'published' } });
    expect((await eng.get(`/api/teardowns/${pub.teardownId}`).expect(200)).body.teardown).toMatchObject({ status: 'published', unitLabel: 'Unit A' });
    const ok = await eng.patch(`/api/teardowns/${pub.teardownId}`, { version: current.version, unitLabel: 'Unit A (rev 2)' }).set(CONFIRM_UNPUBLISH_HEADER, 'yes').expect(200);
    expect(ok.body.teardown).toMatchObject({ status: 'draft', unitLabel: 'Unit A (rev 2)', publishedAt: null });
    const history = (await eng.get(`/api/teardowns/${pub.teardownId}/history`).expect(200)).body.entries as { action: string }[];
    expect(
      history
        .slice(0, 2)
        .map((e) => e.action)
        .sort(),
    ).toEqual(['teardown.unpublished', 'teardown.updated']);
    await (await as('viewer')).get(`/api/teardowns/${pub.teardownId}`).expect(404);
  });
});

describe('review workflow', () => {
  it('draft → in review (leads e-mailed) → sent back (engineer e-mailed) → in review → published', async () => {
    const d = await newDevice({ model: 'Review Flow 1' });
    const td = await newTeardown(d.id, { unitLabel: 'Unit R' });
    const eng = await as('engineer');
    const lead = await as('lead');

    for (const role of NON_EDITORS) await (await as(role)).post(`/api/teardowns/${td.id}/submit`, {}).expect(403);
    await (await t.anonymous()).post(`/api/teardowns/${td.id}/submit`, {}).expect(401);
    await lead.post(`/api/teardowns/${td.id}/approve`, {}).expect(409);

    const submitted = (await eng.post(`/api/teardowns/${td.id}/submit`, { note: 'Parts and power done.' }).expect(200)).body.teardown;
    expect(submitted).toMatchObject({ status: 'in_review', submittedAt: expect.any(String) });
    const mail = await t.waitForMail('lead@splitcase.test');
    expect(mail.subject).toBe(`Review requested: Testwright Review Flow 1 (Unit R)`);
    expect(mail.text).toContain('Parts and power done.');
    expect(linkIn(mail.text).pathname).toBe(`/teardowns/${td.id}`);

    const again = await eng.post(`/api/teardowns/${td.id}/submit`, {}).expect(409);
    expect(again.body.error.message).toMatch(/in review/);
    await (await as('viewer')).get(`/api/teardowns/${td.id}`).expect(404);

    for (const role of ['engineer', 'sourcing', 'viewer']) {
      await (await as(role)).post(`/api/teardowns/${td.id}/approve`, {}).expect(403);
      await (await as(role)).post(`/api/teardowns/${td.id}/send-back`, { comment: 'x' }).expect(403);
    }
    const missing = await lead.post(`/api/teardowns/${td.id}/send-back`, {}).expect(400);
    expect(missing.body.error.fields).toHaveProperty('comment');
    const blank = await lead.post(`/api/teardowns/${td.id}/send-back`, { comment: '   ' }).expect(400);
    expect(blank.body.error.fields).toHaveProperty('comment');

    const before = (await t.waitForMail('lead@splitcase.test')).id;
    const back = (await lead.post(`/api/teardowns/${td.id}/send-back`, { comment: 'Please add the cell marking photo.' }).expect(200)).body.teardown;
    expect(back).toMatchObject({ status: 'draft', lastReviewNote: 'Please add the cell marking photo.' });
    const toEngineer = await t.waitForMail('engineer@splitcase.test', before);
    expect(toEngineer.subject).toBe('Sent back: Testwright Review Flow 1 (Unit R)');
    expect(toEngineer.text).toContain('Please add the cell marking photo.');
    expect(linkIn(toEngineer.text).pathname).toBe(`/teardowns/${td.id}`);

    await eng.post(`/api/teardowns/${td.id}/submit`, {}).expect(200);
    const published = (await lead.post(`/api/teardowns/${td.id}/approve`, { note: 'Looks right.' }).expect(200)).body.teardown;
    expect(published).toMatchObject({ status: 'published', publishedAt: expect.any(String) });
    const sendBackPublished = await lead.post(`/api/teardowns/${td.id}/send-back`, { comment: 'x' }).expect(409);
    expect(sendBackPublished.body.error.message).toMatch(/published/);
    expect((await (await as('viewer')).get(`/api/teardowns/${td.id}`).expect(200)).body.teardown.status).toBe('published');

    const comments = (await eng.get(`/api/teardowns/${td.id}/comments`).expect(200)).body.comments as { kind: string; body: string; author: { name: string } }[];
    expect(comments.map((c) => c.kind)).toEqual(['submitted', 'sent-back', 'submitted', 'approved']);
    expect(comments[1]).toMatchObject({ body: 'Please add the cell marking photo.', author: { name: 'Jonah Velde' } });
    const history = (await eng.get(`/api/teardowns/${td.id}/history`).expect(200)).body.entries as { action: string; actor: string }[];
    expect(history.map((e) => e.action)).toEqual(['teardown.approved', 'teardown.submitted', 'teardown.sent-back', 'teardown.submitted', 'teardown.created']);
    expect(history[0]!.actor).toBe('Jonah Velde');
  });

  it('when the e-mail cannot be sent, the submission is undone and the history says so', async () => {
    const td = await newTeardown();
    const original = t.deps.mailer.send;
    t.deps.mailer.send = async () => {
      throw new Error('SMTP refused (test)');
    };
    const logged = t.deps.log;
    t.deps.log = () => {};
    try {
      const res = await (await as('engineer')).post(`/api/teardowns/${td.id}/submit`, {}).expect(502);
      expect(res.body.error.message).toMatch(/not submitted/);
    } finally {
      t.deps.mailer.send = original;
      t.deps.log = logged;
    }
    const eng = await as('engineer');
    expect((await eng.get(`/api/teardowns/${td.id}`).expect(200)).body.teardown).toMatchObject({ status: 'draft', submittedAt: null });
    expect((await eng.get(`/api/teardowns/${td.id}/comments`).expect(200)).body.comments).toEqual([]);
    const history = (await eng.get(`/api/teardowns/${td.id}/history`).expect(200)).body.entries as { action: string }[];
    expect(history.map((e) => e.action)).toEqual(['teardown.submit-undone', 'teardown.submitted', 'teardown.created']);
  });

  it('a teardown in review is read-only: every write to it or its records is refused with 409 in_review, with or without the confirm', async () => {
    const td = await newTeardown(undefined, { summary: 'Before review' });
    const eng = await as('engineer');
    const part = (await eng.post(`/api/teardowns/${td.id}/parts`, { designator: 'R1', category: 'passive', description: 'Sense resistor', quantity: 1 }).expect(201)).body.part as { id: number };
    const reading = (await eng.post(`/api/teardowns/${td.id}/measurements`, { quantity: 'resistance', subject: 'Heater flex, cold', value: '3.02 Ω' }).expect(201)).body.measurement as { id: number };
    const finding = (await eng.post(`/api/teardowns/${td.id}/findings`, { kind: 'safety', severity: 'minor', text: 'Loose wire' }).expect(201)).body.finding as { id: number };
    await eng.post(`/api/teardowns/${td.id}/loads`, { kind: 'heater', resistanceOhms: 3 }).expect(201);
    const submitted = (await eng.post(`/api/teardowns/${td.id}/submit`, {}).expect(200)).body.teardown;

    const writes: [string, () => PromiseLike<{ status: number; body: { error?: { code: string; message: string; details?: unknown } } }>][] = [
      ['PATCH teardown', () => eng.patch(`/api/teardowns/${td.id}`, { version: submitted.version, summary: 'Changed in review' })],
      ['POST part', () => eng.post(`/api/teardowns/${td.id}/parts`, { designator: 'R2', category: 'passive', description: 'Another', quantity: 1 })],
      ['PATCH part', () => eng.patch(`/api/parts/${part.id}`, { description: 'Changed' })],
      ['DELETE part', () => eng.delete(`/api/parts/${part.id}`)],
      ['PUT pack', () => eng.put(`/api/teardowns/${td.id}/pack`, { chemistry: 'li-ion', nominalVolts: '3.7 V', capacityAh: '2 Ah' })],
      ['POST load', () => eng.post(`/api/teardowns/${td.id}/loads`, { kind: 'heater', resistanceOhms: 3 })],
      ['POST measurement', () => eng.post(`/api/teardowns/${td.id}/measurements`, { quantity: 'resistance', subject: 'Another', value: '1 Ω' })],
      ['PATCH measurement', () => eng.patch(`/api/measurements/${reading.id}`, { value: '3.1 Ω' })],
      ['PATCH finding', () => eng.patch(`/api/teardowns/${td.id}/findings/${finding.id}`, { text: 'Changed' })],
      ['POST finding', () => eng.post(`/api/teardowns/${td.id}/findings`, { kind: 'safety', severity: 'minor', text: 'Another' })],
      ['POST mode', () => eng.post(`/api/teardowns/${td.id}/modes`, { name: 'High', loads: [] })],
      ['photo upload', () => eng.upload(`/api/teardowns/${td.id}/photos`).attach('file', Buffer.from('not read'), 'x.jpg')],
      ['PATCH teardown, confirmed', () => eng.patch(`/api/teardowns/${td.id}`, { version: submitted.version, summary: 'Changed in review' }).set(CONFIRM_UNPUBLISH_HEADER, 'yes')],
      ['POST part, confirmed', () => eng.post(`/api/teardowns/${td.id}/parts`, { designator: 'R2', category: 'passive', description: 'Another', quantity: 1 }).set(CONFIRM_UNPUBLISH_HEADER, 'yes')],
    ];
    for (const [what, write] of writes) {
      const res = await write();
      expect([what, res.status]).toEqual([what, 409]);
      expect(res.body.error).toMatchObject({ code: 'conflict', details: { reason: 'in_review' } });
      expect(res.body.error!.message).toMatch(/in review/);
    }
    const after = (await eng.get(`/api/teardowns/${td.id}`).expect(200)).body.teardown;
    expect(after).toMatchObject({ status: 'in_review', summary: 'Before review', version: submitted.version, permissions: { edit: false, withdraw: true } });
    expect(((await eng.get(`/api/teardowns/${td.id}/parts`).expect(200)).body.parts as unknown[]).length).toBe(1);
    // Comments stay open during review.
    await (await as('lead')).post(`/api/teardowns/${td.id}/comments`, { body: 'Looking at it now.' }).expect(201);
  });

  it('its engineer or an admin withdraws a teardown from review to edit it; others may not', async () => {
    const td = await newTeardown();
    const eng = await as('engineer');
    await eng.post(`/api/teardowns/${td.id}/submit`, {}).expect(200);
    for (const role of ['engineer2', 'lead', 'sourcing']) {
      const res = await (await as(role)).post(`/api/teardowns/${td.id}/withdraw`, {}).expect(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    await (await as('viewer')).post(`/api/teardowns/${td.id}/withdraw`, {}).expect(403);
    expect((await (await as('engineer2')).get(`/api/teardowns/${td.id}`).expect(200)).body.teardown.permissions).toMatchObject({ edit: false, withdraw: false });

    const withdrawn = (await eng.post(`/api/teardowns/${td.id}/withdraw`, {}).expect(200)).body.teardown;
    expect(withdrawn).toMatchObject({ status: 'draft', permissions: { edit: true, withdraw: false } });
    const twice = await eng.post(`/api/teardowns/${td.id}/withdraw`, {}).expect(409);
    expect(twice.body.error).toMatchObject({ code: 'conflict', details: { status: 'draft' } });
    await eng.patch(`/api/teardowns/${td.id}`, { version: withdrawn.version, summary: 'Edited after withdrawing' }).expect(200);
    const history = (await eng.get(`/api/teardowns/${td.id}/history`).expect(200)).body.entries as { action: string }[];
    expect(history.map((e) => e.action).slice(0, 3)).toEqual(['teardown.updated', 'teardown.withdrawn', 'teardown.submitted']);

    await eng.post(`/api/teardowns/${td.id}/submit`, {}).expect(200);
    expect((await (await as('admin')).post(`/api/teardowns/${td.id}/withdraw`, {}).expect(200)).body.teardown.status).toBe('draft');
  });

  it('admins may approve; a wrong state names the state', async () => {
    const td = await newTeardown();
    const admin = await as('admin');
    const res = await admin.post(`/api/teardowns/${td.id}/approve`, {}).expect(409);
    expect(res.body.error).toMatchObject({ code: 'conflict', details: { status: 'draft' } });
    expect(res.body.error.message).toMatch(/draft/);
    await (await as('engineer')).post(`/api/teardowns/${td.id}/submit`, {}).expect(200);
    await admin.post(`/api/teardowns/${td.id}/approve`, {}).expect(200);
  });
});

describe('comments and history', () => {
  it('every role but viewer comments; everyone who can read sees them', async () => {
    const pub = await demoTeardown('Zestora', 'Slimvolt 5');
    for (const role of ['admin', 'engineer', 'sourcing', 'lead']) {
      const res = await (await as(role)).post(`/api/teardowns/${pub.teardownId}/comments`, { body: `Note from ${role}` }).expect(201);
      expect(res.body.comment).toMatchObject({ kind: 'comment', body: `Note from ${role}`, author: { name: expect.any(String) } });
    }
    await (await as('viewer')).post(`/api/teardowns/${pub.teardownId}/comments`, { body: 'x' }).expect(403);
    await (await t.anonymous()).post(`/api/teardowns/${pub.teardownId}/comments`, { body: 'x' }).expect(401);
    const empty = await (await as('lead')).post(`/api/teardowns/${pub.teardownId}/comments`, { body: '' }).expect(400);
    expect(empty.body.error.fields).toHaveProperty('body');
    const seen = (await (await as('viewer')).get(`/api/teardowns/${pub.teardownId}/comments`).expect(200)).body.comments as { body: string }[];
    expect(seen.map((c) => c.body)).toContain('Note from lead');
    // Commenting is not an edit: the teardown stays published.
    expect((await (await as('viewer')).get(`/api/teardowns/${pub.teardownId}`).expect(200)).body.teardown.status).toBe('published');
    const history = (await (await as('lead')).get(`/api/teardowns/${pub.teardownId}/history`).expect(200)).body.entries as { action: string; summary: string }[];
    expect(history[0]).toMatchObject({ action: 'comment.created', summary: 'Commented: Note from lead' });
  });

  it('the demo seed carries review history for teardowns in review and published', async () => {
    const pro = await demoTeardown('Halvix', 'HandGlow Pro 2');
    const eng = await as('engineer');
    const comments = (await eng.get(`/api/teardowns/${pro.teardownId}/comments`).expect(200)).body.comments as { kind: string }[];
    expect(comments.map((c) => c.kind)).toEqual(['submitted', 'sent-back', 'comment', 'submitted', 'comment']);
    const history = (await eng.get(`/api/teardowns/${pro.teardownId}/history`).expect(200)).body.entries as { action: string }[];
    expect(history.at(-1)!.action).toBe('teardown.created');
    expect(history.map((e) => e.action)).toContain('teardown.sent-back');
  });

  it('history records field changes with who and what', async () => {
    const td = await newTeardown();
    await (await as('engineer')).patch(`/api/teardowns/${td.id}`, { version: 1, summary: 'One pouch cell.' }).expect(200);
    const entries = (await (await as('sourcing')).get(`/api/teardowns/${td.id}/history`).expect(200)).body.entries;
    expect(entries[0]).toMatchObject({ action: 'teardown.updated', actor: 'Tomas Reyne', summary: 'Edited summary', changes: { summary: { from: null, to: 'One pouch cell.' } } });
  });
});

describe('findings', () => {
  it('records, lists (most severe first), changes and deletes findings with linked parts', async () => {
    const td = await newTeardown();
    const em = t.orm.em.fork();
    const part = em.create(PartSchema, { teardown: td.id, designators: 'U1', category: 'ic', description: 'Charger and boost IC' } as never);
    await em.flush();
    const eng = await as('engineer');
    const note = (
      await eng
        .post(`/api/teardowns/${td.id}/findings`, { kind: 'clever-idea', severity: 'note', text: 'One IC does charging and boost.', tags: ['Power-Path', 'power-path'], partIds: [part.id] })
        .expect(201)
    ).body.finding;
    expect(note).toMatchObject({
      id: expect.any(Number),
      kind: 'clever-idea',
      severity: 'note',
      tags: ['power-path'],
      parts: [{ id: part.id, designators: 'U1', description: 'Charger and boost IC' }],
      photos: [],
    });
    const major = (await eng.post(`/api/teardowns/${td.id}/findings`, { kind: 'safety', severity: 'major', text: 'No fuse.', tags: [] }).expect(201)).body.finding;
    const list = (await eng.get(`/api/teardowns/${td.id}/findings`).expect(200)).body;
    expect(list.findings.map((f: { id: number }) => f.id)).toEqual([major.id, note.id]);
    expect(list.parts).toEqual([{ id: part.id, designators: 'U1', description: 'Charger and boost IC', category: 'ic' }]);

    const changed = (await eng.patch(`/api/teardowns/${td.id}/findings/${major.id}`, { severity: 'critical', partIds: [part.id] }).expect(200)).body.finding;
    expect(changed).toMatchObject({ severity: 'critical', parts: [{ id: part.id }] });
    await eng.delete(`/api/teardowns/${td.id}/findings/${note.id}`).expect(204);
    expect((await eng.get(`/api/teardowns/${td.id}/findings`).expect(200)).body.findings.map((f: { id: number }) => f.id)).toEqual([major.id]);
    await eng.delete(`/api/teardowns/${td.id}/findings/${note.id}`).expect(404);
    const history = (await eng.get(`/api/teardowns/${td.id}/history`).expect(200)).body.entries as { action: string }[];
    expect(history.slice(0, 4).map((e) => e.action)).toEqual(['finding.deleted', 'finding.updated', 'finding.created', 'finding.created']);
  });

  it('refuses bad input naming the fields, and parts of another teardown', async () => {
    const td = await newTeardown();
    const other = await demoTeardown('Halvix', 'HandGlow Duo 10');
    const em = t.orm.em.fork();
    const foreign = em.create(PartSchema, { teardown: other.teardownId, category: 'passive', description: 'Someone else’s resistor' } as never);
    await em.flush();
    const eng = await as('engineer');
    const res = await eng.post(`/api/teardowns/${td.id}/findings`, { kind: 'bogus', severity: 'huge', text: '', tags: ['ok', ''] }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['kind', 'severity', 'tags.1', 'text']);
    const link = await eng.post(`/api/teardowns/${td.id}/findings`, { kind: 'safety', severity: 'minor', text: 'x', tags: [], partIds: [foreign.id], photoIds: [424242] }).expect(400);
    expect(Object.keys(link.body.error.fields).sort()).toEqual(['partIds', 'photoIds']);
    expect((await eng.get(`/api/teardowns/${td.id}/findings`).expect(200)).body.findings).toEqual([]);
    const f = (await eng.post(`/api/teardowns/${td.id}/findings`, { kind: 'safety', severity: 'minor', text: 'x', tags: [] }).expect(201)).body.finding;
    await eng.patch(`/api/teardowns/${td.id}/findings/${f.id}`, {}).expect(400);
    await eng.patch(`/api/teardowns/${other.teardownId}/findings/${f.id}`, { text: 'y' }).set(CONFIRM_UNPUBLISH_HEADER, 'yes').expect(404);
  });

  it('only engineers and admins change findings; a published teardown asks first', async () => {
    const td = await newTeardown();
    const body = { kind: 'cost-down', severity: 'minor', text: 'Two screws could be one.', tags: ['fasteners'] };
    await (await t.anonymous()).post(`/api/teardowns/${td.id}/findings`, body).expect(401);
    for (const role of NON_EDITORS) await (await as(role)).post(`/api/teardowns/${td.id}/findings`, body).expect(403);
    const f = (await (await as('admin')).post(`/api/teardowns/${td.id}/findings`, body).expect(201)).body.finding;
    for (const role of NON_EDITORS) {
      await (await as(role)).patch(`/api/teardowns/${td.id}/findings/${f.id}`, { text: 'x' }).expect(403);
      await (await as(role)).delete(`/api/teardowns/${td.id}/findings/${f.id}`).expect(403);
    }

    const pub = await demoTeardown('Corvane', 'Breeze Pocket');
    const eng = await as('engineer');
    const refused = await eng.post(`/api/teardowns/${pub.teardownId}/findings`, body).expect(409);
    expect(refused.body.error.details).toEqual({ reason: 'published' });
    await eng.post(`/api/teardowns/${pub.teardownId}/findings`, body).set(CONFIRM_UNPUBLISH_HEADER, 'yes').expect(201);
    expect((await eng.get(`/api/teardowns/${pub.teardownId}`).expect(200)).body.teardown.status).toBe('draft');
  });

  it('the demo seed has several findings per teardown across kinds and severities', async () => {
    const eng = await as('engineer');
    const duo = await demoTeardown('Halvix', 'HandGlow Duo 10');
    const findings = (await eng.get(`/api/teardowns/${duo.teardownId}/findings`).expect(200)).body.findings as { kind: string; severity: string; suggestionKey: string | null }[];
    expect(findings.length).toBeGreaterThanOrEqual(5);
    expect(new Set(findings.map((f) => f.kind))).toEqual(new Set(['safety', 'user-experience', 'compliance', 'clever-idea', 'cost-down']));
    expect(findings.find((f) => f.suggestionKey === 'thermal.no-sensor')).toMatchObject({ kind: 'safety', severity: 'major' });
    const devices = (await eng.get('/api/devices').expect(200)).body.devices as { model: string; latestTeardown: { id: number } }[];
    for (const d of devices.filter((x) => x.latestTeardown)) {
      const n = (await eng.get(`/api/teardowns/${d.latestTeardown.id}/findings`).expect(200)).body.findings.length;
      if (!d.model.startsWith('Bench') && !d.model.startsWith('Review') && !d.model.startsWith('Claims')) expect(n, d.model).toBeGreaterThan(0);
    }
  });
});

describe('figures of the demo heater', () => {
  /**
   * The Halvix HandGlow Duo 10 as recorded at the bench (scenario.ts): two 3.0 Ω flexible heater
   * elements in parallel at 3.65 V, one 2.7 Ah 3.7 V Li-ion cell of 46 g without protection,
   * buck-boost charge and output converters, no sensor among the parts. A new teardown of the demo
   * device, so its label claims (5200 mAh) feed the figures too.
   */
  async function heaterTeardown() {
    const duo = await demoTeardown('Halvix', 'HandGlow Duo 10');
    const td = await newTeardown(duo.deviceId, { unitLabel: 'Unit F' });
    const em = t.orm.em.fork();
    em.create(PackSchema, {
      teardown: td.id,
      chemistry: 'li-ion',
      cellFormat: '18650',
      cellNominalVolts: 3.7,
      cellMaxVolts: 4.2,
      cellRatedAh: 2.7,
      series: 1,
      parallel: 1,
      packMassKg: 0.046,
      protection: false,
      joining: 'welded-tab',
    } as never);
    const heater = em.create(LoadSchema, {
      teardown: td.id,
      kind: 'heater',
      label: 'Flexible PCB heater elements',
      resistanceOhms: 3.0,
      supplyVolts: 3.65,
      count: 2,
      connection: 'parallel',
      duty: 1,
    } as never);
    em.create(ConverterSchema, {
      teardown: td.id,
      label: 'Charger (buck)',
      topology: 'buck-boost',
      role: 'charge',
      vin: 5,
      vout: 4.2,
      efficiency: 0.9,
      efficiencySource: 'assumed',
      chargeCurrentA: 1,
    } as never);
    em.create(ConverterSchema, { teardown: td.id, label: 'USB output (boost)', topology: 'buck-boost', role: 'output', vin: 3.7, vout: 5, efficiency: 0.88, efficiencySource: 'measured' } as never);
    em.create(PartSchema, { teardown: td.id, designators: 'HT1, HT2', category: 'heater', description: 'Flexible PCB heater, 3.0 Ω' } as never);
    await em.flush();
    return { ...td, heaterId: heater.id };
  }

  it('equal the hand-computed values', async () => {
    const td = await heaterTeardown();
    const res = (await (await as('sourcing')).get(`/api/teardowns/${td.id}/figures`).expect(200)).body;
    const fig = (key: string) => res.figures.find((f: { key: string }) => f.key === key);
    // [REFERENCES §3; C] a 3.0 Ω element at 3.65 V: P = V²/R = 4.440833 W
    expect(fig(`load.${td.heaterId}.elementPower`).value).toBeCloseTo(4.440833, 6);
    expect(fig(`load.${td.heaterId}.elementPower`).unit).toBe('W');
    // [REFERENCES §3; C] two in parallel (1.5 Ω): 8.881667 W, 2.433333 A
    expect(fig('load.power')).toMatchObject({ unit: 'W', formula: expect.any(String), source: expect.any(String) });
    expect(fig('load.power').value).toBeCloseTo(8.881667, 6);
    expect(fig('load.current').value).toBeCloseTo(2.433333, 6);
    // [S: Wh = V_nom·Ah, REFERENCES §4; C] 3.7 V × 2.7 Ah = 9.99 Wh
    expect(fig('pack.energy')).toMatchObject({ unit: 'Wh' });
    expect(fig('pack.energy').value).toBeCloseTo(9.99, 9);
    // [C; CP "a little over one hour"] runtime = 9.99 Wh × usable 0.9 (workspace default [CP]) ÷ 8.881667 W
    // (heaters straight on the cell: efficiency 1) = 1.0123 h — the full rated energy (1.1248 h) was issue 10 §2.6
    expect(fig('runtime.hours').unit).toBe('h');
    expect(fig('runtime.hours').value).toBeCloseTo((9.99 * 0.9) / 8.881667, 5);
    expect(fig('runtime.hours').value).toBeCloseTo(1.0123, 4);
    expect(fig('runtime.hours').inputs.find((i: { key: string }) => i.key === 'usableBasis').value).toMatch(/usable fraction 0.9 \(workspace setting\)/);
    // [S: IATA DGR, REFERENCES §4] 9.99 Wh does not exceed 100 Wh
    expect(fig('pack.transportClass').value).toBe('up-to-100-wh');
    // [C] 9.99 Wh ÷ 0.046 kg = 217.17 Wh/kg
    expect(fig('pack.specificEnergy').value).toBeCloseTo(217.1739, 3);
    for (const f of res.figures) expect(f.inputs.length, f.key).toBeGreaterThan(0);
    expect(res.note).toMatch(/not certification results/);

    const keys = res.suggestions.map((s: { key: string }) => s.key);
    expect(keys).toContain('thermal.no-sensor');
    // [C] 5.2 Ah × 3.7 V = 19.24 Wh in 46 g = 418 Wh/kg, beyond Li-ion (REFERENCES §4: 100–265 Wh/kg)
    expect(keys).toContain('capacity.implausible');
    expect(keys).not.toContain('pack.over-100wh');
    expect(res.suggestions.find((s: { key: string }) => s.key === 'thermal.no-sensor')).toMatchObject({ kind: 'safety', severity: 'major', status: 'open', findingId: null });
  });

  it('come from the stored records: a sensor part removes the no-sensor suggestion; contributors add inputs', async () => {
    const td = await heaterTeardown();
    const eng = await as('engineer');
    FIGURE_CONTRIBUTORS.push(async (_em, teardowns) => new Map(teardowns.map((x) => [x.id, { measuredCapacityAh: 2.62 }])));
    try {
      const res = (await eng.get(`/api/teardowns/${td.id}/figures`).expect(200)).body;
      // [C] 2.62 Ah × 3.7 V ÷ 8.881667 W = 1.0915 h
      expect(res.figures.find((f: { key: string }) => f.key === 'runtime.hours').value).toBeCloseTo((2.62 * 3.7) / 8.881667, 5);
    } finally {
      FIGURE_CONTRIBUTORS.pop();
    }
    const em = t.orm.em.fork();
    em.create(PartSchema, { teardown: td.id, designators: 'RT1', category: 'sensor', description: 'NTC thermistor 10 kΩ' } as never);
    await em.flush();
    const after = (await eng.get(`/api/teardowns/${td.id}/figures`).expect(200)).body;
    expect(after.suggestions.map((s: { key: string }) => s.key)).not.toContain('thermal.no-sensor');
  });

  it('accepting a suggestion creates the finding; dismissing is remembered and can be undone', async () => {
    const td = await heaterTeardown();
    const eng = await as('engineer');
    for (const role of NON_EDITORS) await (await as(role)).post(`/api/teardowns/${td.id}/suggestions/thermal.no-sensor/accept`).expect(403);
    await (await t.anonymous()).post(`/api/teardowns/${td.id}/suggestions/thermal.no-sensor/accept`).expect(401);

    const detail = (await eng.get(`/api/teardowns/${td.id}/figures`).expect(200)).body.suggestions.find((s: { key: string }) => s.key === 'thermal.no-sensor').detail;
    const accepted = (await eng.post(`/api/teardowns/${td.id}/suggestions/thermal.no-sensor/accept`).expect(201)).body.finding;
    expect(accepted).toMatchObject({ id: expect.any(Number), kind: 'safety', severity: 'major', text: detail, suggestionKey: 'thermal.no-sensor' });
    const again = await eng.post(`/api/teardowns/${td.id}/suggestions/thermal.no-sensor/accept`).expect(409);
    expect(again.body.error.message).toContain(`#${accepted.id}`);
    await eng.post(`/api/teardowns/${td.id}/suggestions/thermal.no-sensor/dismiss`).expect(409);
    await eng.post(`/api/teardowns/${td.id}/suggestions/no.such-rule/accept`).expect(404);
    await eng.post(`/api/teardowns/${td.id}/suggestions/bad key!/accept`).expect(400);

    const dismissed = (await eng.post(`/api/teardowns/${td.id}/suggestions/capacity.implausible/dismiss`).expect(200)).body.suggestion;
    expect(dismissed).toMatchObject({ key: 'capacity.implausible', status: 'dismissed', decidedBy: 'Tomas Reyne' });
    let figures = (await eng.get(`/api/teardowns/${td.id}/figures`).expect(200)).body;
    const status = (key: string) => figures.suggestions.find((s: { key: string }) => s.key === key);
    expect(status('thermal.no-sensor')).toMatchObject({ status: 'accepted', findingId: accepted.id });
    expect(status('capacity.implausible')).toMatchObject({ status: 'dismissed' });
    expect((await eng.post(`/api/teardowns/${td.id}/suggestions/capacity.implausible/reopen`).expect(200)).body.suggestion.status).toBe('open');
    figures = (await eng.get(`/api/teardowns/${td.id}/figures`).expect(200)).body;
    expect(status('capacity.implausible').status).toBe('open');

    // Deleting the accepted finding reopens its suggestion.
    await eng.delete(`/api/teardowns/${td.id}/findings/${accepted.id}`).expect(204);
    figures = (await eng.get(`/api/teardowns/${td.id}/figures`).expect(200)).body;
    expect(status('thermal.no-sensor')).toMatchObject({ status: 'open', findingId: null });
    const history = (await eng.get(`/api/teardowns/${td.id}/history`).expect(200)).body.entries as { action: string }[];
    expect(history.map((e) => e.action)).toEqual(expect.arrayContaining(['suggestion.accepted', 'suggestion.dismissed', 'suggestion.reopened', 'finding.deleted']));
  });

  it('a teardown without records has no figures and no suggestions', async () => {
    const td = await newTeardown();
    const res = (await (await as('lead')).get(`/api/teardowns/${td.id}/figures`).expect(200)).body;
    expect(res).toMatchObject({ figures: [], suggestions: [] });
  });
});
