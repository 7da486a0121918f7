import type { Server } from 'node:http';
import type { Env } from './config/env';
import { migrate, openOrm, type Orm } from './db/orm';
import type { Logger } from 'pino';
import { createApp, type CreateAppOptions } from './http/create-app';
import { createLogger, logFunction } from './http/logging';
import type { AppDeps } from './http/deps';
import { startCaptureServer, type CaptureServer } from './modules/mail/capture-server';
import { sweepUploadLeftovers } from './modules/leftovers';
import { createMailer } from './modules/mail/mailer';
import { clearRunning, markRunning } from './modules/system/server-lock';
import { seedIfEmpty } from './seed/index';

export interface Running {
  url: string;
  port: number;
  orm: Orm;
  deps: AppDeps;
  logger: Logger;
  seeded: boolean;
  capture: CaptureServer | null;
  close(): Promise<void>;
}

/** Open and migrate the database, optionally seed, start mail, build the app and listen. */
export async function startServer(env: Env, options: CreateAppOptions & { seed?: boolean; log?: (...a: unknown[]) => void; logger?: Logger } = {}): Promise<Running> {
  const logger = options.logger ?? createLogger(env.logLevel);
  const log = options.log ?? logFunction(logger);
  const orm = await openOrm(env.dbPath);
  await migrate(orm);
  // Nothing is in flight yet: finish or undo uploads a crash interrupted.
  const swept = await sweepUploadLeftovers(orm.em.fork(), env.uploadsDir);
  for (const [what, r] of Object.entries(swept)) {
    if (r.removed.length || r.restored.length)
      logger.warn({ removed: r.removed, restored: r.restored }, `Upload leftovers (${what}): removed ${r.removed.length}, moved into place ${r.restored.length}`);
  }
  const seeded = options.seed ? await seedIfEmpty(orm, env) : false;
  const capture = env.smtpUrl ? null : await startCaptureServer(orm, env.captureSmtpPort, log);
  const mailer = createMailer({ smtpUrl: env.smtpUrl, capturePort: capture?.port, from: env.mailFrom });
  const deps: AppDeps = { env, orm, mailer, outboxEnabled: capture !== null, logger, log };
  const app = createApp(deps, options);
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(env.port, env.host, () => resolve(s));
    s.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : env.port;
  // `npm run restore` refuses while this file names a live process.
  markRunning(env, port);
  return {
    url: `http://localhost:${port}`,
    port,
    orm,
    deps,
    logger,
    seeded,
    capture,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections?.();
      mailer.close();
      await capture?.close();
      await orm.close();
      clearRunning(env);
    },
  };
}
