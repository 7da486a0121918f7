import { describe, expect, it } from 'vitest';
import { MAIN_LOAD_KIND, mainLoads } from './main-load';

describe('mainLoads', () => {
  it('takes the loads a category is bought for [CP]', () => {
    // A pocket heater with a power-bank output is compared on its heater, not on its USB port.
    const heater = mainLoads('pocket-heater', [
      { id: '1', kind: 'heater', fullDutyWatts: 8.9 },
      { id: '2', kind: 'usb-output', fullDutyWatts: 5 },
      { id: '3', kind: 'heater', fullDutyWatts: 2 },
    ]);
    expect(heater).toEqual({ ids: ['1', '3'], basis: 'category' });
    expect(
      mainLoads('power-bank', [
        { id: 'u', kind: 'usb-output' },
        { id: 'l', kind: 'led', fullDutyWatts: 0.1 },
      ]),
    ).toEqual({ ids: ['u'], basis: 'category' });
    expect(MAIN_LOAD_KIND.headlamp).toBe('led');
    expect(MAIN_LOAD_KIND['usb-fan']).toBe('motor');
  });

  it('falls back to the largest load when the category has none of its kind, or no kind at all', () => {
    expect(
      mainLoads('speaker', [
        { id: 'a', kind: 'other', fullDutyWatts: 3 },
        { id: 'b', kind: 'led', fullDutyWatts: 0.2 },
        { id: 'c', kind: 'motor', fullDutyWatts: 3 }, // tie with a: the first given stays
      ]),
    ).toEqual({ ids: ['a'], basis: 'largest' });
    expect(
      mainLoads('pocket-heater', [
        { id: 'm', kind: 'motor', fullDutyWatts: 1 },
        { id: 'n', kind: 'led', fullDutyWatts: null },
      ]),
    ).toEqual({ ids: ['m'], basis: 'largest' });
  });

  it('chooses nothing when no load has a power', () => {
    expect(mainLoads('speaker', [])).toEqual({ ids: [], basis: 'none' });
    expect(mainLoads('other', [{ id: 'x', kind: 'other' }])).toEqual({ ids: [], basis: 'none' });
  });

  it('names a bad input', () => {
    expect(() => mainLoads('other', 'x' as never)).toThrow(/loads must be a list/);
    expect(() => mainLoads('other', [{ id: '', kind: 'led' }])).toThrow(/loads\[0\]\.id/);
    expect(() => mainLoads('other', [{ id: 'a', kind: 'led', fullDutyWatts: Number.NaN }])).toThrow(/loads\[0\]\.fullDutyWatts/);
  });
});
