import { describe, it, expect } from 'vitest';
import { chooseMode, type ModeCandidate } from './mode-choice';

const modes: ModeCandidate[] = [
  { id: '1', name: 'Low', mainLoadWatts: 4.44, usbOutput: false },
  { id: '2', name: 'High', mainLoadWatts: 8.88, usbOutput: false },
  { id: '3', name: 'Power bank', mainLoadWatts: 0, usbOutput: true },
  { id: '4', name: 'Standby', mainLoadWatts: 0, usbOutput: false },
];

describe('the mode a lineup compares', () => {
  it('highest and lowest main-load power; the lowest is a mode with the main load on', () => {
    expect(chooseMode(modes, { rule: 'highest' })).toMatchObject({ id: '2', name: 'High' });
    expect(chooseMode(modes, { rule: 'lowest' })).toMatchObject({ id: '1', name: 'Low' });
  });
  it('the power-bank output, and a mode by name (any case)', () => {
    expect(chooseMode(modes, { rule: 'power-bank' })?.id).toBe('3');
    expect(chooseMode(modes, { rule: 'named', name: ' high ' })?.id).toBe('2');
    expect(chooseMode(modes, { rule: 'named', name: 'Turbo' })).toBeNull();
  });
  it('nothing to choose, or a bad rule', () => {
    expect(chooseMode([], { rule: 'highest' })).toBeNull();
    expect(chooseMode(modes.slice(2, 3), { rule: 'lowest' })).toBeNull();
    expect(() => chooseMode(modes, { rule: 'named' })).toThrow(/mode name/);
    expect(() => chooseMode(modes, { rule: 'best' as never })).toThrow(/Mode rule/);
    expect(() => chooseMode('x' as never, { rule: 'highest' })).toThrow(/list/);
  });
});
