import type { Role } from '@splitcase/contracts';
import { hashPassword } from '../modules/auth/passwords';
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
  // The demo password is shared and published (README, `npm start` prints it), so no guessing check
  // would make it secret; it only needs 12 characters (config/env.ts). The password rule applies to
  // every password a person sets: accepting an invitation, a reset, a change.
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
