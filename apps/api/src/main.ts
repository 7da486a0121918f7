// API entry for `npm run dev` (watch mode): migrate, seed when empty, listen.
import { readEnv } from './config/env';
import { demoSignIns } from './seed/index';
import { startServer } from './server';

const env = readEnv();
const running = await startServer(env, { seed: true });
console.log(`Splitcase API on ${running.url} (data: ${env.dataDir})`);
if (running.seeded) console.log(['Seeded the demo workspace. Sign in with:', ...demoSignIns(env)].join('\n  '));
const stop = () => running.close().then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
