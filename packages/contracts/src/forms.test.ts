// The form schemas of the parts editor (also the CSV import's row rules) and the power cards: what a
// form checks before the server reads the quantities, and the bodies they give.
import { describe, expect, it } from 'vitest';
import { createPartBody, partFormSchema } from './parts';
import { converterFormSchema, loadFormSchema, packFormSchema } from './power';

const messages = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) => Object.fromEntries((r.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]));

describe('partFormSchema', () => {
  it('gives a create body: blank text is none, the quantity is read as a whole number, spaces allowed', () => {
    const out = partFormSchema.parse({
      designators: ' R1 ',
      category: 'passive',
      description: 'Chip resistor',
      marking: '',
      makerPartNumber: '',
      package: '0402',
      quantity: '1 000',
      mount: 'smt',
      notes: '',
    });
    expect(out).toEqual({ designators: 'R1', category: 'passive', description: 'Chip resistor', marking: null, makerPartNumber: null, package: '0402', quantity: 1000, mount: 'smt', notes: null });
    expect(createPartBody.parse(out)).toMatchObject(out);
    // A CSV row without a quantity or a mount cell: 1, and the mount left to the category.
    const bare = partFormSchema.parse({ category: 'ic', description: 'MCU' });
    expect(bare.quantity).toBe(1);
    expect(bare.mount).toBeUndefined();
  });

  it('says what is wrong with the value given, with the body rules', () => {
    expect(messages(partFormSchema.safeParse({ category: 'gizmo', description: ' ', quantity: 'two', mount: 'glued' }))).toEqual({
      category: expect.stringMatching(/^Unknown category "gizmo"\. Choose a category: /),
      description: 'Required: describe the part.',
      quantity: '"two" is not a number: enter a whole number of at least 1.',
      mount: 'Unknown mount "glued": choose smt, tht or manual.',
    });
    expect(messages(partFormSchema.safeParse({ category: 'ic', description: 'x', quantity: '-3' }))).toEqual({ quantity: 'At least 1: -3 is below 1 (a line needs at least one part).' });
    expect(messages(partFormSchema.safeParse({ category: 'ic', description: 'x', quantity: '1.5' }))).toEqual({ quantity: '1.5 is not a whole number.' });
    expect(messages(partFormSchema.safeParse({ category: 'ic', description: 'x', quantity: '' }))).toEqual({ quantity: 'Enter a whole number of at least 1' });
    expect(messages(createPartBody.safeParse({ category: 'ic', description: 'x', quantity: 1.5 }))).toEqual(messages(partFormSchema.safeParse({ category: 'ic', description: 'x', quantity: '1.5' })));
  });
});

describe('power form schemas', () => {
  const pack = {
    chemistry: 'li-ion',
    cellFormat: '',
    joining: '',
    protection: false,
    nominalVolts: '3.7 V',
    maxVolts: '',
    capacityAh: '2700 mAh',
    measuredCapacityAh: '',
    series: '',
    parallel: '2',
    massKg: '46',
    internalResistanceOhms: '',
    internalResistanceReadings: { lowAmps: '', lowVolts: '', highAmps: '', highVolts: '' },
  };

  it('pack: the text goes to the server as typed; blanks are none or the defaults', () => {
    expect(packFormSchema.parse(pack)).toEqual({
      ...pack,
      cellFormat: null,
      joining: null,
      maxVolts: null,
      measuredCapacityAh: null,
      series: '1',
      internalResistanceOhms: null,
      internalResistanceReadings: null,
    });
  });

  it('pack: the required quantities and all four readings or none, named by field', () => {
    const r = packFormSchema.safeParse({ ...pack, nominalVolts: ' ', internalResistanceReadings: { lowAmps: '0.6 A', lowVolts: '', highAmps: '3 A', highVolts: '3.8 V' } });
    expect(messages(r)).toEqual({ nominalVolts: 'Required', 'internalResistanceReadings.lowVolts': 'Required: give all four readings, or none' });
  });

  it('loads and converters: the converter id from the select, count and duty defaults, required voltages', () => {
    const load = loadFormSchema.parse({
      kind: 'heater',
      label: '',
      connection: 'parallel',
      converterId: '7',
      surfaceMaterial: '',
      elementMaterial: 'copper',
      resistanceOhms: '3R0',
      currentAmps: '',
      powerWatts: '',
      supplyVolts: '3.65 V',
      count: '',
      duty: '',
      heatedAreaM2: '',
      heatedMassKg: '',
    });
    expect(load).toMatchObject({ label: null, converterId: 7, surfaceMaterial: null, elementMaterial: 'copper', resistanceOhms: '3R0', currentAmps: null, count: '1', duty: '100 %' });
    const converter = converterFormSchema.safeParse({
      label: '',
      topology: 'buck',
      role: 'charge',
      efficiencySource: 'assumed',
      inputVolts: '5 V',
      outputVolts: '',
      ratedCurrentAmps: '',
      chargeCurrentAmps: '1 A',
      efficiency: '',
    });
    expect(messages(converter)).toEqual({ outputVolts: 'Required' });
  });
});
