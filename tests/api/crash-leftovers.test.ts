// Uploads killed half-way (SIGKILL of a real server in a child process) leave nothing behind once
// the server starts again: temporary files and folders of uploads that never committed are swept,
// and an upload whose row was committed just before the kill is moved into place and served.
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import sqlite3 from 'sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CONFIRM_UNPUBLISH_HEADER } from '@splitcase/contracts';
import { testEnv } from '../../apps/api/src/config/env';
import { migrate, openOrm } from '../../apps/api/src/db/orm';
import { SEED_STEPS, seedIfEmpty } from '../../apps/api/src/seed/index';
import { signIn, type HttpSession } from '../support/http-client';
import { DEMO_PASSWORD } from '../support/test-app';

const dataDir = mkdtempSync(join(tmpdir(), 'splitcase-crash-'));
const env = testEnv({ dataDir, demoPassword: DEMO_PASSWORD });
const childScript = new URL('../support/child-server.ts', import.meta.url).pathname;
const children = new Set<ChildProcess>();
let teardownId: number;

interface Child {
  proc: ChildProcess;
  base: string;
  /** Resolves with the first stdout line matching, e.g. "PAUSED photo-staged". */
  waitFor(line: RegExp): Promise<string>;
  kill(signal: NodeJS.Signals): Promise<void>;
}

async function startChild(pause?: string): Promise<Child> {
  const proc = spawn(process.execPath, ['--import', 'tsx', childScript, ...(pause ? [pause] : [])], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: '0',
      HOST: '127.0.0.1',
      SPLITCASE_DATA_DIR: env.dataDir,
      SPLITCASE_UPLOADS_DIR: env.uploadsDir,
      SPLITCASE_DEMO_PASSWORD: DEMO_PASSWORD,
      SPLITCASE_LOGIN_LIMIT_IP: '10000',
      SPLITCASE_LOGIN_LIMIT_ACCOUNT: '10000',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.add(proc);
  const lines: string[] = [];
  const waiters: { re: RegExp; done: (l: string) => void }[] = [];
  let stderr = '';
  let buffered = '';
  proc.stdout!.on('data', (chunk: Buffer) => {
    buffered += chunk.toString('utf8');
    for (let nl = buffered.indexOf('\n'); nl >= 0; nl = buffered.indexOf('\n')) {
      const line = buffered.slice(0, nl);
      buffered = buffered.slice(nl + 1);
      lines.push(line);
      for (const w of waiters.filter((x) => x.re.test(line))) {
        waiters.splice(waiters.indexOf(w), 1);
        w.done(line);
      }
    }
  });
  proc.stderr!.on('data', (chunk: Buffer) => (stderr += chunk.toString('utf8')));
  const exited = new Promise<void>((done) => proc.once('exit', () => done()));
  const waitFor = (re: RegExp) =>
    new Promise<string>((resolve, reject) => {
      const seen = lines.find((l) => re.test(l));
      if (seen) return resolve(seen);
      const timer = setTimeout(() => reject(new Error(`No "${re}" from the child server within 60 s. stderr:\n${stderr}`)), 60_000);
      waiters.push({ re, done: (l) => (clearTimeout(timer), resolve(l)) });
      exited.then(() => reject(new Error(`The child server exited before "${re}". stderr:\n${stderr}`)));
    });
  const port = Number((await waitFor(/^LISTENING \d+$/)).split(' ')[1]);
  return {
    proc,
    base: `http://127.0.0.1:${port}`,
    waitFor,
    async kill(signal) {
      proc.kill(signal);
      await exited;
      children.delete(proc);
    },
  };
}

function all<T>(sql: string): Promise<T[]> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(env.dbPath, (err) => {
      if (err) return reject(err);
      db.all(sql, (e, rows) => db.close(() => (e ? reject(e) : resolve(rows as T[]))));
    });
  });
}

const list = (dir: string) => (existsSync(dir) ? readdirSync(dir).sort() : []);
const photosDir = join(env.uploadsDir, 'photos');
const runsDir = join(env.uploadsDir, 'runs');

/** What is on disk against what the database holds. */
async function state() {
  const photoKeys = (await all<{ storage_key: string }>('select storage_key from photos')).map((r) => r.storage_key).sort();
  const runKeys = (await all<{ storage_key: string }>('select storage_key from bench_runs')).map((r) => r.storage_key).sort();
  return {
    photoKeys,
    runKeys,
    photoFolders: list(photosDir).filter((f) => f !== '.incoming'),
    photoStaging: list(join(photosDir, '.incoming')),
    runFolders: list(runsDir).filter((f) => f !== '.incoming'),
    runIncoming: list(join(runsDir, '.incoming')),
  };
}

/** After a restart: no temporary file or folder, and exactly one complete folder per row. */
async function expectClean() {
  const s = await state();
  expect(s.photoStaging).toEqual([]);
  expect(s.runIncoming).toEqual([]);
  expect(s.photoFolders).toEqual(s.photoKeys);
  expect(s.runFolders).toEqual(s.runKeys);
  for (const key of s.photoKeys) expect(list(join(photosDir, key))).toEqual(['display.webp', 'original.jpg', 'thumb.webp']);
  for (const key of s.runKeys) expect(list(join(runsDir, key))).toEqual(['raw.csv', 'series.f64']);
  return s;
}

async function photoUpload(session: HttpSession, name: string): Promise<Response> {
  const form = new FormData();
  const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#3d7a4a' } })
    .jpeg()
    .toBuffer();
  form.append('file', new Blob([jpeg], { type: 'image/jpeg' }), name);
  return fetch(`${session.base}/api/teardowns/${teardownId}/photos`, {
    method: 'POST',
    headers: { cookie: session.cookie, 'x-csrf-token': session.csrf, [CONFIRM_UNPUBLISH_HEADER]: 'yes' },
    body: form,
  });
}

const LOG = ['elapsed_s,volts,amps', ...Array.from({ length: 600 }, (_, k) => `${k},${(4.1 - k / 1000).toFixed(4)},1.000`)].join('\n') + '\n';
const MAPPING = JSON.stringify({ kind: 'discharge', time: { column: 'elapsed_s', unit: 's' }, voltage: { column: 'volts', unit: 'V' }, current: { column: 'amps', unit: 'A' } });

async function runUpload(session: HttpSession, name: string): Promise<Response> {
  const form = new FormData();
  form.append('mapping', MAPPING);
  form.append('file', new Blob([LOG], { type: 'text/csv' }), name);
  return fetch(`${session.base}/api/teardowns/${teardownId}/runs`, {
    method: 'POST',
    headers: { cookie: session.cookie, 'x-csrf-token': session.csrf, [CONFIRM_UNPUBLISH_HEADER]: 'yes' },
    body: form,
  });
}

const signInEngineer = (c: Child) => signIn(c.base, 'engineer@splitcase.test', DEMO_PASSWORD);

beforeAll(async () => {
  const orm = await openOrm(env.dbPath);
  await migrate(orm);
  await seedIfEmpty(
    orm,
    env,
    () => {},
    SEED_STEPS.filter((s) => s.name === 'users' || s.name === 'workspace'),
  );
  const [row] = (await orm.em.fork().getConnection().execute('select min(id) as id from teardowns')) as { id: number }[];
  teardownId = row!.id;
  await orm.close();
}, 60_000);

afterAll(() => {
  for (const proc of children) proc.kill('SIGKILL');
  rmSync(dataDir, { recursive: true, force: true });
});

describe('a photo upload killed half-way', () => {
  it('after its files are written and before its row: the restart removes the files', async () => {
    const child = await startChild('photo-staged');
    const session = await signInEngineer(child);
    const before = await state();
    const upload = photoUpload(session, 'killed.jpg').catch(() => null);
    await child.waitFor(/^PAUSED photo-staged$/);
    await child.kill('SIGKILL');
    expect(await upload).toBeNull();
    // The kill left the three files of an upload that has no row.
    const killed = await state();
    expect(killed.photoKeys).toEqual(before.photoKeys);
    expect([...killed.photoStaging, ...killed.photoFolders].length).toBeGreaterThan(before.photoFolders.length);

    const again = await startChild();
    const s = await expectClean();
    expect(s.photoKeys).toEqual(before.photoKeys);
    await again.kill('SIGTERM');
  }, 120_000);

  it('after its row is committed and before its files are moved into place: the restart finishes the move', async () => {
    const child = await startChild('photo-committed');
    const session = await signInEngineer(child);
    const before = await state();
    const upload = photoUpload(session, 'committed.jpg').catch(() => null);
    await child.waitFor(/^PAUSED photo-committed$/);
    await child.kill('SIGKILL');
    expect(await upload).toBeNull();
    const killed = await state();
    expect(killed.photoKeys.length).toBe(before.photoKeys.length + 1);

    const again = await startChild();
    const s = await expectClean();
    expect(s.photoKeys.length).toBe(before.photoKeys.length + 1);
    // The photo is whole and served.
    const session2 = await signInEngineer(again);
    const photos = (await session2.json('GET', `/api/teardowns/${teardownId}/photos`)).body as { photos: { name: string; urls: { thumb: string } }[] };
    const kept = photos.photos.find((p) => p.name === 'committed.jpg')!;
    const thumb = await fetch(again.base + kept.urls.thumb, { headers: { cookie: session2.cookie } });
    expect(thumb.status).toBe(200);
    expect(thumb.headers.get('content-type')).toBe('image/webp');
    await again.kill('SIGTERM');
  }, 120_000);
});

describe('a bench-run upload killed half-way', () => {
  it('in the middle of the body: the restart removes the temporary file', async () => {
    const child = await startChild();
    const session = await signInEngineer(child);
    const boundary = 'killBoundary42';
    const url = new URL(`/api/teardowns/${teardownId}/runs`, child.base);
    const req = httpRequest({
      method: 'POST',
      host: url.hostname,
      port: url.port,
      path: url.pathname,
      headers: { cookie: session.cookie, 'x-csrf-token': session.csrf, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(50 * 1024 * 1024) },
    });
    req.on('error', () => {});
    req.write(
      `--${boundary}\r\nContent-Disposition: form-data; name="mapping"\r\n\r\n${MAPPING}\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.csv"\r\nContent-Type: text/csv\r\n\r\n`,
    );
    const row = Buffer.from('0,4.1000,1.000\n'.repeat(70_000));
    for (let k = 0; k < 4; k++) req.write(row);
    // Wait until the server has written part of the file to its temporary path.
    const incoming = join(runsDir, '.incoming');
    for (let k = 0; k < 200; k++) {
      const parts = list(incoming).filter((f) => f.endsWith('.part'));
      if (parts.length && statSync(join(incoming, parts[0]!)).size > 1024 * 1024) break;
      await new Promise((r) => setTimeout(r, 50));
    }
    await child.kill('SIGKILL');
    req.destroy();
    const killed = await state();
    expect(killed.runIncoming.filter((f) => f.endsWith('.part')).length).toBeGreaterThan(0);

    const again = await startChild();
    await expectClean();
    await again.kill('SIGTERM');
  }, 120_000);

  it('after its files are written and before its row: the restart removes them', async () => {
    const child = await startChild('run-staged');
    const session = await signInEngineer(child);
    const before = await state();
    const upload = runUpload(session, 'killed.csv').catch(() => null);
    await child.waitFor(/^PAUSED run-staged$/);
    await child.kill('SIGKILL');
    expect(await upload).toBeNull();
    expect((await state()).runKeys).toEqual(before.runKeys);

    const again = await startChild();
    const s = await expectClean();
    expect(s.runKeys).toEqual(before.runKeys);
    await again.kill('SIGTERM');
  }, 120_000);

  it('after its row is committed and before its folder is moved into place: the restart finishes the move', async () => {
    const child = await startChild('run-committed');
    const session = await signInEngineer(child);
    const before = await state();
    const upload = runUpload(session, 'committed.csv').catch(() => null);
    await child.waitFor(/^PAUSED run-committed$/);
    await child.kill('SIGKILL');
    expect(await upload).toBeNull();
    expect((await state()).runKeys.length).toBe(before.runKeys.length + 1);

    const again = await startChild();
    const s = await expectClean();
    expect(s.runKeys.length).toBe(before.runKeys.length + 1);
    const session2 = await signInEngineer(again);
    const runs = (await session2.json('GET', `/api/teardowns/${teardownId}/runs`)).body as { runs: { id: number; fileName: string }[] };
    const kept = runs.runs.find((r) => r.fileName === 'committed.csv')!;
    expect((await session2.json('GET', `/api/runs/${kept.id}/series?maxPoints=100`)).status).toBe(200);
    const rawLog = await fetch(`${again.base}/api/runs/${kept.id}/raw`, { headers: { cookie: session2.cookie } });
    expect(await rawLog.text()).toBe(LOG);
    await again.kill('SIGTERM');
  }, 120_000);
});
