// Backup and restore of a workspace: the database and the sessions database copied online with
// SQLite's backup API (a consistent snapshot while the server keeps writing), the files of every
// photo and bench run that snapshot names, the session secret, and a manifest with row counts and
// a SHA-256 per file. `npm run backup` writes a dated folder; `npm run restore <folder>` checks every
// hash and puts it back, refusing while a server runs on the data folder.
import { createHash } from 'node:crypto';
import { createReadStream, existsSync, copyFileSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import sqlite3 from 'sqlite3';
import type { Env } from '../../config/env';
import { photosRoot } from '../photos/photo-files';
import { runsRoot } from '../runs/storage';
import { runningServer } from './server-lock';

export const BACKUP_FORMAT = 'splitcase-backup-1';
const DB_FILE = 'splitcase.sqlite';
const SESSIONS_FILE = 'sessions.sqlite';
const SECRET_FILE = 'session-secret';
const MANIFEST = 'manifest.json';

export interface BackupFile {
  /** Relative to the backup folder, with forward slashes. */
  path: string;
  bytes: number;
  sha256: string;
}

export interface BackupManifest {
  format: typeof BACKUP_FORMAT;
  createdAt: string;
  appVersion: string;
  /** Rows per table of the database copy. */
  tables: Record<string, number>;
  photos: number;
  runs: number;
  files: BackupFile[];
}

// ---- sqlite3 helpers ----------------------------------------------------------------------------

interface SqliteBackup {
  step(pages: number, done: (err: Error | null) => void): void;
  finish(done?: (err: Error | null) => void): void;
  readonly completed: boolean;
}
type Db = sqlite3.Database & { backup(filename: string, done: (err: Error | null) => void): SqliteBackup };

const open = (path: string) =>
  new Promise<Db>((done, fail) => {
    const db = new sqlite3.Database(path, (err) => (err ? fail(err) : done(db as Db)));
  });
const all = <T>(db: Db, sql: string) => new Promise<T[]>((done, fail) => db.all(sql, (err, rows) => (err ? fail(err) : done(rows as T[]))));
const close = (db: Db) => new Promise<void>((done, fail) => db.close((err) => (err ? fail(err) : done())));

/**
 * Copies a live database with SQLite's online backup API: every page in one step, under a read
 * lock, so the copy is one consistent moment however busy the server is. The copy is switched to a
 * plain rollback journal so it is one self-contained file.
 */
async function onlineCopy(source: string, dest: string): Promise<void> {
  const db = await open(source);
  try {
    for (let attempt = 0; ; attempt++) {
      try {
        await new Promise<void>((done, fail) => {
          const backup = db.backup(dest, (err) => {
            if (err) return fail(err);
            backup.step(-1, (stepErr) => {
              if (stepErr) return backup.finish(() => fail(stepErr));
              const completed = backup.completed;
              backup.finish((finishErr) => (finishErr ? fail(finishErr) : completed ? done() : fail(new Error('The backup did not complete.'))));
            });
          });
        });
        break;
      } catch (err) {
        // A writer holding the lock: wait a little and try again.
        if (attempt >= 20 || !/SQLITE_(BUSY|LOCKED)/.test(String((err as Error).message))) throw err;
        await new Promise((r) => setTimeout(r, 100));
      }
    }
  } finally {
    await close(db);
  }
  const copy = await open(dest);
  try {
    await all(copy, 'PRAGMA journal_mode = DELETE');
    const [check] = await all<{ integrity_check: string }>(copy, 'PRAGMA integrity_check');
    if (check?.integrity_check !== 'ok') throw new Error(`The copy of ${basename(source)} failed its integrity check: ${check?.integrity_check}`);
  } finally {
    await close(copy);
  }
}

async function tableCounts(db: Db): Promise<Record<string, number>> {
  const tables = await all<{ name: string }>(db, "select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name");
  const counts: Record<string, number> = {};
  for (const { name } of tables) counts[name] = (await all<{ n: number }>(db, `select count(*) as n from "${name.replace(/"/g, '""')}"`))[0]!.n;
  return counts;
}

// ---- files --------------------------------------------------------------------------------------

export function sha256(path: string): Promise<string> {
  return new Promise((done, fail) => {
    const hash = createHash('sha256');
    createReadStream(path)
      .on('data', (c) => hash.update(c))
      .on('error', fail)
      .on('end', () => done(hash.digest('hex')));
  });
}

/** Every file under a folder, relative to it, with forward slashes. */
function walk(dir: string, root = dir): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? walk(path, root) : [relative(root, path).split(sep).join('/')];
  });
}

const folderName = (at: Date) =>
  at
    .toISOString()
    .replace(/\.\d+Z$/, 'Z')
    .replace(/:/g, '-');

export interface BackupResult {
  folder: string;
  manifest: BackupManifest;
}

/**
 * A consistent online backup into a new dated folder of env.backupsDir. The files copied are those
 * of the photos and runs in the database copy; a folder that is missing at that moment (an upload
 * committing, a delete in progress) is waited for, then the whole backup is taken again.
 */
export async function createBackup(env: Env, opts: { appVersion: string; now?: () => Date }): Promise<BackupResult> {
  const now = opts.now ?? (() => new Date());
  mkdirSync(env.backupsDir, { recursive: true });
  for (let attempt = 1; ; attempt++) {
    const at = now();
    let name = folderName(at);
    for (let k = 2; existsSync(join(env.backupsDir, name)); k++) name = `${folderName(at)}-${k}`;
    const folder = join(env.backupsDir, name);
    const partial = `${folder}.partial`;
    rmSync(partial, { recursive: true, force: true });
    mkdirSync(partial, { recursive: true });
    try {
      await onlineCopy(env.dbPath, join(partial, DB_FILE));
      const sessions = join(env.dataDir, SESSIONS_FILE);
      if (existsSync(sessions)) await onlineCopy(sessions, join(partial, SESSIONS_FILE));
      if (existsSync(join(env.dataDir, SECRET_FILE))) copyFileSync(join(env.dataDir, SECRET_FILE), join(partial, SECRET_FILE));

      const copy = await open(join(partial, DB_FILE));
      let tables: Record<string, number>;
      let photoKeys: string[];
      let runKeys: string[];
      try {
        tables = await tableCounts(copy);
        photoKeys = (await all<{ storage_key: string }>(copy, 'select storage_key from photos')).map((r) => r.storage_key);
        runKeys = (await all<{ storage_key: string }>(copy, 'select storage_key from bench_runs')).map((r) => r.storage_key);
      } finally {
        await close(copy);
      }
      const missing: string[] = [];
      for (const [root, keys, kind] of [
        [photosRoot(env.uploadsDir), photoKeys, 'photos'],
        [runsRoot(env.uploadsDir), runKeys, 'runs'],
      ] as const) {
        for (const key of keys) {
          const source = join(root, key);
          // A row committed a moment ago has its folder moved into place right after: wait for it.
          for (let wait = 0; wait < 10 && !existsSync(source); wait++) await new Promise((r) => setTimeout(r, 100));
          if (!existsSync(source)) {
            missing.push(`${kind}/${key}`);
            continue;
          }
          const target = join(partial, 'uploads', kind, key);
          mkdirSync(target, { recursive: true });
          for (const file of readdirSync(source)) copyFileSync(join(source, file), join(target, file));
        }
      }
      if (missing.length) {
        if (attempt < 3) {
          rmSync(partial, { recursive: true, force: true });
          continue;
        }
        throw new Error(`The files of ${missing.length} record(s) are missing from the uploads folder (${missing.slice(0, 3).join(', ')}); no backup was made.`);
      }
      const files: BackupFile[] = [];
      for (const path of walk(partial).sort()) {
        const full = join(partial, path);
        files.push({ path, bytes: statSync(full).size, sha256: await sha256(full) });
      }
      const manifest: BackupManifest = { format: BACKUP_FORMAT, createdAt: at.toISOString(), appVersion: opts.appVersion, tables, photos: photoKeys.length, runs: runKeys.length, files };
      writeFileSync(join(partial, MANIFEST), JSON.stringify(manifest, null, 2) + '\n');
      // Only a complete backup gets its dated name.
      renameSync(partial, folder);
      return { folder, manifest };
    } catch (err) {
      rmSync(partial, { recursive: true, force: true });
      throw err;
    }
  }
}

export function readManifest(folder: string): BackupManifest {
  const path = join(folder, MANIFEST);
  if (!existsSync(path)) throw new Error(`${folder} is not a backup folder (it has no ${MANIFEST}).`);
  const manifest = JSON.parse(readFileSync(path, 'utf8')) as BackupManifest;
  if (manifest.format !== BACKUP_FORMAT) throw new Error(`${folder} holds a backup in another format (${String(manifest.format)}).`);
  return manifest;
}

/** The newest complete backup in env.backupsDir, or null. */
export function latestBackup(env: Pick<Env, 'backupsDir'>): { at: string; folder: string; bytes: number; files: number } | null {
  if (!existsSync(env.backupsDir)) return null;
  let best: { at: string; folder: string; bytes: number; files: number } | null = null;
  for (const name of readdirSync(env.backupsDir)) {
    if (name.endsWith('.partial')) continue;
    try {
      const m = readManifest(join(env.backupsDir, name));
      if (!best || m.createdAt > best.at) best = { at: m.createdAt, folder: name, bytes: m.files.reduce((s, f) => s + f.bytes, 0), files: m.files.length };
    } catch {
      // not a backup folder
    }
  }
  return best;
}

export class RestoreRefused extends Error {}

/** A backup folder named on the command line: a path, or a folder name inside env.backupsDir. */
export function backupFolder(env: Pick<Env, 'backupsDir'>, given: string): string {
  if (isAbsolute(given) || existsSync(given)) return resolve(given);
  return join(env.backupsDir, given);
}

export interface RestoreResult {
  manifest: BackupManifest;
  /** Where the data that was replaced now is (delete it once the restore is checked). */
  setAside: string[];
}

/**
 * Puts a backup back: refuses while a server runs on the data folder, checks every file against the
 * manifest, copies it beside the live data, then swaps: the current database, sessions, secret and
 * upload folders are moved aside (not deleted), and the copies renamed into place.
 */
export async function restoreBackup(env: Env, folder: string): Promise<RestoreResult> {
  const server = runningServer(env);
  if (server) {
    throw new RestoreRefused(
      `A Splitcase server is running on ${env.dataDir} (process ${server.pid}, port ${server.port}, since ${server.startedAt}). Stop it, then restore: the database cannot be replaced under a running server.`,
    );
  }
  const manifest = readManifest(folder);
  for (const f of manifest.files) {
    const path = join(folder, ...f.path.split('/'));
    if (!existsSync(path)) throw new RestoreRefused(`The backup is incomplete: ${f.path} is missing. Nothing was changed.`);
    if (statSync(path).size !== f.bytes || (await sha256(path)) !== f.sha256)
      throw new RestoreRefused(`The backup is damaged: ${f.path} does not match its SHA-256 in the manifest. Nothing was changed.`);
  }
  if (!manifest.files.some((f) => f.path === DB_FILE)) throw new RestoreRefused('The backup has no database. Nothing was changed.');

  const stamp = folderName(new Date());
  const stageData = join(env.dataDir, `.restore-${stamp}`);
  const stageUploads = join(env.uploadsDir, `.restore-${stamp}`);
  const asideData = join(env.dataDir, `.before-restore-${stamp}`);
  const asideUploads = join(env.uploadsDir, `.before-restore-${stamp}`);
  mkdirSync(stageData, { recursive: true });
  mkdirSync(stageUploads, { recursive: true });
  try {
    for (const f of manifest.files) {
      const from = join(folder, ...f.path.split('/'));
      const to = f.path.startsWith('uploads/') ? join(stageUploads, ...f.path.slice('uploads/'.length).split('/')) : join(stageData, f.path);
      mkdirSync(dirname(to), { recursive: true });
      copyFileSync(from, to);
    }
  } catch (err) {
    rmSync(stageData, { recursive: true, force: true });
    rmSync(stageUploads, { recursive: true, force: true });
    throw err;
  }

  // The swap: renames within the same folders.
  const setAside: string[] = [];
  const moveAside = (path: string, aside: string) => {
    if (!existsSync(path)) return;
    mkdirSync(aside, { recursive: true });
    renameSync(path, join(aside, basename(path)));
    if (!setAside.includes(aside)) setAside.push(aside);
  };
  const dataFiles = [DB_FILE, `${DB_FILE}-wal`, `${DB_FILE}-shm`, `${DB_FILE}-journal`, SESSIONS_FILE, `${SESSIONS_FILE}-journal`, `${SESSIONS_FILE}-wal`, `${SESSIONS_FILE}-shm`];
  const hasSecret = manifest.files.some((f) => f.path === SECRET_FILE);
  for (const name of [...dataFiles, ...(hasSecret ? [SECRET_FILE] : [])]) moveAside(join(env.dataDir, name), asideData);
  for (const name of ['photos', 'runs']) moveAside(join(env.uploadsDir, name), asideUploads);
  for (const name of readdirSync(stageData)) renameSync(join(stageData, name), join(env.dataDir, name));
  for (const name of readdirSync(stageUploads)) renameSync(join(stageUploads, name), join(env.uploadsDir, name));
  rmSync(stageData, { recursive: true, force: true });
  rmSync(stageUploads, { recursive: true, force: true });
  return { manifest, setAside };
}
