// The figures of a teardown: build the calc input from the stored records (pack, loads, converters,
// part categories, device claims, settings), merge every contributor's additions, compute through
// packages/calc, and mark each suggestion with what the engineer decided.
import type { EntityManager } from '@mikro-orm/sqlite';
import { teardownFigures, type Figure, type TeardownFigureInput, type TeardownFiguresResult } from '@splitcase/calc';
import { DEVICE_CATEGORY, ESTIMATES_NOTE, HOT_SURFACE_CAUTION, type FigureDto, type FiguresResponse, type SuggestionDto, type WorkspaceSettings } from '@splitcase/contracts';
import { PartSchema } from '../parts/part.entity';
import { ConverterSchema } from '../power/converter.entity';
import { LoadSchema } from '../power/load.entity';
import { PackSchema } from '../power/pack.entity';
import { modesOf } from '../power/power.service';
import { getSettings } from '../settings/settings.service';
import { SuggestionDecisionSchema } from '../teardowns/suggestion-decision.entity';
import type { Teardown } from '../teardowns/teardown.entity';
import { findInChunks, groupBy, refId } from '../../db/batch';
import { FIGURE_CONTRIBUTORS } from './contributors';

const opt = <T>(v: T | null | undefined): T | undefined => (v === null ? undefined : v);
/** Doubles come back from the driver as numbers (typed number | string): read them as numbers. */
const n = (v: number | string): number => Number(v);
const optN = (v: number | string | null | undefined): number | undefined => (v === null || v === undefined ? undefined : Number(v));

/** The calc input for a teardown (device must be loaded). */
export async function figureInput(em: EntityManager, t: Teardown): Promise<TeardownFigureInput> {
  return (await figureInputs(em, [t])).get(t.id)!;
}

/**
 * The calc inputs of many teardowns (devices loaded), keyed by teardown id, in a fixed number of
 * queries whatever the count (pattern counts and lineup comparisons read hundreds at once).
 */
export async function figureInputs(em: EntityManager, teardowns: Teardown[]): Promise<Map<number, TeardownFigureInput>> {
  const ids = teardowns.map((t) => t.id);
  const [packs, loads, converters, parts, settings, modes] = await Promise.all([
    findInChunks(ids, (chunk) => em.find(PackSchema, { teardown: { $in: chunk } })),
    findInChunks(ids, (chunk) => em.find(LoadSchema, { teardown: { $in: chunk } }, { orderBy: { id: 'asc' } })),
    findInChunks(ids, (chunk) => em.find(ConverterSchema, { teardown: { $in: chunk } }, { orderBy: { id: 'asc' } })),
    findInChunks(ids, (chunk) => em.find(PartSchema, { teardown: { $in: chunk } }, { fields: ['id', 'category', 'teardown'] as never })),
    getSettings(em),
    modesOf(em, ids),
  ]);
  const modesOfTeardown = groupBy(modes, (m) => refId(m.mode.teardown));
  const packOf = new Map(packs.map((p) => [refId(p.teardown), p]));
  const loadsOf = groupBy(loads, (l) => refId(l.teardown));
  const convertersOf = groupBy(converters, (c) => refId(c.teardown));
  const partsOf = groupBy(parts, (p) => refId(p.teardown));
  const contributions = await Promise.all(FIGURE_CONTRIBUTORS.map((contribute) => contribute(em, teardowns)));

  const out = new Map<number, TeardownFigureInput>();
  for (const t of teardowns) {
    const pack = packOf.get(t.id);
    const d = t.device;
    const claims: NonNullable<TeardownFigureInput['claims']> = {};
    if (d.claimCapacityAh != null) claims.capacityAh = n(d.claimCapacityAh);
    if (d.claimCapacityWh != null) claims.capacityWh = n(d.claimCapacityWh);
    if (d.claimRuntimeH != null) claims.runtimeH = n(d.claimRuntimeH);
    if (d.claimOutputWatts != null) claims.outputWatts = n(d.claimOutputWatts);
    if (d.claimPowerW != null) claims.powerWatts = n(d.claimPowerW);
    const base: TeardownFigureInput = {
      pack: pack
        ? {
            chemistry: pack.chemistry,
            cellNominalVolts: n(pack.cellNominalVolts),
            cellMaxVolts: optN(pack.cellMaxVolts),
            cellRatedAh: n(pack.cellRatedAh),
            cellMeasuredAh: optN(pack.cellMeasuredAh),
            series: pack.series,
            parallel: pack.parallel,
            packMassKg: optN(pack.packMassKg),
            protection: pack.protection,
          }
        : undefined,
      loads: (loadsOf.get(t.id) ?? []).map((l) => ({
        id: String(l.id),
        kind: l.kind,
        label: l.label,
        resistanceOhms: optN(l.resistanceOhms),
        currentAmps: optN(l.currentAmps),
        powerWatts: optN(l.powerWatts),
        supplyVolts: optN(l.supplyVolts),
        count: l.count,
        connection: l.connection,
        duty: n(l.duty),
        converterId: l.converter ? String(refId(l.converter)) : undefined,
        heatedAreaM2: optN(l.heatedAreaM2),
        surfaceMaterial: opt(l.surfaceMaterial),
        elementMaterial: opt(l.elementMaterial),
        heatedMassKg: optN(l.heatedMassKg),
      })),
      modes: (modesOfTeardown.get(t.id) ?? []).map(({ mode, loads: links }) => ({
        id: String(mode.id),
        name: mode.name,
        note: opt(mode.note),
        loads: links.map((l) => ({ loadId: String(refId(l.load)), duty: n(l.duty) })),
        quiescentAmps: optN(mode.quiescentAmps),
      })),
      converters: (convertersOf.get(t.id) ?? []).map((c) => ({
        id: String(c.id),
        topology: c.topology,
        role: c.role,
        vin: n(c.vin),
        vout: n(c.vout),
        efficiency: optN(c.efficiency),
        efficiencySource: c.efficiencySource,
        chargeCurrentA: optN(c.chargeCurrentA),
      })),
      partCategories: (partsOf.get(t.id) ?? []).map((p) => p.category),
      claims,
      capacityWarnFraction: settings.capacityWarnFraction,
      ...contactTime(t, settings),
      usableFraction: settings.usableFraction,
      deviceCategory: d.category,
      ...(pack?.internalOhms != null
        ? {
            cellInternalResistance: {
              ohms: n(pack.internalOhms),
              basis: pack.internalReadings ? 'two DC-method readings on the pack record' : 'the pack record',
            },
          }
        : {}),
    };
    // Other modules (bench runs, readings…) add what they know, in registration order; a value the
    // engineer recorded on the pack (internal resistance) is not replaced by one a run worked out.
    let input = base;
    for (const c of contributions) {
      const add = { ...c.get(t.id) };
      if (base.cellInternalResistance) delete add.cellInternalResistance;
      // Two measured surface temperatures (a thermal run and a reading): the hotter one counts.
      if (add.measuredSurface && input.measuredSurface && input.measuredSurface.temperatureC >= add.measuredSurface.temperatureC) delete add.measuredSurface;
      input = { ...input, ...add };
    }
    out.set(t.id, input);
  }
  return out;
}

/**
 * The contact time a touch margin is judged at, and why: the teardown's own, else the workspace default
 * for the device category (what is held or worn for long is judged at 10 min or 8 h), else the default.
 */
export function contactTime(t: Teardown, settings: WorkspaceSettings): { contactSeconds: number; contactBasis: string } {
  if (t.contactSeconds != null) return { contactSeconds: t.contactSeconds, contactBasis: 'set on this teardown' };
  const category = t.device.category;
  const byCategory = settings.contactSecondsByCategory[category];
  if (byCategory !== undefined) {
    return { contactSeconds: byCategory, contactBasis: `workspace default for ${DEVICE_CATEGORY.labels[category].toLowerCase()}s, held or worn for long` };
  }
  return { contactSeconds: settings.defaultContactSeconds, contactBasis: 'workspace default' };
}

/** Figures whose reader may be about to touch something hot get the hot-surface caution beside them. */
const HOT = /(^|\.)(touchMargin|surfaceRise|surfaceTemperature|timeToThreshold)$/;

/** A calc figure as the API returns it (calc's mode ids are the record ids as text). */
export function toFigureDto(f: Figure): FigureDto {
  return {
    key: f.key,
    label: f.label,
    value: f.value,
    unit: f.unit,
    formula: f.formula,
    source: f.source,
    inputs: f.inputs.map((i) => ({ key: i.key, label: i.label, value: i.value, ...(i.unit !== undefined ? { unit: i.unit } : {}) })),
    assumptions: f.assumptions,
    warnings: f.warnings,
    caution: HOT.test(f.key) ? HOT_SURFACE_CAUTION : null,
    modeId: f.modeId === undefined ? null : Number(f.modeId),
    implausible: f.implausible === true,
  };
}

/** The figures and suggestions of a teardown (device loaded), with the decisions taken on the suggestions. */
export async function teardownFiguresFor(em: EntityManager, t: Teardown): Promise<FiguresResponse & { raw: TeardownFiguresResult }> {
  const input = await figureInput(em, t);
  const raw = teardownFigures(input);
  const decisions = await em.find(SuggestionDecisionSchema, { teardown: t.id }, { populate: ['decidedBy'] });
  const byKey = new Map(decisions.map((d) => [d.key, d]));
  const suggestions: SuggestionDto[] = raw.suggestions.map((s) => {
    const d = byKey.get(s.key);
    return {
      key: s.key,
      title: s.title,
      kind: s.kind,
      severity: s.severity,
      detail: s.detail,
      status: d ? d.status : 'open',
      findingId: d?.findingId ?? null,
      decidedBy: d?.decidedBy ? d.decidedBy.name : null,
      decidedAt: d ? d.decidedAt.toISOString() : null,
    };
  });
  return {
    raw,
    figures: raw.figures.map(toFigureDto),
    modes: (input.modes ?? []).map((m) => ({ id: Number(m.id), name: m.name, note: m.note ?? null })),
    suggestions,
    note: ESTIMATES_NOTE,
  };
}
