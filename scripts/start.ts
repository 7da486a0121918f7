// `npm start`: build the web app when it is missing or older than its sources, migrate the
// database, seed the demo workspace when empty, and serve web app and API on one port.
import { readEnv } from '../apps/api/src/config/env';
import { demoSignIns } from '../apps/api/src/seed/index';
import { startServer } from '../apps/api/src/server';
import { ensureWebBuild, webDist } from './web-build';

try {
  ensureWebBuild();
} catch (err) {
  console.error((err as Error).message);
  process.exit(1);
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
