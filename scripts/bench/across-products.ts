// Reading across products at scale: the demo workspace copied BENCH_COPIES times (default 50: 500
// devices and teardowns, about 13,000 parts, 2,000 findings), then the calls a lead makes — search,
// facets, browse, CSV export, pattern counts, the home page and a 30-device lineup comparison — timed
// end to end through the HTTP API in-process (routing, validation, queries and JSON included).
// Each call runs once to warm up, then BENCH_REPEAT times (default 7); the median and the slowest are
// reported against the targets below. Exit code 1 when a median misses its target.
import { performance } from 'node:perf_hooks';
import { LINEUP_MAX_DEVICES } from '@splitcase/contracts';
import { makeTestApp, type Agent } from '../../tests/support/test-app';

const COPIES = Number(process.env.BENCH_COPIES ?? 50);
const REPEAT = Number(process.env.BENCH_REPEAT ?? 7);

/** Median targets in milliseconds, for a 2-core machine shared with other work. */
const TARGET_MS = {
  search: 500,
  browse: 500,
  csv: 3000,
  patterns: 2000,
  home: 1000,
  comparison: 2000,
} as const;

/**
 * Tables copied per copy of the demo, parents first, with the foreign keys to remap. A copy's ids
 * are the original ids plus copy × (the table's largest original id), so every reference is remapped
 * by the parent table's offset. Bench runs, photos and callouts are not copied: their files live on
 * disk under unique keys; the measured-capacity metric therefore comes from the original devices.
 */
const TABLES: { table: string; fks: Record<string, string>; rename?: Record<string, string>; originals?: string }[] = [
  { table: 'devices', fks: {}, rename: { model: "model || ' Mk ' || :copy" } },
  { table: 'teardowns', fks: { device_id: 'devices' } },
  { table: 'packs', fks: { teardown_id: 'teardowns' } },
  { table: 'converters', fks: { teardown_id: 'teardowns' } },
  { table: 'loads', fks: { teardown_id: 'teardowns', converter_id: 'converters' } },
  { table: 'parts', fks: { teardown_id: 'teardowns' } },
  { table: 'part_prices', fks: { part_id: 'parts' } },
  { table: 'measurements', fks: { teardown_id: 'teardowns' } },
  { table: 'findings', fks: { teardown_id: 'teardowns' } },
  { table: 'finding_parts', fks: { finding_id: 'findings', part_id: 'parts' }, originals: 'finding_id' },
  { table: 'comments', fks: { teardown_id: 'teardowns' } },
  { table: 'suggestion_decisions', fks: { teardown_id: 'teardowns', finding_id: 'findings' } },
];

const t = await makeTestApp({ seed: 'demo' });
try {
  // ── Grow the workspace ────────────────────────────────────────────────────────────────────────
  const conn = t.orm.em.fork().getConnection();
  const q = async <T = Record<string, unknown>>(sql: string, params: unknown[] = []) => (await conn.execute(sql, params)) as T[];
  const grown = performance.now();
  const maxId: Record<string, number> = {};
  const columns: Record<string, string[]> = {};
  for (const { table, originals } of TABLES) {
    if (!originals) maxId[table] = (await q<{ m: number | null }>(`select max(id) as m from ${table}`))[0]!.m ?? 0;
    columns[table] = (await q<{ name: string }>(`pragma table_info(${table})`)).map((c) => c.name);
  }
  await q('begin');
  for (let copy = 1; copy < COPIES; copy++) {
    for (const { table, fks, rename, originals } of TABLES) {
      // Rows of the original demo: ids up to the original maximum (or, in a link table, the rows
      // whose key column points at an original row).
      const where = originals ? `${originals} <= ${maxId[fks[originals]!]}` : `id <= ${maxId[table]}`;
      const cols = columns[table]!;
      const select = cols.map((c) => {
        if (c === 'id') return `id + ${copy * maxId[table]!}`;
        const parent = fks[c];
        if (parent) return `case when ${c} is null then null else ${c} + ${copy * maxId[parent]!} end`;
        if (rename?.[c]) return rename[c]!.replace(':copy', String(copy + 1));
        return c;
      });
      await q(`insert into ${table} (${cols.map((c) => `\`${c}\``).join(', ')}) select ${select.join(', ')} from ${table} where ${where}`);
    }
  }
  await q('commit');
  const counts: Record<string, number> = {};
  for (const table of ['devices', 'teardowns', 'parts', 'findings', 'comments', 'measurements']) {
    counts[table] = (await q<{ n: number }>(`select count(*) as n from ${table}`))[0]!.n;
  }
  counts['search index rows'] = (await q<{ n: number }>('select count(*) as n from search_fts'))[0]!.n;
  console.log(`Workspace grown to ${COPIES}× the demo in ${((performance.now() - grown) / 1000).toFixed(1)} s:`, counts);

  // A lineup of the most devices one may hold, across categories and copies.
  const lead = await t.as('lead');
  const viewer = await t.as('viewer');
  const ids = (await q<{ id: number }>(`select id from devices order by (id % 10), id limit ${LINEUP_MAX_DEVICES}`)).map((r) => r.id);
  const lineup = await lead.post('/api/lineups', { name: 'Bench lineup', deviceIds: ids }).expect(201);
  const lineupId = (lineup.body as { lineup: { id: number } }).lineup.id;

  // ── Time the calls ────────────────────────────────────────────────────────────────────────────
  const calls: { name: string; target: keyof typeof TARGET_MS; who: Agent; path: string; check: (body: unknown, text: string) => string }[] = [
    { name: 'search "sensor" (lead)', target: 'search', who: lead, path: '/api/search?q=sensor', check: (b) => `${(b as { total: number }).total} hits` },
    { name: 'search prefix "therm" (lead)', target: 'search', who: lead, path: '/api/search?q=therm', check: (b) => `${(b as { total: number }).total} hits` },
    {
      name: 'search two words, 2 facets (lead)',
      target: 'search',
      who: lead,
      path: '/api/search?q=cell+charger&category=power-bank&type=part',
      check: (b) => `${(b as { total: number }).total} hits`,
    },
    { name: 'search "sensor" (viewer)', target: 'search', who: viewer, path: '/api/search?q=sensor', check: (b) => `${(b as { total: number }).total} hits` },
    {
      name: 'browse findings, severity facet',
      target: 'browse',
      who: lead,
      path: '/api/search?severity=major&severity=critical&sort=date&dir=desc',
      check: (b) => `${(b as { total: number }).total} findings`,
    },
    { name: 'search CSV export "cell"', target: 'csv', who: lead, path: '/api/search.csv?q=cell', check: (_b, text) => `${text.split('\r\n').length - 2} rows` },
    { name: 'pattern counts (lead)', target: 'patterns', who: lead, path: '/api/patterns', check: (b) => `${(b as { patterns: unknown[] }).patterns.length} patterns` },
    { name: 'home (lead)', target: 'home', who: lead, path: '/api/home', check: () => 'ok' },
    { name: `lineup comparison, ${ids.length} devices`, target: 'comparison', who: lead, path: `/api/lineups/${lineupId}/comparison`, check: (b) => `${(b as { rows: unknown[] }).rows.length} rows` },
  ];

  const results: Record<string, string>[] = [];
  let missed = 0;
  for (const c of calls) {
    const times: number[] = [];
    let detail = '';
    for (let k = 0; k <= REPEAT; k++) {
      const t0 = performance.now();
      const res = await c.who.get(c.path).expect(200);
      const ms = performance.now() - t0;
      if (k === 0) detail = c.check(res.body, res.text);
      else times.push(ms);
    }
    times.sort((a, b) => a - b);
    const median = times[Math.floor(times.length / 2)]!;
    const ok = median <= TARGET_MS[c.target];
    if (!ok) missed++;
    results.push({
      call: c.name,
      answer: detail,
      median: `${median.toFixed(0)} ms`,
      slowest: `${times[times.length - 1]!.toFixed(0)} ms`,
      target: `≤ ${TARGET_MS[c.target]} ms`,
      met: ok ? 'yes' : 'NO',
    });
  }
  console.table(results);
  console.log(`Peak RSS of the process: ${((process.resourceUsage().maxRSS * 1024) / 1024 / 1024).toFixed(0)} MB`);
  if (missed) {
    console.log(`${missed} median(s) over target.`);
    process.exitCode = 1;
  }
} finally {
  await t.close();
}
