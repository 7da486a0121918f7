import { requireNonNegative, requirePositive } from '../shared/validate';
import { COPPER_OZ_THICKNESS_M, METRES_PER_MIL } from './copper';
import { plain } from '../shared/text';

export type TraceLayer = 'external' | 'internal';

/**
 * IPC-2221 curve-fit constants: I = k · ΔT^0.44 · A^0.725 (A, °C, mil²).
 * Copper thickness enters as oz/ft² × 1.378 mil, with 1 oz/ft² = 35 µm, as published IPC-2221
 * calculators do (35 µm is 1.37795 mil; the 0.003 % difference is kept for agreement with them).
 */
export const IPC2221 = { kExternal: 0.048, kInternal: 0.024, exponentRise: 0.44, exponentArea: 0.725, milPerOz: 1.378 } as const;

/** Copper thickness in mil as IPC-2221 calculations take it: (t / 35 µm) oz × 1.378 mil. */
export function ipc2221ThicknessMil(thicknessM: number): number {
  return (requirePositive(thicknessM, 'Copper thickness (m)') / COPPER_OZ_THICKNESS_M) * IPC2221.milPerOz;
}

function kFor(layer: TraceLayer): number {
  if (layer === 'external') return IPC2221.kExternal;
  if (layer === 'internal') return IPC2221.kInternal;
  throw new RangeError(`Trace layer must be "external" or "internal" (got "${String(layer)}").`);
}

/** Maximum current of a trace by the IPC-2221 fit I = k · ΔT^0.44 · A^0.725, A = w·t in mil² (A). */
export function ipc2221MaxCurrent(p: { widthM: number; thicknessM: number; temperatureRiseC: number; layer: TraceLayer }): number {
  const k = kFor(p.layer);
  const widthMil = requirePositive(p.widthM, 'Trace width (m)') / METRES_PER_MIL;
  const thicknessMil = ipc2221ThicknessMil(p.thicknessM);
  const rise = requirePositive(p.temperatureRiseC, 'Allowed temperature rise (°C)');
  return k * rise ** IPC2221.exponentRise * (widthMil * thicknessMil) ** IPC2221.exponentArea;
}

/** Minimum trace width by the IPC-2221 fit: A = (I / (k·ΔT^0.44))^(1/0.725) mil², w = A / t (m). */
export function ipc2221MinWidth(p: { currentA: number; thicknessM: number; temperatureRiseC: number; layer: TraceLayer }): number {
  const k = kFor(p.layer);
  const current = requireNonNegative(p.currentA, 'Current (A)');
  const thicknessMil = ipc2221ThicknessMil(p.thicknessM);
  const rise = requirePositive(p.temperatureRiseC, 'Allowed temperature rise (°C)');
  const areaMil2 = (current / (k * rise ** IPC2221.exponentRise)) ** (1 / IPC2221.exponentArea);
  return (areaMil2 / thicknessMil) * METRES_PER_MIL;
}

/**
 * Warnings when a case lies outside the range the IPC-2221 fit is quoted for
 * (up to 35 A, up to 400 mil wide, ΔT 10–100 °C [M]).
 */
export function ipc2221RangeWarnings(p: { currentA?: number; widthM?: number; temperatureRiseC?: number }): string[] {
  const out: string[] = [];
  if (p.currentA !== undefined && p.currentA > 35) {
    out.push(`Current ${p.currentA} A is above the 35 A the IPC-2221 fit is quoted for.`);
  }
  if (p.widthM !== undefined && p.widthM / METRES_PER_MIL > 400) {
    out.push(`Width ${plain(p.widthM / METRES_PER_MIL, 3)} mil is above the 400 mil the IPC-2221 fit is quoted for.`);
  }
  if (p.temperatureRiseC !== undefined && (p.temperatureRiseC < 10 || p.temperatureRiseC > 100)) {
    out.push(`Temperature rise ${p.temperatureRiseC} °C is outside the 10–100 °C the IPC-2221 fit is quoted for.`);
  }
  return out;
}
