import type { Logger } from 'pino';
import type { Env } from '../config/env';
import type { Orm } from '../db/orm';
import type { Mailer } from '../modules/mail/mailer';

/** What the app is built from; handed to every route through its context. */
export interface AppDeps {
  env: Env;
  orm: Orm;
  mailer: Mailer;
  /** Whether the built-in capture SMTP server is in use (the Outbox page shows its messages). */
  outboxEnabled: boolean;
  /** The server log (http/logging.ts): one line per request, errors with their stack. */
  logger: Logger;
  /** A problem reported in passing, as an error line of `logger` (`logFunction`). */
  log: (...args: unknown[]) => void;
}
