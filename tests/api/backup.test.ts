// Backup and restore round trip: an online backup of a live workspace (writes keep coming while it
// runs), restored into another data folder, gives the same rows in every table and the same bytes
// in every upload file. Restore refuses while a server runs and when a file does not match its hash.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { appendFileSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import sqlite3 from 'sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testEnv, type Env } from '../../apps/api/src/config/env';
import { createBackup, latestBackup, readManifest, restoreBackup, type BackupResult } from '../../apps/api/src/modules/system/backup';
import { markRunning, pidFile } from '../../apps/api/src/modules/system/server-lock';
import request from 'supertest';
import { migrate, openOrm } from '../../apps/api/src/db/orm';
import { APP_VERSION, createApp } from '../../apps/api/src/http/create-app';
import { DEMO_PASSWORD, makeTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
const scratch = mkdtempSync(join(tmpdir(), 'splitcase-backup-test-'));
const root = fileURLToPath(new URL('../..', import.meta.url));

function query<T>(dbPath: string, sql: string): Promise<T[]> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(dbPath, (err) => {
      if (err) return reject(err);
      db.all(sql, (e, rows) => db.close(() => (e ? reject(e) : resolve(rows as T[]))));
    });
  });
}

async function rowCounts(dbPath: string): Promise<Record<string, number>> {
  const tables = await query<{ name: string }>(dbPath, "select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name");
  const out: Record<string, number> = {};
  for (const { name } of tables) out[name] = (await query<{ n: number }>(dbPath, `select count(*) as n from "${name}"`))[0]!.n;
  return out;
}

/** SHA-256 of every file under the photos and runs folders (staging folders excluded). */
function uploadHashes(uploadsDir: string): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const path = join(dir, name);
      if (name === '.incoming') continue;
      if (statSync(path).isDirectory()) walk(path);
      else out[relative(uploadsDir, path).split(sep).join('/')] = createHash('sha256').update(readFileSync(path)).digest('hex');
    }
  };
  for (const kind of ['photos', 'runs']) if (existsSync(join(uploadsDir, kind))) walk(join(uploadsDir, kind));
  return out;
}

const freshEnv = (name: string): Env => testEnv({ dataDir: join(scratch, name) });

let backup: BackupResult;
let countsAtBackup: Record<string, number>;
let hashesAtBackup: Record<string, string>;

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
}, 120_000);
afterAll(async () => {
  await t?.close();
  rmSync(scratch, { recursive: true, force: true });
});

describe('npm run backup', () => {
  it('copies the live database online, while writes go on, with row counts and a hash per file', async () => {
    const lead = await t.as('lead');
    const [teardown] = await query<{ id: number }>(t.env.dbPath, "select id from teardowns where status = 'published' order by id limit 1");
    // Writes running alongside the backup: the copy is one consistent moment of them.
    let writing = true;
    const writes = (async () => {
      let n = 0;
      while (writing) {
        await lead.post(`/api/teardowns/${teardown!.id}/comments`, { body: `Comment ${++n} written during the backup` }).expect(201);
      }
      return n;
    })();
    backup = await createBackup(t.env, { appVersion: APP_VERSION });
    writing = false;
    expect(await writes).toBeGreaterThan(0);

    const m = readManifest(backup.folder);
    expect(m).toEqual(backup.manifest);
    expect(m.format).toBe('splitcase-backup-1');
    expect(m.photos).toBeGreaterThan(10);
    expect(m.runs).toBeGreaterThan(10);
    // The counts in the manifest are those of the copy.
    expect(await rowCounts(join(backup.folder, 'splitcase.sqlite'))).toEqual(m.tables);
    expect(m.tables.photos).toBe(m.photos);
    // Every file listed, with its hash; every photo and run has its folder.
    for (const f of m.files) {
      const bytes = readFileSync(join(backup.folder, ...f.path.split('/')));
      expect(bytes.length, f.path).toBe(f.bytes);
      expect(createHash('sha256').update(bytes).digest('hex'), f.path).toBe(f.sha256);
    }
    expect(m.files.map((f) => f.path)).toEqual(expect.arrayContaining(['splitcase.sqlite', 'sessions.sqlite', 'session-secret']));
    expect(new Set(m.files.filter((f) => f.path.startsWith('uploads/photos/')).map((f) => f.path.split('/')[2])).size).toBe(m.photos);
    expect(new Set(m.files.filter((f) => f.path.startsWith('uploads/runs/')).map((f) => f.path.split('/')[2])).size).toBe(m.runs);
    // The folder is named after its date.
    expect(backup.folder.split(sep).pop()).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}-\d{2}-\d{2}Z(-\d+)?$/);

    countsAtBackup = m.tables;
    hashesAtBackup = Object.fromEntries(m.files.filter((f) => f.path.startsWith('uploads/')).map((f) => [f.path.slice('uploads/'.length), f.sha256]));
    // Nothing has been written since: the live uploads are the ones backed up.
    expect(uploadHashes(t.env.uploadsDir)).toEqual(hashesAtBackup);
  }, 120_000);

  it('shows the date of the last backup to admins, and only to them', async () => {
    const admin = await t.as('admin');
    const res = await admin.get('/api/system/backup').expect(200);
    expect(res.body.lastBackup).toMatchObject({ at: backup.manifest.createdAt, folder: backup.folder.split(sep).pop(), files: backup.manifest.files.length });
    await (await t.as('engineer')).get('/api/system/backup').expect(403);
    const empty = latestBackup({ backupsDir: join(scratch, 'no-backups-here') });
    expect(empty).toBeNull();
  });
});

describe('npm run restore', () => {
  it('round trip: the restored data folder has the same rows in every table and the same upload files', async () => {
    const target = freshEnv('restored');
    const result = await restoreBackup(target, backup.folder);
    expect(result.setAside).toEqual([]);
    expect(await rowCounts(target.dbPath)).toEqual(countsAtBackup);
    expect(uploadHashes(target.uploadsDir)).toEqual(hashesAtBackup);
    expect(readFileSync(join(target.dataDir, 'session-secret'), 'utf8')).toBe(readFileSync(join(t.env.dataDir, 'session-secret'), 'utf8'));
    // The server opens it as it is: every migration applied, the demo sign-ins work.
    const orm = await openOrm(target.dbPath);
    try {
      expect(await migrate(orm)).toEqual([]);
    } finally {
      await orm.close();
    }
    const served = await openOrm(target.dbPath);
    const app = createApp({ ...t.deps, env: target, orm: served });
    const agent = request.agent(app);
    const csrf = (await agent.get('/api/auth/csrf').expect(200)).body.token;
    await agent.post('/api/auth/login').set('X-CSRF-Token', csrf).send({ email: 'engineer@splitcase.test', password: DEMO_PASSWORD }).expect(200);
    await served.close();
  });

  it('over an existing workspace: the current data is moved aside, not deleted', async () => {
    const target = freshEnv('replaced');
    await restoreBackup(target, backup.folder);
    // Changes after the restore, then the same backup again.
    await query(target.dbPath, "delete from comments where body like '%during the backup%'");
    writeFileSync(join(target.uploadsDir, 'photos', 'note.txt'), 'made after the restore');
    const result = await restoreBackup(target, backup.folder);
    expect(result.setAside).toHaveLength(2);
    expect(await rowCounts(target.dbPath)).toEqual(countsAtBackup);
    expect(uploadHashes(target.uploadsDir)).toEqual(hashesAtBackup);
    const asideUploads = result.setAside.find((p) => p.startsWith(target.uploadsDir))!;
    expect(readFileSync(join(asideUploads, 'photos', 'note.txt'), 'utf8')).toBe('made after the restore');
    const asideData = result.setAside.find((p) => p.startsWith(target.dataDir) && !p.startsWith(target.uploadsDir))!;
    expect(existsSync(join(asideData, 'splitcase.sqlite'))).toBe(true);
  });

  it('refuses while a server runs on the data folder, and changes nothing', async () => {
    const target = freshEnv('in-use');
    await restoreBackup(target, backup.folder);
    const before = await rowCounts(target.dbPath);
    await query(target.dbPath, 'delete from comments');
    markRunning(target, 4321); // this test process stands in for the server
    await expect(restoreBackup(target, backup.folder)).rejects.toThrow(/server is running .*process \d+, port 4321.*Stop it, then restore/);
    expect((await rowCounts(target.dbPath)).comments).toBe(0);
    // A file left by a server that no longer runs does not block.
    writeFileSync(pidFile(target), JSON.stringify({ pid: 2 ** 22 + 12345, port: 1, startedAt: '2026-01-01T00:00:00Z' }));
    await restoreBackup(target, backup.folder);
    expect(await rowCounts(target.dbPath)).toEqual(before);
  });

  it('refuses a backup whose files do not match their hashes, and changes nothing', async () => {
    const copy = join(scratch, 'tampered');
    spawnSync('cp', ['-r', backup.folder, copy]);
    const photo = backup.manifest.files.find((f) => f.path.endsWith('thumb.webp'))!;
    appendFileSync(join(copy, ...photo.path.split('/')), Buffer.from('<script>'));
    const target = freshEnv('tamper-target');
    await expect(restoreBackup(target, copy)).rejects.toThrow(/damaged: .*thumb\.webp does not match its SHA-256/);
    expect(existsSync(target.dbPath)).toBe(false);
  });

  it('works from the command line: npm run backup, then npm run restore <folder>', () => {
    const backupsDir = join(scratch, 'cli-backups');
    const target = freshEnv('cli-target');
    const run = (script: string, args: string[], env: Record<string, string>) =>
      spawnSync(process.execPath, ['--import', 'tsx', join(root, 'scripts', script), ...args], { cwd: root, encoding: 'utf8', env: { ...process.env, ...env } });
    const made = run('backup.ts', [], { SPLITCASE_DATA_DIR: t.env.dataDir, SPLITCASE_UPLOADS_DIR: t.env.uploadsDir, SPLITCASE_BACKUPS_DIR: backupsDir });
    expect(made.status, made.stderr).toBe(0);
    expect(made.stdout).toMatch(/Backup written to .*\n\s+\d+ files, [\d.]+ MB; [\d,]+ rows in \d+ tables/);
    const folder = readdirSync(backupsDir)[0]!;
    const restored = run('restore.ts', [folder], { SPLITCASE_DATA_DIR: target.dataDir, SPLITCASE_UPLOADS_DIR: target.uploadsDir, SPLITCASE_BACKUPS_DIR: backupsDir });
    expect(restored.status, restored.stderr).toBe(0);
    expect(restored.stdout).toMatch(/Restored the backup of/);
    expect(uploadHashes(target.uploadsDir)).toEqual(hashesAtBackup);
    const refused = run('restore.ts', [], {});
    expect(refused.status).toBe(2);
  }, 120_000);
});
