import type { EntityManager } from '@mikro-orm/sqlite';
import {
  CHEMISTRY,
  CONNECTION,
  LOAD_KIND,
  converterResponse,
  convertersResponse,
  createConverterBody,
  createLoadBody,
  idParam,
  loadResponse,
  loadsResponse,
  packBody,
  packResponse,
  powerSystemResponse,
  updateConverterBody,
  updateLoadBody,
} from '@splitcase/contracts';
import { z } from 'zod';
import { internalResistanceDc } from '@splitcase/calc';
import { notFound, validationError } from '../../http/errors';
import { route, type RouteContext, type RouteDef } from '../../http/route';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { CONTENT_EDITORS } from '../teardowns/access';
import { changeTeardownContent } from '../teardowns/content-change';
import { recordOf, teardownRead, teardownWrite } from '../teardowns/teardown-routes';
import type { Teardown } from '../teardowns/teardown.entity';
import { ConverterSchema, type Converter } from './converter.entity';
import { LoadSchema, type Load } from './load.entity';
import { PackSchema, type Pack } from './pack.entity';
import { mergeEntered, readQuantities, type Raw } from './quantities';
import {
  CONVERTER_RULES,
  INTERNAL_RESISTANCE_READING_RULES,
  LOAD_RULES,
  PACK_RULES,
  defaultConverterLabel,
  defaultLoadLabel,
  powerSystem,
  toConverterDto,
  toLoadDto,
  toPackDto,
} from './power.service';

const TAG = 'Power system';
const scope = (teardownId: number) => ({ type: 'teardown', id: teardownId });
const loadParams = z.object({ id: idParam.shape.id, loadId: idParam.shape.id });
const converterParams = z.object({ id: idParam.shape.id, converterId: idParam.shape.id });

type Ctx = RouteContext<unknown, unknown, unknown>;

// ---- pack ----

const packSnapshot = (p: Pack) => toPackDto(p) as unknown as Record<string, unknown>;
const PACK_AUDIT_KEYS = ['chemistry', 'cellFormat', 'nominalVolts', 'maxVolts', 'capacityAh', 'measuredCapacityAh', 'series', 'parallel', 'massKg', 'protection', 'joining', 'internalResistanceOhms'];

/** Two DC-method readings → the cell's internal resistance through calc; errors name the reading. */
function readInternalResistance(raw: z.output<typeof packBody>['internalResistanceReadings']) {
  if (!raw) return null;
  const read = readQuantities(raw, INTERNAL_RESISTANCE_READING_RULES);
  const r = read.values as Record<keyof typeof INTERNAL_RESISTANCE_READING_RULES, number>;
  const field = (k: string) => `internalResistanceReadings.${k}`;
  if (!(r.highAmps > r.lowAmps)) throw validationError({ [field('highAmps')]: 'The high current must be above the low current' });
  if (!(r.lowVolts > r.highVolts)) throw validationError({ [field('highVolts')]: 'The voltage at the high current must be below the voltage at the low current' });
  const readings = { lowAmps: r.lowAmps, lowVolts: r.lowVolts, highAmps: r.highAmps, highVolts: r.highVolts };
  return { ohms: internalResistanceDc(readings), readings };
}

async function putPack(ctx: Ctx & { body: z.output<typeof packBody>; params: { id: number } }) {
  const { body } = ctx;
  return changeTeardownContent(ctx, ctx.params.id, async (tx, t) => {
    const read = readQuantities(
      {
        nominalVolts: body.nominalVolts,
        maxVolts: body.maxVolts ?? null,
        capacityAh: body.capacityAh,
        measuredCapacityAh: body.measuredCapacityAh ?? null,
        series: body.series,
        parallel: body.parallel,
        massKg: body.massKg ?? null,
        internalResistanceOhms: body.internalResistanceOhms ?? null,
      },
      PACK_RULES,
    );
    const v = read.values;
    const ir = readInternalResistance(body.internalResistanceReadings);
    if (ir) {
      v.internalResistanceOhms = ir.ohms;
      delete read.entered.internalResistanceOhms;
    }
    if (v.maxVolts != null && v.nominalVolts != null && v.maxVolts < v.nominalVolts) throw validationError({ maxVolts: 'The charge voltage is below the nominal voltage' });
    if (v.measuredCapacityAh != null && v.capacityAh != null && v.measuredCapacityAh > v.capacityAh * 1.5) {
      throw validationError({ measuredCapacityAh: 'More than 1.5 × the rated capacity: check the unit (mAh or Ah)' });
    }
    let pack = await tx.findOne(PackSchema, { teardown: t.id });
    const created = !pack;
    const before = pack ? packSnapshot(pack) : {};
    const values = {
      chemistry: body.chemistry,
      cellFormat: body.cellFormat ?? null,
      cellNominalVolts: v.nominalVolts!,
      cellMaxVolts: v.maxVolts ?? null,
      cellRatedAh: v.capacityAh!,
      cellMeasuredAh: v.measuredCapacityAh ?? null,
      series: v.series ?? 1,
      parallel: v.parallel ?? 1,
      packMassKg: v.massKg ?? null,
      protection: body.protection,
      joining: body.joining ?? null,
      internalOhms: v.internalResistanceOhms ?? null,
      internalReadings: ir?.readings ?? null,
      entered: Object.keys(read.entered).length ? read.entered : null,
    };
    pack = pack ? Object.assign(pack, values) : tx.create(PackSchema, { teardown: t, ...values });
    await tx.flush();
    const changes = diffChanges(before, packSnapshot(pack), PACK_AUDIT_KEYS);
    recordAudit(tx, ctx.user, {
      action: created ? 'pack.created' : 'pack.updated',
      entityType: 'pack',
      entityId: pack.id,
      scope: scope(t.id),
      summary: `${created ? 'Recorded' : 'Changed'} the pack: ${pack.series}S${pack.parallel}P ${CHEMISTRY.labels[pack.chemistry]}, ${pack.cellRatedAh} Ah per cell`,
      changes,
    });
    return { pack: toPackDto(pack) };
  });
}

// ---- loads ----

async function converterOf(tx: EntityManager, t: Teardown, id: number | null | undefined): Promise<Converter | null | undefined> {
  if (id === undefined) return undefined;
  if (id === null) return null;
  const c = await tx.findOne(ConverterSchema, { id, teardown: t.id });
  if (!c) throw validationError({ converterId: 'Choose a converter of this teardown' });
  return c;
}

function loadRaw(body: Record<string, unknown>): Partial<Record<keyof typeof LOAD_RULES, Raw>> {
  const out: Partial<Record<keyof typeof LOAD_RULES, Raw>> = {};
  for (const k of Object.keys(LOAD_RULES) as (keyof typeof LOAD_RULES)[]) if (k in body) out[k] = body[k] as Raw;
  return out;
}

function applyLoadValues(load: Load, read: ReturnType<typeof readQuantities<keyof typeof LOAD_RULES>>) {
  const v = read.values;
  const map: Record<keyof typeof LOAD_RULES, string> = {
    resistanceOhms: 'resistanceOhms',
    currentAmps: 'currentAmps',
    powerWatts: 'powerWatts',
    supplyVolts: 'supplyVolts',
    count: 'count',
    duty: 'duty',
    heatedAreaM2: 'heatedAreaM2',
    heatedMassKg: 'heatedMassKg',
  };
  for (const key of read.present) {
    const value = v[key];
    if (key === 'count') load.count = value ?? 1;
    else if (key === 'duty') load.duty = value ?? 1;
    else (load as unknown as Record<string, unknown>)[map[key]] = value ?? null;
  }
  load.entered = mergeEntered(load.entered, read as never);
}

function checkLoad(load: Load) {
  if (load.resistanceOhms == null && load.currentAmps == null && load.powerWatts == null) {
    throw validationError({ resistanceOhms: 'Give the resistance, the current or the power of one element' });
  }
}

const loadSnapshot = (l: Load) => toLoadDto(l) as unknown as Record<string, unknown>;
const LOAD_AUDIT_KEYS = [
  'kind',
  'label',
  'resistanceOhms',
  'currentAmps',
  'powerWatts',
  'supplyVolts',
  'count',
  'connection',
  'duty',
  'converterId',
  'heatedAreaM2',
  'surfaceMaterial',
  'elementMaterial',
  'heatedMassKg',
];

// ---- converters ----

const CONVERTER_FIELD: Record<keyof typeof CONVERTER_RULES, string> = {
  inputVolts: 'vin',
  outputVolts: 'vout',
  ratedCurrentAmps: 'ratedCurrentA',
  chargeCurrentAmps: 'chargeCurrentA',
  efficiency: 'efficiency',
};
function converterRaw(body: Record<string, unknown>) {
  const out: Partial<Record<keyof typeof CONVERTER_RULES, Raw>> = {};
  for (const k of Object.keys(CONVERTER_RULES) as (keyof typeof CONVERTER_RULES)[]) if (k in body) out[k] = body[k] as Raw;
  return out;
}
const converterSnapshot = (c: Converter) => toConverterDto(c) as unknown as Record<string, unknown>;
const CONVERTER_AUDIT_KEYS = ['label', 'topology', 'role', 'inputVolts', 'outputVolts', 'ratedCurrentAmps', 'chargeCurrentAmps', 'efficiency', 'efficiencySource'];

export const powerRoutes: RouteDef[] = [
  teardownRead(
    {
      path: '/api/teardowns/:id/power',
      tag: TAG,
      summary: 'The power system of a teardown: pack, loads and converters (SI, with the text typed)',
      response: powerSystemResponse,
    },
    async ({ em, params }) => {
      return powerSystem(em, params.id);
    },
  ),
  teardownRead({ path: '/api/teardowns/:id/pack', tag: TAG, summary: 'The pack of a teardown (null when not recorded)', response: packResponse }, async ({ em, params }) => {
    const pack = await em.findOne(PackSchema, { teardown: params.id });
    return { pack: pack ? toPackDto(pack) : null };
  }),
  route(
    {
      method: 'put',
      path: '/api/teardowns/:id/pack',
      tag: TAG,
      summary: 'Record or replace the pack (one per teardown). Values take units: "2700 mAh", "3.65V", "46 g"',
      access: CONTENT_EDITORS,
      params: idParam,
      body: packBody,
      response: packResponse,
    },
    (ctx) => putPack(ctx as never),
  ),
  route(
    {
      method: 'post',
      path: '/api/teardowns/:id/cells',
      tag: TAG,
      summary: 'Record the cells of the teardown (same as PUT /pack: one pack per teardown, replaced if present)',
      access: CONTENT_EDITORS,
      params: idParam,
      body: packBody,
      response: packResponse,
      status: 201,
    },
    (ctx) => putPack(ctx as never),
  ),
  teardownWrite({ method: 'delete', path: '/api/teardowns/:id/pack', tag: TAG, summary: 'Remove the pack record' }, async (ctx, tx, t) => {
    const pack = await tx.findOne(PackSchema, { teardown: t.id });
    if (!pack) throw notFound('The pack');
    recordAudit(tx, ctx.user, { action: 'pack.deleted', entityType: 'pack', entityId: pack.id, scope: scope(t.id), summary: 'Removed the pack record' });
    tx.remove(pack);
  }),

  // loads
  teardownRead({ path: '/api/teardowns/:id/loads', tag: TAG, summary: 'Loads of a teardown', response: loadsResponse }, async ({ em, params }) => {
    return { loads: (await em.find(LoadSchema, { teardown: params.id }, { orderBy: { id: 'asc' } })).map(toLoadDto) };
  }),
  teardownWrite(
    {
      method: 'post',
      path: '/api/teardowns/:id/loads',
      tag: TAG,
      summary: 'Add a load (per-element resistance, current or power; count in series or parallel; duty)',
      body: createLoadBody,
      response: loadResponse,
      status: 201,
    },
    async (ctx, tx, t) => {
      const body = ctx.body;
      const read = readQuantities(loadRaw(body), LOAD_RULES);
      const converter = await converterOf(tx, t, body.converterId);
      const load = tx.create(LoadSchema, {
        teardown: t,
        kind: body.kind,
        label: body.label ?? defaultLoadLabel(body.kind),
        connection: body.connection,
        converter: converter ?? null,
        surfaceMaterial: body.surfaceMaterial ?? null,
        elementMaterial: body.elementMaterial ?? null,
        count: 1,
        duty: 1,
      });
      applyLoadValues(load, read);
      checkLoad(load);
      await tx.flush();
      recordAudit(tx, ctx.user, {
        action: 'load.created',
        entityType: 'load',
        entityId: load.id,
        scope: scope(t.id),
        summary: `Added load ${load.label} (${LOAD_KIND.labels[load.kind]}, ${load.count} in ${CONNECTION.labels[load.connection as 'series' | 'parallel'].toLowerCase()})`,
      });
      return { load: toLoadDto(load) };
    },
  ),
  teardownWrite(
    { method: 'patch', path: '/api/teardowns/:id/loads/:loadId', tag: TAG, summary: 'Change a load', params: loadParams, body: updateLoadBody, response: loadResponse },
    async (ctx, tx, t) => {
      const load = await recordOf(tx, LoadSchema, ctx.params.loadId, t, 'The load');
      const before = loadSnapshot(load);
      const body = ctx.body;
      const read = readQuantities(loadRaw(body), LOAD_RULES);
      const converter = await converterOf(tx, t, body.converterId);
      if (body.kind) load.kind = body.kind;
      if (body.label !== undefined) load.label = body.label ?? defaultLoadLabel(load.kind);
      if (body.connection) load.connection = body.connection;
      if (converter !== undefined) load.converter = converter;
      if (body.surfaceMaterial !== undefined) load.surfaceMaterial = body.surfaceMaterial ?? null;
      if (body.elementMaterial !== undefined) load.elementMaterial = body.elementMaterial ?? null;
      applyLoadValues(load, read);
      checkLoad(load);
      const changes = diffChanges(before, loadSnapshot(load), LOAD_AUDIT_KEYS);
      if (Object.keys(changes).length) {
        recordAudit(tx, ctx.user, {
          action: 'load.updated',
          entityType: 'load',
          entityId: load.id,
          scope: scope(t.id),
          summary: `Changed load ${load.label}: ${Object.keys(changes).join(', ')}`,
          changes,
        });
      }
      await tx.flush();
      return { load: toLoadDto(load) };
    },
  ),
  teardownWrite({ method: 'delete', path: '/api/teardowns/:id/loads/:loadId', tag: TAG, summary: 'Remove a load', params: loadParams }, async (ctx, tx, t) => {
    const load = await recordOf(tx, LoadSchema, ctx.params.loadId, t, 'The load');
    recordAudit(tx, ctx.user, { action: 'load.deleted', entityType: 'load', entityId: load.id, scope: scope(t.id), summary: `Removed load ${load.label}` });
    tx.remove(load);
  }),

  // converters
  teardownRead({ path: '/api/teardowns/:id/converters', tag: TAG, summary: 'Converters of a teardown', response: convertersResponse }, async ({ em, params }) => {
    return { converters: (await em.find(ConverterSchema, { teardown: params.id }, { orderBy: { id: 'asc' } })).map(toConverterDto) };
  }),
  teardownWrite(
    {
      method: 'post',
      path: '/api/teardowns/:id/converters',
      tag: TAG,
      summary: 'Add a converter stage (buck, boost, buck-boost) with its efficiency, measured or assumed',
      body: createConverterBody,
      response: converterResponse,
      status: 201,
    },
    async (ctx, tx, t) => {
      const body = ctx.body;
      const read = readQuantities(converterRaw(body), CONVERTER_RULES);
      const v = read.values;
      const converter = tx.create(ConverterSchema, {
        teardown: t,
        label: body.label ?? defaultConverterLabel(body.topology, body.role),
        topology: body.topology,
        role: body.role,
        vin: v.inputVolts!,
        vout: v.outputVolts!,
        ratedCurrentA: v.ratedCurrentAmps ?? null,
        chargeCurrentA: v.chargeCurrentAmps ?? null,
        efficiency: v.efficiency ?? null,
        efficiencySource: body.efficiencySource,
        entered: Object.keys(read.entered).length ? read.entered : null,
      });
      await tx.flush();
      recordAudit(tx, ctx.user, { action: 'converter.created', entityType: 'converter', entityId: converter.id, scope: scope(t.id), summary: `Added converter ${converter.label}` });
      return { converter: toConverterDto(converter) };
    },
  ),
  teardownWrite(
    {
      method: 'patch',
      path: '/api/teardowns/:id/converters/:converterId',
      tag: TAG,
      summary: 'Change a converter',
      params: converterParams,
      body: updateConverterBody,
      response: converterResponse,
    },
    async (ctx, tx, t) => {
      const converter = await recordOf(tx, ConverterSchema, ctx.params.converterId, t, 'The converter');
      const before = converterSnapshot(converter);
      const body = ctx.body;
      const read = readQuantities(converterRaw(body), {
        ...CONVERTER_RULES,
        inputVolts: { ...CONVERTER_RULES.inputVolts, required: false },
        outputVolts: { ...CONVERTER_RULES.outputVolts, required: false },
      });
      for (const key of read.present) {
        const value = read.values[key];
        if ((key === 'inputVolts' || key === 'outputVolts') && value == null) throw validationError({ [key]: 'Required' });
        (converter as unknown as Record<string, unknown>)[CONVERTER_FIELD[key]] = value ?? null;
      }
      converter.entered = mergeEntered(converter.entered, read as never);
      if (body.topology) converter.topology = body.topology;
      if (body.role) converter.role = body.role;
      if (body.efficiencySource) converter.efficiencySource = body.efficiencySource;
      if (body.label !== undefined) converter.label = body.label ?? defaultConverterLabel(converter.topology, converter.role);
      const changes = diffChanges(before, converterSnapshot(converter), CONVERTER_AUDIT_KEYS);
      if (Object.keys(changes).length) {
        recordAudit(tx, ctx.user, {
          action: 'converter.updated',
          entityType: 'converter',
          entityId: converter.id,
          scope: scope(t.id),
          summary: `Changed converter ${converter.label}: ${Object.keys(changes).join(', ')}`,
          changes,
        });
      }
      await tx.flush();
      return { converter: toConverterDto(converter) };
    },
  ),
  teardownWrite(
    {
      method: 'delete',
      path: '/api/teardowns/:id/converters/:converterId',
      tag: TAG,
      summary: 'Remove a converter (loads fed through it are then fed straight from the pack)',
      params: converterParams,
    },
    async (ctx, tx, t) => {
      const converter = await recordOf(tx, ConverterSchema, ctx.params.converterId, t, 'The converter');
      const fed = await tx.find(LoadSchema, { converter: converter.id });
      for (const l of fed) l.converter = null;
      recordAudit(tx, ctx.user, {
        action: 'converter.deleted',
        entityType: 'converter',
        entityId: converter.id,
        scope: scope(t.id),
        summary: `Removed converter ${converter.label}${fed.length ? ` (${fed.length} load${fed.length > 1 ? 's' : ''} now fed from the pack)` : ''}`,
      });
      tx.remove(converter);
    },
  ),
];
