import type { EntityManager } from '@mikro-orm/sqlite';
import type { Env } from '../config/env';
import type { User } from '../modules/users/user.entity';
import type { Role } from '@splitcase/contracts';

/** What seed steps share: the users made first, and anything later steps need to find. */
export interface SeedContext {
  env: Env;
  em: EntityManager;
  users: Record<Role, User>;
  /** Free-form references between steps, e.g. devices by key. */
  refs: Map<string, unknown>;
  log: (line: string) => void;
}

export type SeedStep = { name: string; run: (ctx: SeedContext) => Promise<void> };
