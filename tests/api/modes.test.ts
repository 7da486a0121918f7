// Operating modes (issue 10 §1): the records through the API, and the per-mode figures they give.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FigureDto, FiguresResponse } from '@splitcase/contracts';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
const agents: Record<string, Agent> = {};
const as = async (role: string) => (agents[role] ??= await t.as(role));

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
});
afterAll(() => t.close());

const fig = (r: FiguresResponse, key: string, modeId: number | null = null) => r.figures.find((f) => f.key === key && f.modeId === modeId) as FigureDto | undefined;

async function figures(teardownId: number, role = 'engineer'): Promise<FiguresResponse> {
  return (await (await as(role)).get(`/api/teardowns/${teardownId}/figures`).expect(200)).body as FiguresResponse;
}

/** A draft pocket heater: one 2.7 Ah cell, two 3.0 Ω elements in parallel at 3.65 V over 100 cm² of plastic, a 5 V 1 A USB output through a boost stage. */
async function heaterTeardown() {
  const eng = await as('engineer');
  const device = (await eng.post('/api/devices', { maker: 'Testwright', model: `Modes ${Math.random().toString(36).slice(2, 8)}`, category: 'pocket-heater' }).expect(201)).body.device;
  const td = (await eng.post('/api/teardowns', { deviceId: device.id }).expect(201)).body.teardown;
  await eng.put(`/api/teardowns/${td.id}/pack`, { chemistry: 'li-ion', nominalVolts: '3.7 V', maxVolts: '4.2 V', capacityAh: '2700 mAh', protection: true }).expect(200);
  const boost = (
    await eng.post(`/api/teardowns/${td.id}/converters`, { topology: 'boost', role: 'output', inputVolts: '3.7 V', outputVolts: '5 V', efficiency: '88 %', efficiencySource: 'measured' }).expect(201)
  ).body.converter;
  const heater = (
    await eng
      .post(`/api/teardowns/${td.id}/loads`, {
        kind: 'heater',
        label: 'Heater pads',
        resistanceOhms: '3R0',
        supplyVolts: '3.65 V',
        count: 2,
        connection: 'parallel',
        heatedAreaM2: '100 cm²',
        surfaceMaterial: 'plastic',
      })
      .expect(201)
  ).body.load;
  const usb = (await eng.post(`/api/teardowns/${td.id}/loads`, { kind: 'usb-output', label: 'USB-A', currentAmps: '1 A', converterId: boost.id }).expect(201)).body.load;
  return { id: td.id as number, heater: heater.id as number, usb: usb.id as number };
}

describe('the demo heater (HandGlow Duo 10)', () => {
  it('has low / high / power bank / standby, and its heater-only high mode is 8.9 W for 1.0–1.2 h [C: REFERENCES §3; CP: §11]', async () => {
    const admin = await as('admin');
    const devices = (await admin.get('/api/devices?maker=Halvix').expect(200)).body.devices as { model: string; latestTeardown: { id: number } }[];
    const id = devices.find((d) => d.model === 'HandGlow Duo 10')!.latestTeardown.id;
    const r = await figures(id, 'lead');
    expect(r.modes.map((m) => m.name)).toEqual(['Low', 'High', 'Power bank', 'Standby']);
    const high = r.modes.find((m) => m.name === 'High')!.id;
    // two 3.0 Ω elements in parallel at 3.65 V: 3.65² / 1.5 = 8.881667 W [C]
    expect(fig(r, 'mode.power', high)!.value as number).toBeCloseTo(8.881667, 5);
    const runtime = fig(r, 'mode.runtime.hours', high)!.value as number;
    expect(runtime).toBeGreaterThan(1.0);
    expect(runtime).toBeLessThan(1.2);
    expect(fig(r, 'mode.touchMargin', high)).toBeDefined();
    const bank = r.modes.find((m) => m.name === 'Power bank')!.id;
    expect(fig(r, 'mode.touchMargin', bank)).toBeUndefined();
    expect(fig(r, 'mode.standby.months', r.modes.find((m) => m.name === 'Standby')!.id)!.unit).toBe('months');
    // whole-device figures carry no mode; the all-at-once totals are gone
    expect(fig(r, 'pack.energy')!.modeId).toBeNull();
    expect(fig(r, 'load.power')).toBeUndefined();
    // held long: the pocket-heater contact time (10 min) is used and said why [CP: REFERENCES §6]
    expect(fig(r, 'mode.touchMargin', high)!.assumptions.join(' ')).toMatch(/Contact time 10 min \(workspace default for pocket heaters/);
  });
});

describe('POST/PATCH/DELETE /api/teardowns/:id/modes (the contract)', () => {
  it('creates a mode with its loads, duty and quiescent current, and the figures follow per mode', async () => {
    const td = await heaterTeardown();
    const eng = await as('engineer');
    const before = await figures(td.id);
    expect(fig(before, 'load.power')!.assumptions[0]).toMatch(/All loads at once: record modes for runtimes per mode/);
    // 8.881667 W of heat + 5 W out of the boost: 13.88 W "total" that no user sees [C]
    expect(fig(before, 'load.power')!.value as number).toBeCloseTo(13.881667, 5);

    const res = await eng.post(`/api/teardowns/${td.id}/modes`, { name: 'Low', loads: [{ loadId: td.heater, duty: '50 %' }] }).expect(201);
    expect(res.body.mode).toMatchObject({ id: expect.any(Number), name: 'Low', loads: [{ loadId: td.heater, duty: 0.5 }], quiescentAmps: null, note: null });
    const bank = (await eng.post(`/api/teardowns/${td.id}/modes`, { name: 'Power bank', loads: [{ loadId: td.usb, duty: 1 }] }).expect(201)).body.mode;
    const standby = (await eng.post(`/api/teardowns/${td.id}/modes`, { name: 'Standby', loads: [], quiescentAmps: '20 µA', note: 'off' }).expect(201)).body.mode;
    expect(standby).toMatchObject({ quiescentAmps: 2e-5, entered: { quiescentAmps: '20 µA' }, position: 2 });

    const r = await figures(td.id);
    const low = res.body.mode.id;
    expect(r.modes.map((m) => m.id)).toEqual([low, bank.id, standby.id]);
    // Low: 0.5 × 8.881667 = 4.440833 W, 1.216667 A; runtime 9.99 Wh × 0.9 ÷ 4.440833 W = 2.02462 h [C]
    expect(fig(r, 'mode.power', low)!.value as number).toBeCloseTo(4.440833, 5);
    expect(fig(r, 'mode.current', low)!.value as number).toBeCloseTo(1.216667, 5);
    expect(fig(r, 'mode.runtime.hours', low)!.value as number).toBeCloseTo((9.99 * 0.9) / 4.440833, 4);
    // Power bank: 5 W at the port, 5 / 0.88 = 5.681818 W from the pack [C]
    expect(fig(r, 'mode.packPower', bank.id)!.value as number).toBeCloseTo(5 / 0.88, 5);
    // Standby: 2.7 / (0.025 × 2.7 + 20 µA × 730 h) months [C; CP]
    expect(fig(r, 'mode.standby.months', standby.id)!.value as number).toBeCloseTo(2.7 / (0.0675 + 0.0146), 3);
    expect(fig(r, 'load.power')).toBeUndefined();
    for (const f of r.figures) for (const i of f.inputs) expect(i.key, `${f.key} ${i.label}`).toMatch(/\S/);

    // PATCH changes only what it is sent
    const renamed = (await eng.patch(`/api/teardowns/${td.id}/modes/${low}`, { name: 'Gentle' }).expect(200)).body.mode;
    expect(renamed).toMatchObject({ name: 'Gentle', loads: [{ loadId: td.heater, duty: 0.5 }] });
    const faster = (await eng.patch(`/api/teardowns/${td.id}/modes/${low}`, { loads: [{ loadId: td.heater, duty: 0.75 }] }).expect(200)).body.mode;
    expect(faster).toMatchObject({ name: 'Gentle', loads: [{ loadId: td.heater, duty: 0.75 }] });
    await eng.delete(`/api/teardowns/${td.id}/modes/${standby.id}`).expect(204);
    expect((await eng.get(`/api/teardowns/${td.id}/modes`).expect(200)).body.modes.map((m: { name: string }) => m.name)).toEqual(['Gentle', 'Power bank']);
    // the power system carries the modes too
    expect((await eng.get(`/api/teardowns/${td.id}/power`).expect(200)).body.modes).toHaveLength(2);
    // a deleted load leaves every mode it was in
    await eng.delete(`/api/teardowns/${td.id}/loads/${td.usb}`).expect(204);
    const modes = (await eng.get(`/api/teardowns/${td.id}/modes`).expect(200)).body.modes as { name: string; loads: unknown[] }[];
    expect(modes.find((m) => m.name === 'Power bank')!.loads).toEqual([]);
  });

  it('refuses bad modes, naming the field, with nothing saved', async () => {
    const td = await heaterTeardown();
    const other = await heaterTeardown();
    const eng = await as('engineer');
    const bad = async (body: unknown) => (await eng.post(`/api/teardowns/${td.id}/modes`, body).expect(400)).body.error.fields as Record<string, string>;
    expect(await bad({ loads: [] })).toHaveProperty('name');
    expect(await bad({ name: 'X', loads: [{ loadId: 999999, duty: 1 }] })).toEqual({ 'loads.0.loadId': 'Choose a load of this teardown' });
    expect(await bad({ name: 'X', loads: [{ loadId: other.heater, duty: 1 }] })).toEqual({ 'loads.0.loadId': 'Choose a load of this teardown' });
    expect((await bad({ name: 'X', loads: [{ loadId: td.heater, duty: '150 %' }] }))['loads.0.duty']).toMatch(/^Duty: at most 100 %/);
    expect(
      (
        await bad({
          name: 'X',
          loads: [
            { loadId: td.heater, duty: 1 },
            { loadId: td.heater, duty: 0.5 },
          ],
        })
      )['loads.1.loadId'],
    ).toMatch(/already in the mode/);
    expect(await bad({ name: 'X', loads: [], quiescentAmps: '5 V' })).toHaveProperty('quiescentAmps');
    await eng.post(`/api/teardowns/${td.id}/modes`, { name: 'High', loads: [{ loadId: td.heater, duty: 1 }] }).expect(201);
    expect((await bad({ name: ' high ', loads: [] })).name).toMatch(/already has a mode called "high"/);
    expect((await eng.get(`/api/teardowns/${td.id}/modes`).expect(200)).body.modes).toHaveLength(1);
    for (const role of ['sourcing', 'lead', 'viewer']) await (await as(role)).post(`/api/teardowns/${td.id}/modes`, { name: 'Y', loads: [] }).expect(403);
  });
});

describe('the figures the bench expects, through the records', () => {
  it('duty for a target temperature: the loss at 45 °C over 100 cm² of plastic ÷ 8.881667 W [C]', async () => {
    const td = await heaterTeardown();
    const eng = await as('engineer');
    const res = (await eng.get(`/api/teardowns/${td.id}/loads/${td.heater}/duty-for-target?target=${encodeURIComponent('45 °C')}`).expect(200)).body.figure as FigureDto;
    const sigma = 5.670374419e-8;
    const needed = 10 * 0.01 * 20 + 0.9 * sigma * 0.01 * (318.15 ** 4 - 298.15 ** 4);
    expect(res.value as number).toBeCloseTo(needed / 8.881667, 6);
    expect(res.inputs.find((i) => i.key === 'targetC')!.value).toBe(45);
    expect((await eng.get(`/api/teardowns/${td.id}/loads/${td.heater}/duty-for-target?target=20`).expect(400)).body.error.fields).toHaveProperty('target');
    expect((await eng.get(`/api/teardowns/${td.id}/loads/${td.usb}/duty-for-target`).expect(400)).body.error.fields).toHaveProperty('loadId');
  });

  it('internal resistance from two DC-method readings: 3.912 V at 0.6 A, 3.792 V at 3.0 A → 50.0 mΩ, in the loaded-cell figures [C: REFERENCES §12]', async () => {
    const td = await heaterTeardown();
    const eng = await as('engineer');
    const pack = (
      await eng
        .put(`/api/teardowns/${td.id}/pack`, {
          chemistry: 'li-ion',
          nominalVolts: '3.7 V',
          capacityAh: '2700 mAh',
          protection: true,
          internalResistanceReadings: { lowAmps: '0.6 A', lowVolts: '3.912 V', highAmps: '3 A', highVolts: '3.792 V' },
        })
        .expect(200)
    ).body.pack;
    expect(pack.internalResistanceOhms).toBeCloseTo(0.05, 9);
    expect(pack.internalResistanceReadings).toEqual({ lowAmps: 0.6, lowVolts: 3.912, highAmps: 3, highVolts: 3.792 });
    const r = await figures(td.id);
    // all loads at once: 2.433333 A + 5 W / 0.88 / 3.7 V = 3.969 A from the cell; U = 3.7 − 3.969 × 0.05 [C]
    const amps = 2.433333 + 5 / 0.88 / 3.7;
    expect(fig(r, 'pack.terminalVolts')!.value as number).toBeCloseTo(3.7 - amps * 0.05, 4);
    expect(fig(r, 'pack.terminalVolts')!.inputs.find((i) => i.key === 'source')!.value).toMatch(/two DC-method readings/);
    const wrong = await eng
      .put(`/api/teardowns/${td.id}/pack`, { chemistry: 'li-ion', nominalVolts: 3.7, capacityAh: 2.7, internalResistanceReadings: { lowAmps: 3, lowVolts: 3.9, highAmps: 0.6, highVolts: 3.8 } })
      .expect(400);
    expect(wrong.body.error.fields).toHaveProperty('internalResistanceReadings.highAmps');
  });

  it('a surface-temperature reading replaces the estimate in the touch margin; the teardown can set its own contact time', async () => {
    const td = await heaterTeardown();
    const eng = await as('engineer');
    await eng.post(`/api/teardowns/${td.id}/measurements`, { quantity: 'surface-temperature', value: '46.5 °C', subject: 'Front face after 20 min' }).expect(201);
    const r = await figures(td.id);
    const m = fig(r, 'heater.touchMargin')!;
    // 48 °C for 10 min contact (pocket heater) − 46.5 °C measured = 1.5 °C [C; M: ISO 13732-1]
    expect(m.value as number).toBeCloseTo(1.5, 9);
    expect(m.inputs.find((i) => i.key === 'measuredIn')!.value).toMatch(/Front face after 20 min/);
    const current = (await eng.get(`/api/teardowns/${td.id}`).expect(200)).body.teardown;
    await eng.patch(`/api/teardowns/${td.id}`, { contactSeconds: 60, version: current.version }).expect(200);
    const own = fig(await figures(td.id), 'heater.touchMargin')!;
    // plastic at 1 min: 60 °C [M: ISO 13732-1] − 46.5 °C
    expect(own.value as number).toBeCloseTo(13.5, 9);
    expect(own.assumptions.join(' ')).toMatch(/set on this teardown/);
  });
});
