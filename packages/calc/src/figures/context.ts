// The records of a teardown read once and checked, with the settings every subsystem uses.
import { packEnergyWh, CELL_CHEMISTRIES } from '../battery/index';
import { requireFinite, requireFraction, requireInteger, requireNonNegative, requirePositive } from '../shared/validate';
import { duration, requireOneOf } from './build';
import { FIGURE_DEFAULTS, type Figure, type Suggestion, type TeardownFigureInput, type TeardownPack } from './types';

export interface PackInfo {
  p: TeardownPack;
  /** Pack nominal voltage, series × cell (V). */
  volts: number;
  /** Pack rated capacity, parallel × cell (Ah). */
  ratedAh: number;
  /** Rated energy at nominal voltage (Wh). */
  energyWh: number;
}

export interface FigureContext {
  input: TeardownFigureInput;
  figures: Figure[];
  suggestions: Suggestion[];
  pack?: PackInfo;
  claims: NonNullable<TeardownFigureInput['claims']>;
  warnFraction: number;
  ambientC: number;
  ambientAssumed: boolean;
  contact: { seconds: number; text: string; assumption: string };
  usableFraction: { value: number; assumed: boolean };
  targetSurfaceC: number;
}

export function readPack(p: TeardownPack): PackInfo {
  requireOneOf(p.chemistry, CELL_CHEMISTRIES, 'Pack chemistry');
  const series = requireInteger(p.series, 'Pack cells in series');
  const parallel = requireInteger(p.parallel, 'Pack cells in parallel');
  const nominal = requirePositive(p.cellNominalVolts, 'Cell nominal voltage (V)');
  const rated = requirePositive(p.cellRatedAh, 'Cell rated capacity (Ah)');
  if (p.cellMaxVolts !== undefined) requirePositive(p.cellMaxVolts, 'Cell maximum voltage (V)');
  if (p.cellMeasuredAh !== undefined) requireNonNegative(p.cellMeasuredAh, 'Cell measured capacity (Ah)');
  if (p.packMassKg !== undefined) requirePositive(p.packMassKg, 'Pack mass (kg)');
  return {
    p,
    volts: series * nominal,
    ratedAh: rated * parallel,
    energyWh: packEnergyWh({ cellNominalVolts: nominal, cellCapacityAh: rated, series, parallel }),
  };
}

/** Checks the parts of the input every subsystem relies on, and resolves the settings. */
export function readContext(input: TeardownFigureInput): FigureContext {
  for (const [name, list] of [
    ['Loads', input.loads ?? []],
    ['Converters', input.converters ?? []],
    ['Traces', input.traces ?? []],
    ['Part categories', input.partCategories ?? []],
    ['Modes', input.modes ?? []],
  ] as const) {
    if (!Array.isArray(list)) throw new RangeError(`${name} must be a list.`);
  }
  const warnFraction = requireFraction(input.capacityWarnFraction ?? FIGURE_DEFAULTS.capacityWarnFraction, 'Capacity warning fraction');
  const seconds = requirePositive(input.contactSeconds ?? FIGURE_DEFAULTS.contactSeconds, 'Contact time (s)');
  const ambientC = requireFinite(input.ambientC ?? FIGURE_DEFAULTS.ambientC, 'Ambient temperature (°C)');
  const usable = input.usableFraction ?? FIGURE_DEFAULTS.usableFraction;
  requirePositive(usable, 'Usable fraction');
  requireFraction(usable, 'Usable fraction');
  const targetSurfaceC = requireFinite(input.targetSurfaceC ?? FIGURE_DEFAULTS.targetSurfaceC, 'Target surface temperature (°C)');
  if (input.measuredCapacityAh !== undefined) requireNonNegative(input.measuredCapacityAh, 'Measured capacity (Ah)');
  const claims = input.claims ?? {};
  if (claims.capacityAh !== undefined) requirePositive(claims.capacityAh, 'Claimed capacity (Ah)');
  if (claims.capacityWh !== undefined) requirePositive(claims.capacityWh, 'Claimed energy (Wh)');
  if (claims.runtimeH !== undefined) requirePositive(claims.runtimeH, 'Claimed runtime (h)');
  if (claims.outputWatts !== undefined) requirePositive(claims.outputWatts, 'Claimed output power (W)');
  if (claims.powerWatts !== undefined) requirePositive(claims.powerWatts, 'Claimed power (W)');
  const md = input.measuredDischarge;
  if (md) {
    requireNonNegative(md.ampHours, 'Measured discharge capacity (Ah)');
    if (md.wattHours !== undefined) requireNonNegative(md.wattHours, 'Measured discharge energy (Wh)');
    if (md.meanSquareVolts !== undefined) requireNonNegative(md.meanSquareVolts, 'Mean square voltage of the discharge (V²)');
  }
  if (input.cellInternalResistance) requireNonNegative(input.cellInternalResistance.ohms, 'Cell internal resistance (Ω)');
  if (input.powerBankRun) {
    requireNonNegative(input.powerBankRun.efficiency, 'Power-bank run efficiency');
    requireNonNegative(input.powerBankRun.deliveredWh, 'Power-bank run delivered energy (Wh)');
  }
  const text = duration(seconds);
  const assumption =
    input.contactSeconds === undefined
      ? `Contact time ${FIGURE_DEFAULTS.contactSeconds} s assumed for a hand-held heater.`
      : `Contact time ${text}${input.contactBasis ? ` (${input.contactBasis})` : ''}.`;
  return {
    input,
    figures: [],
    suggestions: [],
    pack: input.pack ? readPack(input.pack) : undefined,
    claims,
    warnFraction,
    ambientC,
    ambientAssumed: input.ambientC === undefined,
    contact: { seconds, text, assumption },
    usableFraction: { value: usable, assumed: input.usableFraction === undefined },
    targetSurfaceC,
  };
}

/** Energy that can be drawn to cut-off, and what it rests on. */
export function usableEnergy(ctx: FigureContext): { wh: number; basis: string } | undefined {
  const { pack, input } = ctx;
  if (!pack) return undefined;
  const md = input.measuredDischarge;
  if (md?.wattHours !== undefined && md.wattHours > 0) return { wh: md.wattHours, basis: `energy delivered in the ${md.basis}` };
  const measuredAh = md && md.ampHours > 0 ? md.ampHours : input.measuredCapacityAh;
  if (measuredAh !== undefined && measuredAh > 0) {
    return { wh: measuredAh * pack.volts, basis: `capacity measured in a bench run × the pack nominal ${pack.volts} V` };
  }
  if (pack.p.cellMeasuredAh !== undefined && pack.p.cellMeasuredAh > 0) {
    return { wh: pack.p.cellMeasuredAh * pack.p.parallel * pack.volts, basis: 'measured cell capacity × the pack nominal voltage' };
  }
  const u = ctx.usableFraction;
  return {
    wh: pack.energyWh * u.value,
    basis: `rated energy × usable fraction ${u.value} (${u.assumed ? 'assumed [CP]' : 'workspace setting'})`,
  };
}
