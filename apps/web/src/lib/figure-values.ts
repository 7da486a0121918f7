// How a derived figure and its inputs read on screen and in print (the API computes them; this only
// formats): SI prefixes through lib/format, words for the class strings the server sends.
import type { FigureDto, FigureInputDto } from '@splitcase/contracts';
import { formatQuantity, formatStored, sig } from './format';

/** Words for the class strings the server sends (air-transport classes). */
export const FIGURE_VALUE_WORDS: Record<string, string> = {
  'up-to-100-wh': 'Up to 100 Wh',
  '100-to-160-wh': 'Over 100 Wh, up to 160 Wh',
  'over-160-wh': 'Over 160 Wh',
};

export function figureValue(value: number | string, unit: string): string {
  if (typeof value === 'string') return FIGURE_VALUE_WORDS[value] ?? value;
  if (unit === '' && Number.isInteger(value)) return String(value);
  return formatQuantity(value, unit);
}

export function figureInputValue(i: FigureInputDto): string {
  if (i.value === null) return '—';
  if (typeof i.value === 'boolean') return i.value ? 'yes' : 'no';
  if (typeof i.value === 'string') return FIGURE_VALUE_WORDS[i.value] ?? i.value;
  // Inputs are values in their stored unit: shown as the forms and the report show them (46.0 g, 27.0 cm²).
  if (i.unit) return formatStored(i.value, i.unit);
  return Number.isInteger(i.value) ? String(i.value) : sig(i.value);
}

/** Whole-device figures grouped by what they describe (the key's first word). */
const GROUPS: { title: string; match: RegExp }[] = [
  { title: 'Battery', match: /^pack\./ },
  { title: 'Loads', match: /^load\./ },
  { title: 'Runtime and charging', match: /^(runtime|powerbank|charge|capacity|claim)\./ },
  { title: 'Heater and touch', match: /^heater\./ },
  { title: 'Heater traces', match: /^trace\./ },
];

export interface FigureGroup {
  title: string;
  /** Set for the group of one operating mode. */
  mode?: { id: number; name: string; note: string | null };
  figures: FigureDto[];
}

/** Whole-device figures by subject, then one group per operating mode, in the modes' order. */
export function groupFigures(figures: FigureDto[], modes: { id: number; name: string; note: string | null }[] = []): FigureGroup[] {
  const device = figures.filter((f) => f.modeId === null);
  const out: FigureGroup[] = GROUPS.map((g) => ({ title: g.title, figures: device.filter((f) => g.match.test(f.key)) }));
  const rest = device.filter((f) => !GROUPS.some((g) => g.match.test(f.key)));
  const perMode: FigureGroup[] = modes.map((m) => ({ title: `Mode: ${m.name}`, mode: m, figures: figures.filter((f) => f.modeId === m.id) }));
  return [...out, { title: 'Other', figures: rest }, ...perMode].filter((g) => g.figures.length > 0 || g.mode);
}

/** A stable id for a figure on a page: its key, with its mode when it has one. */
export const figureId = (f: FigureDto) => (f.modeId === null ? f.key : `${f.key}@${f.modeId}`);
