// Display of bench-tool figures: SI prefixes and three significant figures through lib/format,
// scientific notation for tiny constants in units that take no prefix (Ω·m, /K), words for classes.
import { formatQuantity, sig } from '@/lib/format';

const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };
const PREFIXED = new Set(['V', 'A', 'W', 'Ω', 'F', 'H', 'Wh', 'Ah', 'm', 'g', 's', 'Hz', 'J']);

/** Words for the values the tools return as text. */
const WORDS: Record<string, string> = {
  'up-to-100-wh': 'Up to 100 Wh',
  '100-to-160-wh': '100–160 Wh',
  'over-160-wh': 'Over 160 Wh',
  plausible: 'Plausible',
  implausible: 'Implausible',
  external: 'External',
  internal: 'Internal',
};

function scientific(value: number, unit: string): string {
  const [mantissa, exponent] = value.toExponential(2).split('e') as [string, string];
  const exp = String(Number(exponent))
    .split('')
    .map((c) => SUPERSCRIPT[c] ?? c)
    .join('');
  return `${mantissa} × 10${exp} ${unit}`.trim();
}

/** A figure or input value for display: 4.7 kΩ, 1.11 h, 1.72 × 10⁻⁸ Ω·m, "Up to 100 Wh". */
export function formatFigure(value: number | string | boolean | null, unit = ''): string {
  if (value === null) return '—';
  if (typeof value === 'boolean') return value ? 'Yes' : 'No';
  if (typeof value === 'string') return WORDS[value] ?? value;
  // Bench sizes read better in grams and square centimetres than in kg and m².
  if (unit === 'kg' && Math.abs(value) < 1) return formatQuantity(value * 1000, 'g');
  if (unit === 'm²' && value !== 0 && Math.abs(value) < 0.1) return `${sig(value * 1e4)} cm²`;
  if (!PREFIXED.has(unit) && value !== 0 && (Math.abs(value) < 1e-3 || Math.abs(value) >= 1e6)) return scientific(value, unit);
  if (unit === '') return Number.isInteger(value) ? String(value) : sig(value);
  return formatQuantity(value, unit);
}
