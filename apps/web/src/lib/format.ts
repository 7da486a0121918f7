// Number display: SI prefixes, three significant figures by default, a unit always.

const PREFIXES: [number, string][] = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
];

/** Significant-figure rounding without exponent notation for everyday magnitudes; trailing zeros kept ("2.70"). */
export function sig(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const rounded = Number(value.toPrecision(digits));
  const magnitude = Math.floor(Math.log10(Math.abs(rounded)));
  const decimals = Math.min(Math.max(0, digits - 1 - magnitude), 12);
  return rounded.toLocaleString('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals, useGrouping: Math.abs(rounded) >= 10000 });
}

/** Two quantity texts that read the same ("3.02 Ω" and "3.020Ω"): spaces, case and trailing zeros ignored. */
export function sameQuantityText(a: string, b: string): boolean {
  const norm = (s: string) =>
    s
      .replace(/\s/g, '')
      .toLowerCase()
      .replace(/(\.\d*?)0+(?=\D|$)/g, '$1')
      .replace(/\.(?=\D|$)/g, '');
  return norm(a) === norm(b);
}

/** Units that take SI prefixes when shown. Others (%, °C, h, Wh/kg, W/cm²) are shown as they are. */
const PREFIXABLE = new Set(['V', 'A', 'W', 'Ω', 'F', 'H', 'Wh', 'Ah', 'm', 'g', 's', 'Hz', 'J']);

export function formatQuantity(value: number | null | undefined, unit: string, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (!PREFIXABLE.has(unit) || value === 0) return `${sig(value, digits)} ${unit}`.trim();
  const abs = Math.abs(value);
  let [factor, prefix] = PREFIXES.find(([f]) => abs >= f * 0.9995) ?? PREFIXES[PREFIXES.length - 1]!;
  // Keep whole units for kg-style cases: show grams as g, not as "m kg".
  if (unit === 'm' && factor < 1e-3) [factor, prefix] = [1e-6, 'µ'];
  return `${sig(value / factor, digits)} ${prefix}${unit}`;
}

export function formatMoney(amount: number | null | undefined, currency: string, fractionDigits?: number): string {
  if (amount === null || amount === undefined || !Number.isFinite(amount)) return '—';
  const digits = fractionDigits ?? (Math.abs(amount) < 1 ? 4 : 2);
  try {
    return new Intl.NumberFormat('en-GB', { style: 'currency', currency, minimumFractionDigits: digits, maximumFractionDigits: digits }).format(amount);
  } catch {
    return `${amount.toFixed(digits)} ${currency}`;
  }
}

export function formatPercent(fraction: number | null | undefined, digits = 1): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return '—';
  return `${(fraction * 100).toFixed(digits)} %`;
}

export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? '—' : d.toLocaleDateString('en-GB', { year: 'numeric', month: 'short', day: 'numeric' });
}

export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? '—' : d.toLocaleString('en-GB', { year: 'numeric', month: 'short', day: 'numeric', hour: '2-digit', minute: '2-digit' });
}

/**
 * A value in its stored unit (SI; Wh, Ah and °C as the trade uses them), shown the way people read it:
 * kilograms below 1 kg as grams, square metres as cm², fractions (unit '') as a plain number.
 */
export function formatStored(value: number | null | undefined, unit: string, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (unit === 'kg' && Math.abs(value) < 1) return formatQuantity(value * 1000, 'g', digits);
  if (unit === 'm²') return Math.abs(value) < 0.1 ? `${sig(value * 1e4, digits)} cm²` : `${sig(value, digits)} m²`;
  if (unit === '') return sig(value, digits);
  return formatQuantity(value, unit, digits);
}
