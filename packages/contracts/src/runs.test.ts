import { describe, expect, it } from 'vitest';
import {
  RUN_KIND,
  RUN_KIND_NEEDS,
  RUN_OPTION_KEYS,
  runEditFormSchema,
  runMappingSchema,
  runNeedsText,
  runOptionsFor,
  runOptionsSchema,
  runUploadFormSchema,
  seriesWindowFormSchema,
  type RunMappingFormValues,
} from './runs';

const blank = { column: '', unit: 'V' };
const form = (over: Partial<RunMappingFormValues> = {}): RunMappingFormValues => ({
  kind: 'discharge',
  time: { column: 't', unit: 's' },
  voltage: { column: 'v', unit: 'mV' },
  current: { column: 'i', unit: 'A' },
  power: blank,
  temperature: blank,
  delimiter: ',',
  decimalComma: false,
  headerRow: '1',
  ...over,
});

describe('what each kind of run needs', () => {
  it('lists every option of the schema once, and each kind reads options of the schema', () => {
    expect([...RUN_OPTION_KEYS].sort()).toEqual(Object.keys(runOptionsSchema.shape).sort());
    for (const k of RUN_KIND.values) for (const o of RUN_KIND_NEEDS[k].options) expect(RUN_OPTION_KEYS).toContain(o);
  });

  it('says the columns in words, as the upload form shows them', () => {
    expect(runNeedsText('discharge')).toBe('time, voltage, and current or power');
    expect(runNeedsText('charge')).toBe('time, voltage and current');
    expect(runNeedsText('thermal')).toBe('time and temperature');
    expect(runNeedsText('power-bank')).toBe('time, voltage, and current or power');
  });

  it('the mapping schema refuses a kind without its columns, naming the column field', () => {
    const issues = (m: unknown) => {
      const r = runMappingSchema.safeParse(m);
      return r.success ? [] : r.error.issues.map((i) => [i.path.join('.'), i.message]);
    };
    const time = { column: 't', unit: 's' };
    expect(issues({ kind: 'discharge', time })).toEqual([
      ['voltage.column', 'A discharge run needs a voltage column'],
      ['current.column', 'Map a current column (or a power column)'],
    ]);
    expect(issues({ kind: 'discharge', time, voltage: { column: 'v', unit: 'V' }, power: { column: 'p', unit: 'W' } })).toEqual([]);
    expect(issues({ kind: 'charge', time, voltage: { column: 'v', unit: 'V' } })).toEqual([['current.column', 'A charge run needs a current column']]);
    expect(issues({ kind: 'thermal', time })).toEqual([['temperature.column', 'A thermal run needs a temperature column']]);
    expect(issues({ kind: 'power-bank', time, current: { column: 'i', unit: 'A' } })).toEqual([['voltage.column', 'A power-bank output run needs a voltage column']]);
  });

  it('the server refuses an option another kind reads, naming it', () => {
    expect(runOptionsFor('discharge').safeParse({ cutoffVolts: 3, cutoffDebounceSeconds: 0 }).success).toBe(true);
    const r = runOptionsFor('thermal').safeParse({ cutoffVolts: 3, contactSeconds: 60 });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
      ['cutoffVolts', 'Cut-off voltage (V): not a setting of a thermal run (it takes surface touched, contact time, time to a temperature)'],
    ]);
    // Cleared (null) options of another kind are no setting at all.
    expect(runOptionsFor('charge').safeParse({ cutoffVolts: null, cvVolts: 4.2 }).success).toBe(true);
  });
});

describe('the run forms', () => {
  it('the upload form becomes the mapping, the label and only the options of the kind', () => {
    const out = runUploadFormSchema('discharge').parse({
      label: '  Bench check ',
      mapping: form({ headerRow: ' 3 ' }),
      options: { cutoffVolts: '3,0', cutoffDebounceSeconds: '', cvVolts: '4.2', material: 'metal' },
    });
    expect(out).toEqual({
      label: 'Bench check',
      mapping: { kind: 'discharge', time: { column: 't', unit: 's' }, voltage: { column: 'v', unit: 'mV' }, current: { column: 'i', unit: 'A' }, delimiter: ',', decimalComma: false, headerRow: 3 },
      options: { cutoffVolts: 3, cutoffDebounceSeconds: null },
    });
    expect(runUploadFormSchema('discharge').parse({ label: ' ', mapping: form({ headerRow: '' }), options: {} })).toMatchObject({ label: undefined, mapping: { headerRow: 1 } });
  });

  it('names the form field of every refusal: option, column, header row', () => {
    const r = runUploadFormSchema('discharge').safeParse({
      label: 'x',
      mapping: form({ voltage: blank, headerRow: 'first', decimalComma: true }),
      options: { cutoffVolts: '-1', cutoffDebounceSeconds: 'soon' },
    });
    expect(r.success).toBe(false);
    const fields = Object.fromEntries(r.error!.issues.map((i) => [i.path.join('.'), i.message]));
    expect(fields).toEqual({
      'mapping.headerRow': 'Enter a whole number, such as 1',
      'options.cutoffVolts': 'Must be above 0 V',
      'options.cutoffDebounceSeconds': 'Enter a number',
    });
    // With the header row fixed, the mapping's own checks name their fields.
    const m = runUploadFormSchema('discharge').safeParse({ label: '', mapping: form({ voltage: blank, decimalComma: true }), options: {} });
    expect(Object.fromEntries(m.error!.issues.map((i) => [i.path.join('.'), i.message]))).toEqual({
      'mapping.voltage.column': 'A discharge run needs a voltage column',
      'mapping.decimalComma': 'A decimal comma needs a delimiter other than the comma (usually a semicolon)',
    });
  });

  it('the settings form clears a blank option (null) and keeps the kind’s options only', () => {
    expect(runEditFormSchema('thermal').parse({ label: 'Surface', options: { material: '', contactSeconds: '600', thresholdC: '', cutoffVolts: '3' } })).toEqual({
      label: 'Surface',
      options: { material: null, contactSeconds: 600, thresholdC: null },
    });
    const r = runEditFormSchema('thermal').safeParse({ label: '', options: { contactSeconds: '1.5' } });
    expect(Object.fromEntries(r.error!.issues.map((i) => [i.path.join('.'), i.message]))).toEqual({ label: 'Required', 'options.contactSeconds': 'Whole seconds' });
  });
});

describe('the chart window form', () => {
  it('reads a start and a later end, a decimal comma too; anything else asks for both', () => {
    expect(seriesWindowFormSchema.parse({ from: '1,5', to: ' 3 ' })).toEqual({ from: 1.5, to: 3 });
    for (const bad of [
      { from: '', to: '3' },
      { from: '3', to: '3' },
      { from: '-1', to: '2' },
      { from: 'a', to: '2' },
    ]) {
      const r = seriesWindowFormSchema.safeParse(bad);
      expect(r.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([['to', 'Give a start and a later end']]);
    }
  });
});
