import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { linkIn, makeTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(() => t.close());

describe('invitations, end to end through the capture SMTP server', () => {
  it('admin invites; the invitee follows the e-mailed link, sets name and password, and is signed in', async () => {
    const admin = await t.as('admin');
    const created = await admin.post('/api/invitations', { email: 'New.Person@Example.test', role: 'sourcing' }).expect(201);
    expect(created.body.invitation).toMatchObject({ email: 'new.person@example.test', role: 'sourcing', status: 'pending' });

    const mail = await t.waitForMail('new.person@example.test');
    expect(mail.subject).toMatch(/invited you/);
    const link = linkIn(mail.text);
    expect(link.pathname).toBe('/accept-invitation');
    const token = link.searchParams.get('token')!;

    // The admin sees the same message on the Outbox page.
    const outbox = await admin.get('/api/outbox').expect(200);
    expect(outbox.body.enabled).toBe(true);
    expect(outbox.body.messages[0]).toMatchObject({ to: expect.stringContaining('new.person@example.test') });

    const invitee = await t.anonymous();
    const preview = await invitee.get(`/api/auth/invitations/preview?token=${token}`).expect(200);
    expect(preview.body.invitation).toMatchObject({ email: 'new.person@example.test', role: 'sourcing' });

    const weak = await invitee.post('/api/auth/invitations/accept', { token, name: '', password: 'short' }).expect(400);
    expect(Object.keys(weak.body.error.fields)).toEqual(expect.arrayContaining(['name', 'password']));

    const accepted = await invitee.post('/api/auth/invitations/accept', { token, name: 'Nadia Perrault', password: 'a-long-password-1' }).expect(201);
    expect(accepted.body.user).toMatchObject({ email: 'new.person@example.test', role: 'sourcing', name: 'Nadia Perrault' });
    const me = await invitee.get('/api/auth/me').expect(200);
    expect(me.body.user.role).toBe('sourcing');

    // The link works once.
    const reused = await (await t.anonymous()).post('/api/auth/invitations/accept', { token, name: 'Someone Else', password: 'another-password-2' }).expect(410);
    expect(reused.body.error.code).toBe('token_used');
    const list = await admin.get('/api/invitations').expect(200);
    expect(list.body.invitations.find((i: { email: string }) => i.email === 'new.person@example.test').status).toBe('accepted');
  });

  it('refuses an expired invitation with 410 and creates no user', async () => {
    const admin = await t.as('admin');
    await admin.post('/api/invitations', { email: 'late@example.test', role: 'viewer' }).expect(201);
    const token = linkIn((await t.waitForMail('late@example.test')).text).searchParams.get('token')!;
    await t.orm.em
      .fork()
      .getConnection()
      .execute(`update invitations set expires_at = ? where email = 'late@example.test'`, [new Date(Date.now() - 1000).toISOString()]);
    const res = await (await t.anonymous()).post('/api/auth/invitations/accept', { token, name: 'Late Comer', password: 'a-long-password-3' }).expect(410);
    expect(res.body.error.code).toBe('token_expired');
    const users = (await admin.get('/api/users')).body.users as { email: string }[];
    expect(users.some((u) => u.email === 'late@example.test')).toBe(false);
  });

  it('refuses an unknown token, an existing user and a bad role', async () => {
    const admin = await t.as('admin');
    const unknown = await (await t.anonymous()).get('/api/auth/invitations/preview?token=' + 'x'.repeat(43)).expect(400);
    expect(unknown.body.error.code).toBe('token_invalid');
    const existing = await admin.post('/api/invitations', { email: 'lead@splitcase.test', role: 'viewer' }).expect(409);
    expect(existing.body.error.fields.email).toBeDefined();
    const badRole = await admin.post('/api/invitations', { email: 'x@example.test', role: 'owner' }).expect(400);
    expect(badRole.body.error.fields.role).toBeDefined();
  });
});

describe('password reset by e-mail link', () => {
  it('sends a one-hour, one-time link; the new password works and the old one does not', async () => {
    const anon = await t.anonymous();
    const res = await anon.post('/api/auth/password-reset/request', { email: 'engineer@splitcase.test' }).expect(202);
    expect(res.body.ok).toBe(true);
    const mail = await t.waitForMail('engineer@splitcase.test');
    const link = linkIn(mail.text);
    expect(link.pathname).toBe('/reset-password');
    const token = link.searchParams.get('token')!;

    await anon.post('/api/auth/password-reset/confirm', { token, password: 'brand-new-password-9' }).expect(204);
    await anon.post('/api/auth/login', { email: 'engineer@splitcase.test', password: 'brand-new-password-9' }).expect(200);
    const old = await (await t.anonymous()).post('/api/auth/login', { email: 'engineer@splitcase.test', password: 'test-demo-password' }).expect(401);
    expect(old.body.error.code).toBe('invalid_credentials');

    const reused = await (await t.anonymous()).post('/api/auth/password-reset/confirm', { token, password: 'third-password-000' }).expect(410);
    expect(reused.body.error.code).toBe('token_used');
  });

  it('answers the same for an unknown address and sends nothing', async () => {
    const anon = await t.anonymous();
    const res = await anon.post('/api/auth/password-reset/request', { email: 'nobody@splitcase.test' }).expect(202);
    expect(res.body.message).toMatch(/If an account exists/);
    const rows = await t.orm.em.fork().getConnection().execute(`select count(*) as n from outbox_messages where "to" like '%nobody@%'`);
    expect(rows[0]?.n).toBe(0);
  });

  it('refuses an expired link with 410 and leaves the password as it was', async () => {
    const anon = await t.anonymous();
    const before = (await t.orm.em.fork().getConnection().execute(`select max(id) as id from outbox_messages`))[0]?.id ?? 0;
    await anon.post('/api/auth/password-reset/request', { email: 'lead@splitcase.test' }).expect(202);
    const token = linkIn((await t.waitForMail('lead@splitcase.test', before)).text).searchParams.get('token')!;
    await t.orm.em
      .fork()
      .getConnection()
      .execute(`update password_reset_tokens set expires_at = ?`, [new Date(Date.now() - 1000).toISOString()]);
    const res = await anon.post('/api/auth/password-reset/confirm', { token, password: 'never-applied-pass' }).expect(410);
    expect(res.body.error.code).toBe('token_expired');
    await (await t.anonymous()).post('/api/auth/login', { email: 'lead@splitcase.test', password: 'test-demo-password' }).expect(200);
  });
});
