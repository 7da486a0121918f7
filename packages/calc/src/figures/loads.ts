// Converters and loads read from the records, and the whole-device figures of each load.
import { loadPower, requireConnection, type LoadPowerResult } from '../electrical/index';
import { SURFACE_MATERIALS } from '../thermal/index';
import { requireFraction, requireInteger, requireNonNegative, requirePositive } from '../shared/validate';
import { figure, inp, num, requireId, requireOneOf } from './build';
import type { FigureContext } from './context';
import { ELEMENT_MATERIALS, FIGURE_DEFAULTS, type KeyedInput, type LoadKind, type TeardownConverter, type TeardownLoad } from './types';

const LOAD_KINDS: readonly LoadKind[] = ['heater', 'motor', 'led', 'usb-output', 'other'];

export interface ConverterInfo {
  c: TeardownConverter;
  eta: number;
  note?: string;
}

export interface LoadInfo {
  load: TeardownLoad;
  name: string;
  r: LoadPowerResult;
  supplyVolts: number;
  supplyNote?: string;
  converter?: ConverterInfo;
  eta: number;
  /** At full duty: power drawn from the pack (W) and current from the pack (A). */
  packWatts: number;
  packAmps: number;
}

function readConverter(c: TeardownConverter): ConverterInfo {
  const name = `Converter "${c.id}"`;
  requireOneOf(c.topology, ['buck', 'boost', 'buck-boost'], `${name} topology`);
  requireOneOf(c.role, ['charge', 'output', 'load'], `${name} role`);
  requirePositive(c.vin, `${name} input voltage (V)`);
  requirePositive(c.vout, `${name} output voltage (V)`);
  requireOneOf(c.efficiencySource, ['measured', 'assumed'], `${name} efficiency source`);
  if (c.chargeCurrentA !== undefined) requirePositive(c.chargeCurrentA, `${name} charge current (A)`);
  if (c.efficiency === undefined) {
    return { c, eta: FIGURE_DEFAULTS.converterEfficiency, note: `Efficiency of converter "${c.id}" assumed ${FIGURE_DEFAULTS.converterEfficiency} (not recorded).` };
  }
  requirePositive(c.efficiency, `${name} efficiency`);
  requireFraction(c.efficiency, `${name} efficiency`);
  return c.efficiencySource === 'assumed' ? { c, eta: c.efficiency, note: `Efficiency of converter "${c.id}" assumed ${c.efficiency} (not measured).` } : { c, eta: c.efficiency };
}

export function readConverters(ctx: FigureContext): Map<string, ConverterInfo> {
  const converters = new Map<string, ConverterInfo>();
  const ids = new Set<string>();
  (ctx.input.converters ?? []).forEach((c, i) => {
    requireId(c.id, `Converter ${i + 1}`, ids);
    converters.set(c.id, readConverter(c));
  });
  return converters;
}

function readLoad(ctx: FigureContext, load: TeardownLoad, index: number, converters: Map<string, ConverterInfo>, skipped: string[]): LoadInfo | undefined {
  const name = `Load "${load.label || load.id || index + 1}"`;
  requireOneOf(load.kind, LOAD_KINDS, `${name} kind`);
  requireInteger(load.count, `${name} element count`);
  requireConnection(load.connection, `${name} connection`);
  requireFraction(load.duty, `${name} duty`);
  if (load.heatedAreaM2 !== undefined) requirePositive(load.heatedAreaM2, `${name} heated area (m²)`);
  if (load.heatedMassKg !== undefined) requirePositive(load.heatedMassKg, `${name} heated mass (kg)`);
  if (load.surfaceMaterial !== undefined) requireOneOf(load.surfaceMaterial, SURFACE_MATERIALS, `${name} surface material`);
  if (load.elementMaterial !== undefined) requireOneOf(load.elementMaterial, ELEMENT_MATERIALS, `${name} element material`);
  let converter: ConverterInfo | undefined;
  if (load.converterId !== undefined) {
    converter = converters.get(load.converterId);
    if (!converter) throw new RangeError(`${name} refers to converter "${load.converterId}", which is not in this teardown.`);
  }
  const pack = ctx.pack;
  let supply: number;
  let supplyNote: string | undefined;
  if (load.supplyVolts !== undefined) {
    supply = requirePositive(load.supplyVolts, `${name} supply voltage (V)`);
  } else if (converter) {
    supply = converter.c.vout;
    supplyNote = `${name} supply taken as the ${num(supply)} V output of converter "${converter.c.id}".`;
  } else if (pack) {
    supply = pack.volts;
    supplyNote = `${name} supply taken as the pack nominal voltage, ${num(supply)} V.`;
  } else {
    skipped.push(`${name} left out: no supply voltage, converter or pack recorded.`);
    return undefined;
  }
  if (load.resistanceOhms === undefined && load.currentAmps === undefined && load.powerWatts === undefined) {
    skipped.push(`${name} left out: no element resistance, current or power recorded.`);
    return undefined;
  }
  const r = loadPower({ count: load.count, connection: load.connection, resistanceOhms: load.resistanceOhms, currentAmps: load.currentAmps, powerWatts: load.powerWatts, supplyVolts: supply });
  const eta = converter ? converter.eta : 1;
  const packWatts = r.totalWatts / eta;
  const packAmps = converter ? packWatts / converter.c.vin : r.totalAmps;
  return { load, name, r, supplyVolts: supply, supplyNote, converter, eta, packWatts, packAmps };
}

export interface LoadSet {
  converters: Map<string, ConverterInfo>;
  /** The loads whose power could be worked out, in record order. */
  computed: LoadInfo[];
  /** Why a load was left out, in words. */
  skipped: string[];
  byId: Map<string, LoadInfo>;
  /** Every load id of the records (computed or not). */
  ids: Set<string>;
}

export function readLoads(ctx: FigureContext): LoadSet {
  const converters = readConverters(ctx);
  const ids = new Set<string>();
  const skipped: string[] = [];
  const computed: LoadInfo[] = [];
  (ctx.input.loads ?? []).forEach((load, i) => {
    requireId(load.id, `Load ${i + 1}`, ids);
    const info = readLoad(ctx, load, i, converters, skipped);
    if (info) computed.push(info);
  });
  return { converters, computed, skipped, ids, byId: new Map(computed.map((l) => [l.load.id, l])) };
}

export function elementInputs(info: LoadInfo): KeyedInput[] {
  const { load, r } = info;
  const described =
    r.basis === 'resistance'
      ? inp('elementOhms', 'Element resistance', r.elementOhms, 'Ω')
      : r.basis === 'current'
        ? inp('elementAmps', 'Element current', load.currentAmps as number, 'A')
        : inp('elementWatts', 'Element power', load.powerWatts as number, 'W');
  return [inp('count', 'Elements', load.count), inp('connection', 'Connection', load.connection), described, inp('supplyVolts', 'Supply voltage', info.supplyVolts, 'V')];
}

export function loadAssumptions(info: LoadInfo): string[] {
  const out: string[] = [];
  if (info.supplyNote) out.push(info.supplyNote);
  if (info.r.basis === 'current') out.push(`${info.name} treated as resistive at its measured current.`);
  if (info.r.basis === 'power') out.push(`${info.name} treated as resistive at its stated power.`);
  return out;
}

/** Full-duty power of each load and of one element; the average power over a discharge run for a resistive load fed straight from the pack. */
export function loadFigures(ctx: FigureContext, loads: LoadSet): void {
  for (const info of loads.computed) {
    const { load, r } = info;
    ctx.figures.push(
      figure({
        key: `load.${load.id}.power`,
        label: `${load.label} power (full duty)`,
        value: r.totalWatts,
        unit: 'W',
        family: 'load.power',
        inputs: [...elementInputs(info), inp('equivalentOhms', 'Equivalent resistance', r.equivalentOhms, 'Ω')],
        assumptions: loadAssumptions(info),
      }),
      figure({
        key: `load.${load.id}.elementPower`,
        label: `${load.label} power per element`,
        value: r.elementWatts,
        unit: 'W',
        family: 'load.elementPower',
        inputs: [...elementInputs(info), inp('elementVolts', 'Element voltage', r.elementVolts, 'V')],
        assumptions: loadAssumptions(info),
      }),
    );
    const md = ctx.input.measuredDischarge;
    if (md?.meanSquareVolts !== undefined && !info.converter && r.basis === 'resistance' && load.supplyVolts === undefined && ctx.pack) {
      ctx.figures.push(
        figure({
          key: `load.${load.id}.dischargePower`,
          label: `${load.label} average power over the discharge run`,
          value: md.meanSquareVolts / r.equivalentOhms,
          unit: 'W',
          family: 'load.dischargePower',
          inputs: [
            inp('meanSquareVolts', 'Mean of V² over the run', md.meanSquareVolts, 'V²'),
            inp('equivalentOhms', 'Equivalent resistance', r.equivalentOhms, 'Ω'),
            inp('run', 'Bench run', md.basis),
          ],
          assumptions: [
            'A fixed resistance across the pack terminals: the power follows the voltage as the cell empties, so its mean is mean(V²)/R, not (mean V)²/R (REFERENCES §12 [C]).',
            `Full duty; at duty D the average is D times this.`,
          ],
        }),
      );
    }
  }
}

export function requireModeDuty(value: number, name: string): number {
  return requireFraction(requireNonNegative(value, name), name);
}
