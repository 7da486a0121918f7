import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { MikroORM, type Options } from '@mikro-orm/sqlite';
import { ormConfig } from './orm-config';

export type Orm = MikroORM;

/** Open the database file (creating its folder), switch on WAL and foreign keys. */
export async function openOrm(dbPath: string, extra: Partial<Options> = {}): Promise<Orm> {
  mkdirSync(dirname(dbPath), { recursive: true });
  const orm = await MikroORM.init(ormConfig(dbPath, extra));
  const conn = orm.em.getConnection();
  await conn.execute('PRAGMA journal_mode = WAL');
  await conn.execute('PRAGMA foreign_keys = ON');
  await conn.execute('PRAGMA busy_timeout = 5000');
  return orm;
}

/** Apply every pending migration; returns the names applied. */
export async function migrate(orm: Orm): Promise<string[]> {
  const done = await orm.getMigrator().up();
  return done.map((m) => m.name);
}
