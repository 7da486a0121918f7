/**
 * Numbers written into explanation text (meanings, warnings): SI prefix and up to four
 * significant figures. The UI formats the figure values themselves; this is only for prose.
 */
const PREFIXES: [number, string][] = [
  [1e12, 'T'],
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
];

/** A plain number with at most `digits` significant figures and no trailing zeros ("4.7", "0.047", "4700"). */
export function plain(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  return String(Number(value.toPrecision(digits)));
}

/** A quantity with an SI prefix ("4.7 kΩ", "100 nF", "49.9 Ω"); units outside the prefixed set are written as they are. */
export function withPrefix(value: number, unit: string, digits = 4): string {
  if (!Number.isFinite(value) || value === 0) return `${plain(value, digits)} ${unit}`;
  const abs = Math.abs(value);
  const [factor, prefix] = PREFIXES.find(([f]) => abs >= f * (1 - 5e-13)) ?? (PREFIXES[PREFIXES.length - 1] as [number, string]);
  return `${plain(value / factor, digits)} ${prefix}${unit}`;
}
