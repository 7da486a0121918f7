// In-process API for integration tests: a throwaway SQLite file, all migrations, the demo users
// (or the whole demo seed), the capture SMTP server, and supertest agents signed in per role.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Role } from '@splitcase/contracts';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { testEnv, type Env } from '../../apps/api/src/config/env';
import { migrate, openOrm, type Orm } from '../../apps/api/src/db/orm';
import { createApp } from '../../apps/api/src/http/create-app';
import { createLogger, logFunction } from '../../apps/api/src/http/logging';
import type { AppDeps } from '../../apps/api/src/http/deps';
import { startCaptureServer } from '../../apps/api/src/modules/mail/capture-server';
import { createMailer } from '../../apps/api/src/modules/mail/mailer';
import { seedIfEmpty, SEED_STEPS } from '../../apps/api/src/seed/index';

export const DEMO_PASSWORD = 'test-demo-password';

export interface TestApp {
  app: ReturnType<typeof createApp>;
  orm: Orm;
  env: Env;
  deps: AppDeps;
  /** A supertest agent with a session cookie jar and the CSRF header set on state-changing calls. */
  anonymous(): Promise<Agent>;
  as(role: Role | string): Promise<Agent>;
  /** Wait for the capture SMTP server to have stored a message to this address. */
  waitForMail(to: string, after?: number): Promise<{ id: number; subject: string; text: string }>;
  close(): Promise<void>;
}

export interface Agent {
  agent: TestAgent;
  csrf: string;
  get(path: string): request.Test;
  post(path: string, body?: unknown): request.Test;
  put(path: string, body?: unknown): request.Test;
  patch(path: string, body?: unknown): request.Test;
  delete(path: string): request.Test;
  /** A multipart POST with the CSRF header; chain .attach()/.field(). */
  upload(path: string): request.Test;
}

async function makeAgent(app: TestApp['app']): Promise<Agent> {
  const agent = request.agent(app);
  const csrf = (await agent.get('/api/auth/csrf').expect(200)).body.token as string;
  const wrap: Agent = {
    agent,
    csrf,
    get: (p) => agent.get(p),
    post: (p, b) =>
      b === undefined
        ? agent.post(p).set('X-CSRF-Token', wrap.csrf)
        : agent
            .post(p)
            .set('X-CSRF-Token', wrap.csrf)
            .send(b as object),
    put: (p, b) =>
      agent
        .put(p)
        .set('X-CSRF-Token', wrap.csrf)
        .send(b as object),
    patch: (p, b) =>
      agent
        .patch(p)
        .set('X-CSRF-Token', wrap.csrf)
        .send(b as object),
    delete: (p) => agent.delete(p).set('X-CSRF-Token', wrap.csrf),
    upload: (p) => agent.post(p).set('X-CSRF-Token', wrap.csrf),
  };
  return wrap;
}

export async function makeTestApp(options: { seed?: 'users' | 'demo'; env?: Partial<Env> } = {}): Promise<TestApp> {
  const dataDir = mkdtempSync(join(tmpdir(), 'splitcase-test-'));
  const env = testEnv({ dataDir, demoPassword: DEMO_PASSWORD, loginLimitPerIp: 10_000, loginLimitPerAccount: 10_000, ...options.env });
  const orm = await openOrm(env.dbPath);
  await migrate(orm);
  const steps = options.seed === 'demo' ? SEED_STEPS : SEED_STEPS.filter((s) => s.name === 'users');
  await seedIfEmpty(orm, env, () => {}, steps);
  const capture = await startCaptureServer(orm, 0);
  const mailer = createMailer({ capturePort: capture.port, from: env.mailFrom });
  const logger = createLogger(env.logLevel);
  const deps: AppDeps = { env, orm, mailer, outboxEnabled: true, logger, log: logFunction(logger) };
  const app = createApp(deps);
  const t: TestApp = {
    app,
    orm,
    env,
    deps,
    anonymous: () => makeAgent(app),
    async as(who) {
      const a = await makeAgent(app);
      const email = who.includes('@') ? who : `${who}@splitcase.test`;
      await a.post('/api/auth/login', { email, password: DEMO_PASSWORD }).expect(200);
      a.csrf = (await a.get('/api/auth/csrf').expect(200)).body.token;
      return a;
    },
    async waitForMail(to, after = 0) {
      const started = Date.now();
      for (;;) {
        const rows = (await orm.em
          .fork()
          .getConnection()
          .execute('select id, subject, text from outbox_messages where "to" like ? and id > ? order by id desc limit 1', [`%${to}%`, after])) as {
          id: number;
          subject: string;
          text: string;
        }[];
        if (rows[0]) return rows[0];
        if (Date.now() - started > 10_000) throw new Error(`No e-mail to ${to} within 10 s`);
        await new Promise((r) => setTimeout(r, 50));
      }
    },
    async close() {
      mailer.close();
      await capture.close();
      await orm.close();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
  return t;
}

/** The first http(s) link in a message body. */
export function linkIn(text: string): URL {
  const m = text.match(/https?:\/\/\S+/);
  if (!m) throw new Error(`No link in: ${text}`);
  return new URL(m[0]);
}
