// Start-up sweep of upload folders after a crash. Uploads are written to a staging folder and moved
// into place only after their row is committed, so at start-up (no request in flight):
//   - a staged folder whose row exists was committed just before a crash: it is moved into place;
//   - any other staged entry (a temporary file of a body cut short, a folder whose row never
//     committed) is removed;
//   - a kept folder without a row (a delete that stopped before its files went) is removed.
import { existsSync, readdirSync, renameSync, rmSync, statSync } from 'node:fs';
import { basename, join } from 'node:path';

export interface SweepResult {
  /** Paths removed, relative to the root. */
  removed: string[];
  /** Staged folders moved into place (their row was committed). */
  restored: string[];
}

export function sweepFolders(opts: {
  /** Where kept folders live, one per storage key. */
  root: string;
  /** The staging folder inside the root. */
  staging: string;
  /** Storage keys that have a row. */
  keys: ReadonlySet<string>;
  keyPattern: RegExp;
}): SweepResult {
  const { root, staging, keys, keyPattern } = opts;
  const result: SweepResult = { removed: [], restored: [] };
  const entries = (dir: string) => (existsSync(dir) ? readdirSync(dir) : []);
  for (const name of entries(staging)) {
    const path = join(staging, name);
    if (keyPattern.test(name) && keys.has(name) && statSync(path).isDirectory() && !existsSync(join(root, name))) {
      renameSync(path, join(root, name));
      result.restored.push(name);
    } else {
      rmSync(path, { recursive: true, force: true });
      result.removed.push(join(basename(staging), name));
    }
  }
  for (const name of entries(root)) {
    if (name === basename(staging) || !keyPattern.test(name) || keys.has(name)) continue;
    rmSync(join(root, name), { recursive: true, force: true });
    result.removed.push(name);
  }
  return result;
}
