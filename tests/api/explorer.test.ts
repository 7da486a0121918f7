// Findings explorer: FTS5 search over findings, parts, teardown summaries and comments (ranking,
// prefixes, the index kept in step by triggers), facets and filters, the explorer's URL round trip,
// roles, query syntax typed by users, CSV export, and pattern counts across the demo devices.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import {
  EMPTY_SEARCH,
  SNIPPET_HIT_END,
  SNIPPET_HIT_START,
  searchApiQuery,
  searchStateFromParams,
  searchStateToQuery,
  snippetParts,
  snippetText,
  type Pattern,
  type SearchItem,
  type SearchResponse,
  type SearchState,
} from '@splitcase/contracts';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const agents: Record<string, Agent> = {};
const as = async (role: string) => (agents[role] ??= await t.as(role));

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
});
afterAll(() => t.close());

async function sql<T>(query: string, params: unknown[] = []): Promise<T[]> {
  return (await t.orm.em.fork().getConnection().execute(query, params)) as T[];
}
const count = async (query: string, params: unknown[] = []) => Number((await sql<{ n: number }>(query, params))[0]!.n);

async function search(role: string, qs: string): Promise<SearchResponse> {
  const res = await (await as(role)).get(`/api/search?${qs}`);
  expect(res.status, `${qs}: ${JSON.stringify(res.body)}`).toBe(200);
  return res.body as SearchResponse;
}
/** Every hit of a query (all pages). */
async function everything(role: string, qs: string): Promise<SearchItem[]> {
  const items: SearchItem[] = [];
  for (let offset = 0; ; offset += 200) {
    const r = await search(role, `${qs}${qs ? '&' : ''}limit=200&offset=${offset}`);
    items.push(...r.items);
    if (items.length >= r.total) return items;
  }
}
const q = encodeURIComponent;

/** The demo device and its (only) teardown, by model (scenario.ts). */
async function demo(model: string): Promise<{ deviceId: number; teardownId: number }> {
  const rows = await sql<{ d: number; t: number }>('select d.id as d, t.id as t from devices d join teardowns t on t.device_id = d.id where d.model = ? order by t.id limit 1', [model]);
  return { deviceId: rows[0]!.d, teardownId: rows[0]!.t };
}

let scratchDevice = 0;
/** A new draft teardown of a new device (the engineer's), for findings written by the tests. */
async function scratchTeardown(model = `Explorer ${++scratchDevice}`): Promise<{ deviceId: number; teardownId: number }> {
  const eng = await as('engineer');
  const d = (await eng.post('/api/devices', { maker: 'Testwright', model, category: 'other' }).expect(201)).body.device;
  const td = (await eng.post('/api/teardowns', { deviceId: d.id }).expect(201)).body.teardown;
  return { deviceId: d.id, teardownId: td.id };
}
async function addFinding(teardownId: number, text: string, over: Record<string, unknown> = {}) {
  const res = await (await as('engineer')).post(`/api/teardowns/${teardownId}/findings`, { kind: 'reliability', severity: 'minor', text, tags: [], ...over });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.finding as { id: number };
}

// Run first: later tests add devices and findings of their own.
describe('pattern counts on the demo data', () => {
  const byKey = (patterns: Pattern[], key: string) => {
    const p = patterns.find((x) => x.key === key);
    if (!p) throw new Error(`no pattern ${key}; have ${patterns.map((x) => x.key).join(', ')}`);
    return p;
  };
  const ids = async (...models: string[]) => Promise.all(models.map(async (m) => (await demo(m)).deviceId)).then((l) => l.sort((a, b) => a - b));
  const sorted = (l: number[]) => [...l].sort((a, b) => a - b);

  it('a lead sees every demo device (drafts and teardowns in review too): counts hand-checked against scenario.ts', async () => {
    const { patterns } = (await (await as('lead')).get('/api/patterns').expect(200)).body as { patterns: Pattern[] };
    // Heaters: HandGlow Duo 10 (no sensor), Pocketsun S (NTC), HandGlow Pro 2 (two NTCs, in review).
    const heaters = byKey(patterns, 'heater.no-sensor');
    expect([heaters.count, heaters.of]).toEqual([1, 3]);
    expect(heaters.deviceIds).toEqual(await ids('HandGlow Duo 10'));
    expect(heaters.label).toBe('1 of 3 pocket heaters has no temperature sensor');
    expect(heaters.devices[0]).toMatchObject({ maker: 'Halvix', model: 'HandGlow Duo 10', category: 'pocket-heater', teardownId: (await demo('HandGlow Duo 10')).teardownId });
    // Power banks against the 90 % warning level (workspace default): Stackcell 10 delivers 3 × 3.22 of 10 Ah ≈ 97 %,
    // Stackcell 20 PD 6 × 3.18 of 20 Ah ≈ 95 %, Slimvolt 5 4.05 of 5.0 Ah = 81 % [C].
    const banks = byKey(patterns, 'power-bank.capacity-short');
    expect([banks.count, banks.of]).toEqual([1, 3]);
    expect(banks.deviceIds).toEqual(await ids('Slimvolt 5'));
    expect(banks.label).toBe('1 of 3 power banks delivers under 90 % of its label capacity');
    // Every device has a discharge run and a label: under 90 % are Duo 10 (2.62 of 5.2 Ah ≈ 50 %),
    // Breeze Pocket (1.15 of 2.0 Ah ≈ 58 %) and Slimvolt 5 [C].
    const short = byKey(patterns, 'capacity-short');
    expect([short.count, short.of]).toEqual([3, 10]);
    expect(sorted(short.deviceIds)).toEqual(await ids('HandGlow Duo 10', 'Breeze Pocket', 'Slimvolt 5'));
    // 5.2 Ah × 3.7 V in a 46 g cell = 418 Wh/kg > 300 Wh/kg; the next highest is Stackcell 20 PD, 74 Wh / 0.29 kg = 255 Wh/kg [C; CP].
    const mass = byKey(patterns, 'label.beyond-cell-mass');
    expect([mass.count, mass.of]).toEqual([1, 10]);
    expect(mass.deviceIds).toEqual(await ids('HandGlow Duo 10'));
    // All ten packs are lithium; unprotected: Duo 10, Trailbeam C3 (draft), Breeze Pocket.
    const protection = byKey(patterns, 'pack.no-protection');
    expect([protection.count, protection.of]).toEqual([3, 10]);
    expect(sorted(protection.deviceIds)).toEqual(await ids('HandGlow Duo 10', 'Trailbeam C3', 'Breeze Pocket'));
    // Soldered: Pocketsun S, Slimvolt 5, Breeze Pocket.
    const soldered = byKey(patterns, 'pack.soldered-cells');
    expect([soldered.count, soldered.of]).toEqual([3, 10]);
    expect(sorted(soldered.deviceIds)).toEqual(await ids('Pocketsun S', 'Slimvolt 5', 'Breeze Pocket'));
    // Major safety findings: Duo 10 (no sensor), Slimvolt 5 (swollen cell), Breeze Pocket (soldered can, no protection).
    const safety = byKey(patterns, 'findings.safety-major');
    expect([safety.count, safety.of]).toEqual([3, 10]);
    expect(sorted(safety.deviceIds)).toEqual(await ids('HandGlow Duo 10', 'Slimvolt 5', 'Breeze Pocket'));
    // The one critical finding: Breeze Pocket's 57 % capacity claim.
    const critical = byKey(patterns, 'findings.critical');
    expect([critical.count, critical.of]).toEqual([1, 10]);
    expect(critical.deviceIds).toEqual(await ids('Breeze Pocket'));
    for (const p of patterns) {
      expect(p.count).toBe(p.deviceIds.length);
      expect(p.devices.map((d) => d.id)).toEqual(p.deviceIds);
      expect(p.count).toBeLessThanOrEqual(p.of);
    }
  });

  it('a viewer is judged on published teardowns only (six of the ten devices)', async () => {
    const { patterns } = (await (await as('viewer')).get('/api/patterns').expect(200)).body as { patterns: Pattern[] };
    const counts = Object.fromEntries(patterns.map((p) => [p.key, [p.count, p.of]]));
    expect(counts).toEqual({
      // HandGlow Pro 2 is in review: the viewer sees Duo 10 and Pocketsun S only.
      'heater.no-sensor': [1, 2],
      // Stackcell 20 PD is a draft: Stackcell 10 and Slimvolt 5.
      'power-bank.capacity-short': [1, 2],
      'capacity-short': [3, 6],
      'label.beyond-cell-mass': [1, 6],
      // Trailbeam C3 (draft) drops out.
      'pack.no-protection': [2, 6],
      'pack.soldered-cells': [3, 6],
      'findings.safety-major': [3, 6],
      'findings.critical': [1, 6],
    });
    const unpublished = await ids('HandGlow Pro 2', 'Stackcell 20 PD', 'Trailbeam C3', 'Breeze Neck 2');
    for (const p of patterns) for (const id of p.deviceIds) expect(unpublished).not.toContain(id);
  });

  it('needs a session', async () => {
    await (await t.anonymous()).get('/api/patterns').expect(401);
    await (await t.anonymous()).get('/api/search?q=sensor').expect(401);
  });
});

describe('search', () => {
  it('matches prefixes: "sens" finds the sensor finding, NTC parts and the comment about the sensor, with the hit marked', async () => {
    const r = await search('lead', 'q=sens');
    expect(r.mode).toBe('search');
    expect(r.terms).toEqual(['sens']);
    const duo = await demo('HandGlow Duo 10');
    const all = await everything('lead', 'q=sens');
    const finding = all.find((i) => i.type === 'finding' && i.teardownId === duo.teardownId && /No temperature sensor/.test(i.title));
    expect(finding).toBeDefined();
    expect(finding).toMatchObject({ deviceId: duo.deviceId, section: 'findings', kind: 'safety', severity: 'major', device: { maker: 'Halvix', model: 'HandGlow Duo 10', category: 'pocket-heater' } });
    expect(all.some((i) => i.type === 'part' && /NTC thermistor/.test(i.title))).toBe(true);
    expect(all.some((i) => i.type === 'comment' && /missing sensor/.test(snippetText(i.snippet)))).toBe(true);
    for (const item of all) {
      const hits = snippetParts(item.snippet).filter((p) => p.hit);
      expect(hits.length, item.snippet).toBeGreaterThan(0);
      for (const h of hits) expect(h.text.toLowerCase().startsWith('sens'), item.snippet).toBe(true);
    }
    // Whole words match too, and a word that only starts like one does not match the longer query.
    expect((await search('lead', 'q=sensor')).total).toBeGreaterThan(0);
    expect((await search('lead', 'q=sensorx')).total).toBe(0);
  });

  it('ranks the finding whose text matches better first, whatever the order they were written in', async () => {
    const { teardownId } = await scratchTeardown();
    // Written first: one mention in a long text. Written second: the word is most of a short text.
    const weak = await addFinding(
      teardownId,
      'The enclosure halves are joined by four self-tapping screws into bosses moulded in the back shell; the button membrane, the light pipe and the ' +
        'charge-port gasket are separate pieces placed by hand, and somewhere near the bottom a small glimmerwort label is stuck over one screw.',
    );
    const strong = await addFinding(teardownId, 'Glimmerwort coating on the glimmerwort flex: glimmerwort everywhere.');
    const r = await search('lead', 'q=glimmerwort');
    expect(r.items.map((i) => i.id)).toEqual([strong.id, weak.id]);
    expect(r.sort).toBe('relevance');
    // Sorted by date instead, the later-written one comes first as well; oldest first reverses.
    const oldest = await search('lead', 'q=glimmerwort&sort=date&dir=asc');
    expect(oldest.items.map((i) => i.id)).toEqual([weak.id, strong.id]);
  });

  it('keeps the index in step with findings: created → found, edited → new text found and old not, deleted → gone', async () => {
    const { teardownId } = await scratchTeardown();
    const eng = await as('engineer');
    const f = await addFinding(teardownId, 'The quillfeather latch bends open after a few cycles.', { tags: ['latchwork'] });
    expect((await search('lead', 'q=quillfeather')).items.map((i) => [i.type, i.id])).toEqual([['finding', f.id]]);
    expect((await search('lead', 'q=latchwork')).items.map((i) => i.id)).toEqual([f.id]);
    await eng.patch(`/api/teardowns/${teardownId}/findings/${f.id}`, { text: 'The brassneedle hinge wears through its boss.', tags: ['hingework'] }).expect(200);
    expect((await search('lead', 'q=quillfeather')).total).toBe(0);
    expect((await search('lead', 'q=latchwork')).total).toBe(0);
    expect((await search('lead', 'q=brassneedle')).items.map((i) => i.id)).toEqual([f.id]);
    expect((await search('lead', 'q=hingework')).items.map((i) => i.id)).toEqual([f.id]);
    await eng.delete(`/api/teardowns/${teardownId}/findings/${f.id}`).expect(204);
    expect((await search('lead', 'q=brassneedle')).total).toBe(0);
  });

  it('keeps the index in step with parts', async () => {
    const { teardownId } = await scratchTeardown();
    const eng = await as('engineer');
    const part = (await eng.post(`/api/teardowns/${teardownId}/parts`, { category: 'ic', description: 'Vorpalix timer IC', marking: 'VX555', designators: 'U9' }).expect(201)).body.part;
    const found = await search('lead', 'q=vorpalix');
    expect(found.items.map((i) => [i.type, i.id, i.section, i.title])).toEqual([['part', part.id, 'parts', 'U9 · Vorpalix timer IC']]);
    expect((await search('lead', 'q=VX555')).items.map((i) => i.id)).toEqual([part.id]);
    await eng.patch(`/api/parts/${part.id}`, { description: 'Jabberline timer IC' }).expect(200);
    expect((await search('lead', 'q=vorpalix')).total).toBe(0);
    expect((await search('lead', 'q=jabberline')).items.map((i) => i.id)).toEqual([part.id]);
    await eng.delete(`/api/parts/${part.id}`).expect(204);
    expect((await search('lead', 'q=jabberline')).total).toBe(0);
  });

  it('keeps the index in step with teardown summaries, safety notes, device names and comments', async () => {
    const { deviceId, teardownId } = await scratchTeardown('Snarkling 1');
    const eng = await as('engineer');
    const lead = await as('lead');
    const td = (await eng.get(`/api/teardowns/${teardownId}`).expect(200)).body.teardown;
    await eng.patch(`/api/teardowns/${teardownId}`, { version: td.version, summary: 'Bandersnatch-style clamshell with one screw.', safetyNotes: 'Cell kept in the tumtum tray.' }).expect(200);
    const summary = await search('lead', 'q=bandersnatch');
    expect(summary.items.map((i) => [i.type, i.id, i.teardownId, i.section])).toEqual([['teardown', teardownId, teardownId, 'overview']]);
    expect((await search('lead', 'q=tumtum')).items.map((i) => i.id)).toEqual([teardownId]);
    // The device's name is part of its teardowns' entry, and follows a rename.
    expect((await search('lead', 'q=snarkling')).items.map((i) => i.id)).toEqual([teardownId]);
    await eng.patch(`/api/devices/${deviceId}`, { model: 'Slithy 2' }).expect(200);
    expect((await search('lead', 'q=snarkling')).total).toBe(0);
    expect((await search('lead', 'q=slithy')).items.map((i) => [i.type, i.id])).toEqual([['teardown', teardownId]]);

    const comment = (await lead.post(`/api/teardowns/${teardownId}/comments`, { body: 'Is the jubjub spring from the same maker?' }).expect(201)).body.comment;
    const c = await search('lead', 'q=jubjub');
    expect(c.items.map((i) => [i.type, i.id, i.section])).toEqual([['comment', comment.id, 'comments']]);
    expect(c.items[0]!.title).toMatch(/^Comment by /);
    // Comments have no edit or delete route: the triggers are exercised directly.
    await sql('update comments set body = ? where id = ?', ['Is the borogove spring from the same maker?', comment.id]);
    expect((await search('lead', 'q=jubjub')).total).toBe(0);
    expect((await search('lead', 'q=borogove')).items.map((i) => i.id)).toEqual([comment.id]);
    await sql('delete from comments where id = ?', [comment.id]);
    expect((await search('lead', 'q=borogove')).total).toBe(0);

    // A teardown deleted takes its findings, parts and comments out of the index (foreign-key cascades fire the triggers).
    await addFinding(teardownId, 'Mimsy finding of a teardown about to go.');
    await eng.post(`/api/teardowns/${teardownId}/parts`, { category: 'other', description: 'Mimsy part' }).expect(201);
    expect((await search('lead', 'q=mimsy')).total).toBe(2);
    await sql('delete from teardowns where id = ?', [teardownId]);
    expect((await search('lead', 'q=mimsy')).total).toBe(0);
    expect(await count('select count(*) as n from search_fts where teardown_id = ?', [teardownId])).toBe(0);
  });

  it('every row of the index belongs to a record, and every record has its row', async () => {
    expect(await count('select count(*) as n from search_fts')).toBe(
      await count('select (select count(*) from findings) + (select count(*) from parts) + (select count(*) from teardowns) + (select count(*) from comments) as n'),
    );
    for (const [type, table, offset] of [
      ['finding', 'findings', 0],
      ['part', 'parts', 1],
      ['teardown', 'teardowns', 2],
      ['comment', 'comments', 3],
    ] as const) {
      expect(await count(`select count(*) as n from ${table} r left join search_fts s on s.rowid = r.id * 4 + ${offset} where s.type is not '${type}' or s.record_id != r.id`), table).toBe(0);
    }
    // The triggers survive migrations (a later migration that rebuilds one of these tables must re-create them).
    const triggers = (await sql<{ name: string }>("select name from sqlite_master where type = 'trigger' and name like '%search_fts%' order by name")).map((r) => r.name);
    expect(triggers).toEqual(
      ['comments', 'devices', 'findings', 'parts', 'teardowns'].flatMap((tb) => (tb === 'devices' ? [`devices_search_fts_au`] : ['ad', 'ai', 'au'].map((s) => `${tb}_search_fts_${s}`))).sort(),
    );
  });

  it('marks hits only: marker characters in stored text are removed, so text can never fake a highlight', async () => {
    const { teardownId } = await scratchTeardown();
    const fake = `Fake ${SNIPPET_HIT_START}highlight${SNIPPET_HIT_END} next to a zymurgic seam <b>bold</b>.`;
    // The API refuses the marker characters (control characters) in text now; text stored before that
    // rule, written here straight into the table (the search triggers index it), is still safe.
    const refused = await (await as('engineer')).post(`/api/teardowns/${teardownId}/findings`, { kind: 'reliability', severity: 'minor', text: fake, tags: [] });
    expect(refused.status).toBe(400);
    const { id } = await addFinding(teardownId, 'Placeholder zymurgic text');
    await t.orm.em.fork().getConnection().execute('update findings set text = ? where id = ?', [fake, id]);
    const [item] = (await search('lead', 'q=zymurgic')).items;
    expect(
      snippetParts(item!.snippet)
        .filter((p) => p.hit)
        .map((p) => p.text),
    ).toEqual(['zymurgic']);
    expect(item!.snippet).toContain('<b>bold</b>');
  });
});

describe('user input never breaks the query', () => {
  const inputs = [
    '"',
    '"unbalanced',
    'sensor"',
    '(',
    'sensor)',
    '((heater',
    '*',
    'sens*',
    '-',
    '-sensor',
    'NOT',
    'sensor NOT heater',
    'NEAR',
    'NEAR(sensor heater)',
    'NEAR(sensor heater, 2)',
    'sensor AND',
    'AND OR',
    'sensor OR heater',
    'title:sensor',
    '{title body}: sensor',
    '^sensor',
    'sensor + heater',
    "'; drop table findings; --",
    '\\',
    '%_%',
    '""',
    '\u0000',
    'x'.repeat(200),
    'a b c d e f g h i j k l m n o p',
  ];
  it.each(inputs)('%j answers 200 or 400 naming q, never 500', async (input) => {
    const res = await (await as('lead')).get(`/api/search?q=${q(input)}`);
    expect([200, 400], JSON.stringify(res.body)).toContain(res.status);
    if (res.status === 400) expect(Object.keys(res.body.error.fields)).toEqual(['query.q']);
    const csv = await (await as('lead')).get(`/api/search.csv?q=${q(input)}`);
    expect([200, 400]).toContain(csv.status);
  });
  it('operators are words: "sensor OR heater" needs all three words, like any other query', async () => {
    expect((await search('lead', `q=${q('sensor OR heater')}`)).terms).toEqual(['sensor', 'OR', 'heater']);
    const both = await everything('lead', `q=${q('sensor heater')}`);
    const withOr = await everything('lead', `q=${q('sensor OR heater')}`);
    expect(withOr.length).toBeLessThanOrEqual(both.length);
  });
  it('nothing to search is a clear error, and bad filters name their field', async () => {
    const lead = await as('lead');
    expect((await lead.get(`/api/search?q=${q('"()*')}`).expect(400)).body.error.fields).toEqual({ 'query.q': 'Type at least one letter or digit to search' });
    expect((await lead.get('/api/search?kind=bogus').expect(400)).body.error.fields).toHaveProperty('query.kind.0');
    expect((await lead.get('/api/search?from=2026-02-30').expect(400)).body.error.fields).toHaveProperty('query.from');
    expect((await lead.get('/api/search?from=2026-11-01&to=2026-10-01').expect(400)).body.error.fields).toEqual({ 'query.to': 'The end date is before the start date' });
    expect((await lead.get('/api/search?limit=5000').expect(400)).body.error.fields).toHaveProperty('query.limit');
    expect((await lead.get('/api/search?sort=price').expect(400)).body.error.fields).toHaveProperty('query.sort');
  });
});

describe('facets and filters', () => {
  it('browse mode (no words) lists findings, newest teardown first, with facets equal to direct counts', async () => {
    const r = await search('lead', '');
    expect(r.mode).toBe('browse');
    expect(r.types).toEqual(['finding']);
    expect(r.total).toBe(await count('select count(*) as n from findings'));
    const dates = r.items.map((i) => i.teardown.date);
    expect(dates).toEqual([...dates].sort().reverse());
    for (const sev of ['note', 'minor', 'major', 'critical']) {
      expect(r.facets.severity[sev] ?? 0, sev).toBe(await count('select count(*) as n from findings where severity = ?', [sev]));
    }
    expect(r.facets.kind.safety).toBe(await count("select count(*) as n from findings where kind = 'safety'"));
    expect(r.facets.tag.thermal).toBe(await count("select count(*) as n from findings f, json_each(f.tags) j where j.value = 'thermal'"));
    expect(r.facets.category['pocket-heater']).toBe(
      await count("select count(*) as n from findings f join teardowns t on t.id = f.teardown_id join devices d on d.id = t.device_id where d.category = 'pocket-heater'"),
    );
    expect(r.facets.maker.Halvix).toBe(await count("select count(*) as n from findings f join teardowns t on t.id = f.teardown_id join devices d on d.id = t.device_id where d.maker = 'Halvix'"));
    expect(r.facets.status.draft).toBe(await count("select count(*) as n from findings f join teardowns t on t.id = f.teardown_id where t.status = 'draft'"));
    expect(r.facets.month['2026-10']).toBe(await count("select count(*) as n from findings f join teardowns t on t.id = f.teardown_id where t.date like '2026-10-%'"));
    // The type facet ignores the (implied) type: every kind of record is counted.
    expect(r.facets.type.part).toBe(await count('select count(*) as n from parts'));
    expect(r.facets.type.comment).toBe(await count('select count(*) as n from comments'));
  });

  it('browse mode reads the text of the rows it shows: every type gets the same title, creation time and order as a search finds them with', async () => {
    // Browse mode reads only what the filters need for every row, then the text of the rows that
    // pass; a search reads the text with the candidates. Both must describe a record the same way.
    const key = (i: SearchItem) => `${i.type}:${i.id}`;
    const found = new Map((await everything('lead', 'q=cell')).map((i) => [key(i), i]));
    for (const type of ['finding', 'part', 'teardown', 'comment']) {
      const browsed = await everything('lead', `type=${type}&sort=date&dir=desc`);
      expect(browsed.length, type).toBe(await count(`select count(*) as n from ${type === 'teardown' ? 'teardowns' : `${type}s`}`));
      const both = browsed.filter((i) => found.has(key(i)));
      expect(both.length, `${type} found by "cell" too`).toBeGreaterThan(0);
      for (const i of both) expect({ title: i.title, createdAt: i.createdAt }, key(i)).toEqual({ title: found.get(key(i))!.title, createdAt: found.get(key(i))!.createdAt });
      // Newest teardown first; within a teardown, newest record first.
      const order = browsed.map((i) => `${i.teardown.date}|${i.createdAt}`);
      expect(order).toEqual([...order].sort().reverse());
      expect(browsed.every((i) => i.title.length > 0)).toBe(true);
    }
    const comment = (await everything('lead', 'type=comment')).find((i) => i.title.startsWith('Comment by '));
    expect(comment, 'a comment titled with its author').toBeDefined();
  });

  it("a facet's counts leave out its own filter and apply the others (values of one facet add up, facets narrow)", async () => {
    const all = await search('lead', '');
    const safety = await search('lead', 'kind=safety');
    expect(safety.total).toBe(await count("select count(*) as n from findings where kind = 'safety'"));
    // Kind counts are those without the kind filter: the user sees what adding another kind brings.
    expect(safety.facets.kind).toEqual(all.facets.kind);
    // Severity counts are within safety findings.
    for (const sev of ['note', 'minor', 'major', 'critical']) {
      expect(safety.facets.severity[sev] ?? 0).toBe(await count("select count(*) as n from findings where kind = 'safety' and severity = ?", [sev]));
    }
    const two = await search('lead', 'kind=safety&kind=compliance');
    expect(two.total).toBe(all.facets.kind.safety! + all.facets.kind.compliance!);
    // A chosen value with no hits stays listed, at 0.
    const none = await search('lead', 'kind=safety&severity=critical');
    expect(none.total).toBe(0);
    expect(none.facets.severity.critical).toBe(0);
    expect(none.facets.kind.safety).toBe(0);
  });

  it('filters combine with the words and with each other', async () => {
    const words = await everything('lead', 'q=cell');
    const combos: [string, (i: SearchItem) => boolean][] = [
      ['category=power-bank', (i) => i.device.category === 'power-bank'],
      ['category=power-bank&type=finding', (i) => i.device.category === 'power-bank' && i.type === 'finding'],
      ['maker=Corvane&maker=Zestora&status=published', (i) => ['Corvane', 'Zestora'].includes(i.device.maker) && i.teardown.status === 'published'],
      ['severity=major&severity=critical&kind=compliance', (i) => i.type === 'finding' && ['major', 'critical'].includes(i.severity!) && i.kind === 'compliance'],
      ['tag=label-claim&tag=cell-joining', (i) => i.tags.some((tg) => ['label-claim', 'cell-joining'].includes(tg))],
      ['from=2026-09-01&to=2026-10-31', (i) => i.teardown.date >= '2026-09-01' && i.teardown.date <= '2026-10-31'],
      ['type=part&type=teardown&status=draft', (i) => ['part', 'teardown'].includes(i.type) && i.teardown.status === 'draft'],
    ];
    for (const [qs, keep] of combos) {
      const got = await everything('lead', `q=cell&${qs}`);
      const expected = words.filter(keep);
      expect(expected.length, qs).toBeGreaterThan(0);
      expect(got.map((i) => `${i.type}:${i.id}`).sort(), qs).toEqual(expected.map((i) => `${i.type}:${i.id}`).sort());
    }
    const pocket = await demo('Breeze Pocket');
    const byDevice = await everything('lead', `q=cell&device=${pocket.deviceId}`);
    expect(byDevice.length).toBeGreaterThan(0);
    expect(byDevice.every((i) => i.deviceId === pocket.deviceId)).toBe(true);
  });

  it('sorts by severity (most severe first, other types last), by device, and pages without gaps or repeats', async () => {
    const sev = await everything('lead', 'q=cell&sort=severity');
    const order = ['critical', 'major', 'minor', 'note'];
    const ranks = sev.map((i) => (i.severity ? order.indexOf(i.severity) : 9));
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
    const dev = await everything('lead', 'q=cell&sort=device&dir=desc');
    const names = dev.map((i) => `${i.device.maker} ${i.device.model}`);
    expect(names).toEqual([...names].sort((a, b) => b.localeCompare(a, 'en', { sensitivity: 'base', numeric: true })));
    const full = await everything('lead', 'q=cell');
    const pages: SearchItem[] = [];
    for (let offset = 0; offset < full.length; offset += 7) pages.push(...(await search('lead', `q=cell&limit=7&offset=${offset}`)).items);
    expect(pages.map((i) => `${i.type}:${i.id}`)).toEqual(full.map((i) => `${i.type}:${i.id}`));
  });

  it('round trip: the URL the explorer writes for a state reads back to the same state and asks the API the same query', async () => {
    const state: SearchState = {
      ...EMPTY_SEARCH,
      q: 'cell',
      kind: ['safety', 'compliance'],
      category: ['power-bank', 'usb-fan'],
      status: ['published'],
      sort: 'severity',
      dir: 'desc',
    };
    const url = searchStateToQuery(state);
    const back = searchStateFromParams(new URLSearchParams(url));
    expect(back).toEqual(state);
    const viaUrl = await search('lead', searchApiQuery(back));
    const byHand = await search('lead', 'q=cell&kind=safety&kind=compliance&category=power-bank&category=usb-fan&status=published&sort=severity');
    expect(viaUrl.total).toBeGreaterThan(0);
    expect(viaUrl.items).toEqual(byHand.items);
    expect(viaUrl.facets).toEqual(byHand.facets);
    // Page 2 of a URL with a page is the API's offset.
    const paged = searchStateFromParams(new URLSearchParams(searchStateToQuery({ ...EMPTY_SEARCH, q: 'cell', page: 2 })));
    expect((await search('lead', searchApiQuery(paged, 5))).items).toEqual((await search('lead', 'q=cell&limit=5&offset=5')).items);
  });
});

describe('roles', () => {
  it('a viewer sees published teardowns only: in the results, the totals and every facet', async () => {
    const published = "select count(*) as n from findings f join teardowns t on t.id = f.teardown_id where t.status = 'published'";
    const r = await search('viewer', '');
    expect(r.total).toBe(await count(published));
    expect(Object.keys(r.facets.status)).toEqual(['published']);
    expect(r.facets.severity.major).toBe(await count(`${published} and f.severity = 'major'`));
    expect(r.facets.type.part).toBe(await count("select count(*) as n from parts p join teardowns t on t.id = p.teardown_id where t.status = 'published'"));
    const models = Object.keys(r.facets.maker);
    expect(models).not.toContain('Brightlark'); // Trailbeam C3 is a draft
    const viewerAll = await everything('viewer', 'q=sensor');
    const leadAll = await everything('lead', 'q=sensor');
    expect(viewerAll.length).toBeLessThan(leadAll.length);
    expect(viewerAll.every((i) => i.teardown.status === 'published')).toBe(true);
    expect(viewerAll.map((i) => `${i.type}:${i.id}`).sort()).toEqual(
      leadAll
        .filter((i) => i.teardown.status === 'published')
        .map((i) => `${i.type}:${i.id}`)
        .sort(),
    );
    // A draft's comment ("repeat the capacity run") is the lead's to find, not the viewer's.
    expect((await search('lead', 'q=repeat+capacity')).total).toBeGreaterThan(0);
    expect((await search('viewer', 'q=repeat+capacity')).total).toBe(0);
    // Asking for other statuses does not reveal them.
    expect((await search('viewer', 'status=draft&status=in_review')).total).toBe(0);
  });
});

describe('CSV export', () => {
  it('exports every hit of the query, spreadsheet-safe: BOM, CRLF, quoted, formulas neutralised, no hit markers', async () => {
    const { teardownId } = await scratchTeardown();
    await addFinding(teardownId, '=HYPERLINK("http://example.invalid","formulacheck") in a finding.', { tags: ['formulacheck'] });
    const lead = await as('lead');
    const res = await lead.get('/api/search.csv?q=formulacheck').expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="splitcase-search-formulacheck\.csv"/);
    const text = res.text;
    expect(text.charCodeAt(0)).toBe(0xfeff);
    expect(text).toContain('\r\n');
    expect(text.replace(/\r\n/g, '')).not.toContain('\n');
    expect(text).not.toContain(SNIPPET_HIT_START);
    const rows = Papa.parse<string[]>(text.slice(1).trim(), { newline: '\r\n' }).data;
    expect(rows[0]).toEqual(['Type', 'Title', 'Text', 'Maker', 'Model', 'Device category', 'Severity', 'Kind', 'Tags', 'Teardown status', 'Teardown date', 'Unit', 'Link']);
    expect(rows).toHaveLength(2);
    expect(rows[1]![0]).toBe('Finding');
    expect(rows[1]![1]!.startsWith("'=HYPERLINK")).toBe(true);
    expect(rows[1]![12]).toBe(`${t.env.publicUrl}/teardowns/${teardownId}/findings`);

    // Without words: every finding (all pages), as the browse list.
    const all = await lead.get('/api/search.csv?severity=major').expect(200);
    const data = Papa.parse<string[]>(all.text.slice(1).trim(), { newline: '\r\n' }).data;
    expect(data.length - 1).toBe(await count("select count(*) as n from findings where severity = 'major'"));
    expect(Number(all.headers['x-total-count'])).toBe(data.length - 1);
    // The viewer's export holds published teardowns only.
    const viewerCsv = await (await as('viewer')).get('/api/search.csv').expect(200);
    const vrows = Papa.parse<string[]>(viewerCsv.text.slice(1).trim(), { newline: '\r\n' }).data.slice(1);
    expect(vrows.length).toBe(await count("select count(*) as n from findings f join teardowns t on t.id = f.teardown_id where t.status = 'published'"));
    expect(new Set(vrows.map((r) => r[9]))).toEqual(new Set(['Published']));
  });
});
