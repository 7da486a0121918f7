// Ids of demo records for tests that walk the route table: one published and one draft teardown
// that both have every kind of sub-record, and the records under them.
import type { TestApp } from './test-app';

export interface TeardownRecords {
  teardown: number;
  device: number;
  photo: number | null;
  callout: number | null;
  part: number | null;
  finding: number | null;
  load: number | null;
  mode: number | null;
  converter: number | null;
  measurement: number | null;
  run: number | null;
}

export interface DemoRecords {
  published: TeardownRecords;
  draft: TeardownRecords;
  lineups: { published: number; draft: number };
  users: Record<string, number>;
}

type Row = Record<string, number | string | null>;

async function rows(t: TestApp, sql: string, params: unknown[] = []): Promise<Row[]> {
  return (await t.orm.em.fork().getConnection().execute(sql, params)) as Row[];
}

async function first(t: TestApp, sql: string, params: unknown[]): Promise<number | null> {
  const r = await rows(t, sql, params);
  return r[0] ? Number(Object.values(r[0])[0]) : null;
}

async function recordsOf(t: TestApp, teardown: number, device: number): Promise<TeardownRecords> {
  const by = (table: string) => first(t, `select id from ${table} where teardown_id = ? order by id limit 1`, [teardown]);
  return {
    teardown,
    device,
    photo: await by('photos'),
    callout: await first(t, 'select c.id from callouts c join photos p on p.id = c.photo_id where p.teardown_id = ? order by c.id limit 1', [teardown]),
    part: await by('parts'),
    finding: await by('findings'),
    // A heater with its heated area first: the routes on a load (duty for a target) need one.
    load: await first(t, "select id from loads where teardown_id = ? order by (kind = 'heater' and heated_area_m2 is not null) desc, id limit 1", [teardown]),
    mode: await by('operating_modes'),
    converter: await by('converters'),
    measurement: await by('measurements'),
    run: await by('bench_runs'),
  };
}

/** The published and the draft teardown of the demo with the most kinds of sub-record. */
export async function demoRecords(t: TestApp): Promise<DemoRecords> {
  const pick = async (status: string) => {
    const candidates: TeardownRecords[] = [];
    for (const r of await rows(t, 'select id, device_id from teardowns where status = ? order by id', [status])) {
      candidates.push(await recordsOf(t, Number(r.id), Number(r.device_id)));
    }
    const score = (c: TeardownRecords) => Object.values(c).filter((v) => v !== null).length;
    candidates.sort((a, b) => score(b) - score(a));
    if (!candidates[0]) throw new Error(`The demo has no ${status} teardown`);
    return candidates[0];
  };
  const lineup = async (status: string) => {
    const id = await first(t, 'select id from lineups where status = ? order by id limit 1', [status]);
    if (id === null) throw new Error(`The demo has no ${status} lineup`);
    return id;
  };
  const users = Object.fromEntries((await rows(t, 'select id, email from users')).map((u) => [String(u.email).split('@')[0], Number(u.id)]));
  return { published: await pick('published'), draft: await pick('draft'), lineups: { published: await lineup('published'), draft: await lineup('draft') }, users };
}
