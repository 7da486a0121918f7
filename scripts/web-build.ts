// Build the web app when apps/web/dist is missing or older than its sources (used by npm start and the browser tests).
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const root = fileURLToPath(new URL('..', import.meta.url));
export const webDist = join(root, 'apps/web/dist');

function newest(path: string): number {
  const st = statSync(path);
  if (!st.isDirectory()) return st.mtimeMs;
  return Math.max(st.mtimeMs, ...readdirSync(path).map((f) => newest(join(path, f))));
}

export function webBuildIsStale(): boolean {
  const index = join(webDist, 'index.html');
  if (!existsSync(index)) return true;
  const sources = ['apps/web/src', 'apps/web/index.html', 'apps/web/public', 'packages/contracts/src', 'tailwind.config.ts', 'vite.config.ts'].map((p) => join(root, p));
  return Math.max(...sources.filter(existsSync).map(newest)) > statSync(index).mtimeMs;
}

export function ensureWebBuild(log: (line: string) => void = console.log): void {
  if (!webBuildIsStale()) return;
  log('Building the web app…');
  const r = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) throw new Error(`vite build failed (exit ${r.status})`);
}
