// Server logs: one JSON line per request (method, route pattern, status, duration, user id), a
// server error with its stack in the log and never in the response, and nothing of what was sent
// (password, e-mail, cookie, CSRF token) in any line. The app logs into a captured stream.
import { Writable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createApp } from '../../apps/api/src/http/create-app';
import { createLogger, logFunction } from '../../apps/api/src/http/logging';
import { DEMO_PASSWORD, makeTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let app: ReturnType<typeof createApp>;
const lines: string[] = [];

beforeAll(async () => {
  t = await makeTestApp();
  const capture = new Writable({
    write(chunk: Buffer, _enc, done) {
      lines.push(...chunk.toString('utf8').split('\n').filter(Boolean));
      done();
    },
  });
  const logger = createLogger('info', capture);
  app = createApp({ ...t.deps, logger, log: logFunction(logger) });
});
afterAll(() => t?.close());

type Line = Record<string, unknown> & { err?: { stack?: string; message?: string } };
const parsed = () => lines.map((l) => JSON.parse(l) as Line);
/** The request lines logged since `from`, once `count` of them are there (the line is written when the response has gone). */
async function requestLines(from: number, count: number): Promise<Line[]> {
  for (let k = 0; k < 100; k++) {
    const found = parsed()
      .slice(from)
      .filter((l) => 'route' in l);
    if (found.length >= count) return found;
    await new Promise((r) => setTimeout(r, 20));
  }
  throw new Error(`expected ${count} request lines, got: ${lines.slice(from).join('\n')}`);
}

describe('server logs', () => {
  it('log one JSON line per request with the method, route pattern, status, duration and user id, and nothing that was sent', async () => {
    const agent = request.agent(app);
    const csrf = (await agent.get('/api/auth/csrf').expect(200)).body.token as string;
    const email = 'engineer@splitcase.test';
    const from = lines.length;
    const login = await agent.post('/api/auth/login').set('X-CSRF-Token', csrf).send({ email, password: DEMO_PASSWORD }).expect(200);
    const userId = login.body.user.id as number;
    await agent.get('/api/devices/987654').expect(404);
    const [signIn, read] = await requestLines(from, 2);
    expect(signIn).toMatchObject({ level: 30, method: 'POST', route: '/api/auth/login', status: 200 });
    expect(read).toMatchObject({ level: 30, method: 'GET', route: '/api/devices/:id', status: 404, userId });
    for (const line of [signIn!, read!]) {
      expect(line.durationMs).toBeTypeOf('number');
      expect(line.msg).toBe(`${line.method} ${line.route} ${line.status}`);
    }
    // One line per request.
    expect(
      parsed()
        .slice(from)
        .filter((l) => 'route' in l),
    ).toHaveLength(2);
    const text = lines.slice(from).join('\n');
    const cookie = String(login.headers['set-cookie']?.[0] ?? '')
      .split(';')[0]!
      .split('=')[1]!;
    for (const secret of [DEMO_PASSWORD, email, csrf, cookie, '987654']) expect(text, secret).not.toContain(secret);
    expect(text).not.toMatch(/cookie|x-csrf-token|"headers"|"body"/i);
  });

  it('log a server error with its stack, and answer with the standard error shape without it', async () => {
    const agent = request.agent(app);
    const csrf = (await agent.get('/api/auth/csrf').expect(200)).body.token as string;
    await agent.post('/api/auth/login').set('X-CSRF-Token', csrf).send({ email: 'lead@splitcase.test', password: DEMO_PASSWORD }).expect(200);
    // A failure the code does not expect: a table gone from under it.
    const conn = t.orm.em.fork().getConnection();
    await conn.execute('drop table lineup_devices');
    await conn.execute('drop table lineups');
    const from = lines.length;
    const res = await agent.get('/api/lineups').expect(500);
    expect(res.body).toEqual({ error: { code: 'internal', message: 'Something went wrong on the server. The error has been logged.' } });
    expect(JSON.stringify(res.body)).not.toMatch(/lineups|no such|stack|\bat /);
    const [line] = await requestLines(from, 1);
    expect(line).toMatchObject({ level: 50, method: 'GET', route: '/api/lineups', status: 500 });
    expect(line!.err!.message).toMatch(/no such table: lineups/);
    expect(line!.err!.stack).toMatch(/\n\s+at /);
  });
});
