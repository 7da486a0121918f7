// Parts (bill of materials) with marking decoding and CSV in/out, the power system (pack, loads,
// converters) with typed units, and measurements: routes, validation, roles, audit, demo seed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { CONFIRM_UNPUBLISH_HEADER } from '@splitcase/contracts';
import { TeardownSchema } from '../../apps/api/src/modules/teardowns/teardown.entity';
import { DeviceSchema } from '../../apps/api/src/modules/devices/device.entity';
import { UserSchema } from '../../apps/api/src/modules/users/user.entity';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let eng: Agent;

beforeAll(async () => {
  t = await makeTestApp({ seed: 'demo' });
  eng = await t.as('engineer');
});
afterAll(() => t.close());

async function sql<T>(query: string, params: unknown[] = []): Promise<T[]> {
  return (await t.orm.em.fork().getConnection().execute(query, params)) as T[];
}

/** A fresh teardown of a demo device, in the given status, with nothing recorded yet. */
async function newTeardown(status: 'draft' | 'in_review' | 'published' = 'draft'): Promise<number> {
  const em = t.orm.em.fork();
  const device = await em.findOneOrFail(DeviceSchema, { model: 'Stackcell 10' });
  const engineer = await em.findOneOrFail(UserSchema, { email: 'engineer@splitcase.test' });
  const td = em.create(TeardownSchema, { device, engineer, date: '2026-12-01', status, unitLabel: `Test unit ${Math.random().toString(36).slice(2, 7)}` } as never);
  await em.flush();
  return td.id;
}

async function auditFor(teardownId: number) {
  return sql<{ action: string; entity_type: string; scope_type: string; scope_id: string; summary: string }>(
    'select action, entity_type, scope_type, scope_id, summary from audit_entries where scope_type = ? and scope_id = ? order by id',
    ['teardown', String(teardownId)],
  );
}

const part = (over: Record<string, unknown> = {}) => ({ designators: 'R1', category: 'passive', description: 'Chip resistor', quantity: 1, mount: 'smt', marking: '472', ...over });

describe('parts: happy path, decoding and audit', () => {
  it('adds, lists, changes and removes a part line, each change audited in the teardown scope', async () => {
    const id = await newTeardown();
    const created = await eng.post(`/api/teardowns/${id}/parts`, part({ package: '0402', makerPartNumber: 'QZ-R4702', notes: 'pull-up' })).expect(201);
    const p = created.body.part;
    expect(p).toMatchObject({
      id: expect.any(Number),
      designators: 'R1',
      category: 'passive',
      marking: '472',
      decodedUnit: 'Ω',
      quantity: 1,
      mount: 'smt',
      package: '0402',
      makerPartNumber: 'QZ-R4702',
    });
    // 472 = 47 × 10² Ω [S: REFERENCES.md §1, SMD resistor codes]
    expect(p.decodedValue).toBeCloseTo(4700, 9);

    const list = await eng.get(`/api/teardowns/${id}/parts`).expect(200);
    expect(list.body.parts.map((x: { id: number }) => x.id)).toEqual([p.id]);

    const changed = await eng.patch(`/api/parts/${p.id}`, { marking: '4R7', quantity: 3 }).expect(200);
    // 4R7 = 4.7 Ω [S: REFERENCES.md §1]
    expect(changed.body.part.decodedValue).toBeCloseTo(4.7, 12);
    expect(changed.body.part.quantity).toBe(3);
    expect(changed.body.part.notes).toBe('pull-up');

    await eng.delete(`/api/parts/${p.id}`).expect(204);
    expect((await eng.get(`/api/teardowns/${id}/parts`).expect(200)).body.parts).toEqual([]);
    await eng.patch(`/api/parts/${p.id}`, { quantity: 2 }).expect(404);

    const audit = await auditFor(id);
    expect(audit.map((a) => a.action)).toEqual(['part.created', 'part.updated', 'part.deleted']);
    expect(audit.every((a) => a.scope_type === 'teardown' && a.scope_id === String(id))).toBe(true);
    expect(audit[1]!.summary).toMatch(/marking/);
  });

  it('accepts the singular "designator" of the published contract', async () => {
    const id = await newTeardown();
    const res = await eng.post(`/api/teardowns/${id}/parts`, { designator: 'C7', category: 'passive', description: 'Ceramic capacitor', quantity: 1, mount: 'smt', marking: '104' }).expect(201);
    expect(res.body.part.designators).toBe('C7');
  });

  it.each([
    // [S: REFERENCES.md §1 — SMD resistor codes, EIA-96 table, capacitor 3-digit code]
    ['R1', 'Chip resistor', '472', 4700, 'Ω'],
    ['R2', 'Chip resistor', '4R7', 4.7, 'Ω'],
    ['R3', 'Current-sense resistor', 'R010', 0.01, 'Ω'],
    ['R4', 'Chip resistor 1 %', '68X', 49.9, 'Ω'],
    ['R5', 'Chip resistor 1 %', '1002', 10_000, 'Ω'],
    ['C1', 'Ceramic capacitor', '104', 100e-9, 'F'],
    ['C2', 'Ceramic capacitor', '4n7', 4.7e-9, 'F'],
    ['', 'Thick-film resistor', '100', 10, 'Ω'],
  ])('decodes %s "%s" marked %s as %d %s', async (designators, description, marking, value, unit) => {
    const id = await newTeardown();
    const res = await eng.post(`/api/teardowns/${id}/parts`, { designators, category: 'passive', description, quantity: 1, mount: 'smt', marking }).expect(201);
    expect(res.body.part.decodedUnit).toBe(unit);
    expect(res.body.part.decodedValue / value).toBeCloseTo(1, 12);
    expect(res.body.part.decodeNote).toBeNull();
  });

  it('keeps a marking that is not a code with no value and a note, and never errors on an IC marking', async () => {
    const id = await newTeardown();
    const ic = await eng.post(`/api/teardowns/${id}/parts`, { designators: 'U1', category: 'ic', description: 'Microcontroller', quantity: 1, mount: 'smt', marking: '472' }).expect(201);
    expect(ic.body.part).toMatchObject({ marking: '472', decodedValue: null, decodedUnit: null, decodeNote: null });
    const odd = await eng.post(`/api/teardowns/${id}/parts`, part({ designators: 'R9', marking: 'K7Q' })).expect(201);
    expect(odd.body.part).toMatchObject({ marking: 'K7Q', decodedValue: null, decodedUnit: null });
    expect(odd.body.part.decodeNote).toMatch(/not a resistor code/);
    const badIndex = await eng.post(`/api/teardowns/${id}/parts`, part({ designators: 'R10', marking: '99X' })).expect(201);
    expect(badIndex.body.part.decodedValue).toBeNull();
    expect(badIndex.body.part.decodeNote).toMatch(/EIA-96/);
  });

  it('puts the lines in a new order, refusing a list that is not every part once', async () => {
    const id = await newTeardown();
    const a = (await eng.post(`/api/teardowns/${id}/parts`, part({ designators: 'R1' })).expect(201)).body.part.id;
    const b = (await eng.post(`/api/teardowns/${id}/parts`, part({ designators: 'R2' })).expect(201)).body.part.id;
    const res = await eng.put(`/api/teardowns/${id}/parts/order`, { ids: [b, a] }).expect(200);
    expect(res.body.parts.map((p: { designators: string }) => p.designators)).toEqual(['R2', 'R1']);
    expect((await eng.get(`/api/teardowns/${id}/parts`)).body.parts.map((p: { id: number }) => p.id)).toEqual([b, a]);
    const bad = await eng.put(`/api/teardowns/${id}/parts/order`, { ids: [b] }).expect(400);
    expect(bad.body.error.fields).toHaveProperty('ids');
  });
});

describe('parts: validation names the field', () => {
  it.each([
    ['unknown category', { category: 'gizmo' }, 'category', /Choose a category/],
    ['negative quantity', { quantity: -2 }, 'quantity', /At least 1/],
    ['fractional quantity', { quantity: 1.5 }, 'quantity', /whole number/],
    ['quantity as text', { quantity: 'many' }, 'quantity', /whole number/],
    ['missing description', { description: '  ' }, 'description', /Required/],
    ['unknown mount', { mount: 'glued' }, 'mount', /smt, tht or manual/],
    ['marking too long', { marking: 'x'.repeat(121) }, 'marking', /120/],
  ])('%s → 400 naming %s', async (_name, over, field, message) => {
    const id = await newTeardown();
    const res = await eng.post(`/api/teardowns/${id}/parts`, part(over)).expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.fields[field]).toMatch(message);
    expect((await eng.get(`/api/teardowns/${id}/parts`)).body.parts).toEqual([]);
  });

  it('an empty PATCH is refused', async () => {
    const id = await newTeardown();
    const p = (await eng.post(`/api/teardowns/${id}/parts`, part()).expect(201)).body.part;
    await eng.patch(`/api/parts/${p.id}`, {}).expect(400);
  });
});

describe('roles and the published state', () => {
  it('sourcing, lead and viewer cannot write; anonymous is asked to sign in', async () => {
    const id = await newTeardown();
    const p = (await eng.post(`/api/teardowns/${id}/parts`, part()).expect(201)).body.part;
    for (const role of ['sourcing', 'lead', 'viewer']) {
      const a = await t.as(role);
      expect((await a.post(`/api/teardowns/${id}/parts`, part())).status, role).toBe(403);
      expect((await a.patch(`/api/parts/${p.id}`, { quantity: 2 })).status, role).toBe(403);
      expect((await a.delete(`/api/parts/${p.id}`)).status, role).toBe(403);
      expect((await a.put(`/api/teardowns/${id}/pack`, { chemistry: 'li-ion', nominalVolts: 3.7, capacityAh: 2 })).status, role).toBe(403);
      expect((await a.post(`/api/teardowns/${id}/loads`, { kind: 'heater', resistanceOhms: 3 })).status, role).toBe(403);
      expect((await a.post(`/api/teardowns/${id}/converters`, { topology: 'buck', inputVolts: 5, outputVolts: 3.3 })).status, role).toBe(403);
      expect((await a.post(`/api/teardowns/${id}/measurements`, { quantity: 'voltage', value: '3 V', subject: 'x' })).status, role).toBe(403);
      expect((await a.post(`/api/teardowns/${id}/parts/import?dryRun=1`, { csv: 'Category,Description\nic,x' })).status, role).toBe(403);
    }
    const anon = await t.anonymous();
    expect((await anon.post(`/api/teardowns/${id}/parts`, part())).status).toBe(401);
    expect((await anon.get(`/api/teardowns/${id}/parts`)).status).toBe(401);
    expect((await eng.get(`/api/teardowns/${id}/parts`).expect(200)).body.parts).toHaveLength(1);
  });

  it("a viewer cannot read a draft's records (404, as if absent) but reads a published one's", async () => {
    const draft = await newTeardown('draft');
    const published = await newTeardown('published');
    const viewer = await t.as('viewer');
    for (const path of ['parts', 'parts.csv', 'power', 'pack', 'loads', 'converters', 'measurements', 'measurements.csv']) {
      expect((await viewer.get(`/api/teardowns/${draft}/${path}`)).status, path).toBe(404);
      expect((await viewer.get(`/api/teardowns/${published}/${path}`)).status, path).toBe(200);
    }
    const lead = await t.as('lead');
    expect((await lead.get(`/api/teardowns/${draft}/parts`)).status).toBe(200);
  });

  it('a change to a published teardown needs the confirm header (409 without), then moves it back to draft', async () => {
    const id = await newTeardown('published');
    const refused = await eng.post(`/api/teardowns/${id}/parts`, part()).expect(409);
    expect(refused.body.error.details).toEqual({ reason: 'published' });
    expect((await eng.get(`/api/teardowns/${id}/parts`)).body.parts).toEqual([]);
    await eng.put(`/api/teardowns/${id}/pack`, { chemistry: 'li-ion', nominalVolts: '3.7 V', capacityAh: '2 Ah' }).expect(409);
    await eng.post(`/api/teardowns/${id}/measurements`, { quantity: 'voltage', value: '3 V', subject: 'cell' }).expect(409);
    expect((await eng.get(`/api/teardowns/${id}`)).body.teardown.status).toBe('published');

    await eng.post(`/api/teardowns/${id}/parts`, part()).set(CONFIRM_UNPUBLISH_HEADER, 'yes').expect(201);
    expect((await eng.get(`/api/teardowns/${id}`)).body.teardown.status).toBe('draft');
    expect((await auditFor(id)).map((a) => a.action)).toEqual(['teardown.unpublished', 'part.created']);
  });

  it('a refused change leaves a published teardown published (the unpublish rolls back with it)', async () => {
    const id = await newTeardown('published');
    await eng
      .post(`/api/teardowns/${id}/parts`, part({ quantity: 0 }))
      .set(CONFIRM_UNPUBLISH_HEADER, 'yes')
      .expect(400);
    await eng.put(`/api/teardowns/${id}/pack`, { chemistry: 'li-ion', nominalVolts: '3.7 A', capacityAh: '2 Ah' }).set(CONFIRM_UNPUBLISH_HEADER, 'yes').expect(400);
    expect((await eng.get(`/api/teardowns/${id}`)).body.teardown.status).toBe('published');
    expect(await auditFor(id)).toEqual([]);
  });
});

describe('parts CSV import', () => {
  const GOOD = [
    'Designators,Category,Description,Marking,Maker part number,Package,Quantity,Mount,Notes',
    'R1,passive,Chip resistor,472,QZ-R4702,0402,2,smt,',
    '"C1, C2",passive,"Ceramic capacitor, X7R",104,,0402,2,SMT,"said ""decoupling"""',
    'U1,ic,Microcontroller,M8C31,KV-M8C31S,SOP-8,1,smt,',
  ].join('\n');

  it('previews without saving: decoded values, header names matched case-insensitively', async () => {
    const id = await newTeardown();
    const csv = GOOD.replace('Designators,Category,Description', 'DESIGNATORS,category,  Description ');
    const res = await eng.post(`/api/teardowns/${id}/parts/import?dryRun=1`, { csv }).expect(200);
    expect(res.body).toMatchObject({ dryRun: true, valid: true, imported: 0, errors: [], delimiter: ',' });
    expect(res.body.rows).toHaveLength(3);
    expect(res.body.rows[0]).toMatchObject({ row: 2, part: { designators: 'R1', decodedValue: 4700, decodedUnit: 'Ω', quantity: 2 } });
    expect(res.body.rows[1].part).toMatchObject({ designators: 'C1, C2', description: 'Ceramic capacitor, X7R', notes: 'said "decoupling"', mount: 'smt' });
    expect(res.body.rows[1].part.decodedValue).toBeCloseTo(100e-9, 20);
    expect((await eng.get(`/api/teardowns/${id}/parts`)).body.parts).toEqual([]);
  });

  it('reports row-level errors naming the row number and the column', async () => {
    const id = await newTeardown();
    const csv = ['Designators;Category;Description;Qty;Mount', 'R1;passive;Chip resistor;2;smt', 'X1;gizmo;Odd thing;1;smt', 'R2;passive;;-3;glued'].join('\r\n');
    const res = await eng.post(`/api/teardowns/${id}/parts/import?dryRun=1`, { csv }).expect(200);
    expect(res.body.valid).toBe(false);
    expect(res.body.delimiter).toBe(';');
    expect(res.body.errors).toEqual([
      { row: 3, column: 'Category', message: expect.stringMatching(/Unknown category "gizmo"/) },
      { row: 4, column: 'Description', message: expect.stringMatching(/Required/) },
      { row: 4, column: 'Qty', message: expect.stringMatching(/below 1/) },
      { row: 4, column: 'Mount', message: expect.stringMatching(/Unknown mount "glued"/) },
    ]);
    expect(res.body.rows[0].errors).toEqual([]);
  });

  it('checks a row by the rules of a part sent to the API: the same message, named by row and column', async () => {
    const id = await newTeardown();
    const long = 'x'.repeat(501);
    const sent = await eng.post(`/api/teardowns/${id}/parts`, { category: 'ic', description: long, quantity: 1.5 }).expect(400);
    const csv = ['Category,Description,Quantity,Mount', `ic,${long},1.5,smt`, 'ic,MCU,two,glued'].join('\n');
    const res = await eng.post(`/api/teardowns/${id}/parts/import?dryRun=1`, { csv }).expect(200);
    expect(res.body.errors).toEqual([
      { row: 2, column: 'Description', message: sent.body.error.fields.description },
      { row: 2, column: 'Quantity', message: sent.body.error.fields.quantity },
      { row: 3, column: 'Quantity', message: '"two" is not a number: enter a whole number of at least 1.' },
      { row: 3, column: 'Mount', message: 'Unknown mount "glued": choose smt, tht or manual.' },
    ]);
  });

  it('names a missing required column against the header row', async () => {
    const id = await newTeardown();
    const res = await eng.post(`/api/teardowns/${id}/parts/import?dryRun=1`, { csv: 'Designators,Description\nR1,Resistor' }).expect(200);
    expect(res.body.errors).toEqual([{ row: 1, column: 'Category', message: expect.stringMatching(/Missing column/) }]);
  });

  it('rolls back on a bad row: nothing is saved, 400 lists every problem', async () => {
    const id = await newTeardown();
    await eng.post(`/api/teardowns/${id}/parts`, part({ designators: 'R99' })).expect(201);
    const csv = [GOOD, 'R3,passive,Chip resistor,103,,0402,two,smt,'].join('\n');
    const res = await eng.post(`/api/teardowns/${id}/parts/import`, { csv }).expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.fields).toEqual({ 'row.5.Quantity': expect.stringMatching(/not a number/) });
    expect(res.body.error.details.errors).toHaveLength(1);
    const after = (await eng.get(`/api/teardowns/${id}/parts`)).body.parts;
    expect(after.map((p: { designators: string }) => p.designators)).toEqual(['R99']);
    // Replace mode with a bad row keeps the old list too.
    await eng.post(`/api/teardowns/${id}/parts/import`, { csv, mode: 'replace' }).expect(400);
    expect((await eng.get(`/api/teardowns/${id}/parts`)).body.parts).toHaveLength(1);
    expect((await auditFor(id)).filter((a) => a.action === 'parts.imported')).toEqual([]);
  });

  it('commits every row in one go and audits the import', async () => {
    const id = await newTeardown();
    const res = await eng.post(`/api/teardowns/${id}/parts/import`, { csv: GOOD }).expect(200);
    expect(res.body).toMatchObject({ dryRun: false, valid: true, imported: 3 });
    const parts = (await eng.get(`/api/teardowns/${id}/parts`)).body.parts;
    expect(parts.map((p: { designators: string }) => p.designators)).toEqual(['R1', 'C1, C2', 'U1']);
    expect((await auditFor(id)).map((a) => a.summary)).toEqual(['Imported 3 parts from CSV']);
  });

  it('reads a UTF-8 BOM, semicolons, quoted separators and line breaks, labels and synonyms', async () => {
    const id = await newTeardown();
    const csv = '\uFEFFRef;Type;Description;Marking;QTY;Mounting;Remarks\r\n"R1";Resistor;"Shunt; 1 %";R010;1;Surface mount;"two\r\nlines"\r\n\r\nJ1;Connector;USB-C receptacle;;1;Through-hole;\r\n';
    const res = await eng.post(`/api/teardowns/${id}/parts/import`, { csv }).expect(200);
    expect(res.body.imported).toBe(2);
    const [r1, j1] = (await eng.get(`/api/teardowns/${id}/parts`)).body.parts;
    expect(r1).toMatchObject({ designators: 'R1', category: 'passive', description: 'Shunt; 1 %', decodedUnit: 'Ω', mount: 'smt', notes: 'two\r\nlines' });
    expect(r1.decodedValue).toBeCloseTo(0.01, 12);
    expect(j1).toMatchObject({ category: 'connector', mount: 'tht' });
    // A spreadsheet shows the two-line cell in one row (2) and the blank line as row 3: J1 is row 4.
    expect(res.body.rows.map((r: { row: number }) => r.row)).toEqual([2, 4]);
  });

  it('ignores unknown columns with a warning', async () => {
    const id = await newTeardown();
    const res = await eng.post(`/api/teardowns/${id}/parts/import?dryRun=1`, { csv: 'Category,Description,Unit price\nic,MCU,0.12' }).expect(200);
    expect(res.body.valid).toBe(true);
    expect(res.body.columns.ignored).toEqual(['Unit price']);
    expect(res.body.warnings.join(' ')).toMatch(/Unit price/);
  });

  it('refuses an empty body and an unknown mode, naming the field', async () => {
    const id = await newTeardown();
    expect((await eng.post(`/api/teardowns/${id}/parts/import`, { csv: '' }).expect(400)).body.error.fields).toHaveProperty('csv');
    expect((await eng.post(`/api/teardowns/${id}/parts/import`, { csv: GOOD, mode: 'merge' }).expect(400)).body.error.fields).toHaveProperty('mode');
  });

  it('replace mode swaps the whole list in one transaction', async () => {
    const id = await newTeardown();
    await eng.post(`/api/teardowns/${id}/parts`, part({ designators: 'OLD1' })).expect(201);
    await eng.post(`/api/teardowns/${id}/parts/import`, { csv: GOOD, mode: 'replace' }).expect(200);
    const parts = (await eng.get(`/api/teardowns/${id}/parts`)).body.parts;
    expect(parts.map((p: { designators: string }) => p.designators)).toEqual(['R1', 'C1, C2', 'U1']);
  });
});

describe('parts CSV export', () => {
  it('opens cleanly in a spreadsheet: BOM, CRLF, every field quoted, formula cells neutralised', async () => {
    const id = await newTeardown();
    await eng.post(`/api/teardowns/${id}/parts`, part({ description: '=HYPERLINK("http://x.test","click")', notes: '+1 spare', marking: '472' })).expect(201);
    await eng.post(`/api/teardowns/${id}/parts`, part({ designators: 'U1', category: 'ic', description: '@SUM(A1)', makerPartNumber: '-5V-REG', marking: null, notes: 'ohm Ω, "quoted"' })).expect(201);
    const res = await eng
      .get(`/api/teardowns/${id}/parts.csv`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="pellam-works-stackcell-10-parts\.csv"/);
    const bytes = res.body as Buffer;
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const text = bytes.toString('utf8').slice(1);
    const lines = text.split('\r\n');
    expect(lines.at(-1)).toBe('');
    expect(text.replace(/\r\n/g, '')).not.toMatch(/\n/);
    expect(lines[0]).toBe('"Designators","Category","Description","Marking","Decoded value","Decoded unit","Maker part number","Package","Quantity","Mount","Notes"');
    // OWASP CSV injection guidance [CP]: cells starting with = + - @ get a leading single quote.
    expect(lines[1]).toContain(`"'=HYPERLINK(""http://x.test"",""click"")"`);
    expect(lines[1]).toContain(`"'+1 spare"`);
    expect(lines[1]).toContain('"4700"');
    expect(lines[2]).toContain(`"'@SUM(A1)"`);
    expect(lines[2]).toContain(`"'-5V-REG"`);
    expect(lines[2]).toContain('"ohm Ω, ""quoted"""');
    const parsed = Papa.parse<string[]>(text.trim(), { header: false });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.every((r) => r.length === 11)).toBe(true);
  });

  it('round-trips: export → import into another teardown gives the same lines', async () => {
    const from = (await sql<{ id: number }>("select t.id from teardowns t join devices d on d.id = t.device_id where d.model = 'HandGlow Duo 10'"))[0]!.id;
    const original = (await eng.get(`/api/teardowns/${from}/parts`).expect(200)).body.parts;
    const csv = (await eng.get(`/api/teardowns/${from}/parts.csv`).expect(200)).text;
    const to = await newTeardown();
    const res = await eng.post(`/api/teardowns/${to}/parts/import`, { csv }).expect(200);
    expect(res.body.imported).toBe(original.length);
    expect(res.body.warnings.join(' ')).toMatch(/Decoded values are worked out again/);
    const copied = (await eng.get(`/api/teardowns/${to}/parts`).expect(200)).body.parts;
    const strip = ({ id: _i, teardownId: _t, updatedAt: _u, position: _p, ...rest }: Record<string, unknown>) => rest;
    expect(copied.map(strip)).toEqual(original.map(strip));
  });

  it('round-trips text that starts like a formula', async () => {
    const from = await newTeardown();
    await eng.post(`/api/teardowns/${from}/parts`, part({ description: '=2+3', notes: '-40 °C rated', makerPartNumber: '+QZ1' })).expect(201);
    const csv = (await eng.get(`/api/teardowns/${from}/parts.csv`).expect(200)).text;
    const to = await newTeardown();
    await eng.post(`/api/teardowns/${to}/parts/import`, { csv }).expect(200);
    const [p] = (await eng.get(`/api/teardowns/${to}/parts`)).body.parts;
    expect(p).toMatchObject({ description: '=2+3', notes: '-40 °C rated', makerPartNumber: '+QZ1' });
  });
});

describe('power system: units stored in SI with the typed text kept', () => {
  it('records the pack from typed quantities, replaces it, reads it back and removes it', async () => {
    const id = await newTeardown();
    const res = await eng
      .put(`/api/teardowns/${id}/pack`, {
        chemistry: 'li-ion',
        cellFormat: '18650',
        nominalVolts: '3.65V',
        maxVolts: '4.2 V',
        capacityAh: '2700 mAh',
        measuredCapacityAh: '2.62 Ah',
        series: 1,
        parallel: '2',
        massKg: '46 g',
        protection: true,
        joining: 'welded-tab',
      })
      .expect(200);
    const p = res.body.pack;
    // SI prefixes: m = 10⁻³ (BIPM SI Brochure, 9th ed., Table 7) [S]
    expect(p).toMatchObject({ chemistry: 'li-ion', nominalVolts: 3.65, maxVolts: 4.2, series: 1, parallel: 2, protection: true, joining: 'welded-tab', lithium: true });
    expect(p.capacityAh).toBeCloseTo(2.7, 12);
    expect(p.measuredCapacityAh).toBeCloseTo(2.62, 12);
    expect(p.massKg).toBeCloseTo(0.046, 12);
    expect(p.entered).toEqual({ nominalVolts: '3.65V', maxVolts: '4.2 V', capacityAh: '2700 mAh', measuredCapacityAh: '2.62 Ah', parallel: '2', massKg: '46 g' });

    const again = await eng.put(`/api/teardowns/${id}/pack`, { chemistry: 'nimh', nominalVolts: 1.2, capacityAh: '2000mAh', series: 3 }).expect(200);
    expect(again.body.pack).toMatchObject({ id: p.id, chemistry: 'nimh', nominalVolts: 1.2, series: 3, parallel: 1, massKg: null, lithium: false, entered: { capacityAh: '2000mAh' } });
    expect((await eng.get(`/api/teardowns/${id}/pack`).expect(200)).body.pack.capacityAh).toBeCloseTo(2, 12);

    await eng.delete(`/api/teardowns/${id}/pack`).expect(204);
    expect((await eng.get(`/api/teardowns/${id}/pack`).expect(200)).body.pack).toBeNull();
    await eng.delete(`/api/teardowns/${id}/pack`).expect(404);
    expect((await auditFor(id)).map((a) => a.action)).toEqual(['pack.created', 'pack.updated', 'pack.deleted']);
  });

  it('POST /cells (the published contract) records the pack with SI numbers', async () => {
    const id = await newTeardown();
    const res = await eng.post(`/api/teardowns/${id}/cells`, { chemistry: 'li-ion', nominalVolts: 3.7, maxVolts: 4.2, capacityAh: 2.7, series: 1, parallel: 1, massKg: 0.046 }).expect(201);
    expect(res.body.pack).toMatchObject({ nominalVolts: 3.7, capacityAh: 2.7, massKg: 0.046, entered: {} });
  });

  it.each([
    ['a unit of the wrong kind', { nominalVolts: '3.7 A' }, 'nominalVolts', /voltage/],
    ['nonsense', { capacityAh: 'lots' }, 'capacityAh', /capacity/],
    ['a plain number far too large for Ah', { capacityAh: 2700 }, 'capacityAh', /mAh/],
    ['a negative mass', { massKg: '-4 g' }, 'massKg', /more than 0/],
    ['a fractional series count', { series: 1.5 }, 'series', /whole number/],
    ['zero in parallel', { parallel: 0 }, 'parallel', /at least 1/],
    ['a charge voltage below nominal', { maxVolts: '3.0 V' }, 'maxVolts', /below the nominal/],
    ['an unknown chemistry', { chemistry: 'unobtainium' }, 'chemistry', /Choose one of/],
    ['a missing capacity', { capacityAh: '' }, 'capacityAh', /Required/],
  ])('refuses %s, naming the field', async (_n, over, field, message) => {
    const id = await newTeardown();
    const res = await eng.put(`/api/teardowns/${id}/pack`, { chemistry: 'li-ion', nominalVolts: '3.7 V', capacityAh: '2700 mAh', ...over }).expect(400);
    expect(res.body.error.fields[field]).toMatch(message);
    expect((await eng.get(`/api/teardowns/${id}/pack`)).body.pack).toBeNull();
  });

  it('reports every bad field at once', async () => {
    const id = await newTeardown();
    const res = await eng.put(`/api/teardowns/${id}/pack`, { chemistry: 'li-ion', nominalVolts: '3.7 Ω', capacityAh: '5 V', massKg: 'heavy' }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['capacityAh', 'massKg', 'nominalVolts']);
  });

  it('converters and loads: create with units, feed a load through a converter, change, remove', async () => {
    const id = await newTeardown();
    const conv = (
      await eng
        .post(`/api/teardowns/${id}/converters`, {
          topology: 'boost',
          role: 'output',
          inputVolts: '3.7V',
          outputVolts: '5 V',
          ratedCurrentAmps: '2.1 A',
          efficiency: '88 %',
          efficiencySource: 'measured',
        })
        .expect(201)
    ).body.converter;
    expect(conv).toMatchObject({ topology: 'boost', role: 'output', inputVolts: 3.7, outputVolts: 5, ratedCurrentAmps: 2.1, efficiencySource: 'measured', label: 'Boost — power-bank output' });
    expect(conv.efficiency).toBeCloseTo(0.88, 12);
    expect(conv.entered).toMatchObject({ efficiency: '88 %', inputVolts: '3.7V' });

    // The published contract: SI numbers, efficiency optional.
    const plain = await eng.post(`/api/teardowns/${id}/converters`, { topology: 'buck-boost', inputVolts: 5, outputVolts: 4.2 }).expect(201);
    expect(plain.body.converter).toMatchObject({ role: 'load', efficiency: null, efficiencySource: 'assumed' });

    const heater = (
      await eng
        .post(`/api/teardowns/${id}/loads`, {
          kind: 'heater',
          resistanceOhms: '3R0',
          supplyVolts: '3.65 V',
          count: 2,
          connection: 'parallel',
          duty: '60 %',
          heatedAreaM2: '27 cm²',
          surfaceMaterial: 'metal',
        })
        .expect(201)
    ).body.load;
    expect(heater).toMatchObject({ kind: 'heater', label: 'Heater element', resistanceOhms: 3, supplyVolts: 3.65, count: 2, connection: 'parallel', converterId: null, surfaceMaterial: 'metal' });
    expect(heater.duty).toBeCloseTo(0.6, 12);
    expect(heater.heatedAreaM2).toBeCloseTo(0.0027, 12);
    expect(heater.entered).toEqual({ resistanceOhms: '3R0', supplyVolts: '3.65 V', duty: '60 %', heatedAreaM2: '27 cm²' });

    // The published contract: SI numbers.
    const usb = (await eng.post(`/api/teardowns/${id}/loads`, { kind: 'usb-output', currentAmps: 1, count: 1, connection: 'parallel', converterId: conv.id }).expect(201)).body.load;
    expect(usb).toMatchObject({ currentAmps: 1, converterId: conv.id, duty: 1 });

    const changed = await eng.patch(`/api/teardowns/${id}/loads/${heater.id}`, { resistanceOhms: '2.9 Ω', duty: 1 }).expect(200);
    expect(changed.body.load).toMatchObject({ resistanceOhms: 2.9, duty: 1, entered: { resistanceOhms: '2.9 Ω', supplyVolts: '3.65 V', heatedAreaM2: '27 cm²' } });
    // A bare number typed as text is read in the unit of the field's example (88 %): "90" is 90 %.
    const conv2 = await eng.patch(`/api/teardowns/${id}/converters/${conv.id}`, { efficiency: '90' }).expect(200);
    expect(conv2.body.converter.efficiency).toBeCloseTo(0.9, 12);

    const power = (await eng.get(`/api/teardowns/${id}/power`).expect(200)).body;
    expect(power.loads).toHaveLength(2);
    expect(power.converters).toHaveLength(2);
    expect((await eng.get(`/api/teardowns/${id}/loads`).expect(200)).body.loads).toHaveLength(2);
    expect((await eng.get(`/api/teardowns/${id}/converters`).expect(200)).body.converters).toHaveLength(2);

    await eng.delete(`/api/teardowns/${id}/converters/${conv.id}`).expect(204);
    const usbAfter = (await eng.get(`/api/teardowns/${id}/loads`)).body.loads.find((l: { id: number }) => l.id === usb.id);
    expect(usbAfter.converterId).toBeNull();
    await eng.delete(`/api/teardowns/${id}/loads/${usb.id}`).expect(204);
    await eng.delete(`/api/teardowns/${id}/loads/${usb.id}`).expect(404);
    const actions = (await auditFor(id)).map((a) => a.action);
    expect(actions).toEqual(['converter.created', 'converter.created', 'load.created', 'load.created', 'load.updated', 'converter.updated', 'converter.deleted', 'load.deleted']);
  });

  it.each([
    ['no resistance, current or power', { kind: 'heater' }, 'resistanceOhms', /resistance, the current or the power/],
    ['a voltage typed as a resistance', { kind: 'heater', resistanceOhms: '3 V' }, 'resistanceOhms', /resistance/],
    ['a duty above 100 %', { kind: 'motor', currentAmps: '0.3 A', duty: '120 %' }, 'duty', /^Duty: at most 100 %$/],
    ['a negative count', { kind: 'led', currentAmps: '20 mA', count: -1 }, 'count', /at least 1/],
    ['an unknown kind', { kind: 'toaster', powerWatts: 5 }, 'kind', /Choose one of/],
    ['a series/parallel typo', { kind: 'heater', resistanceOhms: 3, connection: 'paralel' }, 'connection', /Choose one of/],
  ])('loads: refuses %s, naming the field', async (_n, body, field, message) => {
    const id = await newTeardown();
    const res = await eng.post(`/api/teardowns/${id}/loads`, body).expect(400);
    expect(res.body.error.fields[field]).toMatch(message);
    expect((await eng.get(`/api/teardowns/${id}/loads`)).body.loads).toEqual([]);
  });

  it('loads: refuses a converter of another teardown', async () => {
    const a = await newTeardown();
    const b = await newTeardown();
    const conv = (await eng.post(`/api/teardowns/${a}/converters`, { topology: 'boost', inputVolts: 3.7, outputVolts: 5 }).expect(201)).body.converter;
    const res = await eng.post(`/api/teardowns/${b}/loads`, { kind: 'usb-output', currentAmps: 1, converterId: conv.id }).expect(400);
    expect(res.body.error.fields.converterId).toMatch(/this teardown/);
    await eng.patch(`/api/teardowns/${b}/converters/${conv.id}`, { efficiency: 0.9 }).expect(404);
  });

  it.each([
    ['an efficiency above 100 %', { efficiency: '105 %' }, 'efficiency', /^Efficiency: at most 100 %$/],
    ['a current typed as input voltage', { inputVolts: '5 A' }, 'inputVolts', /voltage/],
    ['a missing output voltage', { outputVolts: undefined }, 'outputVolts', /Required/],
    ['an unknown topology', { topology: 'flyback' }, 'topology', /Choose one of/],
  ])('converters: refuses %s, naming the field', async (_n, over, field, message) => {
    const id = await newTeardown();
    const res = await eng.post(`/api/teardowns/${id}/converters`, { topology: 'buck', inputVolts: '5 V', outputVolts: '3.3 V', ...over }).expect(400);
    expect(res.body.error.fields[field]).toMatch(message);
  });
});

describe('measurements', () => {
  it('records a reading typed with its unit, lists, corrects and removes it', async () => {
    const id = await newTeardown();
    const res = await eng
      .post(`/api/teardowns/${id}/measurements`, { quantity: 'resistance', value: '3.02 Ω', subject: 'Heater element, front', conditions: '23 °C', instrument: 'Bench DMM', uncertainty: '±0.2 %' })
      .expect(201);
    const m = res.body.measurement;
    expect(m).toMatchObject({ quantity: 'resistance', value: 3.02, unit: 'Ω', entered: '3.02 Ω', subject: 'Heater element, front', takenBy: { name: expect.any(String) } });

    const milli = await eng.post(`/api/teardowns/${id}/measurements`, { quantity: 'current', value: '350 mA', subject: 'Motor' }).expect(201);
    expect(milli.body.measurement.value).toBeCloseTo(0.35, 12);
    const other = await eng.post(`/api/teardowns/${id}/measurements`, { quantity: 'other', value: '1200 rpm', subject: 'Fan speed' }).expect(201);
    expect(other.body.measurement).toMatchObject({ value: 1200, unit: 'rpm' });

    const list = (await eng.get(`/api/teardowns/${id}/measurements`).expect(200)).body.measurements;
    expect(list).toHaveLength(3);

    const fixed = await eng.patch(`/api/measurements/${m.id}`, { value: '2.98 Ω' }).expect(200);
    expect(fixed.body.measurement).toMatchObject({ value: 2.98, entered: '2.98 Ω', subject: 'Heater element, front' });
    const requantified = await eng.patch(`/api/measurements/${m.id}`, { quantity: 'voltage' }).expect(400);
    expect(requantified.body.error.fields.value).toMatch(/voltage/);

    await eng.delete(`/api/measurements/${m.id}`).expect(204);
    await eng.delete(`/api/measurements/${m.id}`).expect(404);
    expect((await auditFor(id)).map((a) => a.action)).toEqual(['measurement.created', 'measurement.created', 'measurement.created', 'measurement.updated', 'measurement.deleted']);
  });

  it.each([
    ['a voltage typed for a current', { quantity: 'current', value: '3.7 V' }, 'value', /current/],
    ['nonsense', { quantity: 'resistance', value: 'about three' }, 'value', /resistance/],
    ['an unknown quantity', { quantity: 'vibes', value: '3' }, 'quantity', /Choose a quantity/],
    ['no subject', { quantity: 'voltage', value: '3 V', subject: '' }, 'subject', /what was measured/],
    ['no value', { quantity: 'voltage', value: '' }, 'value', /Required/],
  ])('refuses %s, naming the field', async (_n, over, field, message) => {
    const id = await newTeardown();
    const res = await eng.post(`/api/teardowns/${id}/measurements`, { subject: 'Cell', ...over }).expect(400);
    expect(res.body.error.fields[field]).toMatch(message);
    expect((await eng.get(`/api/teardowns/${id}/measurements`)).body.measurements).toEqual([]);
  });

  it('exports CSV that opens cleanly in a spreadsheet', async () => {
    const id = await newTeardown();
    await eng.post(`/api/teardowns/${id}/measurements`, { quantity: 'voltage', value: '-0.35 V', subject: '=cmd|calc', instrument: '@meter' }).expect(201);
    const res = await eng.get(`/api/teardowns/${id}/measurements.csv`).expect(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.text.charCodeAt(0)).toBe(0xfeff);
    const lines = res.text.slice(1).split('\r\n');
    expect(lines[0]).toMatch(/^"Quantity","Value","Unit","As entered","What was measured"/);
    expect(lines[1]).toContain('"Voltage","-0.35","V"');
    expect(lines[1]).toContain(`"'-0.35 V"`);
    expect(lines[1]).toContain(`"'=cmd|calc"`);
    expect(lines[1]).toContain(`"'@meter"`);
  });
});

describe('demo seed: parts, power systems and readings for every teardown', () => {
  it('gives every demo teardown 10–30 part lines, a pack, loads, converters and readings', async () => {
    const rows = await sql<{ id: number; model: string; parts: number; packs: number; loads: number; converters: number; readings: number }>(
      `select t.id, d.model,
        (select count(*) from parts p where p.teardown_id = t.id) as parts,
        (select count(*) from packs k where k.teardown_id = t.id) as packs,
        (select count(*) from loads l where l.teardown_id = t.id) as loads,
        (select count(*) from converters c where c.teardown_id = t.id) as converters,
        (select count(*) from measurements m where m.teardown_id = t.id) as readings
       from teardowns t join devices d on d.id = t.device_id where t.unit_label not like 'Test unit%'`,
    );
    expect(rows).toHaveLength(10);
    for (const r of rows) {
      expect(r.parts, r.model).toBeGreaterThanOrEqual(10);
      expect(r.parts, r.model).toBeLessThanOrEqual(30);
      expect(r.packs, r.model).toBe(1);
      expect(r.loads, r.model).toBeGreaterThan(0);
      expect(r.converters, r.model).toBeGreaterThan(0);
      expect(r.readings, r.model).toBeGreaterThanOrEqual(4);
    }
  });

  it('has no sensor part on the Halvix HandGlow Duo 10, and one on each heater with an NTC', async () => {
    const sensors = await sql<{ model: string; n: number }>(
      `select d.model, (select count(*) from parts p where p.teardown_id = t.id and p.category = 'sensor') as n
       from teardowns t join devices d on d.id = t.device_id where d.category = 'pocket-heater' and t.unit_label not like 'Test unit%'`,
    );
    expect(Object.fromEntries(sensors.map((s) => [s.model, s.n > 0]))).toEqual({ 'HandGlow Duo 10': false, 'Pocketsun S': true, 'HandGlow Pro 2': true });
  });

  it('the Halvix Duo heaters: two 3.0 Ω elements in parallel at 3.65 V, and decoded markings on show', async () => {
    const id = (await sql<{ id: number }>("select t.id from teardowns t join devices d on d.id = t.device_id where d.model = 'HandGlow Duo 10'"))[0]!.id;
    const power = (await eng.get(`/api/teardowns/${id}/power`).expect(200)).body;
    const heater = power.loads.find((l: { kind: string }) => l.kind === 'heater');
    expect(heater).toMatchObject({ resistanceOhms: 3, supplyVolts: 3.65, count: 2, connection: 'parallel', entered: { resistanceOhms: '3R0' } });
    // P = V²/R per element, two in parallel [C]: 2 × 3.65² / 3.0 = 8.8817 W
    expect((2 * heater.supplyVolts ** 2) / heater.resistanceOhms).toBeCloseTo(8.88, 2);
    expect(power.pack).toMatchObject({ chemistry: 'li-ion', capacityAh: 2.7, series: 1, parallel: 1, lithium: true, entered: { capacityAh: '2700 mAh' } });
    const usb = power.loads.find((l: { kind: string }) => l.kind === 'usb-output');
    const output = power.converters.find((c: { role: string }) => c.role === 'output');
    expect(usb.converterId).toBe(output.id);

    const parts = (await eng.get(`/api/teardowns/${id}/parts`).expect(200)).body.parts as { marking: string | null; decodedValue: number | null; makerPartNumber: string | null }[];
    const decoded = Object.fromEntries(parts.filter((p) => p.decodedValue !== null).map((p) => [p.marking, p.decodedValue]));
    expect(decoded['472']).toBeCloseTo(4700, 9);
    expect(decoded['68X']).toBeCloseTo(49.9, 9);
    expect(decoded['104']).toBeCloseTo(1e-7, 18);
    expect(parts.some((p) => p.makerPartNumber === 'HX-BB2103')).toBe(true);
  });
});
