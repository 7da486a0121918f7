// MikroORM 6.6.16 reads SQLite enum check constraints wrongly when an enum has more than two
// values: its split keeps only the first and last items, so every schema diff (and every new
// migration) wants to rebuild each table with an enum column. This reads the quoted items of
// `col text check (col in ('a', 'b', 'c'))` correctly; it only runs when a schema is compared
// (creating migrations), never on ordinary queries.
import { SqliteSchemaHelper } from '@mikro-orm/sqlite';

type Execute = (sql: string, params: unknown[], method: 'get', ctx?: unknown) => Promise<{ sql: string } | undefined>;

export function parseSqliteEnumChecks(tableSql: string): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const m of tableSql.matchAll(/[`["']([^`\]"']+)[`\]"'] text check \(\s*[`["'][^`\]"']+[`\]"'] in \(((?:\s*'(?:[^']|'')*'\s*,?)*)\)\s*\)/gi)) {
    out[m[1]!] = [...m[2]!.matchAll(/'((?:[^']|'')*)'/g)].map((x) => x[1]!.replace(/''/g, "'"));
  }
  return out;
}

const proto = SqliteSchemaHelper.prototype as unknown as {
  getEnumDefinitions: (connection: { execute: Execute }, checks: unknown, tableName: string, schemaName?: string, ctx?: unknown) => Promise<Record<string, string[]>>;
};
proto.getEnumDefinitions = async function (connection, _checks, tableName, _schemaName, ctx) {
  const row = await connection.execute('select sql from sqlite_master where type = ? and name = ?', ['table', tableName], 'get', ctx);
  return parseSqliteEnumChecks(row?.sql ?? '');
};
