// Bench tools API: each route against the reference values of REFERENCES.md (label beside each
// check), typed unit inputs, 400s naming the field, 422 for what the calculation refuses, 401 anonymous.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES } from '@splitcase/contracts';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let eng: Agent;
beforeAll(async () => {
  t = await makeTestApp();
  eng = await t.as('engineer');
});
afterAll(() => t.close());

interface Figure {
  key: string;
  label: string;
  value: number | string;
  unit: string;
  formula: string;
  source: string;
  inputs: { label: string; value: unknown; unit?: string }[];
  assumptions: string[];
  warnings: string[];
}
const figure = (body: { figures: Figure[] }, key: string): Figure => {
  const f = body.figures.find((x) => x.key === key);
  if (!f) throw new Error(`no figure "${key}" in ${body.figures.map((x) => x.key).join(', ')}`);
  return f;
};

describe('POST /api/tools/marking', () => {
  it.each([
    ['472', 'resistor', 4700, 'Ω', 'S'],
    ['100', 'resistor', 10, 'Ω', 'S'],
    ['4R7', 'resistor', 4.7, 'Ω', 'S'],
    ['R010', 'resistor', 0.01, 'Ω', 'C'],
    ['4991', 'resistor', 4990, 'Ω', 'S'],
    ['68X', 'resistor', 49.9, 'Ω', 'S'],
    ['39D', 'resistor', 249000, 'Ω', 'S'],
    ['01C', 'resistor', 10000, 'Ω', 'C'],
    ['104', 'capacitor', 1e-7, 'F', 'S'],
    ['473', 'capacitor', 4.7e-8, 'F', 'S'],
    ['4R7', 'capacitor', 4.7e-12, 'F', 'S'],
  ])('%s as a %s is %d %s [%s]', async (code, kind, value, unit) => {
    const res = await eng.post('/api/tools/marking', { code, kind }).expect(200);
    expect(res.body.readings).toHaveLength(1);
    const r = res.body.readings[0];
    expect(r.value / value).toBeCloseTo(1, 12);
    expect(r.unit).toBe(unit);
    expect(r.formula.length).toBeGreaterThan(0);
    expect(r.source).toMatch(/\[(S|C|M|CP)/);
    expect(r.meaning.length).toBeGreaterThan(0);
  });

  it('472 → 4.7 kΩ with its meaning and the E24 member 4.7 kΩ [S]; nearest preferred values by the log rule [C]', async () => {
    const r = (await eng.post('/api/tools/marking', { code: '472', kind: 'resistor' }).expect(200)).body.readings[0];
    expect(r.schemeLabel).toBe('3-digit code');
    expect(r.meaning.join(' ')).toMatch(/47 × 100 = 4\.7 kΩ/);
    expect(r.preferred.map((p: { series: string }) => p.series)).toEqual(['E6', 'E12', 'E24', 'E48', 'E96', 'E192']);
    expect(r.preferred.find((p: { series: string }) => p.series === 'E24')).toMatchObject({ nearest: 4700, member: true });
    // 4 700 is not in E96: its nearest E96 members are 4 640 and 4 750; √(4640·4750) = 4694.7 < 4700 → 4 750 [C]
    expect(r.preferred.find((p: { series: string }) => p.series === 'E96')).toMatchObject({ nearest: 4750, member: false });
  });

  it('68X → 49.9 Ω, the E96 index 68 times X = × 0.1 [S]', async () => {
    const r = (await eng.post('/api/tools/marking', { code: '68X', kind: 'auto' }).expect(200)).body;
    expect(r.ambiguous).toBe(false);
    expect(r.readings[0].value).toBeCloseTo(49.9, 12);
    expect(r.readings[0].meaning).toContain('"X" is the multiplier × 0.1.');
  });

  it('104K → 100 nF ±10 % (IEC 60062 letter K) with its range [S; C]', async () => {
    const r = (await eng.post('/api/tools/marking', { code: '104K', kind: 'capacitor' }).expect(200)).body.readings[0];
    expect(r.value).toBe(1e-7);
    expect(r.tolerance).toMatchObject({ letter: 'K', text: '±10 %', kind: 'percent' });
    expect(r.range.low).toBeCloseTo(9e-8, 20);
    expect(r.range.high).toBeCloseTo(1.1e-7, 20);
  });

  it('"4R7" with kind auto reads as 4.7 Ω and 4.7 pF, and says the part tells which [S]', async () => {
    const r = (await eng.post('/api/tools/marking', { code: '4R7' }).expect(200)).body;
    expect(r.ambiguous).toBe(true);
    expect(r.readings.map((x: { component: string }) => x.component)).toEqual(['resistor', 'capacitor']);
    expect(r.note).toMatch(/part itself tells which/);
  });

  it('yellow-violet-red-gold → 4.7 kΩ ±5 %, 4 465–4 935 Ω [C]', async () => {
    const r = (await eng.post('/api/tools/marking', { bands: ['yellow', 'violet', 'red', 'gold'] }).expect(200)).body.readings[0];
    expect(r).toMatchObject({ value: 4700, unit: 'Ω', scheme: 'colour-bands', tolerance: { letter: 'J', text: '±5 %' } });
    expect(r.range.low).toBeCloseTo(4465, 9);
    expect(r.range.high).toBeCloseTo(4935, 9);
  });

  it.each([
    [['brown', 'black', 'black', 'red', 'brown'], 10000, 1, 'C'],
    [['green', 'blue', 'gold', 'gold'], 5.6, 5, 'C'],
    [['orange', 'orange', 'silver', 'silver'], 0.33, 10, 'C'],
    [['Brown', 'black', 'orange'], 10000, 20, 'C'],
    [['brown', 'black', 'black', 'red', 'brown', 'red'], 10000, 1, 'C; M tempco'],
  ])('%j → %d Ω ±%d % [%s]', async (bands, ohms, tol) => {
    const r = (await eng.post('/api/tools/marking', { bands }).expect(200)).body.readings[0];
    expect(r.value / ohms).toBeCloseTo(1, 12);
    expect(r.tolerance.plus).toBe(tol);
  });

  it('400 naming the field: no code, both code and bands, unknown colour, two bands, bad kind', async () => {
    const cases: [unknown, string][] = [
      [{}, 'code'],
      [{ code: '  ' }, 'code'],
      [{ code: '472', bands: ['red', 'red', 'red'] }, 'bands'],
      [{ bands: ['red', 'purple', 'red', 'gold'] }, 'bands.1'],
      [{ bands: ['red', 'red'] }, 'bands'],
      [{ code: '472', kind: 'inductor' }, 'kind'],
      [{ code: '1234567890123' }, 'code'],
    ];
    for (const [body, field] of cases) {
      const res = await eng.post('/api/tools/marking', body).expect(400);
      expect(res.body.error.code).toBe('validation_failed');
      expect(Object.keys(res.body.error.fields), JSON.stringify(body)).toContain(field);
    }
  });

  it('422 with the calculation’s message for codes it cannot read', async () => {
    let res = await eng.post('/api/tools/marking', { code: '97A', kind: 'resistor' }).expect(422);
    expect(res.body.error).toMatchObject({ code: 'unprocessable', message: expect.stringMatching(/EIA-96 code needs an index from 01 to 96/) });
    res = await eng.post('/api/tools/marking', { code: 'XYZ', kind: 'auto' }).expect(422);
    expect(res.body.error.message).toMatch(/neither a resistor code nor a capacitor code/);
    res = await eng.post('/api/tools/marking', { code: '107', kind: 'capacitor' }).expect(422);
    expect(res.body.error.message).toMatch(/last digit of 7/);
    res = await eng.post('/api/tools/marking', { bands: ['red', 'red', 'red', 'black'] }).expect(422);
    expect(res.body.error.message).toMatch(/Band 4 \(tolerance\)/);
  });
});

describe('POST /api/tools/heater-trace', () => {
  it('a 100 mm × 0.254 mm × 35 µm trace is 0.19394 Ω IACS at 20 °C [C], with the CRC note, formula and source', async () => {
    const res = await eng.post('/api/tools/heater-trace', { length: '100 mm', width: '0.254 mm', thickness: '35 µm', layer: 'external' }).expect(200);
    const r = figure(res.body, 'resistance');
    expect(r.value as number).toBeCloseTo(0.19394, 5);
    expect(r.unit).toBe('Ω');
    expect(r.formula).toBe('R = ρ·L / (w·t) · [1 + α·(T − 20 °C)]');
    expect(r.source).toMatch(/IEC 60028/);
    expect(r.assumptions.join(' ')).toMatch(/1\.678 × 10⁻⁸ Ω·m \[M\], would give 188\.8 mΩ/);
    expect(res.body.parsed).toEqual({
      length: { entered: '100 mm', value: 0.1, unit: 'm' },
      width: { entered: '0.254 mm', value: 0.000254, unit: 'm' },
      thickness: { entered: '35 µm', value: 0.000035, unit: 'm' },
    });
  });

  it('the same trace at 60 °C is 0.22443 Ω IACS [C]', async () => {
    const res = await eng.post('/api/tools/heater-trace', { length: 0.1, width: '10 mil', thickness: '1 oz', temperature: '60 °C', layer: 'external' }).expect(200);
    expect(figure(res.body, 'resistance').value as number).toBeCloseTo(0.22443, 4);
  });

  it('1 oz, 10 mil, external, ΔT 10 °C carries 0.8855 A; internal 0.4428 A [S: IPC-2221 fit; C]', async () => {
    const ext = await eng.post('/api/tools/heater-trace', { length: '100 mm', width: '10 mil', thickness: '1 oz', temperatureRise: '10 °C', layer: 'external' }).expect(200);
    expect(figure(ext.body, 'maxCurrent').value as number).toBeCloseTo(0.8855, 4);
    expect(figure(ext.body, 'maxCurrent').source).toMatch(/IPC-2221/);
    expect(ext.body.parsed.thickness).toEqual({ entered: '1 oz', value: 0.000035, unit: 'm' });
    const int = await eng.post('/api/tools/heater-trace', { length: '100 mm', width: '10 mil', thickness: '1 oz', temperatureRise: '10 K', layer: 'internal' }).expect(200);
    expect(figure(int.body, 'maxCurrent').value as number).toBeCloseTo(0.4428, 4);
  });

  it('1 A at ΔT 10 °C on 1 oz external needs 11.826 mil = 0.3004 mm [C]', async () => {
    const res = await eng.post('/api/tools/heater-trace', { length: '100 mm', width: '0.3 mm', thickness: '35 µm', current: '1 A', layer: 'external' }).expect(200);
    expect((figure(res.body, 'minWidth').value as number) * 1e3).toBeCloseTo(0.3004, 4);
    expect(figure(res.body, 'maxCurrent').assumptions.join(' ')).toMatch(/Allowed rise 10 °C assumed/);
  });

  it('a 3R0 heater element path at 3.65 V: 4.440833 W and 1.216667 A [C], above its IPC-2221 rating, power density and hot-surface warning', async () => {
    // 1.546894 m of 10 mil, 1 oz copper is 3.000 Ω at 20 °C (L = R·w·t / ρ).
    const lengthM = (3 * 0.254e-3 * 35e-6) / 1.7241e-8;
    const res = await eng.post('/api/tools/heater-trace', { length: lengthM, width: '10 mil', thickness: '1 oz', supplyVoltage: '3.65 V', layer: 'external', area: '24 cm²' }).expect(200);
    expect(figure(res.body, 'resistance').value as number).toBeCloseTo(3, 9);
    expect(figure(res.body, 'current').value as number).toBeCloseTo(1.216667, 6);
    expect(figure(res.body, 'power').value as number).toBeCloseTo(4.440833, 6);
    expect(figure(res.body, 'maxCurrent').warnings.join(' ')).toMatch(/is above the 885\.5 mA this trace carries/);
    expect(figure(res.body, 'powerDensity')).toMatchObject({ unit: 'W/cm²' });
    expect(figure(res.body, 'powerDensity').value as number).toBeCloseTo(4.440833 / 24, 6);
    expect(figure(res.body, 'surfaceRise').warnings[0]).toMatch(/burn threshold/);
    expect(res.body.warnings.length).toBeGreaterThanOrEqual(2);
  });

  it('warns outside the IPC-2221 fit range [M]', async () => {
    const res = await eng.post('/api/tools/heater-trace', { length: '50 mm', width: '12 mm', thickness: '2 oz', temperatureRise: '5 °C', layer: 'external' }).expect(200);
    expect(figure(res.body, 'maxCurrent').warnings.join(' ')).toMatch(/above the 400 mil.*outside the 10–100 °C/);
  });

  it('400 naming each wrong field, with what did parse in details', async () => {
    const res = await eng.post('/api/tools/heater-trace', { length: '100 V', width: '-1 mm', thickness: '1 lb', temperatureRise: 'warm', area: '0 cm²', layer: 'external' }).expect(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.fields).toEqual({
      length: expect.stringMatching(/length/),
      width: 'Trace width: must be greater than zero',
      thickness: expect.stringMatching(/^Copper thickness: enter a copper thickness such as "35 µm" or a copper weight such as "1 oz"/),
      temperatureRise: expect.stringMatching(/^Allowed rise \(IPC-2221\): enter a temperature rise/),
      area: 'Heated area: must be greater than zero',
    });
    expect(res.body.error.details.parsed.width).toEqual({ entered: '-1 mm', value: -0.001, unit: 'm' });
  });

  it('400 for missing fields and a bad layer', async () => {
    const res = await eng.post('/api/tools/heater-trace', { width: '10 mil', layer: 'middle' }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['layer', 'length', 'thickness']);
    expect(res.body.error.fields.length).toBe('Required');
  });

  it('422 when the temperature is outside the linear copper model [C]', async () => {
    const res = await eng.post('/api/tools/heater-trace', { length: '100 mm', width: '10 mil', thickness: '1 oz', temperature: '-250 °C', layer: 'external' }).expect(422);
    expect(res.body.error).toMatchObject({ code: 'unprocessable', message: expect.stringMatching(/linear copper model/) });
  });
});

describe('POST /api/tools/runtime', () => {
  it('a 2.7 Ah 3.7 V cell at 9 W lasts 1.11 h [CP], pack 9.99 Wh [C], typed "2700 mAh"', async () => {
    const res = await eng.post('/api/tools/runtime', { cellNominalVoltage: '3.7 V', cellCapacity: '2700 mAh', loadPower: '9 W' }).expect(200);
    expect(figure(res.body, 'packEnergy').value as number).toBeCloseTo(9.99, 9);
    const rt = figure(res.body, 'runtime');
    expect(rt.value as number).toBeCloseTo(1.11, 9);
    expect(rt).toMatchObject({ unit: 'h', formula: expect.stringMatching(/E · η · u \/ P/), source: expect.stringMatching(/\[C\]/) });
    expect(rt.assumptions.join(' ')).toMatch(/Efficiency 1 assumed/);
    expect(figure(res.body, 'cRate').value as number).toBeCloseTo(0.900901, 6);
    expect(figure(res.body, 'transportClass').value).toBe('up-to-100-wh');
    expect(res.body.parsed.cellCapacity).toEqual({ entered: '2700 mAh', value: 2.7, unit: 'Ah' });
  });

  it('two 3R0 elements in parallel (1R5) across the cell at 3.65 V: 8.881667 W, 1.124789 h, 0.901235 C [C]', async () => {
    const res = await eng.post('/api/tools/runtime', { cellNominalVoltage: '3.7 V', cellCapacity: '2.7 Ah', loadResistance: '1R5', supplyVoltage: '3.65 V' }).expect(200);
    expect(figure(res.body, 'loadPower').value as number).toBeCloseTo(8.881667, 6);
    expect(figure(res.body, 'runtime').value as number).toBeCloseTo(1.124789, 5);
    expect(figure(res.body, 'cRate').value as number).toBeCloseTo(0.901235, 5);
    expect(res.body.parsed.loadResistance).toEqual({ entered: '1R5', value: 1.5, unit: 'Ω' });
  });

  it('one 3R0 element at 3.65 V with PWM at 60 %: 2.664500 W average [C]', async () => {
    const res = await eng.post('/api/tools/runtime', { cellNominalVoltage: '3.7 V', cellCapacity: '2700 mAh', loadResistance: '3R0', supplyVoltage: '3.65 V', duty: '60 %' }).expect(200);
    expect(figure(res.body, 'averagePower').value as number).toBeCloseTo(2.6645, 6);
    expect(figure(res.body, 'runtime').value as number).toBeCloseTo(9.99 / 2.6645, 5);
  });

  it('a power bank: 10 000 mAh at 3.7 V, η 85 %, 5 V × 1 A USB = 5 W [CP] lasts 6.29 h [C]', async () => {
    const res = await eng.post('/api/tools/runtime', { cellNominalVoltage: 3.7, cellCapacity: '10000 mAh', loadResistance: '5 Ω', supplyVoltage: '5 V', efficiency: '85 %' }).expect(200);
    expect(figure(res.body, 'runtime').value as number).toBeCloseTo(6.29, 9);
  });

  it('a current drawn from the pack: 350 mA from 2.7 Ah is 7.714 h and 0.1296 C [C]', async () => {
    const res = await eng.post('/api/tools/runtime', { cellNominalVoltage: '3.7 V', cellCapacity: '2700 mAh', loadCurrent: '350 mA' }).expect(200);
    expect(figure(res.body, 'runtime').value as number).toBeCloseTo(2.7 / 0.35, 9);
    expect(figure(res.body, 'cRate').value as number).toBeCloseTo(0.35 / 2.7, 9);
  });

  it('14.4 V × 7 Ah (4S of 3.6 V) is 100.8 Wh: airline approval needed [S: IATA; C]', async () => {
    const res = await eng.post('/api/tools/runtime', { cellNominalVoltage: '3.6 V', cellCapacity: '7 Ah', series: 4, loadPower: '20 W' }).expect(200);
    expect(figure(res.body, 'packEnergy').value as number).toBeCloseTo(100.8, 9);
    expect(figure(res.body, 'transportClass')).toMatchObject({ value: '100-to-160-wh', warnings: [expect.stringMatching(/airline approval/)] });
  });

  it('with a cell mass: 3.6 V 3.35 Ah 48.5 g is 248.66 Wh/kg, plausible [C]; 9 900 mAh on 45 g is implausible [CP]', async () => {
    const ok = await eng.post('/api/tools/runtime', { cellNominalVoltage: '3.6 V', cellCapacity: '3350 mAh', cellMass: '48.5 g', loadPower: '5 W' }).expect(200);
    expect(figure(ok.body, 'specificEnergy').value as number).toBeCloseTo(248.66, 2);
    expect(figure(ok.body, 'plausibility').value).toBe('plausible');
    const bad = await eng.post('/api/tools/runtime', { cellNominalVoltage: '3.7 V', cellCapacity: '9900 mAh', cellMass: '45 g', loadPower: '5 W', chemistry: 'li-ion' }).expect(200);
    expect(figure(bad.body, 'plausibility')).toMatchObject({ value: 'implausible', warnings: [expect.stringMatching(/above the 300 Wh\/kg/)] });
  });

  it('400 naming each wrong field: units of the wrong kind, fractions above 1, counts below 1', async () => {
    const res = await eng
      .post('/api/tools/runtime', { cellNominalVoltage: '3.7 A', cellCapacity: '2700 mAh', series: 0, loadPower: '9 W', efficiency: '120 %', duty: 'half', cellMass: '-3 g' })
      .expect(400);
    expect(res.body.error.fields).toEqual({
      cellNominalVoltage: expect.stringMatching(/voltage/),
      series: 'Cells in series: enter a whole number of at least 1',
      efficiency: 'Converter efficiency: enter a fraction above 0 % and at most 100 %, such as 90 %',
      duty: expect.stringMatching(/^PWM duty: enter a fraction/),
      cellMass: 'Mass of one cell: must be greater than zero',
    });
    expect(res.body.error.details.parsed.cellCapacity).toEqual({ entered: '2700 mAh', value: 2.7, unit: 'Ah' });
  });

  it('400 for the load: none, several, a resistance without its voltage, a voltage without a resistance', async () => {
    const base = { cellNominalVoltage: '3.7 V', cellCapacity: '2700 mAh' };
    let res = await eng.post('/api/tools/runtime', base).expect(400);
    expect(res.body.error.fields).toEqual({ loadPower: expect.stringMatching(/Give the load power/) });
    res = await eng.post('/api/tools/runtime', { ...base, loadPower: '9 W', loadCurrent: '1 A' }).expect(400);
    expect(res.body.error.fields).toEqual({ loadCurrent: expect.stringMatching(/one load only/) });
    res = await eng.post('/api/tools/runtime', { ...base, loadResistance: '3R0' }).expect(400);
    expect(res.body.error.fields).toEqual({ supplyVoltage: 'Required with a load resistance' });
    res = await eng.post('/api/tools/runtime', { ...base, loadPower: '9 W', supplyVoltage: '5 V' }).expect(400);
    expect(res.body.error.fields).toEqual({ supplyVoltage: 'Only used with a load resistance' });
    res = await eng.post('/api/tools/runtime', { ...base, loadPower: '9 W', chemistry: 'unobtainium' }).expect(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['chemistry']);
  });
});

describe('access', () => {
  it('401 for anonymous callers on every tool route', async () => {
    const anon = await t.anonymous();
    for (const path of ['/api/tools/marking', '/api/tools/heater-trace', '/api/tools/runtime']) {
      const res = await anon.post(path, {}).expect(401);
      expect(res.body.error.code).toBe('unauthenticated');
    }
  });

  it('every role may use the tools (they read nothing of the workspace)', async () => {
    for (const role of ROLES) {
      const a = await t.as(role);
      await a.post('/api/tools/marking', { code: '472', kind: 'resistor' }).expect(200);
    }
  });

  it('the routes are in the OpenAPI document', async () => {
    const doc = (await (await t.anonymous()).get('/api/openapi.json').expect(200)).body;
    for (const path of ['/api/tools/marking', '/api/tools/heater-trace', '/api/tools/runtime']) expect(doc.paths[path]?.post, path).toBeDefined();
    expect(doc.paths['/api/tools/runtime'].post.requestBody.content['application/json'].schema.properties).toHaveProperty('cellCapacity');
  });
});
