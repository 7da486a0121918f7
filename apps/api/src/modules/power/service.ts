import type { EntityManager } from '@mikro-orm/sqlite';
import {
  CONVERTER_ROLE,
  CONVERTER_TOPOLOGY,
  LITHIUM_CHEMISTRIES,
  LOAD_KIND,
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

export const PACK_RULES = {
  nominalVolts: { kind: 'voltage', min: 0, above: true, max: 10, maxMessage: "At most 10 V: give one cell's voltage and the series count", required: true },
  maxVolts: { kind: 'voltage', min: 0, above: true, max: 10, maxMessage: "At most 10 V: give one cell's charge voltage" },
  capacityAh: { kind: 'capacity', min: 0, above: true, max: 1000, maxMessage: 'At most 1000 Ah for one cell — a plain number is read in Ah; type "2700 mAh" for milliamp-hours', required: true },
  measuredCapacityAh: { kind: 'capacity', min: 0, above: true, max: 1000, maxMessage: 'At most 1000 Ah for one cell — a plain number is read in Ah; type "2700 mAh" for milliamp-hours' },
  series: { kind: 'count', min: 1, max: 1000 },
  parallel: { kind: 'count', min: 1, max: 1000 },
  massKg: { kind: 'mass', min: 0, above: true, max: 100, maxMessage: 'At most 100 kg — a plain number is read in kg; type "46 g" for grams' },
  internalResistanceOhms: { kind: 'resistance', min: 0, above: true, max: 10, maxMessage: 'At most 10 Ω for one cell: type "50 mΩ" for milliohms' },
} satisfies Record<string, FieldRule>;

/** The two readings of the DC method (IEC 61960-3): cell voltage at a low and at a high current. */
export const INTERNAL_RESISTANCE_READING_RULES = {
  lowAmps: { kind: 'current', min: 0, max: 1000, required: true },
  lowVolts: { kind: 'voltage', min: 0, above: true, max: 10, required: true },
  highAmps: { kind: 'current', min: 0, above: true, max: 1000, required: true },
  highVolts: { kind: 'voltage', min: 0, above: true, max: 10, required: true },
} satisfies Record<string, FieldRule>;

export const MODE_RULES = {
  quiescentAmps: { kind: 'current', min: 0, max: 10, maxMessage: 'At most 10 A: type "20 µA" for microamps' },
} satisfies Record<string, FieldRule>;
export const MODE_DUTY_RULE = { kind: 'fraction', min: 0, above: true, max: 1, maxMessage: 'At most 1 (100 %)' } satisfies FieldRule;

export const LOAD_RULES = {
  resistanceOhms: { kind: 'resistance', min: 0, above: true },
  currentAmps: { kind: 'current', min: 0, above: true, max: 1000 },
  powerWatts: { kind: 'power', min: 0, above: true, max: 100_000 },
  supplyVolts: { kind: 'voltage', min: 0, above: true, max: 1000 },
  count: { kind: 'count', min: 1, max: 1000 },
  duty: { kind: 'fraction', min: 0, above: true, max: 1, maxMessage: 'At most 1 (100 %)' },
  heatedAreaM2: { kind: 'area', min: 0, above: true, max: 10, maxMessage: 'At most 10 m² — a plain number is read in m²; type "27 cm²"' },
  heatedMassKg: { kind: 'mass', min: 0, above: true, max: 100, maxMessage: 'At most 100 kg — type "40 g" for grams' },
} satisfies Record<string, FieldRule>;

export const CONVERTER_RULES = {
  inputVolts: { kind: 'voltage', min: 0, above: true, max: 1000, required: true },
  outputVolts: { kind: 'voltage', min: 0, above: true, max: 1000, required: true },
  ratedCurrentAmps: { kind: 'current', min: 0, above: true, max: 1000 },
  chargeCurrentAmps: { kind: 'current', min: 0, above: true, max: 1000 },
  efficiency: { kind: 'fraction', min: 0, above: true, max: 1, maxMessage: 'At most 1 (100 %)' },
} satisfies Record<string, FieldRule>;

export const defaultLoadLabel = (kind: Load['kind']) => LOAD_KIND.labels[kind];
export const defaultConverterLabel = (topology: Converter['topology'], role: Converter['role']) =>
  `${CONVERTER_TOPOLOGY.labels[topology]} — ${CONVERTER_ROLE.labels[role].toLowerCase()}`;

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
