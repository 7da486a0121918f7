// Operating modes of a teardown: which loads run in each mode, at what duty, and the standby draw.
// The figures are worked out per mode by packages/calc (modeAndLoadFigures); these routes keep the records.
import type { EntityManager } from '@mikro-orm/sqlite';
import { MODE_FIELDS, createModeBody, dutyForTargetQuery, figureSchema, idParam, modeResponse, modesResponse, updateModeBody } from '@splitcase/contracts';
import { teardownFigures } from '@splitcase/calc';
import { z } from 'zod';
import { AppError, validationError } from '../../http/errors';
import type { RouteDef } from '../../http/route';
import { readQuantity } from '../../lib/units';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { figureInput, toFigureDto } from '../figures/figures.service';
import { recordOf, teardownRead, teardownWrite } from '../teardowns/teardown-routes';
import type { Teardown } from '../teardowns/teardown.entity';
import { LoadSchema } from './load.entity';
import { ModeLoadSchema } from './mode-load.entity';
import { OperatingModeSchema, type OperatingMode } from './mode.entity';
import { mergeEntered, readQuantities } from './quantities';
import { MODE_DUTY_RULE, MODE_RULES, modesOf, toModeDto } from './power.service';

const TAG = 'Power system';
const modeParams = z.object({ id: idParam.shape.id, modeId: idParam.shape.id });
const loadParams = z.object({ id: idParam.shape.id, loadId: idParam.shape.id });
const scope = (teardownId: number) => ({ type: 'teardown', id: teardownId });

type ModeLoadsBody = NonNullable<z.output<typeof createModeBody>['loads']>;

/** The loads of a mode read and checked against the teardown: every bad entry named at once. */
async function readModeLoads(tx: EntityManager, t: Teardown, loads: ModeLoadsBody) {
  const known = new Set((await tx.find(LoadSchema, { teardown: t.id }, { fields: ['id'] as never })).map((l) => l.id));
  const errors: Record<string, string> = {};
  const seen = new Set<number>();
  const out: { loadId: number; duty: number; entered: string | null }[] = [];
  loads.forEach((entry, k) => {
    if (!known.has(entry.loadId)) errors[`loads.${k}.loadId`] = 'Choose a load of this teardown';
    else if (seen.has(entry.loadId)) errors[`loads.${k}.loadId`] = 'This load is already in the mode';
    seen.add(entry.loadId);
    try {
      const read = readQuantities({ duty: entry.duty }, { duty: { ...MODE_DUTY_RULE, required: true } });
      out.push({ loadId: entry.loadId, duty: read.values.duty!, entered: read.entered.duty ?? null });
    } catch (err) {
      const fields = err instanceof AppError ? (err.fields ?? {}) : {};
      errors[`loads.${k}.duty`] = fields.duty ?? 'Enter a duty between 0 and 1, or a percentage';
    }
  });
  if (Object.keys(errors).length) throw validationError(errors);
  return out;
}

async function uniqueName(tx: EntityManager, t: Teardown, name: string, except?: number) {
  const others = await tx.find(OperatingModeSchema, { teardown: t.id }, { fields: ['id', 'name'] as never });
  if (others.some((m) => m.id !== except && m.name.trim().toLowerCase() === name.trim().toLowerCase())) {
    throw validationError({ name: `This teardown already has a mode called "${name.trim()}"` });
  }
}

async function replaceLoads(tx: EntityManager, mode: OperatingMode, loads: Awaited<ReturnType<typeof readModeLoads>>) {
  await tx.nativeDelete(ModeLoadSchema, { mode: mode.id });
  for (const l of loads) tx.create(ModeLoadSchema, { mode, load: tx.getReference(LoadSchema, l.loadId), duty: l.duty, entered: l.entered });
}

async function modeDto(tx: EntityManager, mode: OperatingMode) {
  const links = await tx.find(ModeLoadSchema, { mode: mode.id }, { orderBy: { id: 'asc' } });
  return toModeDto(mode, links);
}

const snapshot = (m: ReturnType<typeof toModeDto>) => ({ name: m.name, note: m.note, quiescentAmps: m.quiescentAmps, loads: m.loads.map((l) => `${l.loadId}@${l.duty}`).join(', ') });
const describeLoads = (n: number) => (n === 0 ? 'no loads' : `${n} load${n > 1 ? 's' : ''}`);

export const modeRoutes: RouteDef[] = [
  teardownRead(
    { path: '/api/teardowns/:id/modes', tag: TAG, summary: 'Operating modes of a teardown, in order, with the loads active in each and their duty', response: modesResponse },
    async ({ em, params }) => {
      return { modes: (await modesOf(em, [params.id])).map(({ mode, loads }) => toModeDto(mode, loads)) };
    },
  ),
  teardownWrite(
    {
      method: 'post',
      path: '/api/teardowns/:id/modes',
      tag: TAG,
      summary: 'Add an operating mode: a name, the loads active in it with their duty ("60 %"), and the quiescent current ("20 µA")',
      body: createModeBody,
      response: modeResponse,
      status: 201,
    },
    async (ctx, tx, t) => {
      const body = ctx.body;
      await uniqueName(tx, t, body.name);
      const q = readQuantities({ quiescentAmps: body.quiescentAmps ?? null }, MODE_RULES);
      const loads = await readModeLoads(tx, t, body.loads);
      const last = await tx.findOne(OperatingModeSchema, { teardown: t.id }, { orderBy: { position: 'desc' } });
      const mode = tx.create(OperatingModeSchema, {
        teardown: t,
        name: body.name,
        note: body.note ?? null,
        position: last ? last.position + 1 : 0,
        quiescentAmps: q.values.quiescentAmps ?? null,
        entered: Object.keys(q.entered).length ? (q.entered as Record<string, string>) : null,
      });
      await tx.flush();
      await replaceLoads(tx, mode, loads);
      await tx.flush();
      recordAudit(tx, ctx.user, { action: 'mode.created', entityType: 'mode', entityId: mode.id, scope: scope(t.id), summary: `Added mode "${mode.name}" (${describeLoads(loads.length)})` });
      return { mode: await modeDto(tx, mode) };
    },
  ),
  teardownWrite(
    {
      method: 'patch',
      path: '/api/teardowns/:id/modes/:modeId',
      tag: TAG,
      summary: 'Change a mode: only the fields sent (the loads list, when sent, replaces the old one)',
      params: modeParams,
      body: updateModeBody,
      response: modeResponse,
    },
    async (ctx, tx, t) => {
      const mode = await recordOf(tx, OperatingModeSchema, ctx.params.modeId, t, 'The mode');
      const before = snapshot(await modeDto(tx, mode));
      const body = ctx.body;
      if (body.name !== undefined) {
        await uniqueName(tx, t, body.name, mode.id);
        mode.name = body.name;
      }
      if (body.note !== undefined) mode.note = body.note ?? null;
      if ('quiescentAmps' in body) {
        const q = readQuantities({ quiescentAmps: body.quiescentAmps ?? null }, MODE_RULES);
        mode.quiescentAmps = q.values.quiescentAmps ?? null;
        mode.entered = mergeEntered(mode.entered, q as never);
      }
      if (body.loads !== undefined) await replaceLoads(tx, mode, await readModeLoads(tx, t, body.loads));
      await tx.flush();
      const dto = await modeDto(tx, mode);
      const changes = diffChanges(before, snapshot(dto));
      if (Object.keys(changes).length) {
        recordAudit(tx, ctx.user, {
          action: 'mode.updated',
          entityType: 'mode',
          entityId: mode.id,
          scope: scope(t.id),
          summary: `Changed mode "${mode.name}": ${Object.keys(changes).join(', ')}`,
          changes,
        });
      }
      return { mode: dto };
    },
  ),
  teardownWrite({ method: 'delete', path: '/api/teardowns/:id/modes/:modeId', tag: TAG, summary: 'Remove a mode', params: modeParams }, async (ctx, tx, t) => {
    const mode = await recordOf(tx, OperatingModeSchema, ctx.params.modeId, t, 'The mode');
    recordAudit(tx, ctx.user, { action: 'mode.deleted', entityType: 'mode', entityId: mode.id, scope: scope(t.id), summary: `Removed mode "${mode.name}"` });
    await tx.nativeDelete(ModeLoadSchema, { mode: mode.id });
    tx.remove(mode);
  }),
  teardownRead(
    {
      path: '/api/teardowns/:id/loads/:loadId/duty-for-target',
      tag: TAG,
      summary: 'The PWM duty that holds a heater load at a target surface temperature (steady state, convection + exact radiation), with formula and inputs',
      params: loadParams,
      query: dutyForTargetQuery,
      response: z.object({ figure: figureSchema }),
    },
    async ({ em, params, query }, t) => {
      const load = await recordOf(em, LoadSchema, params.loadId, t, 'The load');
      if (load.kind !== 'heater' || load.heatedAreaM2 == null) throw validationError({ loadId: 'A heater load with a heated area is needed for a target temperature' });
      let targetC: number;
      try {
        targetC = readQuantity(query.target, MODE_FIELDS.targetSurfaceC).value;
      } catch (err) {
        throw validationError({ target: (err as Error).message });
      }
      const input = await figureInput(em, t);
      const result = teardownFigures({ ...input, targetSurfaceC: targetC });
      const many = input.loads.filter((l) => l.kind === 'heater' && l.heatedAreaM2 !== undefined).length > 1;
      const f = result.figures.find((x) => x.key === (many ? `heater.${load.id}.dutyForTarget` : 'heater.dutyForTarget'));
      if (!f) throw validationError({ target: `Choose a target above the ${input.ambientC ?? 25} °C ambient` });
      return { figure: toFigureDto(f) };
    },
  ),
];
