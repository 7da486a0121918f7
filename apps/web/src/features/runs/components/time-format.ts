// Elapsed time of bench runs: "4 h 51 min", "12 min 30 s", and clock-style "4:51:07" for tables.

export function formatElapsed(seconds: number | null | undefined): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return '—';
  let s = Math.abs(seconds);
  if (s < 59.95) return `${Number(s.toPrecision(3))} s`;
  s = Math.round(s);
  if (s < 3600) {
    const m = Math.floor(s / 60);
    const rest = s - m * 60;
    return rest ? `${m} min ${rest} s` : `${m} min`;
  }
  const h = Math.floor(s / 3600);
  const m = Math.round((s - h * 3600) / 60);
  return m === 60 ? `${h + 1} h` : m ? `${h} h ${m} min` : `${h} h`;
}

export function formatClock(seconds: number): string {
  const sign = seconds < 0 ? '−' : '';
  let s = Math.abs(seconds);
  const h = Math.floor(s / 3600);
  s -= h * 3600;
  const m = Math.floor(s / 60);
  s -= m * 60;
  const sec = s < 10 ? `0${s.toFixed(s % 1 ? 1 : 0)}` : s.toFixed(s % 1 ? 1 : 0);
  return `${sign}${h}:${String(m).padStart(2, '0')}:${sec}`;
}

/** Axis unit for a time span: hours for long runs, minutes for medium, seconds for short. */
export function timeAxisUnit(spanS: number): { unit: 'h' | 'min' | 's'; divisor: number } {
  if (spanS >= 2 * 3600) return { unit: 'h', divisor: 3600 };
  if (spanS >= 120) return { unit: 'min', divisor: 60 };
  return { unit: 's', divisor: 1 };
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(bytes < 10 * 1024 ? 1 : 0)} KiB`;
  return `${(bytes / 1024 / 1024).toFixed(bytes < 10 * 1024 * 1024 ? 1 : 0)} MiB`;
}

/** Round tick positions (in seconds) for a time axis shown in `divisor` units: steps of 1, 2 or 5 × 10ⁿ of that unit. */
export function niceTimeTicks(from: number, to: number, divisor: number, target = 6): number[] {
  const span = (to - from) / divisor;
  if (!(span > 0)) return [from];
  const raw = span / target;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * magnitude >= raw) ?? 10) * magnitude;
  const first = Math.ceil(from / divisor / step) * step;
  const ticks: number[] = [];
  for (let x = first; x <= to / divisor + step * 1e-9; x += step) ticks.push(Number((x * divisor).toPrecision(12)));
  return ticks;
}
