// `npm run seed`: migrate and seed the demo workspace when the database is empty.
import { readEnv } from '../apps/api/src/config/env';
import { migrate, openOrm } from '../apps/api/src/db/orm';
import { demoSignIns, seedIfEmpty } from '../apps/api/src/seed/index';

const env = readEnv();
const orm = await openOrm(env.dbPath);
await migrate(orm);
const seeded = await seedIfEmpty(orm, env, (l) => console.log(`  ${l}`));
console.log(seeded ? 'Seeded the demo workspace.' : 'The database already has users; nothing seeded (npm run db:fresh starts over).');
console.log(['Demo sign-ins:', ...demoSignIns(env).map((l) => '  ' + l)].join('\n'));
await orm.close();
