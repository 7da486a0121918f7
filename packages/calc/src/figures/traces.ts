// Copper traces: IPC-2221 current rating and resistance of each recorded trace.
import { COPPER_RESISTIVITY_PURE, copperTraceResistance, ipc2221MaxCurrent, ipc2221RangeWarnings, type TraceLayer } from '../traces/index';
import { requireNonNegative, requirePositive } from '../shared/validate';
import { figure, inp, num, requireId, requireOneOf } from './build';
import type { FigureContext } from './context';
import { FIGURE_DEFAULTS, type TeardownTrace } from './types';

export interface OverRatedTrace {
  t: TeardownTrace;
  rating: number;
  rise: number;
}

export function traceFigures(ctx: FigureContext): OverRatedTrace[] {
  const ids = new Set<string>();
  const overRated: OverRatedTrace[] = [];
  (ctx.input.traces ?? []).forEach((t, i) => {
    requireId(t.id, `Trace ${i + 1}`, ids);
    const name = `Trace "${t.label || t.id}"`;
    requireOneOf<TraceLayer>(t.layer, ['external', 'internal'], `${name} layer`);
    const current = requireNonNegative(t.currentA, `${name} current (A)`);
    const rise = requirePositive(t.allowedRiseC ?? FIGURE_DEFAULTS.traceRiseC, `${name} allowed temperature rise (°C)`);
    const rating = ipc2221MaxCurrent({ widthM: t.widthM, thicknessM: t.thicknessM, temperatureRiseC: rise, layer: t.layer });
    const resistance = copperTraceResistance({ lengthM: t.lengthM, widthM: t.widthM, thicknessM: t.thicknessM });
    const warnings = ipc2221RangeWarnings({ currentA: current, widthM: t.widthM, temperatureRiseC: rise });
    if (current > rating) {
      overRated.push({ t, rating, rise });
      warnings.unshift(`${name} carries ${num(current)} A, above its ${num(rating)} A rating for a ${num(rise)} °C rise.`);
    }
    const geometry = [inp('widthM', 'Width', t.widthM, 'm'), inp('thicknessM', 'Copper thickness', t.thicknessM, 'm')];
    ctx.figures.push(
      figure({
        key: `trace.${t.id}.rating`,
        label: `${t.label} IPC-2221 current rating`,
        value: rating,
        unit: 'A',
        family: 'trace.rating',
        inputs: [...geometry, inp('layer', 'Layer', t.layer), inp('allowedRiseC', 'Allowed rise', rise, '°C'), inp('currentA', 'Current carried', current, 'A')],
        assumptions: [...(t.allowedRiseC === undefined ? [`Allowed temperature rise ${FIGURE_DEFAULTS.traceRiseC} °C assumed.`] : []), '1 oz/ft² copper taken as 35 µm = 1.378 mil.'],
        warnings,
      }),
      figure({
        key: `trace.${t.id}.resistance`,
        label: `${t.label} resistance at 20 °C`,
        value: resistance,
        unit: 'Ω',
        family: 'trace.resistance',
        inputs: [inp('lengthM', 'Length', t.lengthM, 'm'), ...geometry, inp('lossWatts', 'Loss at the current carried', current * current * resistance, 'W')],
        assumptions: [
          'IACS annealed copper, ρ = 1.7241e-8 Ω·m at 20 °C, α = 0.00393 /K.',
          `Pure copper (CRC, 1.678e-8 Ω·m) would give ${num(copperTraceResistance({ lengthM: t.lengthM, widthM: t.widthM, thicknessM: t.thicknessM, resistivityOhmM: COPPER_RESISTIVITY_PURE }), 5)} Ω.`,
        ],
      }),
    );
  });
  return overRated;
}
