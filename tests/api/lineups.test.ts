// Lineups: CRUD with validation and role rules, and the normalised comparison checked against
// hand computations on the demo devices (the demo data is invented; the formulas are not).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { METRIC_KEYS } from '@splitcase/calc';
import { LINEUP_METRIC_KEYS, type ComparisonDto, type ComparisonRowDto, type DeviceDto, type LineupDto } from '@splitcase/contracts';
import { LineupSchema } from '../../apps/api/src/modules/lineups/lineup.entity';
import { LineupDeviceSchema } from '../../apps/api/src/modules/lineups/lineup-device.entity';
import { PartSchema } from '../../apps/api/src/modules/parts/part.entity';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const as: Record<string, Agent> = {};
const dev: Record<string, DeviceDto> = {};

/** Demo devices by maker and model (invented scenario, apps/api/src/seed/scenario.ts). */
const DEMO = {
  duo: 'Halvix HandGlow Duo 10',
  pocketsun: 'Zestora Pocketsun S',
  pro: 'Halvix HandGlow Pro 2',
  pellam10: 'Pellam Works Stackcell 10',
  slimvolt: 'Zestora Slimvolt 5',
  breeze: 'Corvane Breeze Pocket',
} as const;

/** Invented demo rates of the current table (seed/cost.ts), units per 1 EUR, dated 2026-11-27. */
const RATES = { date: '2026-11-27', USD: 1.0822, GBP: 0.8463 };

const counts = async () => {
  const em = t.orm.em.fork();
  return { lineups: await em.count(LineupSchema, {}), rows: await em.count(LineupDeviceSchema, {}) };
};
const rowOf = (c: ComparisonDto, id: number): ComparisonRowDto => {
  const row = c.rows.find((r) => r.deviceId === id);
  if (!row) throw new Error(`no row for device ${id}`);
  return row;
};
async function create(a: Agent, body: Record<string, unknown>): Promise<LineupDto> {
  const res = await a.post('/api/lineups', body);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.lineup as LineupDto;
}
async function comparison(a: Agent, id: number, q = ''): Promise<ComparisonDto> {
  const res = await a.get(`/api/lineups/${id}/comparison${q}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as ComparisonDto;
}
/** Capacity delivered in the latest discharge run of a teardown, read from the runs API. */
async function dischargeAh(a: Agent, teardownId: number): Promise<{ runId: number; ah: number; wh: number }> {
  const res = await a.get(`/api/teardowns/${teardownId}/runs`).expect(200);
  const runs = (res.body.runs as { id: number; kind: string; createdAt: string; analysis: { ampHours: number | null; wattHours: number | null } }[]).filter((r) => r.kind === 'discharge');
  runs.sort((x, y) => y.createdAt.localeCompare(x.createdAt) || y.id - x.id);
  expect(runs[0]?.analysis.ampHours, 'a demo discharge run').toBeTypeOf('number');
  expect(runs[0]?.analysis.wattHours, 'a demo discharge run').toBeTypeOf('number');
  return { runId: runs[0]!.id, ah: runs[0]!.analysis.ampHours!, wh: runs[0]!.analysis.wattHours! };
}

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  for (const role of ['admin', 'engineer', 'sourcing', 'lead', 'viewer']) as[role] = await t.as(role);
  const devices = (await as.lead!.get('/api/devices').expect(200)).body.devices as DeviceDto[];
  for (const [key, name] of Object.entries(DEMO)) {
    const d = devices.find((x) => `${x.maker} ${x.model}` === name);
    if (!d) throw new Error(`demo device ${name} missing`);
    dev[key] = d;
  }
});
afterAll(() => t?.close());

describe('metric keys', () => {
  it('contracts list the same metrics as calc', () => {
    expect([...LINEUP_METRIC_KEYS].sort()).toEqual([...METRIC_KEYS].sort());
  });

  it('the metric catalogue gives units in the currency asked for', async () => {
    const res = await as.viewer!.get('/api/lineups/metrics?currency=gbp').expect(200);
    const byKey = Object.fromEntries((res.body.metrics as { key: string; unit: string; better: string }[]).map((m) => [m.key, m]));
    expect(byKey.retailPrice).toMatchObject({ unit: 'GBP', better: 'low' });
    expect(byKey.whPerCurrency).toMatchObject({ unit: 'Wh/GBP', better: 'high' });
    expect(byKey.capacityVsLabel).toMatchObject({ unit: '%', better: 'high' });
    expect(res.body.weightMax).toBe(10);
  });
});

describe('the demo lineups', () => {
  it('seeds three, one published; a viewer sees the published one only, without the device whose teardown is in review', async () => {
    const all = (await as.lead!.get('/api/lineups').expect(200)).body;
    expect(all.lineups.map((l: LineupDto) => l.name).sort()).toEqual(['Lights and fans, cost view', 'Pocket heaters, winter 2026', 'Power banks under 40 USD']);
    expect(all.canCreate).toBe(true);
    const mine = await as.viewer!.get('/api/lineups').expect(200);
    expect(mine.body.canCreate).toBe(false);
    expect(mine.body.lineups.map((l: LineupDto) => [l.name, l.status])).toEqual([['Pocket heaters, winter 2026', 'published']]);
    const heaters = mine.body.lineups[0] as LineupDto;
    // The HandGlow Pro 2 teardown is in review: a viewer cannot see that device.
    expect(heaters.devices.map((d) => d.id).sort()).toEqual([dev.duo!.id, dev.pocketsun!.id].sort());
    expect(heaters.hiddenDevices).toBe(1);
    expect(heaters.permissions).toEqual({ edit: false, publish: false, delete: false });
    const c = await comparison(as.viewer!, heaters.id);
    expect(c.rows.map((r) => r.deviceId).sort()).toEqual([dev.duo!.id, dev.pocketsun!.id].sort());
    expect(c.hiddenDevices).toBe(1);

    // Heater power density applies where there are heaters, and to no device of the power banks' lineup.
    expect(c.metrics.find((m) => m.key === 'heaterWPerCm2')!.applies).toBe(true);
    const banks = all.lineups.find((l: LineupDto) => l.name === 'Power banks under 40 USD') as LineupDto;
    const bankComparison = await comparison(as.lead!, banks.id);
    expect(bankComparison.metrics.find((m) => m.key === 'heaterWPerCm2')!.applies).toBe(false);
    expect(bankComparison.rows.every((r) => r.metrics.heaterWPerCm2 === null)).toBe(true);
    expect(bankComparison.notes.some((n) => /Hot surface/.test(n))).toBe(false);

    const draft = all.lineups.find((l: LineupDto) => l.status === 'draft') as LineupDto;
    await as.viewer!.get(`/api/lineups/${draft.id}`).expect(404);
    await as.viewer!.get(`/api/lineups/${draft.id}/comparison`).expect(404);
    await as.viewer!.post(`/api/lineups/${draft.id}/comparison`, { weights: { packWh: 1 } }).expect(404);
    expect((await as.viewer!.get('/api/lineups?status=draft').expect(200)).body.lineups).toEqual([]);
  });
});

describe('building and changing a lineup', () => {
  it('an engineer builds one; currency defaults to the reporting currency, weights to the defaults; audited', async () => {
    const before = await counts();
    const l = await create(as.engineer!, { name: '  Bench pair  ', deviceIds: [dev.pellam10!.id, dev.duo!.id] });
    expect(l).toMatchObject({ name: 'Bench pair', currency: 'USD', status: 'draft', version: 1, hiddenDevices: 0 });
    expect(l.devices.map((d) => [d.id, d.position])).toEqual([
      [dev.pellam10!.id, 1],
      [dev.duo!.id, 2],
    ]);
    expect(l.weights.whPerCurrency).toBe(3);
    expect(Object.keys(l.weights).sort()).toEqual([...LINEUP_METRIC_KEYS].sort());
    expect(l.permissions).toEqual({ edit: true, publish: false, delete: true });
    expect(await counts()).toEqual({ lineups: before.lineups + 1, rows: before.rows + 2 });
    const audit = (await as.admin!.get('/api/audit').expect(200)).body;
    const entries = audit.entries as { action: string; entityId: string }[];
    expect(entries.some((e) => e.action === 'lineup.created' && e.entityId === String(l.id))).toBe(true);
  });

  it('names every wrong field and saves nothing', async () => {
    const before = await counts();
    const bad = async (body: Record<string, unknown>, field: string, message: RegExp) => {
      const res = await as.engineer!.post('/api/lineups', body);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
      expect(res.body.error.fields[field], JSON.stringify(res.body.error.fields)).toMatch(message);
    };
    const two = [dev.duo!.id, dev.pellam10!.id];
    await bad({ name: '', deviceIds: two }, 'name', /Required/);
    await bad({ name: 'x', deviceIds: [dev.duo!.id] }, 'deviceIds', /at least 2 devices/);
    await bad({ name: 'x', deviceIds: [dev.duo!.id, dev.pellam10!.id, dev.duo!.id] }, 'deviceIds.2', /already in the lineup/);
    await bad({ name: 'x', deviceIds: [dev.duo!.id, 999_999] }, 'deviceIds.1', /No device with id 999999/);
    await bad({ name: 'x', deviceIds: [dev.duo!.id, 'two'] }, 'deviceIds.1', /whole number/);
    await bad({ name: 'x', deviceIds: two, currency: 'XAU' }, 'currency', /has no rate for XAU/);
    await bad({ name: 'x', deviceIds: two, currency: 'dollars' }, 'currency', /three-letter/);
    await bad({ name: 'x', deviceIds: two, weights: { wattsPerGram: 1 } }, 'weights.wattsPerGram', /Unknown metric/);
    await bad({ name: 'x', deviceIds: two, weights: { packWh: 11 } }, 'weights.packWh', /At most 10/);
    await bad({ name: 'x', deviceIds: two, weights: { packWh: -1 } }, 'weights.packWh', /At least 0/);
    await bad({ name: 'x', deviceIds: two, weights: { packWh: 0, retailPrice: 0 } }, 'weights', /at least one metric/);
    expect(await counts()).toEqual(before);
  });

  it('role rules: viewers cannot build; engineers cannot publish; a published lineup is changed by a lead; stale versions get 409', async () => {
    await as.viewer!.post('/api/lineups', { name: 'No', deviceIds: [dev.duo!.id, dev.pellam10!.id] }).expect(403);
    const l = await create(as.engineer!, { name: 'Heater pair', deviceIds: [dev.duo!.id, dev.pocketsun!.id], currency: 'EUR' });
    await as.viewer!.patch(`/api/lineups/${l.id}`, { name: 'No' }).expect(403);
    await as.viewer!.delete(`/api/lineups/${l.id}`).expect(403);

    // Sourcing edits a draft: devices replaced in the order given, weights saved; version moves on.
    const edited = await as.sourcing!.patch(`/api/lineups/${l.id}`, { version: 1, deviceIds: [dev.pocketsun!.id, dev.duo!.id, dev.pro!.id], weights: { shouldCost: 2 } }).expect(200);
    expect(edited.body.lineup.devices.map((d: { id: number }) => d.id)).toEqual([dev.pocketsun!.id, dev.duo!.id, dev.pro!.id]);
    expect(edited.body.lineup.weights).toMatchObject({ shouldCost: 2, packWh: 0 });
    expect(edited.body.lineup.version).toBe(2);
    const stale = await as.engineer!.patch(`/api/lineups/${l.id}`, { version: 1, name: 'Late edit' }).expect(409);
    expect(stale.body.error.code).toBe('stale_version');
    expect(stale.body.error.details.current.version).toBe(2);

    const publish = await as.engineer!.patch(`/api/lineups/${l.id}`, { status: 'published' }).expect(403);
    expect(publish.body.error.message).toMatch(/lead or an admin publishes/);
    const published = await as.lead!.patch(`/api/lineups/${l.id}`, { status: 'published', version: 2 }).expect(200);
    expect(published.body.lineup).toMatchObject({ status: 'published', publishedBy: 'Jonah Velde' }); // the demo lead
    expect(published.body.lineup.publishedAt).toBeTruthy();
    // Now the viewer sees it, without the in-review HandGlow Pro 2.
    const seen = (await as.viewer!.get(`/api/lineups/${l.id}`).expect(200)).body.lineup as LineupDto;
    expect(seen.devices.map((d) => d.id)).toEqual([dev.pocketsun!.id, dev.duo!.id]);

    const locked = await as.engineer!.patch(`/api/lineups/${l.id}`, { name: 'Renamed' }).expect(403);
    expect(locked.body.error.message).toMatch(/published: a lead or an admin changes it/);
    await as.engineer!.delete(`/api/lineups/${l.id}`).expect(403);
    await as.lead!.patch(`/api/lineups/${l.id}`, { name: 'Heater pair (lead)' }).expect(200);
    await as.lead!.patch(`/api/lineups/${l.id}`, {}).expect(400);

    // Back to draft by the lead; then the engineer who built it deletes it; another engineer's draft is not theirs.
    await as.lead!.patch(`/api/lineups/${l.id}`, { status: 'draft' }).expect(200);
    await as.viewer!.get(`/api/lineups/${l.id}`).expect(404);
    const other = await create(as.lead!, { name: 'Lead draft', deviceIds: [dev.duo!.id, dev.pellam10!.id] });
    await as.engineer!.delete(`/api/lineups/${other.id}`).expect(403);
    await as.lead!.delete(`/api/lineups/${other.id}`).expect(204);
    await as.engineer!.delete(`/api/lineups/${l.id}`).expect(204);
    await as.lead!.get(`/api/lineups/${l.id}`).expect(404);
  });
});

describe('the comparison', () => {
  let lineup: LineupDto;
  let c: ComparisonDto;
  beforeAll(async () => {
    lineup = await create(as.lead!, {
      name: 'Hand check',
      currency: 'USD',
      deviceIds: [dev.duo!.id, dev.pocketsun!.id, dev.pellam10!.id, dev.slimvolt!.id, dev.breeze!.id],
      weights: { packWh: 1 },
    });
    c = await comparison(as.lead!, lineup.id);
  });

  it('HandGlow Duo 10: the metrics worked by hand', async () => {
    const row = rowOf(c, dev.duo!.id);
    const m = row.metrics as Record<string, number>;
    // The latest teardown the lead can see, and its discharge run.
    expect(row.teardown?.id).toBe(dev.duo!.latestTeardown!.id);
    const { runId, wh } = await dischargeAh(as.lead!, row.teardown!.id);
    // Pack: one 18650 cell, 3.7 V × 2.7 Ah = 9.99 Wh [S: Wh = V·Ah, REFERENCES §4]
    expect(m.packWh).toBeCloseTo(3.7 * 2.7, 9);
    expect(m.packWh).toBeCloseTo(9.99, 9);
    // Retail 24.99 USD in a USD lineup: no conversion. Wh per USD = 9.99 / 24.99 [C]
    expect(m.retailPrice).toBe(24.99);
    expect(m.whPerCurrency).toBeCloseTo(9.99 / 24.99, 9);
    // Wh/kg with the 46 g pack: 9.99 / 0.046 = 217.2 Wh/kg, inside 100–265 Wh/kg for Li-ion [S: REFERENCES §4]
    expect(m.whPerKg).toBeCloseTo(9.99 / 0.046, 6);
    expect(m.whPerKg).toBeGreaterThan(100);
    expect(m.whPerKg).toBeLessThan(265);
    // Measured capacity vs label, in Wh (issue 10 §2.1): delivered Wh of the discharge run ÷ the
    // 5.2 Ah on the label × the 3.7 V cell nominal voltage (labels quote mAh at the cell voltage) [C; CP]
    expect(m.capacityVsLabel).toBeCloseTo(wh / (5.2 * 3.7), 9);
    expect(m.capacityVsLabel).toBeLessThan(0.55); // a 2.7 Ah cell sold as 5200 mAh
    expect(row.sources.capacityVsLabel).toContain(`discharge run`);
    void runId;
    // Runtime in the mode the lineup compares (default: the most power at the main load, the heater's
    // "High"; the USB output is left out): two 3.0 Ω elements in parallel at 3.65 V: P = V² / (R/2) =
    // 3.65² / 1.5 = 8.8817 W [C: Joule's law], duty 1, straight from the cell (efficiency 1); usable
    // energy = the Wh the discharge run delivered: t = wh / 8.8817 W [C: energy balance]
    const heaterW = (3.65 * 3.65) / 1.5;
    expect(m.runtimeH).toBeCloseTo(wh / heaterW, 6);
    expect(row.mode).toMatchObject({ name: 'High', reason: 'the most power at the main load' });
    expect(row.sources.runtimeH).toMatch(/Mode "High"/);
    expect(row.sources.runtimeH).not.toMatch(/USB/);
    // Heater power density at full duty: 8.8817 W over 2 × 6 cm × 4.5 cm = 54 cm² [C: p = P / A]
    expect(m.heaterWPerCm2).toBeCloseTo(heaterW / 54, 6);
    // Should-cost and implied margin: the cost service's figures at the model's middle volume, in USD.
    const cost = (await as.lead!.get(`/api/teardowns/${row.teardown!.id}/cost?currency=USD`).expect(200)).body;
    expect(m.shouldCost).toBeCloseTo(cost.landed, 9);
    expect(m.impliedMargin).toBeCloseTo(cost.impliedMargin.fraction, 9);
    expect(row.sources.shouldCost).toContain(`${cost.volume.toLocaleString('en-GB')} units`);
    // Findings by severity, as the findings list of the teardown gives them.
    const findings = (await as.lead!.get(`/api/teardowns/${row.teardown!.id}/findings`).expect(200)).body.findings as { severity: string }[];
    const n = (s: string) => findings.filter((f) => f.severity === s).length;
    expect([m.findingsCritical, m.findingsMajor, m.findingsMinor, m.findingsNote]).toEqual([n('critical'), n('major'), n('minor'), n('note')]);
    expect(findings.length).toBeGreaterThan(0);
  });

  it('Pellam Works Stackcell 10: the metrics worked by hand', async () => {
    const row = rowOf(c, dev.pellam10!.id);
    const m = row.metrics as Record<string, number>;
    const { wh } = await dischargeAh(as.lead!, row.teardown!.id);
    // 1S3P of 3.35 Ah cells at 3.7 V: 3 × 3.35 Ah × 3.7 V = 37.185 Wh [S: Wh = V·Ah, REFERENCES §4]
    expect(m.packWh).toBeCloseTo(37.185, 9);
    expect(m.retailPrice).toBe(19.99);
    expect(m.whPerCurrency).toBeCloseTo(37.185 / 19.99, 9); // 1.860 Wh per USD [C]
    // 147 g pack: 37.185 / 0.147 = 252.96 Wh/kg, inside 100–265 Wh/kg [S: REFERENCES §4]
    expect(m.whPerKg).toBeCloseTo(37.185 / 0.147, 6);
    // Label 10 000 mAh at the 3.7 V cell voltage = 37 Wh, against the run's delivered Wh [C; CP]
    expect(m.capacityVsLabel).toBeCloseTo(wh / 37, 9);
    // Mode "USB-C output": 3 A at the 5 V of the boost stage = 15 W; through the boost at its
    // measured 87 %: 15 / 0.87 = 17.24 W from the pack [C: converter power balance]; t = wh / 17.24 W [C]
    expect(m.runtimeH).toBeCloseTo(wh / (15 / 0.87), 6);
    expect(row.mode?.name).toBe('USB-C output');
    // Not a heater: missing with the reason, never 0.
    expect(m.heaterWPerCm2).toBeNull();
    expect(row.missing.heaterWPerCm2).toMatch(/Not a heater/);
    expect(row.sources.packWh).toMatch(/3\.7 V × 3\.35 Ah × 1S3P/);
  });

  it('converts prices with the current rates and names the rate date', () => {
    expect(c.currency).toBe('USD');
    expect(c.rateDate).toBe(RATES.date);
    // 14.90 EUR × 1.0822 USD/EUR = 16.12 USD [S: cross rate through the base, REFERENCES §9; demo rates invented]
    const pocketsun = rowOf(c, dev.pocketsun!.id);
    expect(pocketsun.metrics.retailPrice).toBeCloseTo(14.9 * RATES.USD, 9);
    expect(pocketsun.retail).toMatchObject({ amount: 14.9, currency: 'EUR' });
    expect(pocketsun.retail!.rate).toBeCloseTo(RATES.USD, 12);
    expect(pocketsun.sources.retailPrice).toContain(`rates of ${RATES.date}`);
    // 11.50 GBP → USD through the euro: 11.50 / 0.8463 × 1.0822 = 14.71 USD [C]
    const slim = rowOf(c, dev.slimvolt!.id);
    expect(slim.metrics.retailPrice).toBeCloseTo((11.5 / RATES.GBP) * RATES.USD, 9);
    expect(slim.metrics.whPerCurrency).toBeCloseTo(18.5 / ((11.5 / RATES.GBP) * RATES.USD), 9);
  });

  it('in another currency the same lineup converts every money metric', async () => {
    await as.lead!.patch(`/api/lineups/${lineup.id}`, { currency: 'GBP' }).expect(200);
    const gbp = await comparison(as.lead!, lineup.id);
    await as.lead!.patch(`/api/lineups/${lineup.id}`, { currency: 'USD' }).expect(200);
    expect(gbp.currency).toBe('GBP');
    // 24.99 USD / 1.0822 × 0.8463 = 19.54 GBP [C]
    const duo = rowOf(gbp, dev.duo!.id);
    expect(duo.metrics.retailPrice).toBeCloseTo((24.99 / RATES.USD) * RATES.GBP, 9);
    const cost = (await as.lead!.get(`/api/teardowns/${duo.teardown!.id}/cost?currency=GBP`).expect(200)).body;
    expect(duo.metrics.shouldCost).toBeCloseTo(cost.landed, 9);
    expect(gbp.metrics.find((x) => x.key === 'whPerCurrency')!.unit).toBe('Wh/GBP');
  });

  it('the Pareto set of price against pack energy, checked by hand', () => {
    // retail price (lower is better) against pack energy (higher is better), USD:
    //   Breeze Pocket   9.99 USD,  4.44 Wh  — cheapest: on the frontier
    //   Slimvolt 5     14.71 USD, 18.50 Wh  — beats Pocketsun on both: on the frontier
    //   Pocketsun S    16.12 USD,  7.40 Wh  — dominated by Slimvolt
    //   Stackcell 10   19.99 USD, 37.19 Wh  — beats the Duo on both: on the frontier
    //   HandGlow Duo   24.99 USD,  9.99 Wh  — dominated by Stackcell 10 [C: Pareto dominance]
    expect(c.pareto.x).toBe('retailPrice');
    expect(c.pareto.y).toBe('packWh');
    expect(c.pareto.deviceIds).toEqual([dev.breeze!.id, dev.slimvolt!.id, dev.pellam10!.id]);
    expect(
      c.pareto.points
        .filter((p) => !p.onFrontier)
        .map((p) => p.deviceId)
        .sort(),
    ).toEqual([dev.duo!.id, dev.pocketsun!.id].sort());
    expect(c.pareto.leftOut).toEqual([]);
  });

  it('the Pareto set of two better-high metrics, checked by hand, and bad axes named', async () => {
    // Wh/kg (higher better) against measured capacity ÷ label (higher better), from the pack
    // records and the demo discharge runs (read from the runs API):
    //   Stackcell 10  37.185 / 0.147 = 253 Wh/kg,  Ah / 10
    //   Slimvolt 5    18.5 / 0.078   = 237 Wh/kg,  Ah / 5
    //   HandGlow Duo  9.99 / 0.046   = 217 Wh/kg,  Ah / 5.2
    //   Pocketsun S   7.4 / 0.036    = 206 Wh/kg,  Ah / 2
    //   Breeze Pocket 4.44 / 0.040   = 111 Wh/kg,  Ah / 2
    const ratio: Record<string, number> = {};
    for (const [key, label] of [
      ['pellam10', 10],
      ['slimvolt', 5],
      ['duo', 5.2],
      ['pocketsun', 2],
      ['breeze', 2],
    ] as const) {
      ratio[key] = (await dischargeAh(as.lead!, dev[key]!.latestTeardown!.id)).ah / label;
    }
    // The demo runs give Pocketsun 1.93 / 2 ≈ 0.963 and Stackcell 9.63 / 10 ≈ 0.962; every other
    // device has both less Wh/kg and a lower ratio than the Stackcell 10, so it is dominated [C].
    expect(ratio.pocketsun).toBeGreaterThan(ratio.pellam10!);
    for (const key of ['slimvolt', 'duo', 'breeze']) expect(ratio[key]).toBeLessThan(ratio.pellam10!);
    const pair = await comparison(as.lead!, lineup.id, '?x=whPerKg&y=capacityVsLabel');
    expect(pair.pareto.deviceIds).toEqual([dev.pocketsun!.id, dev.pellam10!.id]);
    const bad = await as.lead!.get(`/api/lineups/${lineup.id}/comparison?x=packWh&y=packWh`).expect(400);
    expect(bad.body.error.fields).toHaveProperty('query.y');
    const unknown = await as.lead!.get(`/api/lineups/${lineup.id}/comparison?x=price`).expect(400);
    expect(unknown.body.error.fields).toHaveProperty('query.x');
  });

  it('weights change the ranking on the server; a preview saves nothing; PATCH saves', async () => {
    // Only pack energy weighs: min-max normalised, 4.44 Wh → 0, 37.185 Wh → 100 [C];
    // Slimvolt = 100 × (18.5 − 4.44) / (37.185 − 4.44) = 42.94
    expect(c.rows.map((r) => r.deviceId)).toEqual([dev.pellam10!.id, dev.slimvolt!.id, dev.duo!.id, dev.pocketsun!.id, dev.breeze!.id]);
    expect(rowOf(c, dev.slimvolt!.id).score).toBeCloseTo((100 * (18.5 - 4.44)) / (37.185 - 4.44), 6);
    expect(rowOf(c, dev.pellam10!.id)).toMatchObject({ rank: 1, score: 100 });

    // Price alone (lower is better): the cheapest ranks first.
    const cheap = await as.lead!.post(`/api/lineups/${lineup.id}/comparison`, { weights: { retailPrice: 1 } }).expect(200);
    expect(cheap.body.weightsFrom).toBe('preview');
    expect(cheap.body.rows[0].deviceId).toBe(dev.breeze!.id);
    expect(cheap.body.rows.at(-1).deviceId).toBe(dev.duo!.id);
    // The preview did not save: the saved ranking is unchanged.
    expect((await comparison(as.lead!, lineup.id)).rows[0]!.deviceId).toBe(dev.pellam10!.id);
    const badPreview = await as.lead!.post(`/api/lineups/${lineup.id}/comparison`, { weights: { packWh: 20 } }).expect(400);
    expect(badPreview.body.error.fields).toHaveProperty('weights.packWh');

    await as.lead!.patch(`/api/lineups/${lineup.id}`, { weights: { retailPrice: 1 } }).expect(200);
    const saved = await comparison(as.lead!, lineup.id);
    expect(saved.weightsFrom).toBe('saved');
    expect(saved.rows[0]!.deviceId).toBe(dev.breeze!.id);
    await as.lead!.patch(`/api/lineups/${lineup.id}`, { weights: { packWh: 1 } }).expect(200);
  });

  it('missing values are null with a reason, never 0, and are left out of the score (weights renormalised)', async () => {
    // An invented device with a price but no teardown yet, and one with neither.
    const priced = (await as.engineer!.post('/api/devices', { maker: 'Testbrook (invented)', model: 'Unopened 12', category: 'power-bank', retailPrice: 12, currency: 'USD' }).expect(201)).body
      .device as DeviceDto;
    const bare = (await as.engineer!.post('/api/devices', { maker: 'Testbrook (invented)', model: 'Bare 0', category: 'pocket-heater' }).expect(201)).body.device as DeviceDto;
    // A teardown with nothing recorded yet: figures missing, findings counted (zero is a count here).
    const td = (await as.engineer!.post('/api/teardowns', { deviceId: bare.id }).expect(201)).body.teardown as { id: number };
    const l = await create(as.lead!, {
      name: 'Gaps',
      currency: 'USD',
      deviceIds: [dev.duo!.id, dev.breeze!.id, priced.id, bare.id],
      weights: { retailPrice: 1, packWh: 1 },
    });
    const gaps = await comparison(as.lead!, l.id);
    const p = rowOf(gaps, priced.id);
    expect(p.teardown).toBeNull();
    expect(p.metrics.retailPrice).toBe(12);
    for (const key of ['packWh', 'runtimeH', 'whPerCurrency', 'whPerKg', 'capacityVsLabel', 'shouldCost', 'impliedMargin', 'findingsCritical', 'findingsNote'] as const) {
      expect(p.metrics[key], key).toBeNull();
      expect(p.missing[key], key).toMatch(/No teardown of this device yet/);
    }
    // Renormalised: only the price counts for it. Price range 9.99 (Breeze) … 24.99 (Duo), lower is
    // better: (24.99 − 12) / (24.99 − 9.99) = 0.866 → 86.6, not half of it [C].
    expect(p.score).toBeCloseTo((100 * (24.99 - 12)) / (24.99 - 9.99), 6);
    expect(p.normalised).not.toHaveProperty('packWh');
    // …and says how little it rests on: 1 of the 2 weighted metrics, half the weight.
    expect(p.coverage).toEqual({ known: 1, weighted: 2, weightShare: 0.5 });
    expect(rowOf(gaps, dev.duo!.id).coverage).toEqual({ known: 2, weighted: 2, weightShare: 1 });

    const b = rowOf(gaps, bare.id);
    expect(b.teardown?.id).toBe(td.id);
    expect(b.metrics.retailPrice).toBeNull();
    expect(b.missing.retailPrice).toMatch(/No retail price/);
    expect(b.metrics.packWh).toBeNull();
    expect(b.missing.packWh).toMatch(/No cells recorded/);
    expect(b.metrics.capacityVsLabel).toBeNull();
    expect(b.missing.capacityVsLabel).toMatch(/No discharge bench run/);
    expect(b.metrics.shouldCost).toBeNull();
    expect(b.missing.shouldCost).toMatch(/No parts list/);
    expect(b.metrics.findingsCritical).toBe(0);
    expect(b.score).toBeNull();
    expect(gaps.rows.at(-1)!.deviceId).toBe(bare.id);
    // Off the chart, with the reason.
    expect(gaps.pareto.leftOut.map((x) => x.deviceId).sort()).toEqual([priced.id, bare.id].sort());
    expect(gaps.pareto.leftOut.find((x) => x.deviceId === bare.id)!.reason).toMatch(/^No retail price/);
    // The JSON says null, not 0, for every missing value.
    for (const row of gaps.rows) for (const [key, v] of Object.entries(row.metrics)) if (row.missing[key]) expect(v, key).toBeNull();
  });

  it('the implied margin is missing with the reason while a line of the teardown is unpriced, and a number once all are priced', async () => {
    // An invented device with a two-line BOM, one line priced.
    const d = (await as.engineer!.post('/api/devices', { maker: 'Testbrook (invented)', model: 'Half-priced 2', category: 'power-bank', retailPrice: 24.99, currency: 'USD' }).expect(201)).body
      .device as DeviceDto;
    const td = (await as.engineer!.post('/api/teardowns', { deviceId: d.id }).expect(201)).body.teardown as { id: number };
    const em = t.orm.em.fork();
    const part = (position: number, v: Record<string, unknown>) => em.create(PartSchema, { teardown: td.id, position, quantity: 1, mount: 'manual', ...v } as never);
    const cell = part(1, { designators: 'BT1', category: 'cell', description: 'Pouch cell' });
    const shell = part(2, { designators: null, category: 'enclosure', description: 'Shell' });
    await em.flush();
    const price = { currency: 'USD', breaks: [{ minQty: 1, unitPrice: 2 }], source: 'quote', confidence: 'high' };
    await as.sourcing!.put(`/api/parts/${cell.id}/price`, price).expect(200);
    const l = await create(as.lead!, { name: 'Half priced', currency: 'USD', deviceIds: [dev.duo!.id, d.id], weights: { impliedMargin: 1 } });
    const row = rowOf(await comparison(as.lead!, l.id), d.id);
    // The should-cost is shown (flagged low); the margin is not: 1 of 2 lines priced.
    expect(row.metrics.shouldCost).toBeTypeOf('number');
    expect(row.metrics.impliedMargin).toBeNull();
    expect(row.missing.impliedMargin).toMatch(/^Implied margin incomplete: 1 of 2 lines priced/);
    expect(row.score).toBeNull();
    // Priced in full, the margin is the cost service's figure.
    await as.sourcing!.put(`/api/parts/${shell.id}/price`, price).expect(200);
    const full = rowOf(await comparison(as.lead!, l.id), d.id);
    const cost = (await as.lead!.get(`/api/teardowns/${td.id}/cost?currency=USD`).expect(200)).body;
    expect(cost.impliedMargin.complete).toBe(true);
    expect(full.metrics.impliedMargin).toBeCloseTo(cost.impliedMargin.fraction, 12);
    expect(full.missing.impliedMargin).toBeUndefined();
  });

  it('notes the nature of the figures, and the hot-surface caution when heaters are in the lineup', () => {
    expect(c.notes[0]).toMatch(/Engineering estimates, not certification results/);
    // The HandGlow Duo and the Pocketsun are pocket heaters.
    expect(c.notes.some((n) => /Hot surface/.test(n))).toBe(true);
  });
});
