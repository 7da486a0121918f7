import type { Explained, FigureInput } from '../shared/explained';
import { requireFinite, requireFraction, requireInteger, requireNonNegative, requirePositive } from '../shared/validate';
import { loadPower, requireConnection, type Connection, type LoadPowerResult } from '../electrical/index';
import {
  AIR_TRANSPORT_CLASS_TEXT,
  CELL_CHEMISTRIES,
  CELL_VOLTAGES,
  airTransportClass,
  cRate,
  chargeTimeEstimate,
  isLithiumChemistry,
  labelCapacityPlausibility,
  packEnergyWh,
  runtimeHours,
  specificEnergyWhPerKg,
  type CellChemistry,
} from '../battery/index';
import { powerBankOutputAh } from '../converters/index';
import {
  COPPER_RESISTIVITY_PURE,
  copperTraceResistance,
  ipc2221MaxCurrent,
  ipc2221RangeWarnings,
  powerDensityWPerCm2,
  type TraceLayer,
} from '../traces/index';
import { DEFAULT_CONVECTION_H, SURFACE_MATERIALS, burnThresholdDetail, radiativeHeatTransferCoefficient, surfaceTemperatureRiseC, type SurfaceMaterial } from '../thermal/index';
import { formulaOf, type FormulaKey } from './formulas';

export type LoadKind = 'heater' | 'motor' | 'led' | 'usb-output' | 'other';
export type ConverterTopology = 'buck' | 'boost' | 'buck-boost';
export type ConverterRole = 'charge' | 'output' | 'load';
export type SuggestionKind =
  | 'cost-down'
  | 'safety'
  | 'reliability'
  | 'manufacturability'
  | 'user-experience'
  | 'compliance'
  | 'clever-idea';
export type SuggestionSeverity = 'note' | 'minor' | 'major' | 'critical';

export interface TeardownPack {
  chemistry: CellChemistry;
  cellNominalVolts: number;
  cellMaxVolts?: number;
  cellRatedAh: number;
  cellMeasuredAh?: number;
  series: number;
  parallel: number;
  packMassKg?: number;
  protection: boolean;
}

export interface TeardownLoad {
  id: string;
  kind: LoadKind;
  label: string;
  /** Per element (Ω). */
  resistanceOhms?: number;
  /** Per element (A). */
  currentAmps?: number;
  /** Per element (W). */
  powerWatts?: number;
  /** Defaults to the converter's output voltage, or to the pack's nominal voltage. */
  supplyVolts?: number;
  count: number;
  connection: Connection;
  /** PWM duty 0..1 at the setting the figures describe. */
  duty: number;
  converterId?: string;
  /** Area that sheds the heat (both faces if both are exposed) (m²). */
  heatedAreaM2?: number;
  surfaceMaterial?: SurfaceMaterial;
}

export interface TeardownConverter {
  id: string;
  topology: ConverterTopology;
  role: ConverterRole;
  vin: number;
  vout: number;
  /** 0..1; defaults to 0.9 (assumed) when absent. */
  efficiency?: number;
  efficiencySource: 'measured' | 'assumed';
  /** For a charge converter: the current it puts into the pack in the constant-current phase (A). */
  chargeCurrentA?: number;
}

export interface TeardownTrace {
  id: string;
  label: string;
  lengthM: number;
  widthM: number;
  thicknessM: number;
  currentA: number;
  layer: TraceLayer;
  /** Allowed temperature rise for the IPC-2221 rating; defaults to 10 °C. */
  allowedRiseC?: number;
}

export interface TeardownFigureInput {
  pack?: TeardownPack;
  loads: TeardownLoad[];
  converters: TeardownConverter[];
  /** Categories of the BOM lines, e.g. 'cell', 'ic', 'passive', 'sensor', 'heater'. */
  partCategories: string[];
  claims?: { capacityAh?: number; capacityWh?: number; runtimeH?: number; outputWatts?: number };
  /** Pack capacity delivered in a bench run, at the pack terminals (Ah). */
  measuredCapacityAh?: number;
  /** Measured ÷ label below this is flagged; default 0.9. */
  capacityWarnFraction?: number;
  traces?: TeardownTrace[];
  /** Contact time for the burn threshold; default 60 s for a hand-held heater. */
  contactSeconds?: number;
  /** Ambient temperature for the surface estimate; default 25 °C (IEC 62368-1 reference ambient). */
  ambientC?: number;
  /**
   * The hottest surface temperature measured at the bench (e.g. the steady state of a thermal run),
   * with where it comes from. When given, the touch margin uses it instead of the estimate.
   */
  measuredSurface?: { temperatureC: number; basis: string };
  /** The latest discharge bench run: delivered charge and energy at the pack terminals, mean V² of the log. */
  measuredDischarge?: { ampHours: number; wattHours?: number; meanSquareVolts?: number; durationSeconds?: number; basis: string };
  /** Cell internal resistance (DC method), with where it comes from. */
  cellInternalResistance?: { ohms: number; basis: string };
  /** The latest power-bank bench run: conversion efficiency and the energy delivered at the output. */
  powerBankRun?: { efficiency: number; deliveredWh: number; outputVolts?: number; basis: string };
}

/** A derived figure with how it was obtained. */
export interface Figure extends Explained<number | string> {
  /** Stable key, e.g. 'load.power', 'load.heater-1.power', 'trace.t1.rating'. */
  key: string;
  label: string;
}

/** A proposed finding the engineer can accept or dismiss. */
export interface Suggestion {
  /** Stable key, e.g. 'thermal.no-sensor'. */
  key: string;
  title: string;
  kind: SuggestionKind;
  severity: SuggestionSeverity;
  detail: string;
}

export interface TeardownFiguresResult {
  figures: Figure[];
  suggestions: Suggestion[];
}

/** Defaults the figures assume when the records are silent; each use is stated in the figure's assumptions. */
export const FIGURE_DEFAULTS = {
  converterEfficiency: 0.9,
  capacityWarnFraction: 0.9,
  contactSeconds: 60,
  ambientC: 25,
  traceRiseC: 10,
  surfaceMaterial: 'metal' as SurfaceMaterial,
} as const;

export const HOT_SURFACE_CAUTION =
  'Hot surface: measure the real surface temperature with a thermocouple before anyone holds the device, keep skin contact short, ' +
  "and follow the lab's safety rules. These figures are estimates for engineering judgement, not certification results.";

const LOAD_KINDS: readonly LoadKind[] = ['heater', 'motor', 'led', 'usb-output', 'other'];
const TOPOLOGIES: readonly ConverterTopology[] = ['buck', 'boost', 'buck-boost'];
const ROLES: readonly ConverterRole[] = ['charge', 'output', 'load'];
const SENSOR_CATEGORY = /sensor|thermistor|ntc|thermocouple/i;

function requireOneOf<T extends string>(value: T, allowed: readonly T[], name: string): T {
  if (!allowed.includes(value)) {
    throw new RangeError(`${name} must be one of ${allowed.join(', ')} (got "${String(value)}").`);
  }
  return value;
}

function requireId(value: string, name: string, seen: Set<string>): string {
  if (typeof value !== 'string' || value.trim() === '') throw new RangeError(`${name} needs an id.`);
  if (seen.has(value)) throw new RangeError(`${name}: the id "${value}" is used twice.`);
  seen.add(value);
  return value;
}

function figure(
  key: string,
  label: string,
  value: number | string,
  unit: string,
  family: FormulaKey,
  inputs: FigureInput[],
  assumptions: string[] = [],
  warnings: string[] = [],
): Figure {
  const { formula, source } = formulaOf(family);
  return { key, label, value, unit, formula, source, inputs, assumptions, warnings };
}

const fmt = (x: number, digits = 2) => Number(x.toFixed(digits)).toString();

interface PackInfo {
  p: TeardownPack;
  volts: number;
  ratedAh: number;
  energyWh: number;
}

interface ConverterInfo {
  c: TeardownConverter;
  eta: number;
  note?: string;
}

interface LoadInfo {
  load: TeardownLoad;
  name: string;
  r: LoadPowerResult;
  supplyVolts: number;
  supplyNote?: string;
  converter?: ConverterInfo;
  eta: number;
  packWatts: number;
  packAmps: number;
  avgWatts: number;
  avgPackWatts: number;
}

/** Emissivity for the radiation part of the surface estimate: painted, anodised or plastic surfaces [CP]. */
const RADIATING_EMISSIVITY = 0.9;

interface HeaterInfo {
  info: LoadInfo;
  area: number;
  density: number;
  rise: number;
  riseFull: number;
  surface: number;
  material: SurfaceMaterial;
  materialAssumed: boolean;
  threshold: ReturnType<typeof burnThresholdDetail>;
  margin: number;
  /** Set when the surface temperature was measured rather than estimated. */
  measuredBasis?: string;
}

function readPack(p: TeardownPack): PackInfo {
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

function readConverter(c: TeardownConverter): ConverterInfo {
  const name = `Converter "${c.id}"`;
  requireOneOf(c.topology, TOPOLOGIES, `${name} topology`);
  requireOneOf(c.role, ROLES, `${name} role`);
  requirePositive(c.vin, `${name} input voltage (V)`);
  requirePositive(c.vout, `${name} output voltage (V)`);
  requireOneOf(c.efficiencySource, ['measured', 'assumed'], `${name} efficiency source`);
  if (c.chargeCurrentA !== undefined) requirePositive(c.chargeCurrentA, `${name} charge current (A)`);
  if (c.efficiency === undefined) {
    return {
      c,
      eta: FIGURE_DEFAULTS.converterEfficiency,
      note: `Efficiency of converter "${c.id}" assumed ${FIGURE_DEFAULTS.converterEfficiency} (not recorded).`,
    };
  }
  requirePositive(c.efficiency, `${name} efficiency`);
  requireFraction(c.efficiency, `${name} efficiency`);
  return c.efficiencySource === 'assumed'
    ? { c, eta: c.efficiency, note: `Efficiency of converter "${c.id}" assumed ${c.efficiency} (not measured).` }
    : { c, eta: c.efficiency };
}

function readLoad(
  load: TeardownLoad,
  index: number,
  pack: PackInfo | undefined,
  converters: Map<string, ConverterInfo>,
  skipped: string[],
): LoadInfo | undefined {
  const name = `Load "${load.label || load.id || index + 1}"`;
  requireOneOf(load.kind, LOAD_KINDS, `${name} kind`);
  requireInteger(load.count, `${name} element count`);
  requireConnection(load.connection, `${name} connection`);
  requireFraction(load.duty, `${name} duty`);
  if (load.heatedAreaM2 !== undefined) requirePositive(load.heatedAreaM2, `${name} heated area (m²)`);
  if (load.surfaceMaterial !== undefined) requireOneOf(load.surfaceMaterial, SURFACE_MATERIALS, `${name} surface material`);

  let converter: ConverterInfo | undefined;
  if (load.converterId !== undefined) {
    converter = converters.get(load.converterId);
    if (!converter) throw new RangeError(`${name} refers to converter "${load.converterId}", which is not in this teardown.`);
  }
  let supply: number;
  let supplyNote: string | undefined;
  if (load.supplyVolts !== undefined) {
    supply = requirePositive(load.supplyVolts, `${name} supply voltage (V)`);
  } else if (converter) {
    supply = converter.c.vout;
    supplyNote = `${name} supply taken as the ${fmt(supply)} V output of converter "${converter.c.id}".`;
  } else if (pack) {
    supply = pack.volts;
    supplyNote = `${name} supply taken as the pack nominal voltage, ${fmt(supply)} V.`;
  } else {
    skipped.push(`${name} left out: no supply voltage, converter or pack recorded.`);
    return undefined;
  }
  if (load.resistanceOhms === undefined && load.currentAmps === undefined && load.powerWatts === undefined) {
    skipped.push(`${name} left out: no element resistance, current or power recorded.`);
    return undefined;
  }
  const r = loadPower({
    count: load.count,
    connection: load.connection,
    resistanceOhms: load.resistanceOhms,
    currentAmps: load.currentAmps,
    powerWatts: load.powerWatts,
    supplyVolts: supply,
  });
  const eta = converter ? converter.eta : 1;
  const packWatts = r.totalWatts / eta;
  const packAmps = converter ? packWatts / converter.c.vin : r.totalAmps;
  const avgWatts = r.totalWatts * load.duty;
  return { load, name, r, supplyVolts: supply, supplyNote, converter, eta, packWatts, packAmps, avgWatts, avgPackWatts: avgWatts / eta };
}

function elementInputs(info: LoadInfo): FigureInput[] {
  const { load, r } = info;
  const described: FigureInput =
    r.basis === 'resistance'
      ? { label: 'Element resistance', value: r.elementOhms, unit: 'Ω' }
      : r.basis === 'current'
        ? { label: 'Element current', value: load.currentAmps as number, unit: 'A' }
        : { label: 'Element power', value: load.powerWatts as number, unit: 'W' };
  return [
    { label: 'Elements', value: load.count },
    { label: 'Connection', value: load.connection },
    described,
    { label: 'Supply voltage', value: info.supplyVolts, unit: 'V' },
  ];
}

function loadAssumptions(info: LoadInfo): string[] {
  const out: string[] = [];
  if (info.supplyNote) out.push(info.supplyNote);
  if (info.r.basis === 'current') out.push(`${info.name} treated as resistive at its measured current.`);
  if (info.r.basis === 'power') out.push(`${info.name} treated as resistive at its stated power.`);
  return out;
}

function unique(list: string[]): string[] {
  return [...new Set(list)];
}

function claimAgainstMass(pack: PackInfo, claims: NonNullable<TeardownFigureInput['claims']>): LabelClaimCheck | undefined {
  if (pack.p.packMassKg === undefined) return undefined;
  const onLabel = claims.capacityWh !== undefined || claims.capacityAh !== undefined;
  const claimedWh = claims.capacityWh ?? (claims.capacityAh !== undefined ? claims.capacityAh * pack.volts : pack.energyWh);
  return { basis: onLabel ? 'label' : 'cell-rating', plausibility: labelCapacityPlausibility({ claimedWh, cellMassKg: pack.p.packMassKg, chemistry: pack.p.chemistry }) };
}

/** A capacity claim checked against the pack mass: what was checked (the device label, or the cell rating without one) and the result. */
export interface LabelClaimCheck {
  basis: 'label' | 'cell-rating';
  plausibility: ReturnType<typeof labelCapacityPlausibility>;
}

/**
 * The check behind the capacity.implausible suggestion's mass reason, on its own: the label claim
 * (Wh, or Ah × pack nominal voltage; the cell rating when the label is silent) against what the
 * pack mass allows for its chemistry. Undefined without a pack or a pack mass.
 */
export function labelClaimCheck(input: Pick<TeardownFigureInput, 'pack' | 'claims'>): LabelClaimCheck | undefined {
  return input.pack ? claimAgainstMass(readPack(input.pack), input.claims ?? {}) : undefined;
}

/** Derived figures and suggested findings of a teardown, computed from its stored records. */
export function teardownFigures(input: TeardownFigureInput): TeardownFiguresResult {
  const figures: Figure[] = [];
  const suggestions: Suggestion[] = [];
  const loads = input.loads ?? [];
  const convertersIn = input.converters ?? [];
  const traces = input.traces ?? [];
  const categories = input.partCategories ?? [];
  if (!Array.isArray(loads)) throw new RangeError('Loads must be a list.');
  if (!Array.isArray(convertersIn)) throw new RangeError('Converters must be a list.');
  if (!Array.isArray(traces)) throw new RangeError('Traces must be a list.');
  if (!Array.isArray(categories)) throw new RangeError('Part categories must be a list.');

  const warnFraction = requireFraction(input.capacityWarnFraction ?? FIGURE_DEFAULTS.capacityWarnFraction, 'Capacity warning fraction');
  const contactSeconds = requirePositive(input.contactSeconds ?? FIGURE_DEFAULTS.contactSeconds, 'Contact time (s)');
  const ambientC = requireFinite(input.ambientC ?? FIGURE_DEFAULTS.ambientC, 'Ambient temperature (°C)');
  if (input.measuredCapacityAh !== undefined) requireNonNegative(input.measuredCapacityAh, 'Measured capacity (Ah)');
  const claims = input.claims ?? {};
  if (claims.capacityAh !== undefined) requirePositive(claims.capacityAh, 'Claimed capacity (Ah)');
  if (claims.capacityWh !== undefined) requirePositive(claims.capacityWh, 'Claimed energy (Wh)');
  if (claims.runtimeH !== undefined) requirePositive(claims.runtimeH, 'Claimed runtime (h)');
  if (claims.outputWatts !== undefined) requirePositive(claims.outputWatts, 'Claimed output power (W)');

  // Pack
  const pack = input.pack ? readPack(input.pack) : undefined;
  if (pack) {
    const { p } = pack;
    figures.push(
      figure(
        'pack.energy',
        'Pack energy',
        pack.energyWh,
        'Wh',
        'pack.energy',
        [
          { label: 'Cell nominal voltage', value: p.cellNominalVolts, unit: 'V' },
          { label: 'Cell rated capacity', value: p.cellRatedAh, unit: 'Ah' },
          { label: 'Cells in series', value: p.series },
          { label: 'Cells in parallel', value: p.parallel },
        ],
        ['Rated (label) capacity at nominal voltage.'],
      ),
    );
    if (isLithiumChemistry(p.chemistry)) {
      const cls = airTransportClass(pack.energyWh);
      figures.push(
        figure(
          'pack.transportClass',
          'Air-transport class',
          cls,
          '',
          'pack.transportClass',
          [{ label: 'Pack energy', value: pack.energyWh, unit: 'Wh' }],
          ['Watt-hour rating from the rated capacity at nominal voltage, as the regulations use it.'],
          [
            AIR_TRANSPORT_CLASS_TEXT[cls],
            'The battery type must pass UN Manual of Tests and Criteria 38.3 (T.1–T.8), with a test summary available.',
          ],
        ),
      );
    }
  }

  // Mass plausibility of the label claim
  const claimCheck = pack ? claimAgainstMass(pack, claims) : undefined;
  const plausibility = claimCheck?.plausibility;
  const claimBasis = claimCheck?.basis === 'label' ? 'the device label' : 'the cell rating';
  if (pack && plausibility && pack.p.packMassKg !== undefined) {
    const se = specificEnergyWhPerKg(pack.energyWh, pack.p.packMassKg);
    figures.push(
      figure(
        'pack.specificEnergy',
        'Pack specific energy',
        se,
        'Wh/kg',
        'pack.specificEnergy',
        [
          { label: 'Pack energy', value: pack.energyWh, unit: 'Wh' },
          { label: 'Pack mass', value: pack.p.packMassKg, unit: 'kg' },
        ],
        [`Plausibility limit for ${pack.p.chemistry}: ${plausibility.source}.`],
        se > plausibility.limitWhPerKg
          ? [`${fmt(se, 0)} Wh/kg is beyond what ${pack.p.chemistry} cells reach (${plausibility.limitWhPerKg} Wh/kg).`]
          : [],
      ),
    );
  }

  // Converters
  const converters = new Map<string, ConverterInfo>();
  const converterIds = new Set<string>();
  convertersIn.forEach((c, i) => {
    requireId(c.id, `Converter ${i + 1}`, converterIds);
    converters.set(c.id, readConverter(c));
  });

  // Loads
  const loadIds = new Set<string>();
  const skipped: string[] = [];
  const computed: LoadInfo[] = [];
  loads.forEach((load, i) => {
    requireId(load.id, `Load ${i + 1}`, loadIds);
    const info = readLoad(load, i, pack, converters, skipped);
    if (info) computed.push(info);
  });
  const efficiencyNotes = unique(computed.flatMap((l) => (l.converter?.note ? [l.converter.note] : [])));

  for (const info of computed) {
    const { load, r } = info;
    figures.push(
      figure(
        `load.${load.id}.power`,
        `${load.label} power (full duty)`,
        r.totalWatts,
        'W',
        'load.power',
        [...elementInputs(info), { label: 'Equivalent resistance', value: r.equivalentOhms, unit: 'Ω' }],
        loadAssumptions(info),
      ),
      figure(
        `load.${load.id}.elementPower`,
        `${load.label} power per element`,
        r.elementWatts,
        'W',
        'load.elementPower',
        [...elementInputs(info), { label: 'Element voltage', value: r.elementVolts, unit: 'V' }],
        loadAssumptions(info),
      ),
    );
  }

  if (computed.length > 0) {
    const perLoad = (f: (l: LoadInfo) => number, unit: string): FigureInput[] =>
      computed.map((l) => ({ label: l.load.label, value: f(l), unit }));
    const allAssumptions = unique(computed.flatMap(loadAssumptions));
    figures.push(
      figure(
        'load.power',
        'Total load power (full duty)',
        computed.reduce((s, l) => s + l.r.totalWatts, 0),
        'W',
        'load.power',
        perLoad((l) => l.r.totalWatts, 'W'),
        [...allAssumptions, ...skipped],
      ),
      figure(
        'load.averagePower',
        'Average load power (at the recorded duty)',
        computed.reduce((s, l) => s + l.avgWatts, 0),
        'W',
        'load.averagePower',
        [...perLoad((l) => l.r.totalWatts, 'W'), ...computed.map((l) => ({ label: `${l.load.label} duty`, value: l.load.duty }))],
        ['Ideal PWM: average power = duty × full-duty power.', ...skipped],
      ),
    );
  }

  let packAmps: number | undefined;
  if (pack && computed.length > 0) {
    packAmps = computed.reduce((s, l) => s + l.packAmps, 0);
    figures.push(
      figure(
        'load.current',
        'Current from the pack (full duty)',
        packAmps,
        'A',
        'load.current',
        computed.map((l) => ({ label: l.load.label, value: l.packAmps, unit: 'A' })),
        [...efficiencyNotes, 'Loads wired straight to the pack draw their own current (efficiency 1).', ...skipped],
      ),
    );
    const rate = cRate(packAmps, pack.ratedAh);
    figures.push(
      figure(
        'pack.cRate',
        'Discharge rate at full load',
        rate,
        'C',
        'pack.cRate',
        [
          { label: 'Current from the pack', value: packAmps, unit: 'A' },
          { label: 'Pack rated capacity', value: pack.ratedAh, unit: 'Ah' },
        ],
        [],
        rate > 1 ? ["Discharge above 1 C: check the cell maker's rated continuous discharge current."] : [],
      ),
    );
  }

  // Runtime
  const avgPackWatts = computed.reduce((s, l) => s + l.avgPackWatts, 0);
  if (pack && avgPackWatts > 0) {
    let capacityAh = pack.ratedAh;
    let basis = 'rated (label) capacity';
    if (input.measuredCapacityAh !== undefined && input.measuredCapacityAh > 0) {
      capacityAh = input.measuredCapacityAh;
      basis = 'capacity measured in a bench run';
    } else if (pack.p.cellMeasuredAh !== undefined && pack.p.cellMeasuredAh > 0) {
      capacityAh = pack.p.cellMeasuredAh * pack.p.parallel;
      basis = 'measured cell capacity';
    }
    const energyWh = capacityAh * pack.volts;
    const hours = runtimeHours({ energyWh, loadWatts: avgPackWatts });
    const warnings: string[] = [];
    if (claims.runtimeH !== undefined && hours < 0.8 * claims.runtimeH) {
      warnings.push(
        `The label claims ${fmt(claims.runtimeH)} h; the estimate at the recorded duty is ${fmt(hours)} h (claims are often made at the lowest setting).`,
      );
    }
    figures.push(
      figure(
        'runtime.hours',
        'Runtime at the recorded duty',
        hours,
        'h',
        'runtime.hours',
        [
          { label: 'Pack energy', value: energyWh, unit: 'Wh' },
          { label: 'Average power drawn from the pack', value: avgPackWatts, unit: 'W' },
          ...(claims.runtimeH !== undefined ? [{ label: 'Claimed runtime', value: claims.runtimeH, unit: 'h' }] : []),
        ],
        [
          `Energy from the ${basis} at nominal voltage; usable fraction 1.`,
          ...efficiencyNotes,
          'Loads wired straight to the pack have efficiency 1.',
          ...skipped,
        ],
        warnings,
      ),
    );
  }

  // Power-bank output
  const usbOut = [...converters.values()].find((c) => c.c.role === 'output' && c.c.vout >= 4.75 && c.c.vout <= 5.25);
  if (pack && usbOut) {
    figures.push(
      figure(
        'powerbank.outputAh',
        `Capacity at the ${fmt(usbOut.c.vout)} V output`,
        powerBankOutputAh({ energyWh: pack.energyWh, outputVolts: usbOut.c.vout, efficiency: usbOut.eta }),
        'Ah',
        'powerbank.outputAh',
        [
          { label: 'Pack energy', value: pack.energyWh, unit: 'Wh' },
          { label: 'Output voltage', value: usbOut.c.vout, unit: 'V' },
          { label: 'Converter efficiency', value: usbOut.eta },
        ],
        ['Rated capacity is quoted at cell voltage; the output figure is what reaches the USB port.', ...(usbOut.note ? [usbOut.note] : [])],
      ),
    );
  }

  // Charge time
  const charger = [...converters.values()].find((c) => c.c.role === 'charge' && c.c.chargeCurrentA !== undefined);
  if (pack && charger) {
    const current = charger.c.chargeCurrentA as number;
    const est = chargeTimeEstimate({ capacityAh: pack.ratedAh, chargeCurrentA: current });
    const warnings: string[] = [];
    const table = pack.p.chemistry === 'other' ? undefined : CELL_VOLTAGES[pack.p.chemistry];
    const cellLimit = pack.p.cellMaxVolts ?? table?.chargeV ?? undefined;
    if (cellLimit !== undefined && cellLimit !== null && charger.c.vout > cellLimit * pack.p.series * 1.01) {
      warnings.push(
        `Charge converter output ${fmt(charger.c.vout)} V is above the ${fmt(cellLimit * pack.p.series)} V charge limit of the pack: check the charger.`,
      );
    }
    figures.push(
      figure(
        'charge.timeHours',
        'Charge time from empty (estimate)',
        est.totalHours,
        'h',
        'charge.timeHours',
        [
          { label: 'Pack rated capacity', value: pack.ratedAh, unit: 'Ah' },
          { label: 'Charge current', value: current, unit: 'A' },
          { label: 'Constant-current phase', value: est.ccHours, unit: 'h' },
          { label: 'Constant-voltage taper', value: est.cvHours, unit: 'h' },
        ],
        [
          'Rough CC-CV estimate: constant current to 80 % of capacity [CP], then an exponential taper to C/20.',
          'Charger and cell losses are ignored; a real charge takes longer.',
        ],
        warnings,
      ),
    );
  }

  // Heaters. Heat leaves the heated area by free convection (h = 10 W/m²K [S: Çengel]) and by
  // radiation, linearised at ambient: h_rad = 4εσT³ with ε = 0.9 (REFERENCES §7 [C]).
  const hRadiation = radiativeHeatTransferCoefficient(RADIATING_EMISSIVITY, ambientC + 273.15);
  const hTotal = DEFAULT_CONVECTION_H + hRadiation;
  const heaters: HeaterInfo[] = computed
    .filter((l) => l.load.kind === 'heater' && l.load.heatedAreaM2 !== undefined)
    .map((info) => {
      const area = info.load.heatedAreaM2 as number;
      const material = info.load.surfaceMaterial ?? FIGURE_DEFAULTS.surfaceMaterial;
      const rise = surfaceTemperatureRiseC({ watts: info.avgWatts, areaM2: area, hWPerM2K: hTotal });
      const threshold = burnThresholdDetail({ material, contactSeconds });
      const surface = ambientC + rise;
      return {
        info,
        area,
        density: powerDensityWPerCm2(info.r.totalWatts, area),
        rise,
        riseFull: surfaceTemperatureRiseC({ watts: info.r.totalWatts, areaM2: area, hWPerM2K: hTotal }),
        surface,
        material,
        materialAssumed: info.load.surfaceMaterial === undefined,
        threshold,
        margin: threshold.thresholdC - surface,
      };
    });
  // A bench measurement beats the estimate: the hottest heater's margin uses it.
  if (input.measuredSurface && heaters.length > 0) {
    requireFinite(input.measuredSurface.temperatureC, 'Measured surface temperature (°C)');
    const worst = heaters.reduce((a, b) => (b.margin < a.margin ? b : a));
    worst.surface = input.measuredSurface.temperatureC;
    worst.margin = worst.threshold.thresholdC - worst.surface;
    worst.measuredBasis = input.measuredSurface.basis;
  }
  const heaterFigures = (h: HeaterInfo, prefix: string, labelPrefix: string): Figure[] => {
    const { info } = h;
    const marginWarnings =
      h.margin < 0
        ? [
            `${h.measuredBasis ? 'Measured' : 'Estimated'} surface ${fmt(h.surface, 1)} °C is above the ${h.threshold.thresholdC} °C burn threshold for ${fmt(contactSeconds, 0)} s contact with ${h.material}.`,
            HOT_SURFACE_CAUTION,
          ]
        : [];
    return [
      figure(
        `${prefix}.powerDensity`,
        `${labelPrefix}power density (full duty)`,
        h.density,
        'W/cm²',
        'heater.powerDensity',
        [
          { label: `${info.load.label} power`, value: info.r.totalWatts, unit: 'W' },
          { label: 'Heated area', value: h.area, unit: 'm²' },
        ],
      ),
      figure(
        `${prefix}.surfaceRise`,
        `${labelPrefix}surface temperature rise (steady, estimate)`,
        h.rise,
        '°C',
        'heater.surfaceRise',
        [
          { label: `${info.load.label} average power`, value: info.avgWatts, unit: 'W' },
          { label: 'Duty', value: info.load.duty },
          { label: 'Heated area', value: h.area, unit: 'm²' },
          { label: 'Heat-transfer coefficient (convection + radiation)', value: Number(hTotal.toFixed(2)), unit: 'W/m²K' },
        ],
        [
          `h = ${DEFAULT_CONVECTION_H} W/m²K free convection (2–25 W/m²K in air [S]) + ${fmt(hRadiation, 2)} W/m²K radiation (4εσT³, ε ${RADIATING_EMISSIVITY} at ambient [C]); bare polished metal radiates far less, heat that spreads into a larger shell lowers the real temperature, and a hand or pocket holds heat in and raises it.`,
          `Steady state at the recorded duty; at full duty the rise would be ${fmt(h.riseFull, 1)} °C.`,
          'Estimate for engineering judgement, not a certification result.',
        ],
      ),
      figure(
        `${prefix}.touchMargin`,
        `${labelPrefix}margin to the burn threshold`,
        h.margin,
        '°C',
        'heater.touchMargin',
        [
          ...(h.measuredBasis
            ? [
                { label: 'Measured surface temperature', value: h.surface, unit: '°C' },
                { label: 'Measured in', value: h.measuredBasis },
                { label: 'Estimated surface temperature (for comparison)', value: ambientC + h.rise, unit: '°C' },
              ]
            : [
                { label: 'Ambient', value: ambientC, unit: '°C' },
                { label: 'Surface rise', value: h.rise, unit: '°C' },
                { label: 'Estimated surface temperature', value: h.surface, unit: '°C' },
              ]),
          { label: 'Surface material', value: h.material },
          { label: 'Contact time', value: contactSeconds, unit: 's' },
          { label: 'Burn threshold', value: h.threshold.thresholdC, unit: '°C' },
        ],
        [
          h.threshold.source,
          'For a contact time between listed durations the next longer listed duration is used (conservative).',
          ...(input.ambientC === undefined ? [`Ambient ${FIGURE_DEFAULTS.ambientC} °C assumed.`] : []),
          ...(input.contactSeconds === undefined ? [`Contact time ${FIGURE_DEFAULTS.contactSeconds} s assumed for a hand-held heater.`] : []),
          ...(h.materialAssumed ? [`Surface material not recorded; metal assumed (the lowest thresholds).`] : []),
        ],
        marginWarnings,
      ),
    ];
  };
  if (heaters.length > 0) {
    const worst = heaters.reduce((a, b) => (b.margin < a.margin ? b : a));
    const summaryPrefix = heaters.length > 1 ? `Hottest heater (${worst.info.load.label}): ` : 'Heater ';
    figures.push(...heaterFigures(worst, 'heater', summaryPrefix));
    if (heaters.length > 1) {
      for (const h of heaters) figures.push(...heaterFigures(h, `heater.${h.info.load.id}`, `${h.info.load.label} `));
    }
  }

  // Capacity: measured against label
  const measuredAh =
    input.measuredCapacityAh ??
    (pack && pack.p.cellMeasuredAh !== undefined ? pack.p.cellMeasuredAh * pack.p.parallel : undefined);
  let labelAh: number | undefined;
  let labelBasis = '';
  if (claims.capacityAh !== undefined) {
    labelAh = claims.capacityAh;
    labelBasis = 'capacity claimed on the device label';
  } else if (claims.capacityWh !== undefined && pack) {
    labelAh = claims.capacityWh / pack.volts;
    labelBasis = `energy claimed on the device label ÷ pack nominal ${fmt(pack.volts)} V`;
  } else if (pack) {
    labelAh = pack.ratedAh;
    labelBasis = 'rated capacity of the cells';
  }
  let capacityRatio: number | undefined;
  if (measuredAh !== undefined && labelAh !== undefined) {
    capacityRatio = measuredAh / labelAh;
    figures.push(
      figure(
        'capacity.measuredVsLabel',
        'Measured capacity against the label',
        capacityRatio * 100,
        '%',
        'capacity.measuredVsLabel',
        [
          { label: 'Measured capacity', value: measuredAh, unit: 'Ah' },
          { label: 'Label capacity', value: labelAh, unit: 'Ah' },
        ],
        [`Label from the ${labelBasis}.`, 'Measured capacity taken at the pack terminals.'],
        capacityRatio < warnFraction
          ? [`Measured capacity is ${fmt(capacityRatio * 100, 1)} % of the label, below the ${fmt(warnFraction * 100, 0)} % warning level.`]
          : [],
      ),
    );
  }

  // Traces
  const traceIds = new Set<string>();
  const overRated: { t: TeardownTrace; rating: number; rise: number }[] = [];
  traces.forEach((t, i) => {
    requireId(t.id, `Trace ${i + 1}`, traceIds);
    const name = `Trace "${t.label || t.id}"`;
    requireOneOf(t.layer, ['external', 'internal'], `${name} layer`);
    const current = requireNonNegative(t.currentA, `${name} current (A)`);
    const rise = requirePositive(t.allowedRiseC ?? FIGURE_DEFAULTS.traceRiseC, `${name} allowed temperature rise (°C)`);
    const rating = ipc2221MaxCurrent({ widthM: t.widthM, thicknessM: t.thicknessM, temperatureRiseC: rise, layer: t.layer });
    const resistance = copperTraceResistance({ lengthM: t.lengthM, widthM: t.widthM, thicknessM: t.thicknessM });
    const warnings = ipc2221RangeWarnings({ currentA: current, widthM: t.widthM, temperatureRiseC: rise });
    if (current > rating) {
      overRated.push({ t, rating, rise });
      warnings.unshift(`${name} carries ${fmt(current, 3)} A, above its ${fmt(rating, 3)} A rating for a ${fmt(rise, 0)} °C rise.`);
    }
    const geometry: FigureInput[] = [
      { label: 'Width', value: t.widthM, unit: 'm' },
      { label: 'Copper thickness', value: t.thicknessM, unit: 'm' },
    ];
    figures.push(
      figure(
        `trace.${t.id}.rating`,
        `${t.label} IPC-2221 current rating`,
        rating,
        'A',
        'trace.rating',
        [...geometry, { label: 'Layer', value: t.layer }, { label: 'Allowed rise', value: rise, unit: '°C' }, { label: 'Current carried', value: current, unit: 'A' }],
        [
          ...(t.allowedRiseC === undefined ? [`Allowed temperature rise ${FIGURE_DEFAULTS.traceRiseC} °C assumed.`] : []),
          '1 oz/ft² copper taken as 35 µm = 1.378 mil.',
        ],
        warnings,
      ),
      figure(
        `trace.${t.id}.resistance`,
        `${t.label} resistance at 20 °C`,
        resistance,
        'Ω',
        'trace.resistance',
        [{ label: 'Length', value: t.lengthM, unit: 'm' }, ...geometry, { label: 'Loss at the current carried', value: current * current * resistance, unit: 'W' }],
        [
          'IACS annealed copper, ρ = 1.7241e-8 Ω·m at 20 °C, α = 0.00393 /K.',
          `Pure copper (CRC, 1.678e-8 Ω·m) would give ${fmt(copperTraceResistance({ lengthM: t.lengthM, widthM: t.widthM, thicknessM: t.thicknessM, resistivityOhmM: COPPER_RESISTIVITY_PURE }), 5)} Ω.`,
        ],
      ),
    );
  });

  // Suggestions, in a fixed order
  const heaterLoads = loads.filter((l) => l.kind === 'heater');
  const hasSensor = categories.some((c) => typeof c === 'string' && SENSOR_CATEGORY.test(c));
  if (heaterLoads.length > 0 && !hasSensor) {
    suggestions.push({
      key: 'thermal.no-sensor',
      title: 'Heater without temperature sensing',
      kind: 'safety',
      severity: 'major',
      detail:
        `The device drives ${heaterLoads.map((l) => `"${l.label}"`).join(', ')} but no part is recorded as a sensor. ` +
        'PWM regulation without feedback sets only the average power, not the temperature: nothing limits the surface ' +
        'temperature when the device is covered, pressed against skin or left in a pocket. A thermistor on the heated ' +
        'surface read by the controller, and a thermal cut-off, would bound it.',
    });
  }
  const burning = heaters.filter((h) => h.margin < 0);
  if (burning.length > 0) {
    suggestions.push({
      key: 'thermal.touch-margin',
      title: 'Surface can pass the burn threshold',
      kind: 'safety',
      severity: hasSensor ? 'major' : 'critical',
      detail:
        burning
          .map(
            (h) =>
              `"${h.info.load.label}": ${h.measuredBasis ? `measured ${fmt(h.surface, 1)} °C (${h.measuredBasis})` : `estimated ${fmt(h.surface, 1)} °C`} against ${h.threshold.thresholdC} °C for ${fmt(contactSeconds, 0)} s contact with ${h.material} (margin ${fmt(h.margin, 1)} °C).`,
          )
          .join(' ') +
        ' ' +
        HOT_SURFACE_CAUTION,
    });
  }
  if (pack && isLithiumChemistry(pack.p.chemistry) && !pack.p.protection) {
    suggestions.push({
      key: 'pack.no-protection',
      title: 'Lithium pack without protection',
      kind: 'safety',
      severity: 'major',
      detail:
        `No protection circuit is recorded for the ${pack.p.chemistry} pack. Without over-charge, over-discharge, over-current ` +
        'and short-circuit protection a single fault can drive a cell into thermal runaway. Check whether the charger IC ' +
        'covers these functions; otherwise a protection IC with its switches, or protected cells, are needed.',
    });
  }
  if (pack && isLithiumChemistry(pack.p.chemistry) && pack.energyWh > 100) {
    const cls = airTransportClass(pack.energyWh);
    suggestions.push({
      key: 'pack.over-100wh',
      title: 'Pack over 100 Wh',
      kind: 'compliance',
      severity: cls === 'over-160-wh' ? 'major' : 'minor',
      detail: `The pack is rated ${fmt(pack.energyWh, 1)} Wh. ${AIR_TRANSPORT_CLASS_TEXT[cls]} Shipping and labelling rules for this class apply.`,
    });
  }
  const capacityReasons: string[] = [];
  if (pack && plausibility && !plausibility.plausible) {
    const grams = (pack.p.packMassKg as number) * 1000;
    capacityReasons.push(
      `The capacity on ${claimBasis} (${fmt(plausibility.claimedWh, 1)} Wh) in a ${fmt(grams, 0)} g pack ` +
        `would be ${fmt(plausibility.specificEnergyWhPerKg, 0)} Wh/kg, beyond the ${plausibility.limitWhPerKg} Wh/kg that ${pack.p.chemistry} cells reach.`,
    );
  }
  if (capacityRatio !== undefined && capacityRatio < warnFraction) {
    capacityReasons.push(
      `The measured capacity is ${fmt(capacityRatio * 100, 1)} % of the ${labelBasis}, below the ${fmt(warnFraction * 100, 0)} % warning level.`,
    );
  }
  if (capacityReasons.length > 0) {
    suggestions.push({
      key: 'capacity.implausible',
      title: 'Label capacity not supported',
      kind: 'compliance',
      severity: 'major',
      detail: `${capacityReasons.join(' ')} Rated capacity must be delivered at 0.2 C and 20 ± 5 °C (IEC 61960-3).`,
    });
  }
  if (overRated.length > 0) {
    suggestions.push({
      key: 'trace.over-rating',
      title: 'Trace above its IPC-2221 rating',
      kind: 'reliability',
      severity: 'major',
      detail:
        overRated
          .map(({ t, rating, rise }) => `"${t.label}" carries ${fmt(t.currentA, 3)} A against ${fmt(rating, 3)} A for a ${fmt(rise, 0)} °C rise.`)
          .join(' ') + ' Widen the copper, use heavier copper, or accept and verify a larger temperature rise.',
    });
  }

  return { figures, suggestions };
}
