// Quantities and prices typed as people type them, through the API: one reader for every field.
// A bare number typed as text is read in the unit of the field's example or refused naming the field;
// a JSON number stays in the stored unit (SI), as the API contract says.
// Sources: SI prefixes and symbols [S: BIPM SI Brochure, 9th ed., Table 7; IEC 80000], decimal comma
// [S: SI Brochure §5.4.4], R/k/M code [S: IEC 60062], Wh = V × Ah [S: REFERENCES.md §4]; the
// expected values are computed [C]; currency marks [CP].
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DeviceSchema } from '../../apps/api/src/modules/devices/device.entity';
import { TeardownSchema } from '../../apps/api/src/modules/teardowns/teardown.entity';
import { UserSchema } from '../../apps/api/src/modules/users/user.entity';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let eng: Agent;
let sourcing: Agent;

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  eng = await t.as('engineer');
  sourcing = await t.as('sourcing');
});
afterAll(() => t?.close());

async function newTeardown(): Promise<number> {
  const em = t.orm.em.fork();
  const device = await em.findOneOrFail(DeviceSchema, { model: 'Stackcell 10' });
  const engineer = await em.findOneOrFail(UserSchema, { email: 'engineer@splitcase.test' });
  const td = em.create(TeardownSchema, { device, engineer, date: '2026-12-02', status: 'draft', unitLabel: `Units ${Math.random().toString(36).slice(2, 7)}` } as never);
  await em.flush();
  return td.id;
}

const PACK = { chemistry: 'li-ion', nominalVolts: '3.7 V', capacityAh: '2700 mAh' };

describe('pack mass: "46" is 46 g, never 46 kg', () => {
  it('reads a bare "46" as 46 g, and the specific energy is that of a 46 g pack', async () => {
    const id = await newTeardown();
    const res = await eng.put(`/api/teardowns/${id}/pack`, { ...PACK, massKg: '46' }).expect(200);
    expect(res.body.pack.massKg).toBeCloseTo(0.046, 12);
    expect(res.body.pack.entered.massKg).toBe('46');
    const figures = (await eng.get(`/api/teardowns/${id}/figures`).expect(200)).body.figures as { key: string; value: number }[];
    // 3.7 V × 2.7 Ah = 9.99 Wh over 0.046 kg = 217.17 Wh/kg [C], not 0.217 Wh/kg.
    expect(figures.find((f) => f.key === 'pack.specificEnergy')!.value).toBeCloseTo(217.17, 2);
  });

  it('refuses a bare number that was probably kilograms, naming the field and the unit asked for; nothing saved', async () => {
    const id = await newTeardown();
    const res = await eng.put(`/api/teardowns/${id}/pack`, { ...PACK, massKg: '0.046' }).expect(400);
    expect(res.body.error.fields.massKg).toMatch(/^Pack mass: add a unit, e\.g\. 46 g/);
    expect((await eng.get(`/api/teardowns/${id}/pack`)).body.pack).toBeNull();
  });

  it('keeps a JSON number in SI (kg), as the contract says', async () => {
    const id = await newTeardown();
    const res = await eng.put(`/api/teardowns/${id}/pack`, { chemistry: 'li-ion', nominalVolts: 3.7, capacityAh: 2.7, massKg: 0.046 }).expect(200);
    expect(res.body.pack).toMatchObject({ massKg: 0.046, capacityAh: 2.7, entered: {} });
  });
});

describe('the forgiving reader on the power system', () => {
  it('reads "2700mah", "3,65 V", "4,2 V" and "2620 MAH" (never mega-amp-hours)', async () => {
    const id = await newTeardown();
    const res = await eng
      .put(`/api/teardowns/${id}/pack`, { chemistry: 'li-ion', nominalVolts: '3,65 V', maxVolts: '4,2 V', capacityAh: '2700mah', measuredCapacityAh: '2620 MAH', massKg: '46 G' })
      .expect(200);
    expect(res.body.pack).toMatchObject({ nominalVolts: 3.65, maxVolts: 4.2, capacityAh: 2.7, measuredCapacityAh: 2.62, massKg: 0.046 });
    expect(res.body.pack.entered).toMatchObject({ capacityAh: '2700mah', nominalVolts: '3,65 V' });
  });

  it('reads loads: "25k", "4K7", "3 ohm", duty "60" and area "27"; refuses a bare current', async () => {
    const id = await newTeardown();
    const a = await eng.post(`/api/teardowns/${id}/loads`, { kind: 'heater', resistanceOhms: '3 ohm', duty: '60', heatedAreaM2: '27' }).expect(201);
    expect(a.body.load.resistanceOhms).toBe(3);
    expect(a.body.load.duty).toBeCloseTo(0.6, 12);
    expect(a.body.load.heatedAreaM2).toBeCloseTo(0.0027, 12);
    expect((await eng.post(`/api/teardowns/${id}/loads`, { kind: 'led', resistanceOhms: '25k' }).expect(201)).body.load.resistanceOhms).toBe(25_000);
    expect((await eng.post(`/api/teardowns/${id}/loads`, { kind: 'led', resistanceOhms: '4K7', duty: '100 %' }).expect(201)).body.load).toMatchObject({ resistanceOhms: 4700, duty: 1 });
    const bad = await eng.post(`/api/teardowns/${id}/loads`, { kind: 'motor', currentAmps: '350', duty: '0.6' }).expect(400);
    expect(bad.body.error.fields).toEqual({
      currentAmps: 'Current (per element): add a unit, e.g. 350 mA',
      duty: 'Duty: add a unit, e.g. 60 % (a plain 0.6 would be read as 0.6 %)',
    });
  });

  it('reads converters: efficiency "88", "5 v"; refuses "1,000 mA" (1000 or 1.000?)', async () => {
    const id = await newTeardown();
    const c = await eng.post(`/api/teardowns/${id}/converters`, { topology: 'boost', inputVolts: '3,7', outputVolts: '5 v', efficiency: '88' }).expect(201);
    expect(c.body.converter).toMatchObject({ inputVolts: 3.7, outputVolts: 5 });
    expect(c.body.converter.efficiency).toBeCloseTo(0.88, 12);
    const bad = await eng.post(`/api/teardowns/${id}/converters`, { topology: 'boost', inputVolts: '3.7 V', outputVolts: '5 V', ratedCurrentAmps: '1,000 mA' }).expect(400);
    expect(bad.body.error.fields.ratedCurrentAmps).toMatch(/^Rated output current: "1,000" could be 1000 or 1\.000/);
  });
});

describe('every 400 about a quantity names the field as the screen labels it', () => {
  it('range refusals on the power system start with the label and say the limit in its unit', async () => {
    const id = await newTeardown();
    const pack = await eng.put(`/api/teardowns/${id}/pack`, { ...PACK, massKg: '-4 g', maxVolts: '12 V' }).expect(400);
    expect(pack.body.error.fields).toEqual({
      massKg: 'Pack mass: must be more than 0 kg',
      maxVolts: "Charge voltage (per cell): at most 10 V: give one cell's charge voltage",
    });
    const load = await eng.post(`/api/teardowns/${id}/loads`, { kind: 'heater', resistanceOhms: '3 ohm', duty: '150 %', count: '0' }).expect(400);
    expect(load.body.error.fields).toEqual({ duty: 'Duty: at most 100 %', count: 'Count: must be at least 1' });
    const conv = await eng.post(`/api/teardowns/${id}/converters`, { topology: 'boost', inputVolts: '3.7 V', outputVolts: '5 V', efficiency: 0 }).expect(400);
    expect(conv.body.error.fields).toEqual({ efficiency: 'Efficiency: must be more than 0 %' });
  });

  it('a label claim of zero names the claim', async () => {
    const res = await eng
      .post('/api/devices', { maker: 'Unitwright (invented)', model: `Zero ${Math.random().toString(36).slice(2, 7)}`, category: 'power-bank', claimCapacityAh: '0 mAh' })
      .expect(400);
    expect(res.body.error.fields).toEqual({ claimCapacityAh: 'Capacity on the label: must be more than zero' });
  });
});

describe('measurements', () => {
  it('reads "9.99wh", "10 min" and a bare "46" mass; refuses a bare time', async () => {
    const id = await newTeardown();
    const wh = await eng.post(`/api/teardowns/${id}/measurements`, { quantity: 'energy', value: '9.99wh', subject: 'Cell' }).expect(201);
    expect(wh.body.measurement).toMatchObject({ value: 9.99, unit: 'Wh', entered: '9.99wh' });
    expect((await eng.post(`/api/teardowns/${id}/measurements`, { quantity: 'time', value: '10 min', subject: 'Run' }).expect(201)).body.measurement.value).toBe(600);
    expect((await eng.post(`/api/teardowns/${id}/measurements`, { quantity: 'mass', value: '46', subject: 'Pack' }).expect(201)).body.measurement.value).toBeCloseTo(0.046, 12);
    expect((await eng.post(`/api/teardowns/${id}/measurements`, { quantity: 'mass', value: 0.046, subject: 'Pack (SI)' }).expect(201)).body.measurement.value).toBe(0.046);
    const bad = await eng.post(`/api/teardowns/${id}/measurements`, { quantity: 'time', value: '10', subject: 'Run' }).expect(400);
    expect(bad.body.error.fields.value).toBe('Value with unit: add a unit, e.g. 10 min — the quantity is time');
  });
});

describe('device claims and retail price', () => {
  const device = (over: Record<string, unknown>) => ({ maker: 'Unitwright (invented)', model: `Reader ${Math.random().toString(36).slice(2, 7)}`, category: 'power-bank', ...over });

  it('reads a bare "5000" capacity as mAh and "$24.99" against USD', async () => {
    const res = await eng.post('/api/devices', device({ claimCapacityAh: '5000', claimRuntimeH: '6', retailPrice: '$24.99', currency: 'USD' })).expect(201);
    expect(res.body.device).toMatchObject({ claimCapacityAh: 5, claimRuntimeH: 6, retailPrice: 24.99, currency: 'USD' });
    expect(res.body.device.entered).toMatchObject({ claimCapacityAh: '5000' });
  });

  it('takes the currency from "24,99 €" when none is chosen; a JSON number still needs the currency field', async () => {
    const res = await eng.post('/api/devices', device({ retailPrice: '24,99 €' })).expect(201);
    expect(res.body.device).toMatchObject({ retailPrice: 24.99, currency: 'EUR' });
    const changed = await eng.patch(`/api/devices/${res.body.device.id}`, { retailPrice: 'GBP 19.5', currency: '' }).expect(200);
    expect(changed.body.device).toMatchObject({ retailPrice: 19.5, currency: 'GBP' });
    expect((await eng.post('/api/devices', device({ retailPrice: 24.99 })).expect(400)).body.error.fields.currency).toMatch(/currency of the price/);
  });

  it('refuses a currency that is not the chosen one, a shared "$" with none chosen, and a capacity of "20"', async () => {
    const a = await eng.post('/api/devices', device({ retailPrice: '0,12 €', currency: 'USD' })).expect(400);
    expect(a.body.error.fields.retailPrice).toBe('Retail price: "€" is EUR, but this price is in USD: choose EUR as the currency, or type the amount in USD');
    const b = await eng.post('/api/devices', device({ retailPrice: '$24.99' })).expect(400);
    expect(b.body.error.fields.retailPrice).toMatch(/"\$" is used by several currencies/);
    const c = await eng.post('/api/devices', device({ claimCapacityAh: '20' })).expect(400);
    expect(c.body.error.fields.claimCapacityAh).toMatch(/^Capacity on the label: add a unit, e\.g\. 5000 mAh/);
  });
});

describe('price breaks', () => {
  async function newPart(): Promise<number> {
    const id = await newTeardown();
    const res = await eng.post(`/api/teardowns/${id}/parts`, { designators: 'BT1', category: 'cell', description: '18650 cell', quantity: 1, mount: 'manual' }).expect(201);
    return res.body.part.id as number;
  }

  it('reads "$0.12", "0,10", "5k" and "USD 0.095" against the line currency', async () => {
    const partId = await newPart();
    const res = await sourcing
      .put(`/api/parts/${partId}/price`, {
        currency: 'USD',
        source: 'quote',
        confidence: 'medium',
        breaks: [
          { minQty: '1', unitPrice: '$0.12' },
          { minQty: '5k', unitPrice: '0,10' },
          { minQty: '10,000', unitPrice: 'USD 0.095' },
        ],
      })
      .expect(200);
    expect(res.body.price.breaks).toEqual([
      { minQty: 1, unitPrice: 0.12 },
      { minQty: 5000, unitPrice: 0.1 },
      { minQty: 10_000, unitPrice: 0.095 },
    ]);
    // JSON numbers, as before.
    const plain = await sourcing.put(`/api/parts/${partId}/price`, { currency: 'USD', source: 'quote', confidence: 'medium', breaks: [{ minQty: 1, unitPrice: 2.5 }] }).expect(200);
    expect(plain.body.price.breaks).toEqual([{ minQty: 1, unitPrice: 2.5 }]);
  });

  it('refuses "0,12 €" on a USD price and a blank price, naming the break; the order check still applies', async () => {
    const partId = await newPart();
    const body = { currency: 'USD', source: 'quote', confidence: 'medium' };
    const bad = await sourcing
      .put(`/api/parts/${partId}/price`, {
        ...body,
        breaks: [
          { minQty: '1', unitPrice: '0,12 €' },
          { minQty: '1000', unitPrice: '' },
        ],
      })
      .expect(400);
    expect(bad.body.error.fields).toEqual({
      'breaks.0.unitPrice': 'Unit price: "€" is EUR, but this price is in USD: choose EUR as the currency, or type the amount in USD',
      'breaks.1.unitPrice': 'Required',
    });
    const order = await sourcing
      .put(`/api/parts/${partId}/price`, {
        ...body,
        breaks: [
          { minQty: '5k', unitPrice: '0.1' },
          { minQty: '1000', unitPrice: '0.12' },
        ],
      })
      .expect(400);
    expect(order.body.error.fields['breaks.1.minQty']).toMatch(/out of order/);
    await sourcing.delete(`/api/parts/${partId}/price`).expect(404);
  });
});

describe('price import (CSV breaks)', () => {
  it('reads each minQty@unitPrice pair with the reader, against the line currency', async () => {
    const id = await newTeardown();
    await eng.post(`/api/teardowns/${id}/parts`, { designators: 'U1', category: 'ic', description: 'Charger IC', quantity: 1, mount: 'smt' }).expect(201);
    await eng.post(`/api/teardowns/${id}/parts`, { designators: 'U2', category: 'ic', description: 'Boost IC', quantity: 1, mount: 'smt' }).expect(201);
    const upload = (csv: string) => sourcing.upload(`/api/teardowns/${id}/prices/import?mode=preview`).attach('file', Buffer.from(csv), { filename: 'prices.csv', contentType: 'text/csv' });
    const ok = await upload('designators;currency;breaks;source;confidence\nU1;USD;1@$0.32|5k@0,28;quote;high\nU2;EUR;1 000@0,30 €;quote;high\n').expect(200);
    expect(ok.body.rows.map((r: { after: { breaks: unknown } }) => r.after.breaks)).toEqual([
      [
        { minQty: 1, unitPrice: 0.32 },
        { minQty: 5000, unitPrice: 0.28 },
      ],
      [{ minQty: 1000, unitPrice: 0.3 }],
    ]);
    const bad = await upload('designators;currency;breaks;source;confidence\nU1;USD;1@0,30 €;quote;high\n').expect(400);
    expect(bad.body.error.fields['lines.2.breaks']).toBe(
      'Line 2, column breaks: break 1 (unitPrice): Unit price: "€" is EUR, but this price is in USD: choose EUR as the currency, or type the amount in USD',
    );
  });
});

describe('bench tools', () => {
  it('runtime: "2700mah", "3,7 V", "9 w"; a bare duty of "0.6" is refused', async () => {
    const ok = await eng.post('/api/tools/runtime', { cellNominalVoltage: '3,7 V', cellCapacity: '2700mah', loadPower: '9 w' }).expect(200);
    expect(ok.body.parsed.cellCapacity).toEqual({ entered: '2700mah', value: 2.7, unit: 'Ah' });
    expect(ok.body.parsed.cellNominalVoltage.value).toBe(3.7);
    const bad = await eng.post('/api/tools/runtime', { cellNominalVoltage: '3.7 V', cellCapacity: '2700 mAh', loadPower: '9 W', duty: '0.6' }).expect(400);
    expect(bad.body.error.fields.duty).toBe('PWM duty: add a unit, e.g. 60 % (a plain 0.6 would be read as 0.6 %)');
  });
});
