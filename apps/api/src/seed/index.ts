import type { Orm } from '../db/orm';
import type { Env } from '../config/env';
import { UserSchema } from '../modules/users/user.entity';
import type { SeedContext, SeedStep } from './context';
import { DEMO_USERS, demoEmail, seedUsers } from './users';
import { seedWorkspace } from './workspace';
import { seedBom } from './bom';
import { seedPhotos } from './photos';
import { seedCost } from './cost';
import { seedRuns } from './runs';
import { seedFindings } from './findings';
import { seedLineups } from './lineups';

/** Seed steps in order. Later features append their step here. */
export const SEED_STEPS: SeedStep[] = [
  { name: 'users', run: seedUsers },
  { name: 'workspace', run: seedWorkspace },
  { name: 'bom', run: seedBom },
  { name: 'photos', run: seedPhotos },
  { name: 'cost', run: seedCost },
  { name: 'runs', run: seedRuns },
  { name: 'findings', run: seedFindings },
  { name: 'lineups', run: seedLineups },
];

/** Seeds the invented demo workspace when the database has no users. Returns whether it seeded. */
export async function seedIfEmpty(orm: Orm, env: Env, log: (line: string) => void = () => {}, steps: SeedStep[] = SEED_STEPS): Promise<boolean> {
  const em = orm.em.fork();
  if ((await em.count(UserSchema, {})) > 0) return false;
  const ctx: SeedContext = { env, em, users: {} as SeedContext['users'], refs: new Map(), log };
  for (const step of steps) {
    await step.run(ctx);
    await em.flush();
    em.clear();
    // Re-load the users into the cleared identity map for the next step.
    for (const u of DEMO_USERS) ctx.users[u.role] = await em.findOneOrFail(UserSchema, { email: demoEmail(u.role) });
    log(`seeded ${step.name}`);
  }
  return true;
}

export function demoSignIns(env: Env): string[] {
  return DEMO_USERS.map((u) => `${demoEmail(u.role).padEnd(26)} ${u.role.padEnd(9)} password: ${env.demoPassword}`);
}
