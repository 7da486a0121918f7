import { describe, expect, it } from 'vitest';
import { durationText, readDurationSeconds } from './inputs';
import { figureSettingsFormSchema, workspaceSettingsSchema } from './settings';

describe('durations typed with their unit', () => {
  it('reads seconds, minutes and hours, alone or together [C]', () => {
    expect(readDurationSeconds('60 s')).toBe(60);
    expect(readDurationSeconds('10 min')).toBe(600);
    expect(readDurationSeconds('8 h')).toBe(28_800);
    expect(readDurationSeconds('1 h 30 min')).toBe(5_400);
    expect(readDurationSeconds('1,5 h')).toBe(5_400);
    expect(readDurationSeconds('90s')).toBe(90);
    expect(readDurationSeconds('2 minutes')).toBe(120);
    expect(readDurationSeconds('0.1 min')).toBe(6);
  });

  it('refuses a bare number, an unknown unit and a part of a second, saying what to type', () => {
    expect(() => readDurationSeconds('600')).toThrow('Give the unit too, such as 10 min, 8 h or 60 s');
    expect(() => readDurationSeconds('10 days')).toThrow('“days” is not a unit of time');
    expect(() => readDurationSeconds('1.5 s')).toThrow('Give a whole number of seconds');
    expect(() => readDurationSeconds('soon')).toThrow('Enter a time such as 10 min');
    expect(() => readDurationSeconds('1h30')).toThrow('Enter a time such as 10 min');
  });

  it('writes whole seconds back in the units it reads', () => {
    for (const s of [1, 45, 60, 600, 5_400, 28_800, 3_661]) expect(readDurationSeconds(durationText(s))).toBe(s);
    expect(durationText(600)).toBe('10 min');
    expect(durationText(28_800)).toBe('8 h');
    expect(durationText(3_661)).toBe('1 h 1 min 1 s');
  });
});

describe('the figures and safety settings form', () => {
  it('turns what an admin types into the settings fields: seconds by category (blank ones left out) and a fraction', () => {
    const out = figureSettingsFormSchema.parse({ defaultContact: '1 min', byCategory: { 'pocket-heater': '8 h', headlamp: '10 min', 'power-bank': '' }, usablePercent: '85 %' });
    expect(out).toEqual({ defaultContactSeconds: 60, contactSecondsByCategory: { 'pocket-heater': 28_800, headlamp: 600 }, usableFraction: 0.85 });
    // What the settings schema accepts, unchanged.
    expect(workspaceSettingsSchema.parse(out)).toMatchObject(out);
  });

  it('names the field of each mistake', () => {
    const r = figureSettingsFormSchema.safeParse({ defaultContact: '', byCategory: { toothbrush: '9 h' }, usablePercent: '40' });
    expect(r.success).toBe(false);
    const issues = Object.fromEntries(r.error!.issues.map((i) => [i.path.join('.'), i.message]));
    expect(issues).toEqual({ defaultContact: 'Give the default contact time, such as 1 min', 'byCategory.toothbrush': 'At most 8 h', usablePercent: 'At least 50 %' });
  });
});
