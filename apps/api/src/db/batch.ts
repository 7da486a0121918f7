// Helpers for reading many records at once: the id behind a reference, grouping rows by a key, and
// `$in` queries over long id lists.

/** The id of a to-one reference, whether the entity is loaded or only its id is known. */
export const refId = (r: unknown): number => (typeof r === 'object' && r !== null ? (r as { id: number }).id : (r as number));

/** Rows grouped by a numeric key, in their order. */
export function groupBy<T>(rows: readonly T[], key: (row: T) => number): Map<number, T[]> {
  const out = new Map<number, T[]>();
  for (const row of rows) {
    const k = key(row);
    const list = out.get(k);
    if (list) list.push(row);
    else out.set(k, [row]);
  }
  return out;
}

/** Ids per query: well under SQLite's bound-parameter limit, whatever the build. */
export const ID_CHUNK = 500;

/**
 * Runs a query for the records of many ids (`{ x: { $in: chunk } }`) in chunks and joins the
 * answers, so a list of any length stays under the bound-parameter limit. Order is per chunk.
 */
export async function findInChunks<T>(ids: readonly number[], find: (chunk: number[]) => Promise<T[]>, size = ID_CHUNK): Promise<T[]> {
  const out: T[] = [];
  for (let k = 0; k < ids.length; k += size) out.push(...(await find(ids.slice(k, k + size))));
  return out;
}
