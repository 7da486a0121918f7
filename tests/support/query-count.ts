// Counts the SQL statements the ORM sends while a piece of work runs (MikroORM's `onQuery` hook
// sees every statement the connection executes), for tests that hold a read to a fixed number of
// queries whatever the number of records.
import type { Orm } from '../../apps/api/src/db/orm';

export async function countQueries(orm: Orm, work: () => Promise<unknown>): Promise<{ count: number; statements: string[] }> {
  const statements: string[] = [];
  const before = orm.config.get('onQuery');
  orm.config.set('onQuery', (sql: string, params: unknown[]) => {
    statements.push(sql);
    return before(sql, params);
  });
  try {
    await work();
  } finally {
    orm.config.set('onQuery', before);
  }
  return { count: statements.length, statements };
}
