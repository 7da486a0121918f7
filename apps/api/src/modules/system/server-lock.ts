// A running server says so in <data>/server.pid, so that `npm run restore` can refuse to replace the
// database under it. A file left by a server that was killed names a process that no longer exists
// and is ignored.
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Env } from '../../config/env';

export interface ServerMark {
  pid: number;
  port: number;
  startedAt: string;
}

export const pidFile = (env: Pick<Env, 'dataDir'>) => join(env.dataDir, 'server.pid');

export function markRunning(env: Pick<Env, 'dataDir'>, port: number): void {
  const mark: ServerMark = { pid: process.pid, port, startedAt: new Date().toISOString() };
  writeFileSync(pidFile(env), JSON.stringify(mark) + '\n');
}

export function clearRunning(env: Pick<Env, 'dataDir'>): void {
  try {
    const mark = JSON.parse(readFileSync(pidFile(env), 'utf8')) as ServerMark;
    if (mark.pid === process.pid) rmSync(pidFile(env), { force: true });
  } catch {
    // no file, or not ours
  }
}

/** The server running on this data folder, if any (a stale file of a killed server is ignored). */
export function runningServer(env: Pick<Env, 'dataDir'>): ServerMark | null {
  if (!existsSync(pidFile(env))) return null;
  let mark: ServerMark;
  try {
    mark = JSON.parse(readFileSync(pidFile(env), 'utf8')) as ServerMark;
  } catch {
    return null;
  }
  if (!Number.isInteger(mark.pid) || mark.pid <= 0) return null;
  try {
    process.kill(mark.pid, 0);
    return mark;
  } catch (err) {
    // EPERM: the process exists but belongs to someone else.
    return (err as NodeJS.ErrnoException).code === 'EPERM' ? mark : null;
  }
}
