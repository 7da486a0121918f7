import type { EntityManager } from '@mikro-orm/sqlite';
import {
  CONVERTER_FIELDS,
  INTERNAL_RESISTANCE_READING_FIELDS,
  MODE_FIELDS,
  CONVERTER_ROLE,
  CONVERTER_TOPOLOGY,
  LITHIUM_CHEMISTRIES,
  LOAD_FIELDS,
  LOAD_KIND,
  PACK_FIELDS,
  type ConverterDto,
  type LoadDto,
  type ModeDto,
  type PackDto,
} from '@splitcase/contracts';
import { ConverterSchema, type Converter } from './converter.entity';
import { LoadSchema, type Load } from './load.entity';
import { ModeLoadSchema, type ModeLoad } from './mode-load.entity';
import { OperatingModeSchema, type OperatingMode } from './mode.entity';
import { PackSchema, type Pack } from './pack.entity';
import type { FieldRule } from './quantities';

/** Doubles come back as numbers from SQLite; the ORM types them loosely. */
const num = (v: unknown): number | null => (v === null || v === undefined ? null : Number(v));
const req = (v: unknown): number => Number(v);
const idOf = (ref: unknown) => (ref && typeof ref === 'object' ? (ref as { id: number }).id : (ref as number));

export function toPackDto(p: Pack): PackDto {
  return {
    id: p.id,
    teardownId: idOf(p.teardown),
    chemistry: p.chemistry,
    cellFormat: p.cellFormat ?? null,
    nominalVolts: req(p.cellNominalVolts),
    maxVolts: num(p.cellMaxVolts),
    capacityAh: req(p.cellRatedAh),
    measuredCapacityAh: num(p.cellMeasuredAh),
    series: p.series,
    parallel: p.parallel,
    massKg: num(p.packMassKg),
    protection: p.protection,
    joining: p.joining ?? null,
    internalResistanceOhms: num(p.internalOhms),
    internalResistanceReadings: p.internalReadings ?? null,
    entered: p.entered ?? {},
    lithium: LITHIUM_CHEMISTRIES.includes(p.chemistry),
    updatedAt: p.updatedAt.toISOString(),
  };
}

export function toLoadDto(l: Load): LoadDto {
  return {
    id: l.id,
    teardownId: idOf(l.teardown),
    kind: l.kind,
    label: l.label,
    resistanceOhms: num(l.resistanceOhms),
    currentAmps: num(l.currentAmps),
    powerWatts: num(l.powerWatts),
    supplyVolts: num(l.supplyVolts),
    count: l.count,
    connection: l.connection,
    duty: req(l.duty),
    converterId: l.converter ? idOf(l.converter) : null,
    heatedAreaM2: num(l.heatedAreaM2),
    surfaceMaterial: l.surfaceMaterial ?? null,
    elementMaterial: l.elementMaterial ?? null,
    heatedMassKg: num(l.heatedMassKg),
    entered: l.entered ?? {},
    createdAt: l.createdAt.toISOString(),
  };
}

export function toModeDto(m: OperatingMode, loads: ModeLoad[]): ModeDto {
  return {
    id: m.id,
    teardownId: idOf(m.teardown),
    name: m.name,
    note: m.note ?? null,
    position: m.position,
    loads: loads.map((l) => ({ loadId: idOf(l.load), duty: req(l.duty) })),
    quiescentAmps: num(m.quiescentAmps),
    entered: m.entered ?? {},
    createdAt: m.createdAt.toISOString(),
  };
}

/** The modes of some teardowns with their loads, in order (two queries whatever the count). */
export async function modesOf(em: EntityManager, teardownIds: number[]): Promise<{ mode: OperatingMode; loads: ModeLoad[] }[]> {
  if (teardownIds.length === 0) return [];
  const modes = await em.find(OperatingModeSchema, { teardown: { $in: teardownIds } }, { orderBy: { position: 'asc', id: 'asc' } });
  const links = modes.length ? await em.find(ModeLoadSchema, { mode: { $in: modes.map((m) => m.id) } }, { orderBy: { id: 'asc' } }) : [];
  const byMode = new Map<number, ModeLoad[]>();
  for (const l of links) {
    const id = idOf(l.mode);
    byMode.set(id, [...(byMode.get(id) ?? []), l]);
  }
  return modes.map((mode) => ({ mode, loads: byMode.get(mode.id) ?? [] }));
}

export function toConverterDto(c: Converter): ConverterDto {
  return {
    id: c.id,
    teardownId: idOf(c.teardown),
    label: c.label,
    topology: c.topology,
    role: c.role,
    inputVolts: req(c.vin),
    outputVolts: req(c.vout),
    ratedCurrentAmps: num(c.ratedCurrentA),
    chargeCurrentAmps: num(c.chargeCurrentA),
    efficiency: num(c.efficiency),
    efficiencySource: c.efficiencySource,
    entered: c.entered ?? {},
    createdAt: c.createdAt.toISOString(),
  };
}

// ---- field rules (SI; typed text accepted) ----

// A JSON number is in SI (the API contract); text is read by the field's declaration, where a bare
// number is in the unit of the field's example ("46" pack mass = 46 g).
export const PACK_RULES = {
  nominalVolts: { field: PACK_FIELDS.nominalVolts, min: 0, above: true, max: 10, maxMessage: "at most 10 V: give one cell's voltage and the series count", required: true },
  maxVolts: { field: PACK_FIELDS.maxVolts, min: 0, above: true, max: 10, maxMessage: "at most 10 V: give one cell's charge voltage" },
  capacityAh: {
    field: PACK_FIELDS.capacityAh,
    min: 0,
    above: true,
    max: 1000,
    maxMessage: 'at most 1000 Ah for one cell — a number sent without a unit is in Ah; type "2700 mAh" for milliamp-hours',
    required: true,
  },
  measuredCapacityAh: {
    field: PACK_FIELDS.measuredCapacityAh,
    min: 0,
    above: true,
    max: 1000,
    maxMessage: 'at most 1000 Ah for one cell — a number sent without a unit is in Ah; type "2620 mAh" for milliamp-hours',
  },
  series: { field: PACK_FIELDS.series, min: 1, max: 1000 },
  parallel: { field: PACK_FIELDS.parallel, min: 1, max: 1000 },
  massKg: { field: PACK_FIELDS.massKg, min: 0, above: true, max: 100, maxMessage: 'at most 100 kg — type the mass with its unit, e.g. "46 g"' },
  internalResistanceOhms: { field: PACK_FIELDS.internalResistanceOhms, min: 0, above: true, max: 10, maxMessage: 'at most 10 Ω for one cell — type "50 mΩ" for milliohms' },
} satisfies Record<string, FieldRule>;

/** The two readings of the DC method (IEC 61960-3): cell voltage at a low and at a high current. */
export const INTERNAL_RESISTANCE_READING_RULES = {
  lowAmps: { field: INTERNAL_RESISTANCE_READING_FIELDS.lowAmps, min: 0, max: 1000, required: true },
  lowVolts: { field: INTERNAL_RESISTANCE_READING_FIELDS.lowVolts, min: 0, above: true, max: 10, required: true },
  highAmps: { field: INTERNAL_RESISTANCE_READING_FIELDS.highAmps, min: 0, above: true, max: 1000, required: true },
  highVolts: { field: INTERNAL_RESISTANCE_READING_FIELDS.highVolts, min: 0, above: true, max: 10, required: true },
} satisfies Record<string, FieldRule>;

export const MODE_RULES = {
  quiescentAmps: { field: MODE_FIELDS.quiescentAmps, min: 0, max: 10, maxMessage: 'at most 10 A — type "20 µA" for microamps' },
} satisfies Record<string, FieldRule>;
export const MODE_DUTY_RULE = { field: MODE_FIELDS.duty, min: 0, above: true, max: 1 } satisfies FieldRule;

export const LOAD_RULES = {
  resistanceOhms: { field: LOAD_FIELDS.resistanceOhms, min: 0, above: true },
  currentAmps: { field: LOAD_FIELDS.currentAmps, min: 0, above: true, max: 1000 },
  powerWatts: { field: LOAD_FIELDS.powerWatts, min: 0, above: true, max: 100_000 },
  supplyVolts: { field: LOAD_FIELDS.supplyVolts, min: 0, above: true, max: 1000 },
  count: { field: LOAD_FIELDS.count, min: 1, max: 1000 },
  duty: { field: LOAD_FIELDS.duty, min: 0, above: true, max: 1 },
  heatedAreaM2: { field: LOAD_FIELDS.heatedAreaM2, min: 0, above: true, max: 10, maxMessage: 'at most 10 m² — type the area with its unit, e.g. "27 cm²"' },
  heatedMassKg: { field: LOAD_FIELDS.heatedMassKg, min: 0, above: true, max: 100, maxMessage: 'at most 100 kg — type the mass with its unit, e.g. "40 g"' },
} satisfies Record<string, FieldRule>;

export const CONVERTER_RULES = {
  inputVolts: { field: CONVERTER_FIELDS.inputVolts, min: 0, above: true, max: 1000, required: true },
  outputVolts: { field: CONVERTER_FIELDS.outputVolts, min: 0, above: true, max: 1000, required: true },
  ratedCurrentAmps: { field: CONVERTER_FIELDS.ratedCurrentAmps, min: 0, above: true, max: 1000 },
  chargeCurrentAmps: { field: CONVERTER_FIELDS.chargeCurrentAmps, min: 0, above: true, max: 1000 },
  efficiency: { field: CONVERTER_FIELDS.efficiency, min: 0, above: true, max: 1 },
} satisfies Record<string, FieldRule>;

export const defaultLoadLabel = (kind: Load['kind']) => LOAD_KIND.labels[kind];
export const defaultConverterLabel = (topology: Converter['topology'], role: Converter['role']) => `${CONVERTER_TOPOLOGY.labels[topology]} — ${CONVERTER_ROLE.labels[role].toLowerCase()}`;

export async function powerSystem(em: EntityManager, teardownId: number) {
  const pack = await em.findOne(PackSchema, { teardown: teardownId });
  const loads = await em.find(LoadSchema, { teardown: teardownId }, { orderBy: { id: 'asc' } });
  const converters = await em.find(ConverterSchema, { teardown: teardownId }, { orderBy: { id: 'asc' } });
  const modes = await modesOf(em, [teardownId]);
  return {
    pack: pack ? toPackDto(pack) : null,
    loads: loads.map(toLoadDto),
    converters: converters.map(toConverterDto),
    modes: modes.map(({ mode, loads: l }) => toModeDto(mode, l)),
  };
}
