// API entry for `npm run dev` (watch mode): migrate, seed when empty, listen.
import { readEnv } from './config/env';
import { demoSignIns } from './seed/index';
import { startServer } from './server';

const env = readEnv();
const running = await startServer(env, { seed: true });
running.logger.info({ url: running.url, dataDir: env.dataDir }, `Splitcase API on ${running.url}`);
if (running.seeded) running.logger.info({ signIns: demoSignIns(env) }, 'Seeded the demo workspace');
const stop = () => running.close().then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
