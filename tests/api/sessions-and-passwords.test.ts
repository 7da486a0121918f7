// Sessions end when they should (password reset or change, deactivation, absolute and idle limits),
// passwords follow the rule, and the per-address limit is not fooled by a forged X-Forwarded-For.
import { join } from 'node:path';
import sqlite3 from 'sqlite3';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PASSWORD_RULE } from '@splitcase/contracts';
import { readEnv } from '../../apps/api/src/config/env';
import { DEMO_PASSWORD, linkIn, makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(() => t.close());

/** Runs SQL on the session store's own file (the sessions are kept apart from the main database). */
function sessionsDb<T>(app: TestApp, sql: string, params: unknown[] = []): Promise<T[]> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(join(app.env.dataDir, 'sessions.sqlite'));
    db.all(sql, params, (err, rows) => {
      db.close();
      if (err) reject(err);
      else resolve(rows as T[]);
    });
  });
}
const storedSessionsOf = async (app: TestApp, userId: number) => (await sessionsDb<{ n: number }>(app, "select count(*) as n from sessions where json_extract(sess, '$.userId') = ?", [userId]))[0]!.n;

async function newUser(email: string, name: string, password: string): Promise<number> {
  const admin = await t.as('admin');
  await admin.post('/api/invitations', { email, role: 'engineer' }).expect(201);
  const mail = await t.waitForMail(email);
  const token = linkIn(mail.text).searchParams.get('token')!;
  const res = await (await t.anonymous()).post('/api/auth/invitations/accept', { token, name, password });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.user.id;
}
const me = async (a: Agent) => (await a.get('/api/auth/me')).status;

describe('ending sessions', () => {
  it('a password reset ends every session of the user, at once', async () => {
    const id = await newUser('reset-sessions@splitcase.test', 'Reset Sessions', 'first-marmot-ledger-42');
    const signIn = async () => {
      const s = await t.anonymous();
      await s.post('/api/auth/login', { email: 'reset-sessions@splitcase.test', password: 'first-marmot-ledger-42' }).expect(200);
      return s;
    };
    const one = await signIn();
    const two = await signIn();
    expect([await me(one), await me(two)]).toEqual([200, 200]);
    expect(await storedSessionsOf(t, id)).toBeGreaterThanOrEqual(2);
    const anon = await t.anonymous();
    await anon.post('/api/auth/password-reset/request', { email: 'reset-sessions@splitcase.test' }).expect(202);
    const token = linkIn((await t.waitForMail('reset-sessions@splitcase.test', 0)).text).searchParams.get('token');
    await anon.post('/api/auth/password-reset/confirm', { token, password: 'second-walrus-compass-7' }).expect(204);
    expect(await storedSessionsOf(t, id)).toBe(0);
    expect([await me(one), await me(two)]).toEqual([401, 401]);
  });

  it('a password change ends the other sessions; the one that changed it goes on', async () => {
    await newUser('change-sessions@splitcase.test', 'Change Sessions', 'amber-kettle-pylon-19');
    const signIn = async (password: string) => {
      const s = await t.anonymous();
      await s.post('/api/auth/login', { email: 'change-sessions@splitcase.test', password }).expect(200);
      s.csrf = (await s.get('/api/auth/csrf')).body.token;
      return s;
    };
    const phone = await signIn('amber-kettle-pylon-19');
    const desk = await signIn('amber-kettle-pylon-19');
    const wrong = await desk.post('/api/auth/password', { currentPassword: 'not-the-password-1', newPassword: 'violet-harbour-gauge-3' });
    expect(wrong.status).toBe(401);
    expect(wrong.body.error.fields.currentPassword).toBeTruthy();
    await desk.post('/api/auth/password', { currentPassword: 'amber-kettle-pylon-19', newPassword: 'violet-harbour-gauge-3' }).expect(204);
    expect(await me(phone)).toBe(401);
    expect(await me(desk)).toBe(200);
    await signIn('violet-harbour-gauge-3');
    expect((await (await t.anonymous()).post('/api/auth/login', { email: 'change-sessions@splitcase.test', password: 'amber-kettle-pylon-19' })).status).toBe(401);
  });

  it('deactivation ends the sessions at once: the stored sessions are gone, and reactivating does not revive them', async () => {
    const admin = await t.as('admin');
    const viewer = await t.as('viewer');
    const id = (await viewer.get('/api/auth/me')).body.user.id;
    expect(await storedSessionsOf(t, id)).toBeGreaterThanOrEqual(1);
    await admin.patch(`/api/users/${id}`, { active: false }).expect(200);
    expect(await storedSessionsOf(t, id)).toBe(0);
    await admin.patch(`/api/users/${id}`, { active: true }).expect(200);
    expect(await me(viewer)).toBe(401);
    await t.as('viewer');
  });
});

describe('session lifetime', () => {
  it('the limits are workspace settings (12 h absolute, 60 min idle by default), changed by admins only', async () => {
    const admin = await t.as('admin');
    expect((await admin.get('/api/settings')).body.settings).toMatchObject({ sessionMaxHours: 12, sessionIdleMinutes: 60 });
    expect((await (await t.as('sourcing')).patch('/api/settings', { sessionIdleMinutes: 30 })).status).toBe(403);
    const bad = await admin.patch('/api/settings', { sessionMaxHours: 0, sessionIdleMinutes: 2 });
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['sessionIdleMinutes', 'sessionMaxHours']);
  });

  it('a session unused for longer than the idle limit ends; one older than the absolute limit ends however active', async () => {
    const lead = await t.as('lead');
    const id = (await lead.get('/api/auth/me').expect(200)).body.user.id;
    const minutesAgo = (m: number) => Date.now() - m * 60_000;
    await sessionsDb(t, "update sessions set sess = json_set(sess, '$.lastSeenAt', ?) where json_extract(sess, '$.userId') = ?", [minutesAgo(61), id]);
    expect(await me(lead)).toBe(401);

    const again = await t.as('lead');
    await sessionsDb(t, "update sessions set sess = json_set(sess, '$.signedInAt', ?, '$.lastSeenAt', ?) where json_extract(sess, '$.userId') = ?", [minutesAgo(12 * 60 + 1), minutesAgo(1), id]);
    expect(await me(again)).toBe(401);

    // Within both limits the session goes on, and its cookie lives no longer than the idle limit.
    const fresh = await t.anonymous();
    const res = await fresh.post('/api/auth/login', { email: 'lead@splitcase.test', password: DEMO_PASSWORD }).expect(200);
    const cookie = String(res.headers['set-cookie']);
    const expires = new Date(/Expires=([^;]+)/i.exec(cookie)![1]!).getTime();
    expect(expires - Date.now()).toBeLessThanOrEqual(60 * 60_000 + 5000);
    expect(await me(fresh)).toBe(200);
  });

  it('the limits set by an admin are the ones applied, and use keeps a session alive', async () => {
    const admin = await t.as('admin');
    const engineer = await t.as('engineer');
    const id = (await engineer.get('/api/auth/me').expect(200)).body.user.id;
    const minutesAgo = (m: number) => Date.now() - m * 60_000;
    const setSeen = (minutes: number) => sessionsDb(t, "update sessions set sess = json_set(sess, '$.lastSeenAt', ?) where json_extract(sess, '$.userId') = ?", [minutesAgo(minutes), id]);
    const seenAt = async () => (await sessionsDb<{ seen: number }>(t, "select max(json_extract(sess, '$.lastSeenAt')) as seen from sessions where json_extract(sess, '$.userId') = ?", [id]))[0]!.seen;
    try {
      // Idle 50 min of 60: the request goes through and counts as use.
      await setSeen(50);
      expect(await me(engineer)).toBe(200);
      expect(Date.now() - (await seenAt())).toBeLessThan(60_000);
      // With the idle limit lowered to 30 min, 31 min unused ends the session (it was within 60).
      await admin.patch('/api/settings', { sessionIdleMinutes: 30 }).expect(200);
      await setSeen(31);
      expect(await me(engineer)).toBe(401);
      // With the absolute limit lowered to 2 h, a session signed in 3 h ago ends though just used.
      await admin.patch('/api/settings', { sessionIdleMinutes: 60, sessionMaxHours: 2 }).expect(200);
      const again = await t.as('engineer');
      await sessionsDb(t, "update sessions set sess = json_set(sess, '$.signedInAt', ?, '$.lastSeenAt', ?) where json_extract(sess, '$.userId') = ?", [minutesAgo(180), minutesAgo(1), id]);
      expect(await me(again)).toBe(401);
    } finally {
      await admin.patch('/api/settings', { sessionIdleMinutes: 60, sessionMaxHours: 12 }).expect(200);
    }
  });

  it('cookies are Secure by default when the public URL is https', () => {
    expect(readEnv({ SPLITCASE_PUBLIC_URL: 'https://splitcase.example.test' }).secureCookies).toBe(true);
    expect(readEnv({ SPLITCASE_PUBLIC_URL: 'http://localhost:3000' }).secureCookies).toBe(false);
    expect(readEnv({ SPLITCASE_PUBLIC_URL: 'https://splitcase.example.test', SPLITCASE_SECURE_COOKIES: 'false' }).secureCookies).toBe(false);
    expect(readEnv({}).trustProxy).toBe(false);
    expect(readEnv({ SPLITCASE_TRUST_PROXY: 'loopback' }).trustProxy).toBe('loopback');
    expect(readEnv({ SPLITCASE_TRUST_PROXY: '1' }).trustProxy).toBe(1);
  });

  it('behind a configured https proxy the session cookie is Secure', async () => {
    const app = await makeTestApp({ env: { publicUrl: 'https://splitcase.example.test', secureCookies: true, trustProxy: 'loopback' } });
    try {
      // The first request that starts a session (the CSRF token is kept in it) gets the cookie.
      const res = await request(app.app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https').expect(200);
      expect(String(res.headers['set-cookie'])).toMatch(/splitcase\.sid=.*;\s*Secure/i);
      // Over plain http the server does not hand a Secure cookie out at all.
      expect((await request(app.app).get('/api/auth/csrf').expect(200)).headers['set-cookie']).toBeUndefined();
    } finally {
      await app.close();
    }
  });
});

describe('passwords', () => {
  it('the rule is stated once (contracts) for the forms', () => {
    expect(PASSWORD_RULE).toMatch(/12 characters/);
    expect(PASSWORD_RULE).toMatch(/e-mail address or name/);
    expect(PASSWORD_RULE).toMatch(/common password/);
  });

  it('new passwords: at least 12 characters, not the e-mail or name, not a common password', async () => {
    const admin = await t.as('admin');
    await admin.post('/api/invitations', { email: 'rules@splitcase.test', role: 'viewer' }).expect(201);
    const token = linkIn((await t.waitForMail('rules@splitcase.test')).text).searchParams.get('token');
    const invitee = await t.anonymous();
    for (const [password, message] of [
      ['eleven-char', /At least 12 characters/],
      ['rules@splitcase.test', /e-mail address or your name/],
      ['Rosa Ulrike Lester', /e-mail address or your name/],
      ['password1234', /too easy to guess/],
      ['qwertyuiop12', /too easy to guess/],
      ['aaaaaaaaaaaa', /too easy to guess/],
      ['iloveyou2024', /too easy to guess/],
    ] as const) {
      const res = await invitee.post('/api/auth/invitations/accept', { token, name: 'Rosa Ulrike Lester', password });
      expect(res.status, password).toBe(400);
      expect(res.body.error.fields.password, password).toMatch(message);
    }
    await invitee.post('/api/auth/invitations/accept', { token, name: 'Rosa Ulrike Lester', password: 'tidal-basalt-orchard-5' }).expect(201);
  });

  it('a refused new password names the New password field, and nothing changes: same password, no session ended', async () => {
    await newUser('refused-change@splitcase.test', 'Refused Change', 'copper-lantern-fjord-61');
    const signIn = async () => {
      const s = await t.anonymous();
      await s.post('/api/auth/login', { email: 'refused-change@splitcase.test', password: 'copper-lantern-fjord-61' }).expect(200);
      s.csrf = (await s.get('/api/auth/csrf')).body.token;
      return s;
    };
    const other = await signIn();
    const self = await signIn();
    for (const [newPassword, message] of [
      ['short-one', /At least 12 characters/],
      ['refused-change@splitcase.test', /e-mail address or your name/],
      ['Refused Change', /e-mail address or your name/],
      ['password1234', /too easy to guess/],
    ] as const) {
      const res = await self.post('/api/auth/password', { currentPassword: 'copper-lantern-fjord-61', newPassword });
      expect(res.status, newPassword).toBe(400);
      expect(Object.keys(res.body.error.fields), newPassword).toEqual(['newPassword']);
      expect(res.body.error.fields.newPassword, newPassword).toMatch(message);
    }
    expect([await me(other), await me(self)]).toEqual([200, 200]);
    await (await t.anonymous()).post('/api/auth/login', { email: 'refused-change@splitcase.test', password: 'copper-lantern-fjord-61' }).expect(200);
  });

  it('a fresh workspace seeds with the documented default demo password (README), and it signs in', async () => {
    const demoPassword = readEnv({}).demoPassword;
    expect(demoPassword).toBe('splitcase-demo');
    const app = await makeTestApp({ env: { demoPassword } });
    try {
      const a = await app.anonymous();
      await a.post('/api/auth/login', { email: 'admin@splitcase.test', password: demoPassword }).expect(200);
    } finally {
      await app.close();
    }
  });

  it('a reset with a common password is refused and the link still works', async () => {
    const anon = await t.anonymous();
    await anon.post('/api/auth/password-reset/request', { email: 'engineer2@splitcase.test' }).expect(202);
    const token = linkIn((await t.waitForMail('engineer2@splitcase.test')).text).searchParams.get('token');
    const res = await anon.post('/api/auth/password-reset/confirm', { token, password: 'password1234' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/too easy to guess/);
    await anon.post('/api/auth/password-reset/confirm', { token, password: 'granite-meadow-vector-8' }).expect(204);
  });
});

describe('per-address limit and X-Forwarded-For', () => {
  const attempt = (a: Agent, n: number, xff?: string) => {
    const req = a.post('/api/auth/login', { email: `nobody${n}@splitcase.test`, password: 'wrong-password-x' });
    return xff ? req.set('X-Forwarded-For', xff) : req;
  };

  it('without a configured proxy a forged X-Forwarded-For does not give new addresses', async () => {
    const app = await makeTestApp({ env: { loginLimitPerIp: 3 } });
    try {
      const a = await app.anonymous();
      for (let i = 0; i < 3; i++) await attempt(a, i, `203.0.113.${i + 1}`).expect(401);
      const res = await attempt(a, 9, '198.51.100.77');
      expect(res.status).toBe(429);
      expect(res.body.error.code).toBe('rate_limited');
    } finally {
      await app.close();
    }
  });

  it('with the proxy configured (trust proxy), the forwarded address counts', async () => {
    const app = await makeTestApp({ env: { loginLimitPerIp: 3, trustProxy: 'loopback' } });
    try {
      const a = await app.anonymous();
      for (let i = 0; i < 3; i++) await attempt(a, i, '203.0.113.5').expect(401);
      expect((await attempt(a, 4, '203.0.113.5')).status).toBe(429);
      expect((await attempt(a, 5, '198.51.100.77')).status).toBe(401);
    } finally {
      await app.close();
    }
  });
});
