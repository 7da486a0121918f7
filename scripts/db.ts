// Database chores: `migrate` the configured database, `create <name>` a migration from the
// entity changes, `fresh` (delete the database, migrate and seed).
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readEnv } from '../apps/api/src/config/env';
import { migrate, openOrm } from '../apps/api/src/db/orm';
import { migrationsPath } from '../apps/api/src/db/orm-config';
import { seedIfEmpty } from '../apps/api/src/seed/index';

const [command, name] = process.argv.slice(2);
const env = readEnv();

async function main() {
  switch (command) {
    case 'migrate': {
      const orm = await openOrm(env.dbPath);
      const applied = await migrate(orm);
      console.log(applied.length ? `Applied: ${applied.join(', ')}` : 'Database is up to date.');
      await orm.close();
      return;
    }
    case 'create': {
      // Diff the entities against a scratch database built from the committed migrations,
      // so the result does not depend on anyone's local data.
      const dir = mkdtempSync(join(tmpdir(), 'splitcase-migration-'));
      const orm = await openOrm(join(dir, 'scratch.sqlite'));
      await migrate(orm);
      const result = await orm.getMigrator().createMigration(migrationsPath, false, false, name);
      console.log(result.fileName ? `Created ${result.fileName}` : 'No entity changes: nothing to create.');
      await orm.close();
      rmSync(dir, { recursive: true, force: true });
      return;
    }
    case 'fresh': {
      for (const suffix of ['', '-wal', '-shm']) rmSync(env.dbPath + suffix, { force: true });
      const orm = await openOrm(env.dbPath);
      await migrate(orm);
      await seedIfEmpty(orm, env);
      await orm.close();
      console.log(`Fresh database at ${env.dbPath}`);
      return;
    }
    default:
      console.error('Usage: tsx scripts/db.ts migrate | create <name> | fresh');
      process.exitCode = 2;
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exitCode = 1;
});
