// Reads over many teardowns take a fixed number of SQL statements whatever the count (bench-run
// lists, the lineup comparison), and the bench-run word search looks over every run, not only the
// latest 500. Records are cloned from the demo with raw inserts, so the sets differ only in size.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ComparisonDto, DeviceDto, LineupDto, RunDto } from '@splitcase/contracts';
import { countQueries } from '../support/query-count';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let engineer: Agent;

const sql = async (text: string, params: unknown[] = []) => (await t.orm.em.fork().getConnection().execute(text, params)) as Record<string, unknown>[];

const RUN_COLUMNS = 'kind, label, file_name, file_bytes, storage_key, mapping, samples, duration_s, columns, options, analysis, created_by_id, created_at, updated_at';

/** Copies of run `runId` on teardown `teardownId` with these labels; `createdAt` an SQL expression (default: the source's). */
async function cloneRuns(runId: number, teardownId: number, labels: string[], createdAt = 'created_at') {
  for (const label of labels) {
    await sql(
      `insert into bench_runs (teardown_id, ${RUN_COLUMNS}) select ?, kind, ?, file_name, file_bytes, lower(hex(randomblob(16))), mapping, samples, duration_s, columns, options, analysis, created_by_id, ${createdAt}, updated_at from bench_runs where id = ?`,
      [teardownId, label, runId],
    );
  }
}

/** Copies of a teardown (same device, same status), with unit labels; returns their ids. */
async function cloneTeardowns(teardownId: number, unitLabels: string[]): Promise<number[]> {
  const out: number[] = [];
  for (const unit of unitLabels) {
    await sql(
      'insert into teardowns (device_id, engineer_id, unit_label, date, status, version, created_at, updated_at) select device_id, engineer_id, ?, date, status, 1, created_at, updated_at from teardowns where id = ?',
      [unit, teardownId],
    );
    out.push(Number((await sql('select max(id) as id from teardowns'))[0]!.id));
  }
  return out;
}

let discharge: { id: number; teardownId: number };

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  engineer = await t.as('engineer');
  const [row] = await sql("select r.id, r.teardown_id from bench_runs r join teardowns t on t.id = r.teardown_id where r.kind = 'discharge' and t.status = 'published' order by r.id limit 1");
  discharge = { id: Number(row!.id), teardownId: Number(row!.teardown_id) };
});
afterAll(() => t?.close());

describe('the lineup comparison', () => {
  // First: the bench-run tests below add teardowns, which would become some devices' latest.
  it('takes the same number of queries for 2 devices as for 8', async () => {
    const lead = await t.as('lead');
    const devices = (await lead.get('/api/devices').expect(200)).body.devices as DeviceDto[];
    expect(devices.length).toBeGreaterThanOrEqual(8);
    const create = async (ids: number[]) => (await lead.post('/api/lineups', { name: `Count ${ids.length}`, deviceIds: ids }).expect(201)).body.lineup as LineupDto;
    const eightIds = devices.slice(0, 8).map((d) => d.id);
    const eight = await create(eightIds);
    // The pair has every kind of record among the eight that decides whether a query is needed at
    // all (a discharge run with a current pulse: the packs are read for its cell count).
    const [pulsed] = await sql(
      `select t.device_id from bench_runs r join teardowns t on t.id = r.teardown_id where json_extract(r.analysis, '$.discharge.internalResistance') is not null and t.device_id in (${eightIds.join(',')}) limit 1`,
    );
    const first = Number(pulsed!.device_id);
    const pair = await create([first, eightIds.find((id) => id !== first)!]);
    let rows = 0;
    const counted = async (id: number) =>
      countQueries(t.orm, async () => {
        rows = ((await lead.get(`/api/lineups/${id}/comparison`).expect(200)).body as ComparisonDto).rows.length;
      });
    const two = await counted(pair.id);
    expect(rows).toBe(2);
    const many = await counted(eight.id);
    expect(rows).toBe(8);
    expect(many.count, many.statements.join('\n')).toBe(two.count);
  });
});

describe('bench-run lists', () => {
  it('take the same number of queries for 2 teardowns as for 8', async () => {
    const teardowns = await cloneTeardowns(discharge.teardownId, ['qc unit 1', 'qc unit 2', 'qc unit 3', 'qc unit 4', 'qc unit 5', 'qc unit 6', 'qc unit 7', 'qc unit 8']);
    for (const [k, id] of teardowns.entries()) await cloneRuns(discharge.id, id, [k < 2 ? 'qcpair qcall' : 'qcall']);
    let runs: RunDto[] = [];
    const two = await countQueries(t.orm, async () => {
      runs = (await engineer.get('/api/runs?q=qcpair').expect(200)).body.runs;
    });
    expect(new Set(runs.map((r) => r.teardownId)).size).toBe(2);
    const eight = await countQueries(t.orm, async () => {
      runs = (await engineer.get('/api/runs?q=qcall').expect(200)).body.runs;
    });
    expect(new Set(runs.map((r) => r.teardownId)).size).toBe(8);
    expect(eight.count, eight.statements.join('\n')).toBe(two.count);
    // Each run gets the comparison it gets on its own (GET /api/runs/:id).
    for (const r of runs) expect(r.comparison).toEqual(((await engineer.get(`/api/runs/${r.id}`).expect(200)).body.run as RunDto).comparison);
  });

  it('finds a word in a run older than the latest 500', async () => {
    const teardown = Number((await sql('select max(id) as id from teardowns'))[0]!.id);
    await cloneRuns(discharge.id, teardown, ['qcneedle oldest'], '(select min(created_at) from bench_runs)');
    await cloneRuns(
      discharge.id,
      teardown,
      Array.from({ length: 600 }, (_, k) => `qcfiller ${k}`),
      '(select max(created_at) from bench_runs)',
    );
    const all = (await engineer.get('/api/runs').expect(200)).body.runs as RunDto[];
    expect(all).toHaveLength(500);
    expect(all.some((r) => r.label === 'qcneedle oldest')).toBe(false);
    const found = (await engineer.get('/api/runs?q=QCNEEDLE').expect(200)).body.runs as RunDto[];
    expect(found.map((r) => r.label)).toEqual(['qcneedle oldest']);
    // Words are ANDed over maker, model, unit label and run label, case-insensitively.
    const device = found[0]!.device;
    expect(((await engineer.get(`/api/runs?q=${encodeURIComponent(`${device.model.toUpperCase()} qcneedle`)}`).expect(200)).body.runs as RunDto[]).map((r) => r.label)).toEqual(['qcneedle oldest']);
    expect((await engineer.get('/api/runs?q=qcneedle%20nosuchword').expect(200)).body.runs).toEqual([]);
    // % and _ are plain characters in a word, not patterns.
    expect((await engineer.get('/api/runs?q=qcne%25dle').expect(200)).body.runs).toEqual([]);
    expect((await engineer.get('/api/runs?q=qcne_dle').expect(200)).body.runs).toEqual([]);
  });
});
