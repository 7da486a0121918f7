// The figures of a teardown: build the calc input from the stored records (pack, loads, converters,
// part categories, device claims, settings), merge every contributor's additions, compute through
// packages/calc, and mark each suggestion with what the engineer decided.
import type { EntityManager } from '@mikro-orm/sqlite';
import { teardownFigures, type TeardownFigureInput, type TeardownFiguresResult } from '@splitcase/calc';
import { ESTIMATES_NOTE, HOT_SURFACE_CAUTION, type FiguresResponse, type SuggestionDto } from '@splitcase/contracts';
import { PartSchema } from '../parts/part.entity';
import { ConverterSchema } from '../power/converter.entity';
import { LoadSchema } from '../power/load.entity';
import { PackSchema } from '../power/pack.entity';
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
  const [packs, loads, converters, parts, settings] = await Promise.all([
    findInChunks(ids, (chunk) => em.find(PackSchema, { teardown: { $in: chunk } })),
    findInChunks(ids, (chunk) => em.find(LoadSchema, { teardown: { $in: chunk } }, { orderBy: { id: 'asc' } })),
    findInChunks(ids, (chunk) => em.find(ConverterSchema, { teardown: { $in: chunk } }, { orderBy: { id: 'asc' } })),
    findInChunks(ids, (chunk) => em.find(PartSchema, { teardown: { $in: chunk } }, { fields: ['id', 'category', 'teardown'] as never })),
    getSettings(em),
  ]);
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
      contactSeconds: t.contactSeconds ?? settings.defaultContactSeconds,
    };
    // Other modules (bench runs, traces…) add what they know, in registration order.
    let input = base;
    for (const c of contributions) input = { ...input, ...c.get(t.id) };
    out.set(t.id, input);
  }
  return out;
}

/** Figures whose reader may be about to touch something hot get the hot-surface caution beside them. */
const HOT = /(^|\.)(touchMargin|surfaceRise)$/;

/** The figures and suggestions of a teardown (device loaded), with the decisions taken on the suggestions. */
export async function teardownFiguresFor(em: EntityManager, t: Teardown): Promise<FiguresResponse & { raw: TeardownFiguresResult }> {
  const raw = teardownFigures(await figureInput(em, t));
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
    figures: raw.figures.map((f) => ({
      key: f.key,
      label: f.label,
      value: f.value,
      unit: f.unit,
      formula: f.formula,
      source: f.source,
      inputs: f.inputs,
      assumptions: f.assumptions,
      warnings: f.warnings,
      caution: HOT.test(f.key) ? HOT_SURFACE_CAUTION : null,
    })),
    suggestions,
    note: ESTIMATES_NOTE,
  };
}
