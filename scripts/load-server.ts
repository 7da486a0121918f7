// The server under `npm run load`, in its own process (started with --expose-gc and an IPC channel):
// serves like `npm start` without the web app, and answers "memory" with its memory use right after
// a full garbage collection, so the load test can tell retained memory from garbage not yet collected.
import { readEnv } from '../apps/api/src/config/env';
import { startServer } from '../apps/api/src/server';

const running = await startServer(readEnv(), { seed: true });
process.send!({ port: running.port });
process.on('message', (message) => {
  if (message !== 'memory') return;
  const gc = (globalThis as { gc?: () => void }).gc;
  gc?.();
  const u = process.memoryUsage();
  process.send!({ memory: { heapUsed: u.heapUsed, rss: u.rss, external: u.external, collected: Boolean(gc) } });
});
const stop = () => running.close().then(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
