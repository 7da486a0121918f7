import { createWriteStream, existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { once } from 'node:events';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { CONFIRM_UNPUBLISH_HEADER } from '@splitcase/contracts';
import { benchRunFigureInputs } from '../../apps/api/src/modules/runs/figures';
import { runFileOps } from '../../apps/api/src/modules/runs/storage';
import { TeardownSchema } from '../../apps/api/src/modules/teardowns/teardown.entity';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
/** Teardown ids by device model (the demo seed). */
const ids: Record<string, number> = {};
let scratch: string;

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  const rows = (await t.orm.em.fork().getConnection().execute('select t.id, d.model, t.status from teardowns t join devices d on d.id = t.device_id')) as { id: number; model: string }[];
  for (const r of rows) ids[r.model] = r.id;
  scratch = mkdtempSync(join(tmpdir(), 'splitcase-runs-test-'));
});
afterAll(async () => {
  await t.close();
  rmSync(scratch, { recursive: true, force: true });
});

// Teardowns by status in the demo: draft, in review, published.
const DRAFT = 'Stackcell 20 PD';
const PUBLISHED = 'Stackcell 10';
const PUBLISHED_HEATER = 'HandGlow Duo 10';

type Mapping = Record<string, unknown>;
const dischargeMapping = (extra: Mapping = {}): Mapping => ({
  kind: 'discharge',
  time: { column: 'elapsed_s', unit: 's' },
  voltage: { column: 'volts', unit: 'V' },
  current: { column: 'amps', unit: 'A' },
  ...extra,
});

function upload(a: Agent, teardownId: number, text: string | Buffer, mapping: Mapping, opts: { name?: string; options?: unknown; label?: string; confirm?: boolean } = {}) {
  let req = a.upload(`/api/teardowns/${teardownId}/runs`).field('mapping', JSON.stringify(mapping));
  if (opts.options !== undefined) req = req.field('options', JSON.stringify(opts.options));
  if (opts.label !== undefined) req = req.field('label', opts.label);
  if (opts.confirm) req = req.set(CONFIRM_UNPUBLISH_HEADER, 'yes');
  return req.attach('file', Buffer.isBuffer(text) ? text : Buffer.from(text), opts.name ?? 'log.csv');
}

/**
 * Constant-current discharge [C]: 1.000 A for 3600 s, voltage falling linearly from 4.1 V to 3.3 V,
 * one sample a second. Ah = 1 A × 1 h = 1.000 Ah; Wh = ∫V·I dt = 1 A × 3.7 V (mean of a linear fall) × 1 h = 3.700 Wh;
 * the trapezoidal rule is exact for linear segments.
 */
function constantDischarge(format: { sep?: string; time?: (s: number) => string; volts?: (v: number) => string; amps?: (i: number) => string; header?: string } = {}) {
  const sep = format.sep ?? ',';
  const lines = [format.header ?? ['elapsed_s', 'volts', 'amps'].join(sep)];
  for (let k = 0; k <= 3600; k++) {
    const v = 4.1 - (0.8 * k) / 3600;
    lines.push([format.time ? format.time(k) : String(k), format.volts ? format.volts(v) : v.toFixed(6), format.amps ? format.amps(1) : '1.000'].join(sep));
  }
  return lines.join('\n') + '\n';
}

/** Rows in bench_runs and files under uploads/runs (kept runs and anything left in the incoming folder). */
async function stored(): Promise<{ rows: number; runFolders: number; incoming: number }> {
  const [row] = (await t.orm.em.fork().getConnection().execute('select count(*) as n from bench_runs')) as { n: number }[];
  const n = row?.n ?? 0;
  const root = join(t.env.uploadsDir, 'runs');
  const runFolders = existsSync(root) ? readdirSync(root).filter((f) => f !== '.incoming').length : 0;
  const inc = join(root, '.incoming');
  const incoming = existsSync(inc) ? readdirSync(inc).length : 0;
  return { rows: Number(n), runFolders, incoming };
}

describe('upload and analysis of each run kind', () => {
  it('discharge: constant 1.000 A for 3600 s → 1.000 Ah, 3.700 Wh, 3.7 V average [C]', async () => {
    const a = await t.as('engineer');
    const res = await upload(a, ids[DRAFT]!, constantDischarge(), dischargeMapping(), { label: 'Bench check' }).expect(201);
    const { run } = res.body;
    expect(run.kind).toBe('discharge');
    expect(run.label).toBe('Bench check');
    expect(run.samples).toBe(3601);
    expect(run.analysis.ampHours).toBeCloseTo(1.0, 9);
    expect(run.analysis.wattHours).toBeCloseTo(3.7, 9);
    expect(run.analysis.durationS).toBe(3600);
    expect(run.analysis.averageVolts).toBeCloseTo(3.7, 9);
    expect(run.analysis.endVolts).toBeCloseTo(3.3, 9);
    expect(run.analysis.discharge.cutoff.reason).toBe('end-of-run');
    // The label of the Stackcell 20 PD claims 20 Ah: 1 Ah is 5 % of it, below the 90 % setting.
    expect(run.comparison.label).toMatchObject({ claimedAh: 20, percent: expect.closeTo(5, 9), warning: true });
    expect(run.comparison.warnBelowPercent).toBe(90);
  });

  it('discharge with a cut-off: 4.1 − 0.8·t/3600 V reaches 3.5 V at t = 2700 s → 0.750 Ah [C]', async () => {
    const a = await t.as('engineer');
    const { run } = (await upload(a, ids[DRAFT]!, constantDischarge(), dischargeMapping(), { options: { cutoffVolts: 3.5 } }).expect(201)).body;
    expect(run.analysis.discharge.cutoff).toMatchObject({ reason: 'cutoff-voltage', t: 2700 });
    expect(run.analysis.ampHours).toBeCloseTo(0.75, 9);
    // ∫ from 0 to 2700 s of (4.1 − 0.8 t/3600) dt / 3600 = (4.1·2700 − 0.4·2700²/3600) / 3600 = 2.85 Wh [C]
    expect(run.analysis.wattHours).toBeCloseTo(2.85, 9);
    expect(run.options).toEqual({ cutoffVolts: 3.5 });
  });

  it('reads TSV with time in ms, voltage in mV and current in mA to the same answer [C]', async () => {
    const a = await t.as('engineer');
    const tsv = constantDischarge({ sep: '\t', header: 't_ms\tv_mV\ti_mA', time: (s) => String(s * 1000), volts: (v) => (v * 1000).toFixed(3), amps: (i) => String(i * 1000) });
    const mapping = { kind: 'discharge', time: { column: 't_ms', unit: 'ms' }, voltage: { column: 'v_mV', unit: 'mV' }, current: { column: 'i_mA', unit: 'mA' } };
    const { run } = (await upload(a, ids[DRAFT]!, tsv, mapping, { name: 'log.tsv' }).expect(201)).body;
    expect(run.mapping.delimiter).toBe('\t');
    expect(run.analysis.ampHours).toBeCloseTo(1.0, 9);
    expect(run.analysis.wattHours).toBeCloseTo(3.7, 9);
    expect(run.analysis.durationS).toBeCloseTo(3600, 9);
  });

  it('reads time in minutes and a power column without current (current = P/V per sample) [C]', async () => {
    const a = await t.as('engineer');
    const lines = ['minutes,volts,watts'];
    for (let k = 0; k <= 60; k++) lines.push(`${k},4.000,8.000`);
    const mapping = { kind: 'discharge', time: { column: 'minutes', unit: 'min' }, voltage: { column: 'volts', unit: 'V' }, power: { column: 'watts', unit: 'W' } };
    const { run } = (await upload(a, ids[DRAFT]!, lines.join('\n'), mapping).expect(201)).body;
    // 8 W for 1 h = 8 Wh; at 4 V that is 2 A, so 2 Ah.
    expect(run.analysis.wattHours).toBeCloseTo(8, 9);
    expect(run.analysis.ampHours).toBeCloseTo(2, 9);
    expect(run.analysis.durationS).toBe(3600);
  });

  it('reads ISO timestamps, Unix epoch seconds and milliseconds as elapsed time [C]', async () => {
    const a = await t.as('engineer');
    const start = Date.parse('2026-11-02T09:00:00Z');
    const cases: [string, (s: number) => string][] = [
      ['iso', (s) => new Date(start + s * 1000).toISOString()],
      ['epoch-s', (s) => String(start / 1000 + s)],
      ['epoch-ms', (s) => String(start + s * 1000)],
    ];
    for (const [unit, time] of cases) {
      const csv = constantDischarge({ header: 'when,volts,amps', time });
      const { run } = (await upload(a, ids[DRAFT]!, csv, dischargeMapping({ time: { column: 'when', unit } })).expect(201)).body;
      expect(run.analysis.durationS, unit).toBeCloseTo(3600, 6);
      expect(run.analysis.ampHours, unit).toBeCloseTo(1.0, 6);
    }
    // A timestamp without a zone and with a space (as spreadsheets write it) reads the same.
    const spaced = constantDischarge({ header: 'when,volts,amps', time: (s) => new Date(start + s * 1000).toISOString().replace('T', ' ').replace('Z', '') });
    const { run } = (await upload(a, ids[DRAFT]!, spaced, dischargeMapping({ time: { column: 'when', unit: 'iso' } })).expect(201)).body;
    expect(run.analysis.durationS).toBeCloseTo(3600, 6);
  });

  it('reads semicolons with decimal commas, a preamble before the header, and unit words in the cells', async () => {
    const a = await t.as('engineer');
    const lines = ['Logger export', 'Channel: load 1', 'time;voltage;current'];
    for (let k = 0; k <= 3600; k += 60) lines.push(`${k} s;${(4.1 - (0.8 * k) / 3600).toFixed(4).replace('.', ',')} V;1000 mA`);
    const mapping = {
      kind: 'discharge',
      time: { column: 'time', unit: 's' },
      voltage: { column: 'voltage', unit: 'V' },
      current: { column: 'current', unit: 'mA' },
      delimiter: ';',
      decimalComma: true,
      headerRow: 3,
    };
    const { run } = (await upload(a, ids[DRAFT]!, lines.join('\r\n'), mapping).expect(201)).body;
    expect(run.samples).toBe(61);
    expect(run.analysis.ampHours).toBeCloseTo(1.0, 9);
    expect(run.analysis.wattHours).toBeCloseTo(3.7, 3);
  });

  it('charge: finds a known CC→CV transition at 3000 s within one sample; without a pack record, the termination at 5 % of the CC current, tx + τ·ln 20 [C]', async () => {
    // CC 1.5 A while V climbs 3.6 → 4.2 V over 3000 s; then 4.2 V with I = 1.5·e^(−(t − 3000)/900).
    // No rated capacity to take 0.05 C of: termination at 5 % of 1.5 A = 0.075 A, t = 3000 + 900·ln 20 = 5696.2 s.
    const lines = ['t,v,i'];
    for (let s = 0; s <= 7000; s += 10) {
      const cc = s < 3000;
      lines.push(`${s},${(cc ? 3.6 + 0.6 * (s / 3000) ** 1.5 : 4.2).toFixed(5)},${(cc ? 1.5 : 1.5 * Math.exp(-(s - 3000) / 900)).toFixed(6)}`);
    }
    const a = await t.as('engineer');
    const noPack = await benchUnit(a, 'Charge without a pack record', {});
    const mapping = { kind: 'charge', time: { column: 't', unit: 's' }, voltage: { column: 'v', unit: 'V' }, current: { column: 'i', unit: 'A' } };
    const { run } = (await upload(a, noPack, lines.join('\n'), mapping).expect(201)).body;
    const c = run.analysis.charge;
    expect(Math.abs(c.transitionS - 3000)).toBeLessThanOrEqual(10);
    expect(c.cc.currentA).toBeCloseTo(1.5, 9);
    expect(c.terminated).toBe(true);
    expect(c.terminationCurrentA).toBeCloseTo(0.075, 9);
    expect(c.termination).toMatchObject({ basis: 'cc-current', ratedAh: null });
    expect(c.termination.description).toMatch(/no pack record/);
    expect(Math.abs(c.chargeTimeS - (3000 + 900 * Math.log(20)))).toBeLessThanOrEqual(10);
    expect(c.cv.volts).toBeCloseTo(4.2, 6);
    // Charge taken in ≈ 1.5 A × 3000 s + 1.5 A × 900 s × (1 − 1/20) = 5782.5 A·s = 1.606 Ah [C]
    expect(run.analysis.ampHours).toBeCloseTo(1.606, 2);
  });

  it('thermal in °F: first-order 20 + 30·(1 − e^(−t/300)) °C → steady 50 °C, 45 °C at 300·ln 6 s, burn margin for metal at 10 min [C; ISO 13732-1 M]', async () => {
    const lines = ['seconds,surface_F'];
    for (let s = 0; s <= 3600; s++) lines.push(`${s},${((20 + 30 * (1 - Math.exp(-s / 300))) * 1.8 + 32).toFixed(4)}`);
    const a = await t.as('engineer');
    const mapping = { kind: 'thermal', time: { column: 'seconds', unit: 's' }, temperature: { column: 'surface_F', unit: '°F' } };
    const { run } = (await upload(a, ids[DRAFT]!, lines.join('\n'), mapping, { options: { material: 'metal', contactSeconds: 600, thresholdC: 45 } }).expect(201)).body;
    const th = run.analysis.thermal;
    expect(th.startC).toBeCloseTo(20, 3);
    expect(th.steadyState.reached).toBe(true);
    expect(Math.abs(th.steadyState.temperatureC - 50)).toBeLessThan(0.1);
    expect(Math.abs(th.timeToThresholdS - 300 * Math.log(6))).toBeLessThan(0.5);
    // ISO 13732-1 [M]: 10 min contact, 48 °C for every material.
    expect(th.burnThreshold).toMatchObject({ temperatureC: 48, material: 'metal', contactSeconds: 600, listedSeconds: 600 });
    expect(th.marginC).toBeCloseTo(48 - th.maxC, 9);
    expect(th.marginC).toBeLessThan(0);
    // 48 °C is reached at 300·ln(30/2) = 812.4 s [C].
    expect(Math.abs(th.timeToBurnThresholdS - 300 * Math.log(15))).toBeLessThan(0.5);
    expect(run.analysis.warnings[0]).toMatch(/above the 48 °C burn threshold for 600 s contact with metal/);
    expect(run.analysis.ampHours).toBeNull();
  });

  it('thermal without options: material assumed metal, contact time from the workspace setting (60 s → 51 °C)', async () => {
    const lines = ['t,temp'];
    for (let s = 0; s <= 600; s += 5) lines.push(`${s},${(25 + 10 * (1 - Math.exp(-s / 60))).toFixed(3)}`);
    const a = await t.as('engineer');
    const { run } = (await upload(a, ids[DRAFT]!, lines.join('\n'), { kind: 'thermal', time: { column: 't', unit: 's' }, temperature: { column: 'temp', unit: '°C' } }).expect(201)).body;
    expect(run.analysis.thermal.burnThreshold).toMatchObject({ temperatureC: 51, material: 'metal', contactSeconds: 60 });
    expect(run.analysis.notes.join(' ')).toMatch(/metal assumed/);
    expect(run.analysis.notes.join(' ')).toMatch(/workspace setting: 60 s/);
  });

  it('power bank: 5.0 V × 2.0 A for 11 322 s = 31.45 Wh out of 37 Wh of cells → η 0.85, 6.29 Ah at 5 V (REFERENCES §5) [CP; C]', async () => {
    const lines = ['t,v,i'];
    for (let s = 0; s <= 11322; s += 6) lines.push(`${s},5.000,2.000`);
    const a = await t.as('engineer');
    const mapping = { kind: 'power-bank', time: { column: 't', unit: 's' }, voltage: { column: 'v', unit: 'V' }, current: { column: 'i', unit: 'A' } };
    const { run } = (await upload(a, ids[DRAFT]!, lines.join('\n'), mapping, { options: { cellEnergyWh: 37 } }).expect(201)).body;
    expect(run.analysis.wattHours).toBeCloseTo(31.45, 9);
    expect(run.analysis.powerBank.efficiency).toBeCloseTo(0.85, 9);
    expect(run.analysis.powerBank.ampHoursAt5V).toBeCloseTo(6.29, 9);
    // Without the option, the cell energy is what the cells delivered in this unit's latest discharge run.
    const latest = (await a.get(`/api/teardowns/${ids[DRAFT]}/runs`).expect(200)).body.runs.find((r: { kind: string }) => r.kind === 'discharge');
    const fromRun = (await upload(a, ids[DRAFT]!, lines.join('\n'), mapping).expect(201)).body.run;
    expect(fromRun.analysis.powerBank.cellEnergyWh).toBeCloseTo(latest.analysis.wattHours, 9);
    expect(fromRun.analysis.powerBank.cellEnergySource).toMatch(/discharge run of this unit \(".*"\)/);
    // The Stackcell 20 PD label states 74 Wh: 31.45 Wh at the output is under 80 % of it.
    expect(fromRun.comparison.labelEnergy).toMatchObject({ claimedWh: 74, percent: expect.closeTo((31.45 / 74) * 100, 6), warning: true });
  });
});

describe('bad input: a clear message naming the row and column, and nothing stored', () => {
  const cases: { name: string; text: string | Buffer; mapping?: Mapping; status?: number; message: RegExp; row?: number; column?: string }[] = [
    { name: 'header only', text: 'elapsed_s,volts,amps\n', message: /No numeric rows.*row 1/, row: 2, column: 'elapsed_s' },
    { name: 'text where numbers belong', text: 'elapsed_s,volts,amps\n0,abc,1\n1,def,1\n', message: /Row 2, column "volts": "abc" is not a number/, row: 2, column: 'volts' },
    {
      name: 'time going backwards',
      text: 'elapsed_s,volts,amps\n0,4,1\n1,4,1\n2,4,1\n1.5,4,1\n3,4,1\n',
      message: /Row 5, column "elapsed_s": time "1\.5" is not later than the row before \("2"\)/,
      row: 5,
      column: 'elapsed_s',
    },
    {
      name: 'mixed units in a column',
      text: 'elapsed_s,volts,amps\n0,3.7 V,1\n1,3.69 V,1\n2,3690 mV,1\n',
      message: /Row 4, column "volts": "3690 mV" is in mV but row 2 is in V: mixed units/,
      row: 4,
      column: 'volts',
    },
    {
      name: 'a unit that disagrees with the mapping',
      text: 'elapsed_s,volts,amps\n0,3700 mV,1\n1,3690 mV,1\n',
      message: /Row 2, column "volts": "3700 mV" is in mV but the column is mapped as V/,
      row: 2,
      column: 'volts',
    },
    {
      name: 'a mapped column missing from the header',
      text: 'elapsed_s,volts,current\n0,4,1\n1,4,1\n',
      message: /Column "amps" \(mapped to current\) is not in the header \(row 1\), which has: "elapsed_s", "volts", "current"/,
      row: 1,
      column: 'amps',
    },
    {
      name: 'the wrong delimiter (everything in one column)',
      text: 'elapsed_s;volts;amps\n0;4;1\n1;4;1\n',
      mapping: dischargeMapping({ delimiter: ',' }),
      message: /Row 1 has a single column "elapsed_s;volts;amps": the file looks semicolon-separated, not comma-separated/,
      row: 1,
      column: 'elapsed_s;volts;amps',
    },
    { name: 'an empty cell', text: 'elapsed_s,volts,amps\n0,4,1\n1,,1\n', message: /Row 3, column "volts": the cell is empty/, row: 3, column: 'volts' },
    { name: 'a short row', text: 'elapsed_s,volts,amps\n0,4,1\n1,4\n', message: /Row 3 has 2 fields, so column "amps" \(field 3\) is missing/, row: 3, column: 'amps' },
    { name: 'one data row', text: 'elapsed_s,volts,amps\n0,4,1\n', message: /Only one data row \(row 2\)/, row: 2 },
    { name: 'an empty file', text: '', message: /The file is empty/, row: 1 },
    { name: 'a spreadsheet instead of text', text: Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00]), message: /not a text file/, row: 1 },
    {
      name: 'a bad timestamp',
      text: 'when,volts,amps\n2026-11-02T09:00:00Z,4,1\nlater,4,1\n',
      mapping: dischargeMapping({ time: { column: 'when', unit: 'iso' } }),
      message: /Row 3, column "when": "later" is not a timestamp/,
      row: 3,
      column: 'when',
    },
    {
      name: 'a cut-off already reached at the first sample',
      text: 'elapsed_s,volts,amps\n0,3.2,1\n1,3.1,1\n',
      mapping: dischargeMapping(),
      message: /cutoffVolts \(3\.5 V\) is already reached at the first sample/,
    },
  ];

  for (const c of cases) {
    it(c.name, async () => {
      const a = await t.as('engineer');
      const before = await stored();
      const res = await upload(a, ids[DRAFT]!, c.text, c.mapping ?? dischargeMapping(), c.name.startsWith('a cut-off') ? { options: { cutoffVolts: 3.5 } } : {});
      expect(res.status, JSON.stringify(res.body)).toBe(c.status ?? 422);
      expect(res.body.error.message).toMatch(c.message);
      if (c.row !== undefined) expect(res.body.error.details.row).toBe(c.row);
      if (c.column !== undefined) expect(res.body.error.details.column).toBe(c.column);
      expect(await stored()).toEqual(before);
    });
  }

  it('refuses a bad mapping with the field named (400), storing nothing', async () => {
    const a = await t.as('engineer');
    const before = await stored();
    const noVolts = await upload(a, ids[DRAFT]!, constantDischarge(), { kind: 'discharge', time: { column: 'elapsed_s', unit: 's' }, current: { column: 'amps', unit: 'A' } }).expect(400);
    expect(noVolts.body.error.fields['mapping.voltage.column']).toMatch(/needs a voltage column/);
    const badUnit = await upload(a, ids[DRAFT]!, constantDischarge(), dischargeMapping({ current: { column: 'amps', unit: 'kA' } })).expect(400);
    expect(badUnit.body.error.fields).toHaveProperty('mapping.current.unit');
    const twice = await upload(a, ids[DRAFT]!, constantDischarge(), dischargeMapping({ current: { column: 'volts', unit: 'A' } })).expect(400);
    expect(twice.body.error.fields['mapping.current.column']).toMatch(/already mapped to voltage/);
    const notJson = await a.upload(`/api/teardowns/${ids[DRAFT]}/runs`).field('mapping', '{kind:').attach('file', Buffer.from(constantDischarge()), 'log.csv').expect(400);
    expect(notJson.body.error.fields.mapping).toMatch(/Not valid JSON/);
    const noFile = await a.upload(`/api/teardowns/${ids[DRAFT]}/runs`).field('mapping', JSON.stringify(dischargeMapping())).expect(400);
    expect(noFile.body.error.fields.file).toMatch(/Attach the log file/);
    const badOption = await upload(a, ids[DRAFT]!, constantDischarge(), dischargeMapping(), { options: { cutoffVolts: -1 } }).expect(400);
    expect(badOption.body.error.fields).toHaveProperty('options.cutoffVolts');
    // An option another kind reads is refused by the same list the forms show (contracts' RUN_KIND_NEEDS).
    const otherKind = await upload(a, ids[DRAFT]!, constantDischarge(), dischargeMapping(), { options: { cutoffVolts: 3, contactSeconds: 600 } }).expect(400);
    expect(otherKind.body.error.fields['options.contactSeconds']).toMatch(/^Contact time \(s\): not a setting of a discharge run/);
    expect(await stored()).toEqual(before);
  });

  it('takes the cell energy from the label without a discharge run, and asks for it when nothing gives it', async () => {
    const em = t.orm.em.fork();
    const id = ids['Breeze Neck 2']!;
    await em.getConnection().execute("delete from bench_runs where teardown_id = ? and kind = 'discharge'", [id]);
    // The demo seed records this device's pack; this test starts from the label alone.
    await em.getConnection().execute('delete from packs where teardown_id = ?', [id]);
    // The demo has it in review, which is read-only: its engineer withdraws it to edit it.
    await (await t.as('engineer2')).post(`/api/teardowns/${id}/withdraw`, {}).expect(200);
    const a = await t.as('engineer');
    const mapping = { kind: 'power-bank', time: { column: 't', unit: 's' }, voltage: { column: 'v', unit: 'V' }, current: { column: 'i', unit: 'A' } };
    const log = 't,v,i\n0,5,1\n3600,5,1\n';
    // The Breeze Neck 2 label states 4 Ah and no Wh: 4 Ah × 3.7 V nominal (assumed) = 14.8 Wh.
    const fromLabel = (await upload(a, id, log, mapping).expect(201)).body.run;
    expect(fromLabel.analysis.powerBank.cellEnergyWh).toBeCloseTo(14.8, 9);
    expect(fromLabel.analysis.powerBank.efficiency).toBeCloseTo(5 / 14.8, 9);
    expect(fromLabel.analysis.powerBank.cellEnergySource).toMatch(/3\.7 V \(nominal voltage assumed\)/);
    await em.getConnection().execute('update devices set claim_capacity_ah = null, claim_capacity_wh = null where model = ?', ['Breeze Neck 2']);
    const before = await stored();
    const res = await upload(a, id, log, mapping).expect(422);
    expect(res.body.error.fields['options.cellEnergyWh']).toMatch(/Give the energy of the cells/);
    expect(await stored()).toEqual(before);

    // With a pack record (1S2P of 3.7 V, 2.0 Ah cells = 14.8 Wh) the rating gives the cell energy, and a discharge is compared with it.
    await em
      .getConnection()
      .execute("insert into packs (teardown_id, chemistry, cell_nominal_volts, cell_rated_ah, series, parallel, protection, updated_at) values (?, 'li-ion', 3.7, 2.0, 1, 2, 1, ?)", [
        id,
        new Date().toISOString(),
      ]);
    const fromPack = (await upload(a, id, log, mapping).expect(201)).body.run;
    expect(fromPack.analysis.powerBank.cellEnergyWh).toBeCloseTo(14.8, 9);
    expect(fromPack.analysis.powerBank.cellEnergySource).toMatch(/pack record: 1S2P/);
    const discharge = (await upload(a, id, constantDischarge(), dischargeMapping()).expect(201)).body.run;
    // 1.000 Ah against 2 × 2.0 Ah rated = 25 %; no label claim left to compare with.
    expect(discharge.comparison.label).toBeNull();
    expect(discharge.comparison.rated).toMatchObject({ ratedAh: 4, percent: expect.closeTo(25, 9), warning: true, basis: expect.stringMatching(/2 cells of 2 Ah in parallel/) });
  });
});

describe('who may do what', () => {
  it('only engineers and admins upload, preview, change or delete runs', async () => {
    const before = await stored();
    for (const role of ['sourcing', 'lead', 'viewer']) {
      const a = await t.as(role);
      const res = await upload(a, ids[DRAFT]!, constantDischarge(), dischargeMapping());
      expect(res.status, role).toBe(403);
      await a.upload(`/api/teardowns/${ids[DRAFT]}/runs/preview`).attach('file', Buffer.from('a,b\n1,2\n'), 'x.csv').expect(403);
    }
    const anon = await t.anonymous();
    await upload(anon, ids[DRAFT]!, constantDischarge(), dischargeMapping()).expect(401);
    expect(await stored()).toEqual(before);

    const admin = await t.as('admin');
    const { run } = (await upload(admin, ids[DRAFT]!, constantDischarge(), dischargeMapping()).expect(201)).body;
    for (const role of ['sourcing', 'lead', 'viewer']) {
      const a = await t.as(role);
      expect((await a.patch(`/api/runs/${run.id}`, { label: 'x' })).status, role).toBe(403);
      expect((await a.delete(`/api/runs/${run.id}`)).status, role).toBe(403);
    }
  });

  it('viewers read runs of published teardowns only (404 for drafts, as if they did not exist)', async () => {
    const viewer = await t.as('viewer');
    const published = (await viewer.get(`/api/teardowns/${ids[PUBLISHED]}/runs`).expect(200)).body.runs;
    expect(published.length).toBeGreaterThan(0);
    await viewer.get(`/api/teardowns/${ids[DRAFT]}/runs`).expect(404);
    const draftRun = (await (await t.as('engineer')).get(`/api/teardowns/${ids[DRAFT]}/runs`).expect(200)).body.runs[0];
    await viewer.get(`/api/runs/${draftRun.id}`).expect(404);
    await viewer.get(`/api/runs/${draftRun.id}/series`).expect(404);
    await viewer.get(`/api/runs/${draftRun.id}/raw`).expect(404);
    const all = (await viewer.get('/api/runs').expect(200)).body.runs as { teardownStatus: string }[];
    expect(all.length).toBeGreaterThan(0);
    expect(all.every((r) => r.teardownStatus === 'published')).toBe(true);
    const lead = (await (await t.as('lead')).get('/api/runs').expect(200)).body.runs as { teardownStatus: string }[];
    expect(lead.some((r) => r.teardownStatus !== 'published')).toBe(true);
  });

  it('a run added to a published teardown needs the confirm header, and moves it back to draft', async () => {
    const a = await t.as('engineer');
    const id = ids[PUBLISHED_HEATER]!;
    const before = await stored();
    const refused = await upload(a, id, constantDischarge(), dischargeMapping()).expect(409);
    expect(refused.body.error.details.reason).toBe('published');
    expect(await stored()).toEqual(before);
    expect((await a.get(`/api/teardowns/${id}`).expect(200)).body.teardown.status).toBe('published');
    // A bad file with the header: refused, and the teardown stays published.
    await upload(a, id, 'elapsed_s,volts,amps\n', dischargeMapping(), { confirm: true }).expect(422);
    expect((await a.get(`/api/teardowns/${id}`).expect(200)).body.teardown.status).toBe('published');
    await upload(a, id, constantDischarge(), dischargeMapping(), { confirm: true }).expect(201);
    expect((await a.get(`/api/teardowns/${id}`).expect(200)).body.teardown.status).toBe('draft');
  });
});

describe('series, reads and changes', () => {
  let runId: number;
  beforeAll(async () => {
    const a = await t.as('engineer');
    // 20 001 samples: a sine ripple on a falling voltage, so LTTB has something to keep.
    const lines = ['elapsed_s,volts,amps'];
    for (let k = 0; k <= 20000; k++) lines.push(`${k},${(4.1 - k / 20000 + 0.01 * Math.sin(k / 50)).toFixed(5)},${k === 12345 ? '3.000' : '1.000'}`);
    runId = (await upload(a, ids[DRAFT]!, lines.join('\n'), dischargeMapping(), { name: 'ripple.csv' }).expect(201)).body.run.id;
  });

  it('downsamples to at most maxPoints per trace, keeping the first, last and a one-sample spike (LTTB)', async () => {
    const a = await t.as('engineer');
    const def = (await a.get(`/api/runs/${runId}/series`).expect(200)).body;
    expect(def.maxPoints).toBe(2000);
    expect(def.samplesInWindow).toBe(20001);
    expect(def.traces.v.t.length).toBe(2000);
    expect(def.traces.i.y).toContain(3);
    for (const n of [10, 500, 5000]) {
      const s = (await a.get(`/api/runs/${runId}/series?maxPoints=${n}`).expect(200)).body;
      expect(s.traces.v.t.length).toBe(n);
      expect(s.traces.i.t.length).toBe(n);
      expect(s.traces.v.t[0]).toBe(0);
      expect(s.traces.v.t.at(-1)).toBe(20000);
      expect(s.traces.p).toBeUndefined();
    }
    const tooMany = await a.get(`/api/runs/${runId}/series?maxPoints=5001`).expect(400);
    expect(tooMany.body.error.fields['query.maxPoints']).toMatch(/At most 5000/);
    await a.get(`/api/runs/${runId}/series?from=100&to=50`).expect(400);
  });

  it('returns a zoom window at full resolution when it holds fewer samples than maxPoints', async () => {
    const a = await t.as('engineer');
    const s = (await a.get(`/api/runs/${runId}/series?from=1000&to=1500&maxPoints=2000`).expect(200)).body;
    // Samples 999..1500: the window, the sample before it and the first at or after its end, so the lines reach the edges.
    expect(s.window).toEqual({ fromS: 999, toS: 1500 });
    expect(s.samplesInWindow).toBe(502);
    expect(s.traces.v.t).toEqual(Array.from({ length: 502 }, (_, k) => 999 + k));
    const between = (await a.get(`/api/runs/${runId}/series?from=1000.5&to=1499.5`).expect(200)).body;
    expect(between.window).toEqual({ fromS: 1000, toS: 1500 });
    expect(s.range).toEqual({ fromS: 0, toS: 20000 });
    const coarse = (await a.get(`/api/runs/${runId}/series?from=1000&to=9000&maxPoints=100`).expect(200)).body;
    expect(coarse.traces.v.t.length).toBe(100);
    expect(coarse.traces.v.t[0]).toBe(999);
  });

  it('gives back the raw file as uploaded', async () => {
    const a = await t.as('engineer');
    const res = await a.get(`/api/runs/${runId}/raw`).buffer(true).expect(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/ripple\.csv/);
    expect(String(res.text ?? res.body).split('\n')[0]).toBe('elapsed_s,volts,amps');
  });

  it('re-analyses when the options change, renames, and audits both on the teardown', async () => {
    const a = await t.as('engineer');
    const before = (await a.get(`/api/runs/${runId}`).expect(200)).body.run;
    expect(before.analysis.discharge.cutoff.reason).toBe('end-of-run');
    const after = (await a.patch(`/api/runs/${runId}`, { label: 'Ripple check', options: { cutoffVolts: 3.6 } }).expect(200)).body.run;
    expect(after.label).toBe('Ripple check');
    expect(after.analysis.discharge.cutoff.reason).toBe('cutoff-voltage');
    expect(after.analysis.ampHours).toBeLessThan(before.analysis.ampHours);
    await a.patch(`/api/runs/${runId}`, { options: { cutoffVolts: 0 } }).expect(400);
    const otherKind = await a.patch(`/api/runs/${runId}`, { options: { cutoffVolts: 3.6, cvVolts: 4.2 } }).expect(400);
    expect(otherKind.body.error.fields['options.cvVolts']).toMatch(/^Charge voltage \(V\): not a setting of a discharge run \(it takes cut-off voltage, cut-off debounce\)/);
    await a.patch(`/api/runs/${runId}`, {}).expect(400);
    const audit = (await t.orm.em
      .fork()
      .getConnection()
      .execute("select action, summary from audit_entries where scope_type = 'teardown' and scope_id = ? and entity_id = ?", [String(ids[DRAFT]), String(runId)])) as {
      action: string;
      summary: string;
    }[];
    expect(audit.map((x) => x.action)).toEqual(expect.arrayContaining(['run.created', 'run.updated']));
  });

  it('feeds the latest discharge into the figures as the measured capacity', async () => {
    const em = t.orm.em.fork();
    const teardown = await em.findOneOrFail(TeardownSchema, { id: ids[DRAFT]! });
    const latest = (await (await t.as('engineer')).get(`/api/teardowns/${ids[DRAFT]}/runs`).expect(200)).body.runs.find((r: { kind: string }) => r.kind === 'discharge');
    const fed = (await benchRunFigureInputs(em, [teardown])).get(teardown.id)!;
    expect(fed.measuredCapacityAh).toBe(latest.analysis.ampHours);
    expect(fed.measuredDischarge).toEqual({
      ampHours: latest.analysis.ampHours,
      wattHours: latest.analysis.wattHours,
      meanSquareVolts: latest.analysis.discharge.meanSquareVolts,
      durationSeconds: latest.analysis.durationS,
      basis: `discharge run "${latest.label}"`,
    });
    const thermal = (await (await t.as('engineer')).get(`/api/teardowns/${ids[DRAFT]}/runs`).expect(200)).body.runs.find((r: { kind: string }) => r.kind === 'thermal');
    // The touch margin uses the peak of the latest thermal run, when there is one.
    expect(fed.measuredSurface).toEqual(thermal ? { temperatureC: thermal.analysis.thermal.maxC, basis: `peak of the thermal run "${thermal.label}"` } : undefined);
    const empty = await em.findOneOrFail(TeardownSchema, { id: ids['Breeze Neck 2']! });
    await em.getConnection().execute("delete from bench_runs where teardown_id = ? and kind in ('discharge', 'power-bank')", [empty.id]);
    expect((await benchRunFigureInputs(em, [empty])).get(empty.id)).toEqual({});
    // Many teardowns in one call: each gets its own latest runs.
    const both = await benchRunFigureInputs(em, [teardown, empty]);
    expect(both.get(teardown.id)).toEqual(fed);
    expect(both.get(empty.id)).toEqual({});
  });

  it('compares with the label under the capacity warning setting, worked out at read time', async () => {
    const admin = await t.as('admin');
    const a = await t.as('engineer');
    // The Slimvolt 5 demo run delivers about 81 % of its 5 Ah label.
    const [slim] = (await a.get(`/api/teardowns/${ids['Slimvolt 5']}/runs`).expect(200)).body.runs.filter((r: { kind: string }) => r.kind === 'discharge');
    expect(slim.comparison.label.percent).toBeGreaterThan(75);
    expect(slim.comparison.label.percent).toBeLessThan(85);
    expect(slim.comparison.label.warning).toBe(true);
    await admin.patch('/api/settings', { capacityWarnFraction: 0.75 }).expect(200);
    const again = (await a.get(`/api/runs/${slim.id}`).expect(200)).body.run;
    expect(again.comparison.warnBelowPercent).toBe(75);
    expect(again.comparison.label.warning).toBe(false);
    await admin.patch('/api/settings', { capacityWarnFraction: 0.9 }).expect(200);
  });

  it('keeps nothing when the files cannot be moved into place after the row is committed', async () => {
    const a = await t.as('engineer');
    const before = await stored();
    const real = runFileOps.rename;
    const spy = vi.spyOn(runFileOps, 'rename').mockImplementation((from, to) => {
      if (!String(to).includes('.incoming')) throw Object.assign(new Error('permission denied (simulated)'), { code: 'EACCES' });
      real(from, to);
    });
    const log = vi.spyOn(t.deps, 'log').mockImplementation(() => {});
    try {
      expect((await upload(a, ids[DRAFT]!, constantDischarge(), dischargeMapping())).status).toBe(500);
    } finally {
      spy.mockRestore();
      log.mockRestore();
    }
    expect(await stored()).toEqual(before);
  });

  it('deletes the run and its files', async () => {
    const a = await t.as('engineer');
    const before = await stored();
    await a.delete(`/api/runs/${runId}`).expect(204);
    await a.get(`/api/runs/${runId}`).expect(404);
    const after = await stored();
    expect(after.rows).toBe(before.rows - 1);
    expect(after.runFolders).toBe(before.runFolders - 1);
  });
});

describe('column preview', () => {
  it('detects the delimiter, the header after a preamble, decimal commas and the units, from the first rows', async () => {
    const a = await t.as('engineer');
    const lines = ['Logger LX-2 (demo)', 'Started 2026-11-02 09:00', 'Zeitstempel;Spannung (mV);Strom [mA];Temp °C'];
    for (let k = 0; k < 40; k++) lines.push(`${k};${3700 - k};${'600,5'};${(25 + k / 10).toFixed(1).replace('.', ',')}`);
    const p = (
      await a
        .upload(`/api/teardowns/${ids[DRAFT]}/runs/preview`)
        .attach('file', Buffer.from(lines.join('\n')), 'lx2.csv')
        .expect(200)
    ).body;
    expect(p.delimiter).toBe(';');
    expect(p.headerRow).toBe(3);
    expect(p.decimalComma).toBe(true);
    expect(p.columns).toEqual(['Zeitstempel', 'Spannung (mV)', 'Strom [mA]', 'Temp °C']);
    expect(p.rows.length).toBe(20);
    expect(p.guess.voltage).toEqual({ column: 'Spannung (mV)', unit: 'mV' });
    expect(p.guess.current).toEqual({ column: 'Strom [mA]', unit: 'mA' });
    expect(p.guess.temperature).toEqual({ column: 'Temp °C', unit: '°C' });
    expect(p.guess.time).toEqual({ column: 'Zeitstempel', unit: 's' });
  });

  it('guesses timestamps, a TSV and a thermal log; refuses a file no delimiter splits', async () => {
    const a = await t.as('engineer');
    const tsv = ['time\tsurface_F'];
    for (let k = 0; k < 5; k++) tsv.push(`2026-11-02T09:00:0${k}Z\t${70 + k}`);
    const p = (
      await a
        .upload(`/api/teardowns/${ids[DRAFT]}/runs/preview`)
        .attach('file', Buffer.from(tsv.join('\n')), 'th.tsv')
        .expect(200)
    ).body;
    expect(p.delimiter).toBe('\t');
    expect(p.guess.kind).toBe('thermal');
    expect(p.guess.time).toEqual({ column: 'time', unit: 'iso' });
    expect(p.guess.temperature).toEqual({ column: 'surface_F', unit: '°F' });
    const single = await a.upload(`/api/teardowns/${ids[DRAFT]}/runs/preview`).attach('file', Buffer.from('one\n1\n2\n'), 'x.csv').expect(422);
    expect(single.body.error.message).toMatch(/No delimiter splits the rows/);
  });

  it('reads only the head of a large file and drops the cut last line', async () => {
    const a = await t.as('engineer');
    const lines = ['elapsed_s,volts,amps'];
    for (let k = 0; k < 20000; k++) lines.push(`${k},4.0000,1.0000`);
    const p = (
      await a
        .upload(`/api/teardowns/${ids[DRAFT]}/runs/preview`)
        .attach('file', Buffer.from(lines.join('\n')), 'big.csv')
        .expect(200)
    ).body;
    expect(p.rows.length).toBe(20);
    expect(p.guess).toMatchObject({ kind: 'discharge', time: { column: 'elapsed_s', unit: 's' }, voltage: { column: 'volts', unit: 'V' }, current: { column: 'amps', unit: 'A' } });
  });
});

describe('a 1,000,000-row log', () => {
  it('is parsed and analysed (correctness only; memory and time are in npm run bench) [C]', async () => {
    // 1 A constant, t = 0..999 999 s, voltage falling linearly 4.2 → 3.0 V.
    // Ah = 999 999 s × 1 A / 3600 = 277.77750 Ah; Wh = Ah × 3.6 V (mean of a linear fall) = 999.999 Wh [C].
    const n = 1_000_000;
    const path = join(scratch, 'million.csv');
    const out = createWriteStream(path);
    out.write('elapsed_s,volts,amps\n');
    let chunk = '';
    for (let k = 0; k < n; k++) {
      chunk += `${k},${(4.2 - (1.2 * k) / (n - 1)).toFixed(7)},1\n`;
      if (chunk.length > 1 << 16) {
        if (!out.write(chunk)) await once(out, 'drain');
        chunk = '';
      }
    }
    out.end(chunk);
    await once(out, 'finish');
    const a = await t.as('engineer');
    const res = await a.upload(`/api/teardowns/${ids[DRAFT]}/runs`).field('mapping', JSON.stringify(dischargeMapping())).attach('file', path).expect(201);
    const { run } = res.body;
    expect(run.samples).toBe(n);
    expect(run.analysis.durationS).toBe(n - 1);
    expect(run.analysis.ampHours).toBeCloseTo((n - 1) / 3600, 6);
    expect(run.analysis.wattHours).toBeCloseTo(((n - 1) / 3600) * 3.6, 3);
    const s = (await a.get(`/api/runs/${run.id}/series?maxPoints=3000`).expect(200)).body;
    expect(s.samplesInWindow).toBe(n);
    expect(s.traces.v.t.length).toBe(3000);
  }, 120_000);
});

describe('the upload limit', () => {
  it('refuses a log over SPLITCASE_RUN_UPLOAD_MAX_MB with 413 and keeps no partial file', async () => {
    const small = await makeTestApp({ seed: 'demo', env: { runUploadMaxBytes: 4096 } });
    try {
      const a = await small.as('engineer');
      const [row] = (await small.orm.em.fork().getConnection().execute("select t.id from teardowns t join devices d on d.id = t.device_id where d.model = 'Stackcell 20 PD'")) as { id: number }[];
      const res = await a.upload(`/api/teardowns/${row!.id}/runs`).field('mapping', JSON.stringify(dischargeMapping())).attach('file', Buffer.from(constantDischarge()), 'big.csv');
      expect(res.status).toBe(413);
      expect(res.body.error.code).toBe('payload_too_large');
      expect(readdirSync(join(small.env.uploadsDir, 'runs', '.incoming'))).toEqual([]);
    } finally {
      await small.close();
    }
  });
});

/** A new device of an invented maker with a draft teardown and, when given, a pack record. */
async function benchUnit(a: Agent, name: string, device: Record<string, unknown>, pack?: Record<string, unknown>): Promise<number> {
  const d = (await a.post('/api/devices', { maker: 'Testbench Works', model: name, category: 'power-bank', ...device }).expect(201)).body.device;
  const td = (await a.post('/api/teardowns', { deviceId: d.id }).expect(201)).body.teardown;
  if (pack) await a.put(`/api/teardowns/${td.id}/pack`, { chemistry: 'li-ion', nominalVolts: '3.7 V', ...pack }).expect(200);
  return td.id as number;
}

describe('series packs against the label, the debounced cut-off and the termination current', () => {
  it('compares a 2S pack labelled 10 000 mAh in Wh at the cell voltage: 4.9 Ah measured is about 97 %, not 49 % (REFERENCES §5: rated mAh is quoted at cell voltage) [CP; C]', async () => {
    const a = await t.as('engineer');
    const id = await benchUnit(a, '2S label check', { claimCapacityAh: '10000 mAh' }, { capacityAh: '5000 mAh', series: 2, parallel: 1 });
    // 0.98 A for 5 h = 4.9 Ah at the pack terminals, the voltage falling linearly 8.2 → 6.4 V (mean 7.3 V):
    // 4.9 Ah × 7.3 V = 35.77 Wh. The label: 10 Ah × 3.7 V (cell nominal) = 37 Wh. 35.77 / 37 = 96.676 % [C].
    const lines = ['elapsed_s,volts,amps'];
    for (let k = 0; k <= 18000; k += 10) lines.push(`${k},${(8.2 - (1.8 * k) / 18000).toFixed(6)},0.980`);
    const { run } = (await upload(a, id, lines.join('\n'), dischargeMapping()).expect(201)).body;
    expect(run.analysis.ampHours).toBeCloseTo(4.9, 9);
    expect(run.analysis.wattHours).toBeCloseTo(35.77, 9);
    expect(run.comparison.label).toMatchObject({
      claimedAh: 10,
      claimedWh: expect.closeTo(37, 9),
      measuredWh: expect.closeTo(35.77, 9),
      percent: expect.closeTo(96.676, 3),
      labelBasis: 'label-ah-at-cell-volts',
      measuredBasis: 'measured-wh',
      warning: false,
    });
    expect(run.comparison.label.basis).toMatch(/10 Ah × 3\.7 V/);
    expect(run.comparison.label.basis).toMatch(/cell/);
  });

  it('ignores a 2 s sag below the cut-off at a load step and runs on for 20 min more; a setting of 1 s or a run option of 0 s ends there [CP: a debounced end-of-discharge voltage; C]', async () => {
    const a = await t.as('engineer');
    const id = await benchUnit(a, 'Debounce check', {});
    // 1 Hz for 4800 s at 1 A; V = 3.6 − 0.2·t/4800 − 0.05 Ω·(I − 1 A). A step to 3 A at t = 3600 and 3601 s
    // pulls 3.45 V down to 3.35 V, under the 3.4 V cut-off for 2 s (back above at 3602 s); the cell
    // reaches 3.4 V at 1 A only at t = 4800 s, 20 min later.
    const lines = ['elapsed_s,volts,amps'];
    for (let k = 0; k <= 4800; k++) {
      const amps = k === 3600 || k === 3601 ? 3 : 1;
      lines.push(`${k},${(3.6 - (0.2 * k) / 4800 - 0.05 * (amps - 1)).toFixed(6)},${amps.toFixed(3)}`);
    }
    const log = lines.join('\n');
    const { run } = (await upload(a, id, log, dischargeMapping(), { options: { cutoffVolts: 3.4 } }).expect(201)).body;
    const d = run.analysis.discharge;
    expect(d.cutoff).toMatchObject({ reason: 'cutoff-voltage', t: 4800 });
    expect(d.cutoffDebounce).toEqual({ seconds: 5, source: 'workspace' });
    expect(d.ignoredDips).toEqual({ count: 1, firstAtS: 3600, longestS: 2 });
    // (4800 A·s + the step's extra 1 + 2 + 1 A·s) / 3600 = 1.334444 Ah [C]
    expect(run.analysis.ampHours).toBeCloseTo(4804 / 3600, 9);
    expect(run.analysis.notes.join(' ')).toMatch(/5 s/);

    // Without the debounce (a run option of 0 s) the sag ends the run, as before: 3600 A·s + 1 A·s.
    const strict = (await upload(a, id, log, dischargeMapping(), { options: { cutoffVolts: 3.4, cutoffDebounceSeconds: 0 } }).expect(201)).body.run;
    expect(strict.analysis.discharge.cutoff).toMatchObject({ t: 3600 });
    expect(strict.analysis.discharge.cutoffDebounce).toEqual({ seconds: 0, source: 'run' });
    expect(strict.analysis.ampHours).toBeCloseTo(3601 / 3600, 9);

    // The workspace setting: 1 s makes the 2 s sag count.
    const admin = await t.as('admin');
    expect((await admin.get('/api/settings').expect(200)).body.settings.cutoffDebounceSeconds).toBe(5);
    await admin.patch('/api/settings', { cutoffDebounceSeconds: -1 }).expect(400);
    await admin.patch('/api/settings', { cutoffDebounceSeconds: 1 }).expect(200);
    try {
      const short = (await upload(a, id, log, dischargeMapping(), { options: { cutoffVolts: 3.4 } }).expect(201)).body.run;
      expect(short.analysis.discharge.cutoff).toMatchObject({ t: 3600 });
      expect(short.analysis.discharge.cutoffDebounce).toEqual({ seconds: 1, source: 'workspace' });
    } finally {
      await admin.patch('/api/settings', { cutoffDebounceSeconds: 5 }).expect(200);
    }
    const bad = await upload(a, id, log, dischargeMapping(), { options: { cutoffVolts: 3.4, cutoffDebounceSeconds: -2 } }).expect(400);
    expect(bad.body.error.fields).toHaveProperty('options.cutoffDebounceSeconds');
  });

  it('terminates a charge at 0.05 C of the rated capacity: 0.150 A for a 3.0 Ah cell, not 5 % of the 1.5 A CC current (REFERENCES §4) [S; C]', async () => {
    const a = await t.as('engineer');
    const id = await benchUnit(a, 'Termination check', {}, { capacityAh: '3.0 Ah', series: 1, parallel: 1 });
    // CC 1.5 A while V climbs 3.6 → 4.2 V over 3000 s; then 4.2 V with I = 1.5·e^(−(t − 3000)/900).
    // 0.150 A is reached at t = 3000 + 900·ln 10 = 5072.3 s (5 % of the CC current, 0.075 A, only at 5696.2 s) [C].
    const lines = ['t,v,i'];
    for (let s = 0; s <= 7000; s += 10) {
      const cc = s < 3000;
      lines.push(`${s},${(cc ? 3.6 + 0.6 * (s / 3000) ** 1.5 : 4.2).toFixed(5)},${(cc ? 1.5 : 1.5 * Math.exp(-(s - 3000) / 900)).toFixed(6)}`);
    }
    const mapping = { kind: 'charge', time: { column: 't', unit: 's' }, voltage: { column: 'v', unit: 'V' }, current: { column: 'i', unit: 'A' } };
    const { run } = (await upload(a, id, lines.join('\n'), mapping).expect(201)).body;
    const c = run.analysis.charge;
    expect(c.terminationFraction).toBe(0.05);
    expect(c.terminationCurrentA).toBeCloseTo(0.15, 9);
    expect(c.termination).toMatchObject({ basis: 'rated-capacity', ratedAh: 3 });
    expect(Math.abs(c.chargeTimeS - (3000 + 900 * Math.log(10)))).toBeLessThanOrEqual(10);
    expect(run.analysis.notes.join(' ')).toMatch(/0\.05 C of the rated 3 Ah/);
    // A run option of 0.1 C: 0.300 A, reached at 3000 + 900·ln 5 = 4448.5 s [C].
    const tenth = (await upload(a, id, lines.join('\n'), mapping, { options: { terminationFraction: 0.1 } }).expect(201)).body.run;
    expect(tenth.analysis.charge.terminationCurrentA).toBeCloseTo(0.3, 9);
    expect(Math.abs(tenth.analysis.charge.chargeTimeS - (3000 + 900 * Math.log(5)))).toBeLessThanOrEqual(10);
    // 0.5 C of 3.0 Ah is 1.5 A, not below the 1.5 A the charger gives: refused, naming the field, nothing stored.
    const before = await stored();
    const refused = await upload(a, id, lines.join('\n'), mapping, { options: { terminationFraction: 0.5 } }).expect(422);
    expect(refused.body.error.fields['options.terminationFraction']).toMatch(/^Termination \(C\): 0\.5 C of the rated 3 Ah is 1\.5 A, not below the constant current of 1\.5 A/);
    expect(await stored()).toEqual(before);
  });
});

describe('cell internal resistance from a current pulse, and what the bench runs give the figures', () => {
  it('finds the step 0.6 A / 3.912 V → 3.0 A / 3.792 V in a discharge log: 50.0 mΩ (REFERENCES §12, DC method) [M: IEC 61960-3; C]', async () => {
    const a = await t.as('engineer');
    const id = await benchUnit(a, 'Pulse check', { claimCapacityAh: '3000 mAh' }, { capacityAh: '3.0 Ah', series: 1, parallel: 1 });
    // 1 Hz for 1200 s at 0.6 A (0.2 C of 3.0 Ah), one sample at 3.0 A (1.0 C) at t = 601 s; U = 3.942 V − I × 0.05 Ω.
    const lines = ['elapsed_s,volts,amps'];
    for (let k = 0; k <= 1200; k++) {
      const amps = k === 601 ? 3 : 0.6;
      lines.push(`${k},${(3.942 - 0.05 * amps).toFixed(4)},${amps.toFixed(3)}`);
    }
    const { run } = (await upload(a, id, lines.join('\n'), dischargeMapping(), { label: 'Pulse at half charge' }).expect(201)).body;
    const r = run.analysis.discharge.internalResistance;
    expect(r.ohms).toBeCloseTo(0.05, 9);
    expect(r).toMatchObject({ lowAmps: 0.6, lowVolts: 3.912, highAmps: 3, highVolts: 3.792, atSeconds: 601, readAtSeconds: 601 });
    expect(run.analysis.notes.join(' ')).toMatch(/50 mΩ at the pack terminals/);
    // Ah = (1200 × 0.6 + 2 × 1.2) / 3600 = 0.200667 Ah; Wh = (1200 × 2.3472 + 2 × 4.5144) / 3600 = 0.784908 Wh;
    // mean V² = (1200 × 3.912² − (3.912² − 3.792²)) / 1200 = 15.302974 V² [C].
    expect(run.analysis.ampHours).toBeCloseTo(722.4 / 3600, 9);
    expect(run.analysis.wattHours).toBeCloseTo(2825.6688 / 3600, 9);
    expect(run.analysis.discharge.meanSquareVolts).toBeCloseTo(15.3029736, 6);

    // The figures get the discharge, the resistance per cell and (once there is one) the power-bank run.
    const em = t.orm.em.fork();
    const teardown = await em.findOneOrFail(TeardownSchema, { id });
    let fed = (await benchRunFigureInputs(em, [teardown])).get(id)!;
    expect(fed.measuredDischarge).toMatchObject({ ampHours: expect.closeTo(722.4 / 3600, 9), durationSeconds: 1200, basis: 'discharge run "Pulse at half charge"' });
    expect(fed.cellInternalResistance).toEqual({
      ohms: expect.closeTo(0.05, 9),
      basis: expect.stringMatching(/50 mΩ at the pack terminals .*0\.6 A → 3 A in the discharge run "Pulse at half charge" \(one cell/),
    });
    expect(fed.powerBankRun).toBeUndefined();

    // A later discharge without a pulse: the resistance still comes from the run that had one.
    await upload(a, id, constantDischarge(), dischargeMapping(), { label: 'Plain discharge' }).expect(201);
    // A power-bank run: 5.0 V × 2.0 A for 11 322 s = 31.45 Wh out of 37 Wh of cells → η 0.85 (REFERENCES §5) [CP; C].
    const bank = ['t,v,i'];
    for (let s = 0; s <= 11322; s += 6) bank.push(`${s},5.000,2.000`);
    const bankMapping = { kind: 'power-bank', time: { column: 't', unit: 's' }, voltage: { column: 'v', unit: 'V' }, current: { column: 'i', unit: 'A' } };
    await upload(a, id, bank.join('\n'), bankMapping, { label: 'USB output', options: { cellEnergyWh: 37 } }).expect(201);
    // Two cells in series: the pack-terminal 50 mΩ is 25 mΩ a cell.
    await a.put(`/api/teardowns/${id}/pack`, { chemistry: 'li-ion', nominalVolts: '3.7 V', capacityAh: '3.0 Ah', series: 2, parallel: 1 }).expect(200);
    fed = (await benchRunFigureInputs(em, [teardown])).get(id)!;
    expect(fed.measuredDischarge).toMatchObject({ ampHours: expect.closeTo(1, 9), wattHours: expect.closeTo(3.7, 9), basis: 'discharge run "Plain discharge"' });
    expect(fed.cellInternalResistance!.ohms).toBeCloseTo(0.025, 9);
    expect(fed.cellInternalResistance!.basis).toMatch(/× 1 in parallel ÷ 2 in series for one cell/);
    expect(fed.powerBankRun).toEqual({
      efficiency: expect.closeTo(0.85, 9),
      deliveredWh: expect.closeTo(31.45, 9),
      outputVolts: expect.closeTo(5, 9),
      basis: expect.stringMatching(/^power-bank run "USB output" \(cell energy from the value given with the run: 37 Wh\)$/),
    });
    // Still a fixed number of queries with other teardowns in the same call: each keeps its own.
    const other = await em.findOneOrFail(TeardownSchema, { id: ids[DRAFT]! });
    const both = await benchRunFigureInputs(em, [teardown, other]);
    expect(both.get(id)).toEqual(fed);
    expect(both.get(other.id)!.cellInternalResistance).toBeUndefined();
  });

  it('puts a pulse in a demo discharge run', async () => {
    const a = await t.as('engineer');
    const runs = (await a.get('/api/runs?kind=discharge').expect(200)).body.runs as { label: string; analysis: { discharge: { internalResistance: { ohms: number } | null } } }[];
    const pulsed = runs.filter((r) => r.analysis.discharge.internalResistance && /demo/.test(r.label));
    expect(pulsed.length).toBeGreaterThan(0);
    // The demo model's cells have 60 mΩ; in parallel the pack terminals read 60 mΩ ÷ the count (plus noise).
    for (const r of pulsed) expect(r.analysis.discharge.internalResistance!.ohms).toBeGreaterThan(0.015);
  });
});
