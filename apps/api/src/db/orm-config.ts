import { fileURLToPath } from 'node:url';
import { defineConfig, type Options } from '@mikro-orm/sqlite';
import { Migrator } from '@mikro-orm/migrations';
import './sqlite-enum-fix';
import { entities } from '../modules/entities';

export const migrationsPath = fileURLToPath(new URL('../../migrations', import.meta.url));

/** MikroORM options for a SQLite file. Used by the server, scripts, tests and the CLI config. */
export function ormConfig(dbPath: string, extra: Partial<Options> = {}): Options {
  return defineConfig({
    dbName: dbPath,
    entities,
    extensions: [Migrator],
    preferTs: true,
    debug: false,
    allowGlobalContext: false,
    forceUtcTimezone: true,
    // FTS5 virtual tables (and their shadow tables) are made by hand-written migrations.
    schemaGenerator: { skipTables: [/_fts/] },
    migrations: {
      path: migrationsPath,
      pathTs: migrationsPath,
      glob: '!(*.d).{js,ts}',
      emit: 'ts',
      snapshot: false,
      silent: true,
      transactional: true,
      allOrNothing: true,
    },
    dynamicImportProvider: (id: string) => import(id),
    ...extra,
  });
}
