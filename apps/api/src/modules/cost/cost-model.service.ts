import type { EntityManager } from '@mikro-orm/sqlite';
import { costModelSchema, type CostModelDto, type TeardownCostModel } from '@splitcase/contracts';
import { findInChunks, refId } from '../../db/batch';
import type { AuthUser } from '../../http/route';
import { diffChanges, recordAudit } from '../audit/audit.service';
import type { Teardown } from '../teardowns/teardown.entity';
import { UserSchema } from '../users/user.entity';
import { CostModelSchema, type CostModelRow } from './cost-model.entity';
import { BUILT_IN_COST_MODEL } from './defaults';

/** A stored model read through the schema (fills defaults added since it was saved); the built-in one if it no longer validates. */
function readModel(row: CostModelRow | null): CostModelDto {
  if (!row) return BUILT_IN_COST_MODEL;
  const parsed = costModelSchema.safeParse(row.model);
  return parsed.success ? parsed.data : BUILT_IN_COST_MODEL;
}

const stamp = (row: CostModelRow | null) => ({ updatedAt: row?.updatedAt.toISOString() ?? null, updatedBy: row?.updatedBy?.name ?? null });

export async function workspaceModelRow(em: EntityManager): Promise<CostModelRow | null> {
  return em.findOne(CostModelSchema, { teardown: null }, { populate: ['updatedBy'] });
}

export async function getWorkspaceModel(em: EntityManager) {
  const row = await workspaceModelRow(em);
  return { model: readModel(row), ...stamp(row) };
}

/** The model a teardown is costed with: its own if it has one, else the workspace default. */
export async function getTeardownModel(em: EntityManager, teardown: Teardown): Promise<TeardownCostModel> {
  return (await teardownModels(em, [teardown.id])).get(teardown.id)!;
}

/** The models many teardowns are costed with, keyed by teardown id, in two queries whatever the count. */
export async function teardownModels(em: EntityManager, teardownIds: readonly number[]): Promise<Map<number, TeardownCostModel>> {
  const own = await findInChunks(teardownIds, (chunk) => em.find(CostModelSchema, { teardown: { $in: chunk } }, { populate: ['updatedBy'] }));
  const workspace = await workspaceModelRow(em);
  const defaults = readModel(workspace);
  const ownOf = new Map(own.map((row) => [refId(row.teardown), row]));
  const out = new Map<number, TeardownCostModel>();
  for (const id of teardownIds) {
    const row = ownOf.get(id);
    out.set(id, row ? { model: readModel(row), source: 'teardown', defaults, ...stamp(row) } : { model: defaults, source: 'workspace', defaults, ...stamp(workspace) });
  }
  return out;
}

function audit(em: EntityManager, user: AuthUser, before: CostModelDto, after: CostModelDto, teardown: Teardown | null, action: string, summary: string) {
  const changes = diffChanges(before as unknown as Record<string, unknown>, after as unknown as Record<string, unknown>);
  recordAudit(em, user, {
    action,
    entityType: 'cost_model',
    entityId: teardown ? `teardown:${teardown.id}` : 'workspace',
    ...(teardown ? { scope: { type: 'teardown', id: teardown.id } } : {}),
    summary,
    changes,
  });
}

export async function saveWorkspaceModel(em: EntityManager, user: AuthUser, model: CostModelDto) {
  const row = await workspaceModelRow(em);
  const before = readModel(row);
  if (row) {
    row.model = model;
    row.updatedBy = em.getReference(UserSchema, user.id);
  } else em.create(CostModelSchema, { teardown: null, model, updatedBy: em.getReference(UserSchema, user.id) });
  audit(em, user, before, model, null, 'cost_model.updated', 'Changed the workspace cost model');
  await em.flush();
  return getWorkspaceModel(em);
}

export async function saveTeardownModel(em: EntityManager, user: AuthUser, teardown: Teardown, model: CostModelDto) {
  const current = await getTeardownModel(em, teardown);
  const row = await em.findOne(CostModelSchema, { teardown: teardown.id });
  if (row) {
    row.model = model;
    row.updatedBy = em.getReference(UserSchema, user.id);
  } else em.create(CostModelSchema, { teardown, model, updatedBy: em.getReference(UserSchema, user.id) });
  audit(em, user, current.model, model, teardown, 'cost_model.teardown_set', 'Gave this teardown its own cost model');
  await em.flush();
  return getTeardownModel(em, teardown);
}

export async function clearTeardownModel(em: EntityManager, user: AuthUser, teardown: Teardown) {
  const row = await em.findOne(CostModelSchema, { teardown: teardown.id });
  if (row) {
    const current = readModel(row);
    em.remove(row);
    audit(em, user, current, (await getWorkspaceModel(em)).model, teardown, 'cost_model.teardown_cleared', 'Back to the workspace cost model');
    await em.flush();
  }
  return getTeardownModel(em, teardown);
}
