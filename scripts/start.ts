// `npm start`: build the web app when it is missing or older than its sources, migrate the
// database, seed the demo workspace when empty, and serve web app and API on one port.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { readEnv } from '../apps/api/src/config/env';
import { demoSignIns } from '../apps/api/src/seed/index';
import { startServer } from '../apps/api/src/server';

const root = fileURLToPath(new URL('..', import.meta.url));
const webDist = join(root, 'apps/web/dist');

function newest(path: string): number {
  const st = statSync(path);
  if (!st.isDirectory()) return st.mtimeMs;
  return Math.max(st.mtimeMs, ...readdirSync(path).map((f) => newest(join(path, f))));
}

function webBuildIsStale(): boolean {
  const index = join(webDist, 'index.html');
  if (!existsSync(index)) return true;
  const sources = [join(root, 'apps/web/src'), join(root, 'apps/web/index.html'), join(root, 'packages/contracts/src'), join(root, 'tailwind.config.ts'), join(root, 'vite.config.ts')];
  return Math.max(...sources.filter(existsSync).map(newest)) > statSync(index).mtimeMs;
}

if (webBuildIsStale()) {
  console.log('Building the web app…');
  const r = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

const env = readEnv();
const running = await startServer(env, { seed: true, webDist });
console.log(`\nSplitcase is running at ${running.url}`);
console.log(`  data: ${env.dataDir}   uploads: ${env.uploadsDir}`);
console.log(running.capture ? `  e-mail: captured on 127.0.0.1:${running.capture.port}, shown on the Outbox page (admin)` : '  e-mail: sent through SPLITCASE_SMTP_URL');
if (running.seeded) console.log('  seeded the demo workspace');
console.log(['  demo sign-ins:', ...demoSignIns(env).map((l) => '    ' + l)].join('\n'));
const stop = () => running.close().then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
