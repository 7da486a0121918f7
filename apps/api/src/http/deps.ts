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
  log: (...args: unknown[]) => void;
}
