// A PATCH changes only what it is sent. Walks every PATCH route of the route table: for each field of
// its body, sends that field alone and checks that every other field of the record is unchanged.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ZodObject } from 'zod';
import type { Role } from '@splitcase/contracts';
import { allRoutes } from '../../apps/api/src/modules/routes';
import { demoRecords, type DemoRecords } from '../support/demo-records';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let d: DemoRecords;
const agents: Partial<Record<Role, Agent>> = {};
beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  d = await demoRecords(t);
  for (const role of ['admin', 'sourcing'] as const) agents[role] = await t.as(role);
}, 120_000);
afterAll(() => t.close());

type Rec = Record<string, unknown>;

interface PatchCase {
  /** The record's URL (the PATCH target). */
  url: () => string;
  /** The record as the API shows it. */
  read: (a: Agent) => Promise<Rec>;
  /** A valid new value for every field of the body, sent one at a time in this order. */
  values: Rec;
  /** Body fields that are not sent alone (the version that goes with every edit, an alias). */
  notSent?: string[];
  /** Fields of the record that follow from a sent field (e.g. the unit of a new value). */
  derived?: Record<string, string[]>;
  /** Added to every body (e.g. the version the edit started from). */
  extra?: (current: Rec) => Rec;
  role?: Role;
}

const found = (list: Rec[], id: number | null) => {
  const r = list.find((x) => x.id === id);
  if (!r) throw new Error(`record ${id} not in the list`);
  return r;
};
const get = async (a: Agent, url: string) => {
  const res = await a.get(url);
  if (res.status !== 200) throw new Error(`GET ${url}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
};
const td = () => d.draft.teardown;

/** One case per PATCH route (built once the demo ids are known). */
const cases = (): Record<string, PatchCase> => ({
  'PATCH /api/settings': {
    url: () => '/api/settings',
    read: async (a) => (await get(a, '/api/settings')).settings,
    values: {
      capacityWarnFraction: 0.8,
      reportingCurrency: 'EUR',
      defaultContactSeconds: 30,
      contactSecondsByCategory: { 'pocket-heater': 900 },
      usableFraction: 0.85,
      cutoffDebounceSeconds: 8,
      salesTaxByCurrency: { EUR: 0.19 },
      sessionMaxHours: 24,
      sessionIdleMinutes: 90,
    },
  },
  'PATCH /api/users/:id': {
    url: () => `/api/users/${d.users.engineer2}`,
    read: async (a) => found((await get(a, '/api/users')).users, d.users.engineer2!),
    values: { role: 'lead', active: false },
  },
  'PATCH /api/teardowns/:id': {
    url: () => `/api/teardowns/${td()}`,
    read: async (a) => (await get(a, `/api/teardowns/${td()}`)).teardown,
    values: { date: '2026-03-04', unitLabel: 'Unit Z (walk)', summary: 'Summary from the PATCH walk', safetyNotes: 'Notes from the PATCH walk', contactSeconds: 45 },
    notSent: ['version'],
    extra: (cur) => ({ version: cur.version }),
  },
  'PATCH /api/devices/:id': {
    url: () => `/api/devices/${d.draft.device}`,
    read: async (a) => (await get(a, `/api/devices/${d.draft.device}`)).device,
    values: {
      maker: 'Walkmaker',
      model: 'Walk One',
      category: 'usb-fan',
      currency: 'EUR',
      retailPrice: 12.5,
      salesTaxRate: '19 %',
      priceSeenOn: '2026-02-03',
      whereBought: 'A walk-in shop',
      claimCapacityAh: '4321 mAh',
      claimCapacityWh: '15.9 Wh',
      claimOutputWatts: '7 W',
      claimRuntimeH: '9 h',
      claimPowerW: '6 W',
      claimOutputText: '5 V 1.4 A',
      notes: 'Notes from the PATCH walk',
    },
  },
  'PATCH /api/teardowns/:id/findings/:findingId': {
    url: () => `/api/teardowns/${td()}/findings/${d.draft.finding}`,
    read: async (a) => found((await get(a, `/api/teardowns/${td()}/findings`)).findings, d.draft.finding),
    values: { kind: 'clever-idea', severity: 'major', text: 'Text from the PATCH walk', tags: ['walk'], partIds: [d.draft.part], photoIds: [d.draft.photo] },
    derived: { partIds: ['parts'], photoIds: ['photos'] },
  },
  'PATCH /api/photos/:id': {
    url: () => `/api/photos/${d.draft.photo}`,
    read: async (a) => found((await get(a, `/api/teardowns/${td()}/photos`)).photos, d.draft.photo),
    values: { caption: 'Caption from the PATCH walk', layer: 7, step: 11 },
  },
  'PATCH /api/callouts/:id': {
    url: () => `/api/callouts/${d.draft.callout}`,
    read: async (a) => {
      const [row] = (await t.orm.em.fork().getConnection().execute('select photo_id from callouts where id = ?', [d.draft.callout])) as { photo_id: number }[];
      const photo = row!.photo_id;
      return found((await get(a, `/api/photos/${photo}/callouts`)).callouts, d.draft.callout);
    },
    values: { x: 0.123, y: 0.456, label: 'Pin from the PATCH walk', partId: d.draft.part, findingId: d.draft.finding },
    derived: { partId: ['part'], findingId: ['finding'] },
  },
  'PATCH /api/parts/:id': {
    url: () => `/api/parts/${d.draft.part}`,
    read: async (a) => found((await get(a, `/api/teardowns/${td()}/parts`)).parts, d.draft.part),
    values: {
      designators: 'W1, W2',
      category: 'connector',
      description: 'Description from the PATCH walk',
      quantity: 3,
      mount: 'tht',
      marking: '473',
      makerPartNumber: 'WALK-1',
      package: 'SOT-23',
      notes: 'Notes from the PATCH walk',
    },
    // The singular form is an alias of designators.
    notSent: ['designator'],
    derived: { marking: ['decodedValue', 'decodedUnit', 'decoded'] },
  },
  'PATCH /api/teardowns/:id/loads/:loadId': {
    url: () => `/api/teardowns/${td()}/loads/${d.draft.load}`,
    read: async (a) => found((await get(a, `/api/teardowns/${td()}/loads`)).loads, d.draft.load),
    values: {
      kind: 'led',
      label: 'Load from the PATCH walk',
      resistanceOhms: '2R2',
      currentAmps: '350 mA',
      powerWatts: '1.5 W',
      supplyVolts: '3.6 V',
      count: 2,
      connection: 'series',
      duty: '40 %',
      converterId: null,
      heatedAreaM2: 0.0004,
      surfaceMaterial: 'plastic',
      elementMaterial: 'copper',
      heatedMassKg: '35 g',
    },
  },
  'PATCH /api/teardowns/:id/modes/:modeId': {
    url: () => `/api/teardowns/${td()}/modes/${d.draft.mode}`,
    read: async (a) => found((await get(a, `/api/teardowns/${td()}/modes`)).modes, d.draft.mode),
    values: { name: 'Mode from the PATCH walk', note: 'Noted by the walk', loads: [{ loadId: d.draft.load, duty: '35 %' }], quiescentAmps: '25 µA' },
  },
  'PATCH /api/teardowns/:id/converters/:converterId': {
    url: () => `/api/teardowns/${td()}/converters/${d.draft.converter}`,
    read: async (a) => found((await get(a, `/api/teardowns/${td()}/converters`)).converters, d.draft.converter),
    values: {
      label: 'Converter from the PATCH walk',
      topology: 'buck-boost',
      role: 'charge',
      inputVolts: '5.1 V',
      outputVolts: '4.2 V',
      ratedCurrentAmps: '1.5 A',
      chargeCurrentAmps: '900 mA',
      efficiency: '85 %',
      efficiencySource: 'measured',
    },
  },
  'PATCH /api/measurements/:id': {
    url: () => `/api/measurements/${d.draft.measurement}`,
    read: async (a) => found((await get(a, `/api/teardowns/${td()}/measurements`)).measurements, d.draft.measurement),
    values: { quantity: 'voltage', value: '3.71 V', subject: 'Subject from the PATCH walk', conditions: 'At rest', instrument: 'Walk meter', uncertainty: '±0.5 %' },
    derived: { quantity: ['unit', 'value', 'entered'], value: ['unit', 'entered'] },
  },
  'PATCH /api/runs/:id': {
    url: () => `/api/runs/${d.draft.run}`,
    read: async (a) => (await get(a, `/api/runs/${d.draft.run}`)).run,
    // The demo's first run of a teardown is a discharge cut off at 3.0 V: options it reads (another
    // kind's is refused), giving the same figures, so the comparison with the label stays as it was.
    values: { label: 'Run from the PATCH walk', options: { cutoffVolts: 3, cutoffDebounceSeconds: 5 } },
    derived: { options: ['analysis', 'durationS'] },
  },
  'PATCH /api/lineups/:id': {
    url: () => `/api/lineups/${d.lineups.draft}`,
    read: async (a) => (await get(a, `/api/lineups/${d.lineups.draft}`)).lineup,
    values: {
      name: 'Lineup from the PATCH walk',
      description: 'Described by the walk',
      currency: 'EUR',
      weights: { packWh: 4 },
      mode: { rule: 'named', name: 'High' },
      deviceIds: [d.draft.device, d.published.device],
      status: 'published',
    },
    notSent: ['version'],
    derived: { deviceIds: ['devices', 'hiddenDevices'], status: ['publishedAt', 'publishedBy', 'permissions'] },
  },
});

/** Never compared: they change with every write. */
const ALWAYS = new Set(['updatedAt', 'version']);

function unchanged(before: Rec, after: Rec, sent: string, derived: string[]) {
  for (const key of Object.keys(before)) {
    if (key === sent || derived.includes(key) || ALWAYS.has(key)) continue;
    if (key === 'entered' && before.entered && typeof before.entered === 'object') {
      const { [sent]: _b, ...b } = before.entered as Rec;
      const { [sent]: _a, ...a } = after.entered as Rec;
      expect(a, `entered (other than ${sent}) after sending ${sent}`).toEqual(b);
      continue;
    }
    expect(after[key], `${key} after sending only ${sent}`).toEqual(before[key]);
  }
}

describe('a PATCH changes only what it is sent', () => {
  const patches = allRoutes({ env: {} } as never, 'test').filter((r) => r.spec.method === 'patch');

  it('every PATCH route of the route table has a case here', () => {
    const all = cases();
    const missing = patches.map((r) => `PATCH ${r.spec.path}`).filter((k) => !all[k]);
    expect(missing, `add a case to CASES in tests/api/patch-routes.test.ts for: ${missing.join(', ')}`).toEqual([]);
  });

  for (const r of patches) {
    const key = `PATCH ${r.spec.path}`;
    it(`${key}: each field sent alone leaves the others as they were`, async () => {
      const c = cases()[key];
      if (!c) return; // reported by the test above
      const a = agents[c.role ?? 'admin']!;
      const shape = Object.keys((r.spec.body as ZodObject).shape);
      const notSent = c.notSent ?? [];
      expect(Object.keys(c.values).sort(), `values for every field of the body of ${key}`).toEqual(shape.filter((k) => !notSent.includes(k)).sort());
      for (const [field, value] of Object.entries(c.values)) {
        const before = await c.read(a);
        const body = { ...(c.extra?.(before) ?? {}), [field]: value };
        const res = await a.patch(c.url(), body).set('X-Confirm-Unpublish', 'yes');
        expect(res.status, `${key} with ${JSON.stringify(body)}: ${JSON.stringify(res.body)}`).toBe(200);
        const after = await c.read(a);
        unchanged(before, after, field, c.derived?.[field] ?? []);
      }
    });
  }

  it('settings: a second PATCH keeps the first (capacity warning level, then reporting currency)', async () => {
    const admin = agents.admin!;
    await admin.patch('/api/settings', { capacityWarnFraction: 0.75 }).expect(200);
    await admin.patch('/api/settings', { reportingCurrency: 'GBP' }).expect(200);
    expect((await admin.get('/api/settings')).body.settings).toMatchObject({ capacityWarnFraction: 0.75, reportingCurrency: 'GBP' });
  });

  it('settings: sourcing changes the reporting currency (its one field) and nothing else', async () => {
    const sourcing = agents.sourcing!;
    const res = await sourcing.patch('/api/settings', { reportingCurrency: 'USD' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.settings).toMatchObject({ reportingCurrency: 'USD', capacityWarnFraction: 0.75 });
    expect((await sourcing.patch('/api/settings', { capacityWarnFraction: 0.6 })).status).toBe(403);
  });
});
