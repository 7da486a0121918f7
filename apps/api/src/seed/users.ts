import type { Role } from '@splitcase/contracts';
import { hashPassword, passwordProblem } from '../modules/auth/passwords';
import { UserSchema, type User } from '../modules/users/user.entity';
import type { SeedContext } from './context';

/** The invented team of the demo workspace (Brackwater Devices' teardown group). */
export const DEMO_USERS: { role: Role; name: string }[] = [
  { role: 'admin', name: 'Priya Castell' },
  { role: 'engineer', name: 'Tomas Reyne' },
  { role: 'sourcing', name: 'Mei Santori' },
  { role: 'lead', name: 'Jonah Velde' },
  { role: 'viewer', name: 'Ilse Marrow' },
];

export const DEMO_DOMAIN = 'splitcase.test';
export const demoEmail = (role: Role) => `${role}@${DEMO_DOMAIN}`;

export async function seedUsers(ctx: SeedContext): Promise<void> {
  // The demo password follows the rule every user's password follows.
  for (const u of DEMO_USERS) {
    const problem = passwordProblem(ctx.env.demoPassword, { email: demoEmail(u.role), name: u.name });
    if (problem) throw new Error(`SPLITCASE_DEMO_PASSWORD is refused for ${demoEmail(u.role)}: ${problem}`);
  }
  const passwordHash = await hashPassword(ctx.env.demoPassword);
  const users = {} as Record<Role, User>;
  for (const u of DEMO_USERS) {
    users[u.role] = ctx.em.create(UserSchema, { email: demoEmail(u.role), name: u.name, role: u.role, passwordHash, active: true } as never);
  }
  // A second engineer, so lists and reviews show more than one author.
  ctx.em.create(UserSchema, { email: `engineer2@${DEMO_DOMAIN}`, name: 'Rafael Okonkwo-Lind', role: 'engineer', passwordHash, active: true } as never);
  await ctx.em.flush();
  ctx.users = users;
}
