// A part's marking decodes through the same decoder as the bench tools' marking decoder: the same
// readings, in the same order, with the same rule and tolerance (issue 10, defects 2 and 3).
// Values: REFERENCES.md §1; the order is the decoder's ranking rule (DEVELOPERS.md, [CP]).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DecodedReadingDto, MarkingToolResponse, PartDto } from '@splitcase/contracts';
import { makeTestApp, type Agent, type TestApp } from '../support/test-app';

let t: TestApp;
let eng: Agent;
let teardownId: number;

beforeAll(async () => {
  t = await makeTestApp();
  eng = await t.as('engineer');
  const device = (await eng.post('/api/devices', { maker: 'Markwell (invented)', model: 'Decoder 1', category: 'other' }).expect(201)).body.device;
  teardownId = (await eng.post('/api/teardowns', { deviceId: device.id }).expect(201)).body.teardown.id;
});
afterAll(() => t.close());

const addPart = async (designators: string, description: string, marking: string): Promise<PartDto> =>
  (await eng.post(`/api/teardowns/${teardownId}/parts`, { designators, category: 'passive', description, quantity: 1, mount: 'smt', marking }).expect(201)).body.part;

const bench = async (code: string, kind: 'resistor' | 'capacitor'): Promise<MarkingToolResponse> => (await eng.post('/api/tools/marking', { code, kind }).expect(200)).body;

const summary = (
  r: Pick<DecodedReadingDto, 'rank' | 'value' | 'unit' | 'scheme' | 'schemeLabel' | 'schemeShortLabel' | 'rankReason'> & { tolerance: { text: string; letter: string | null } | null },
) => ({
  rank: r.rank,
  value: r.value,
  unit: r.unit,
  scheme: r.scheme,
  schemeLabel: r.schemeLabel,
  schemeShortLabel: r.schemeShortLabel,
  tolerance: r.tolerance ? { letter: r.tolerance.letter, text: r.tolerance.text } : null,
  rankReason: r.rankReason,
});

describe('a part decodes its marking exactly as the bench decoder does', () => {
  it.each([
    // [designators, description, marking, kind, expected readings: [scheme, value, tolerance text]]
    // 4K7 = 4.7 kΩ [S: IEC 60062 letter-and-digit code]; 10K = 10 kΩ [S]
    ['R1', 'Chip resistor', '4K7', 'resistor', [['letter-and-digit', 4700, null]]],
    ['R2', 'Chip resistor', '10K', 'resistor', [['letter-and-digit', 10000, null]]],
    // 10R = 10 Ω R-notation [S: IEC 60062], then EIA-96 index 10 = 124 × 0.01 = 1.24 Ω [S: EIA-96; C]
    [
      'R3',
      'Chip resistor',
      '10R',
      'resistor',
      [
        ['letter-and-digit', 10, null],
        ['eia-96', 1.24, null],
      ],
    ],
    // 47R = 47 Ω [S], then EIA-96 index 47 = 301 × 0.01 = 3.01 Ω [S; C]
    [
      'R4',
      'Chip resistor',
      '47R',
      'resistor',
      [
        ['letter-and-digit', 47, null],
        ['eia-96', 3.01, null],
      ],
    ],
    // 102K = 1 kΩ ±10 % (3-digit code, letter K) [S: IEC 60062 letters], then 102 kΩ (letter-and-digit) [S]; order [CP]
    [
      'R5',
      'Chip resistor',
      '102K',
      'resistor',
      [
        ['three-digit', 1000, '±10 %'],
        ['letter-and-digit', 102000, null],
      ],
    ],
    // 104P = 100 nF +100/−0 % [S: IEC 60062 capacitor P], then 104 pF; 104N = 100 nF ±30 % [S: N], then 104 nF
    [
      'C1',
      'Ceramic capacitor',
      '104P',
      'capacitor',
      [
        ['three-digit', 1e-7, '+100 / −0 %'],
        ['letter-decimal', 104e-12, null],
      ],
    ],
    [
      'C2',
      'Ceramic capacitor',
      '104N',
      'capacitor',
      [
        ['three-digit', 1e-7, '±30 %'],
        ['letter-decimal', 104e-9, null],
      ],
    ],
  ] as const)('%s %s marked "%s"', async (designators, description, marking, kind, expected) => {
    const part = await addPart(designators, description, marking);
    const tool = await bench(marking, kind);

    // The first reading is the part's decoded value.
    expect(part.decodedUnit).toBe(kind === 'resistor' ? 'Ω' : 'F');
    expect(part.decodedValue! / expected[0]![1]).toBeCloseTo(1, 12);
    expect(part.decodeNote).toBeNull();
    expect(part.decodedReadings.map((r) => [r.scheme, r.tolerance?.text ?? null])).toEqual(expected.map(([scheme, , tol]) => [scheme, tol]));
    part.decodedReadings.forEach((r, i) => expect(r.value / expected[i]![1]).toBeCloseTo(1, 12));
    expect(part.decodedValue).toBe(part.decodedReadings[0]!.value);

    // Same readings, same order, same rule and tolerance as the bench tools.
    expect(part.decodedReadings.map(summary)).toEqual(tool.readings.map((r) => summary({ ...r, unit: r.unit as 'Ω' | 'F' })));
    expect(tool.ambiguous).toBe(expected.length > 1);

    // The list and a change of the line give the same readings.
    const listed = ((await eng.get(`/api/teardowns/${teardownId}/parts`).expect(200)).body.parts as PartDto[]).find((p) => p.id === part.id)!;
    expect(listed.decodedReadings).toEqual(part.decodedReadings);
    const changed = (await eng.patch(`/api/parts/${part.id}`, { notes: 'checked' }).expect(200)).body.part as PartDto;
    expect(changed.decodedReadings).toEqual(part.decodedReadings);
  });

  it('a marking neither decoder reads gives the bench decoder’s message on the part, and no readings', async () => {
    const part = await addPart('R20', 'Chip resistor', 'K7Q');
    expect(part).toMatchObject({ decodedValue: null, decodedUnit: null, decodedReadings: [] });
    const tool = await eng.post('/api/tools/marking', { code: 'K7Q', kind: 'resistor' }).expect(422);
    expect(part.decodeNote).toContain(tool.body.error.message);
  });

  it('the CSV preview and the export use the same first reading', async () => {
    const preview = await eng
      .post(`/api/teardowns/${teardownId}/parts/import?dryRun=1`, { csv: 'Designators,Category,Description,Marking\nR30,passive,Chip resistor,10R\nC30,passive,Ceramic capacitor,104N\n' })
      .expect(200);
    const [r, c] = preview.body.rows;
    expect(r.part).toMatchObject({ decodedValue: 10, decodedUnit: 'Ω' });
    expect(r.part.decodedReadings.map((x: DecodedReadingDto) => x.scheme)).toEqual(['letter-and-digit', 'eia-96']);
    expect(c.part.decodedValue).toBe(1e-7);
    expect(c.part.decodedReadings[0].tolerance.text).toBe('±30 %');

    const csv = (await eng.get(`/api/teardowns/${teardownId}/parts.csv`).expect(200)).text;
    const line = csv.split(/\r?\n/).find((l) => l.includes('"R3"'));
    // 10R: 10 Ω first [S: IEC 60062]
    expect(line).toMatch(/"10R","10","Ω"/);
  });
});
