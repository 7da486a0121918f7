import { describe, expect, it } from 'vitest';
import { formatBytes, formatClock, formatElapsed, niceTimeTicks, timeAxisUnit } from './time-format';

describe('elapsed time of runs', () => {
  it('reads as hours and minutes, minutes and seconds, or seconds [C]', () => {
    expect(formatElapsed(17_460)).toBe('4 h 51 min');
    expect(formatElapsed(7200)).toBe('2 h');
    expect(formatElapsed(750)).toBe('12 min 30 s');
    expect(formatElapsed(600)).toBe('10 min');
    expect(formatElapsed(12.34)).toBe('12.3 s');
    expect(formatElapsed(3599.9)).toBe('1 h');
    expect(formatElapsed(null)).toBe('—');
  });

  it('writes clock time h:mm:ss [C]', () => {
    expect(formatClock(0)).toBe('0:00:00');
    expect(formatClock(3661)).toBe('1:01:01');
    expect(formatClock(5.5)).toBe('0:00:05.5');
    expect(formatClock(-60)).toBe('−0:01:00');
  });

  it('picks the axis unit and round ticks in it [C]', () => {
    expect(timeAxisUnit(5 * 3600)).toEqual({ unit: 'h', divisor: 3600 });
    expect(timeAxisUnit(1800)).toEqual({ unit: 'min', divisor: 60 });
    expect(timeAxisUnit(90)).toEqual({ unit: 's', divisor: 1 });
    // 0–2 h 15 min shown in hours: steps of 0.5 h.
    expect(niceTimeTicks(0, 8100, 3600)).toEqual([0, 1800, 3600, 5400, 7200]);
    // 45 min in minutes: steps of 10 min.
    expect(niceTimeTicks(0, 2700, 60)).toEqual([0, 600, 1200, 1800, 2400]);
    expect(niceTimeTicks(10, 10, 1)).toEqual([10]);
  });

  it('gives file sizes in binary units', () => {
    expect(formatBytes(512)).toBe('512 B');
    expect(formatBytes(6400)).toBe('6.3 KiB');
    expect(formatBytes(25 * 1024 * 1024)).toBe('25 MiB');
  });
});
