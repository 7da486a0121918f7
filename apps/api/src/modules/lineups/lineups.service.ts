// Lineups: who may read and change them, loading with the devices, validation that needs the
// database (device ids, the currency's rate), and the DTO.
import type { EntityManager } from '@mikro-orm/sqlite';
import { DEFAULT_LINEUP_MODE, LINEUP_METRIC_KEYS, type LineupDto, type Role } from '@splitcase/contracts';
import { notFound, validationError } from '../../http/errors';
import type { AuthUser } from '../../http/route';
import { currentRateTable, hasRate } from '../cost/rates.service';
import { DeviceSchema, type Device } from '../devices/device.entity';
import { getSettings } from '../settings/settings.service';
import { DRAFT_READERS, REVIEWERS } from '../teardowns/access';
import { TeardownSchema } from '../teardowns/teardown.entity';
import { LineupDeviceSchema } from './lineup-device.entity';
import { LineupSchema, type Lineup } from './lineup.entity';
import { refId } from '../../db/batch';

/** Every role but viewer builds and edits lineups. */
export const LINEUP_EDITORS: readonly Role[] = ['admin', 'engineer', 'sourcing', 'lead'];
/** Leads and admins publish (and change a published lineup), as they approve teardowns. */
export const LINEUP_PUBLISHERS: readonly Role[] = REVIEWERS;

export function lineupPermissions(user: AuthUser, l: Pick<Lineup, 'status' | 'createdBy'>): LineupDto['permissions'] {
  const publisher = LINEUP_PUBLISHERS.includes(user.role);
  const editor = LINEUP_EDITORS.includes(user.role);
  const own = l.createdBy ? refId(l.createdBy) === user.id : false;
  return {
    edit: publisher || (editor && l.status === 'draft'),
    publish: publisher,
    delete: publisher || (editor && own && l.status === 'draft'),
  };
}

/** A lineup the user may read: viewers see published ones only (404 otherwise, as if it did not exist). */
export async function readableLineup(em: EntityManager, user: AuthUser, id: number): Promise<Lineup> {
  const l = await em.findOne(LineupSchema, { id }, { populate: ['createdBy', 'publishedBy'] });
  if (!l || (l.status !== 'published' && !DRAFT_READERS.includes(user.role))) throw notFound('The lineup');
  return l;
}

/** The devices of lineups in position order, by lineup id. */
export async function lineupDevices(em: EntityManager, lineupIds: number[]): Promise<Map<number, Device[]>> {
  const out = new Map<number, Device[]>();
  if (lineupIds.length === 0) return out;
  const rows = await em.find(LineupDeviceSchema, { lineup: { $in: lineupIds } }, { populate: ['device'], orderBy: { position: 'asc', id: 'asc' } });
  for (const r of rows) {
    const id = refId(r.lineup);
    out.set(id, [...(out.get(id) ?? []), r.device]);
  }
  return out;
}

/** Of these devices, the ids the user may see: viewers only devices with a published teardown. */
export async function visibleDeviceIds(em: EntityManager, user: AuthUser, ids: number[]): Promise<Set<number>> {
  if (DRAFT_READERS.includes(user.role)) return new Set(ids);
  if (ids.length === 0) return new Set();
  const published = await em.find(TeardownSchema, { device: { $in: ids }, status: 'published' }, { fields: ['id', 'device'] as never });
  return new Set(published.map((t) => refId(t.device)));
}

export async function toLineupDtos(em: EntityManager, user: AuthUser, lineups: Lineup[]): Promise<LineupDto[]> {
  const devices = await lineupDevices(
    em,
    lineups.map((l) => l.id),
  );
  const visible = await visibleDeviceIds(
    em,
    user,
    [...devices.values()].flat().map((d) => d.id),
  );
  return lineups.map((l) => {
    const all = devices.get(l.id) ?? [];
    const shown = all.filter((d) => visible.has(d.id));
    return {
      id: l.id,
      name: l.name,
      description: l.description ?? null,
      currency: l.currency,
      weights: fullWeights(l.weights),
      mode: l.modeChoice ?? DEFAULT_LINEUP_MODE,
      status: l.status,
      devices: shown.map((d) => ({ id: d.id, maker: d.maker, model: d.model, category: d.category, position: all.indexOf(d) + 1 })),
      hiddenDevices: all.length - shown.length,
      createdBy: l.createdBy ? { id: l.createdBy.id, name: l.createdBy.name } : null,
      createdAt: l.createdAt.toISOString(),
      updatedAt: l.updatedAt.toISOString(),
      publishedAt: l.publishedAt ? l.publishedAt.toISOString() : null,
      publishedBy: l.publishedBy ? l.publishedBy.name : null,
      version: l.version,
      permissions: lineupPermissions(user, l),
    };
  });
}

export async function toLineupDto(em: EntityManager, user: AuthUser, l: Lineup): Promise<LineupDto> {
  return (await toLineupDtos(em, user, [l]))[0]!;
}

/** Every metric key with its weight (absent keys weigh 0). */
export function fullWeights(w: Record<string, number> | null | undefined): Record<string, number> {
  return Object.fromEntries(LINEUP_METRIC_KEYS.map((k) => [k, w?.[k] ?? 0]));
}

/** The devices behind these ids, in the order given; an unknown id is named by its position. */
export async function devicesByIds(em: EntityManager, ids: number[]): Promise<Device[]> {
  const found = await em.find(DeviceSchema, { id: { $in: ids } });
  const byId = new Map(found.map((d) => [d.id, d]));
  const fields: Record<string, string> = {};
  ids.forEach((id, k) => {
    if (!byId.has(id)) fields[`deviceIds.${k}`] = `No device with id ${id}`;
  });
  if (Object.keys(fields).length) throw validationError(fields);
  return ids.map((id) => byId.get(id)!);
}

/**
 * A lineup currency must convert with the current rate table (or be the workspace reporting
 * currency while there is no table yet): otherwise the money metrics could never be shown.
 */
export async function checkLineupCurrency(em: EntityManager, code: string): Promise<void> {
  const table = await currentRateTable(em);
  if (hasRate(table, code)) return;
  if (!table) {
    if (code === (await getSettings(em)).reportingCurrency) return;
    throw validationError({ currency: `There is no rate table yet, so ${code} cannot be used. Use the reporting currency, or enter rates on the Rates page.` });
  }
  throw validationError({
    currency: `The current rate table (base ${table.base}, ${table.date}) has no rate for ${code}. Pick a currency it lists, or add the rate on the Rates page.`,
  });
}

/** Replace the device set of a lineup, keeping the order given (the caller flushes). */
export async function setLineupDevices(em: EntityManager, lineup: Lineup, devices: Device[]): Promise<void> {
  await em.nativeDelete(LineupDeviceSchema, { lineup: lineup.id });
  devices.forEach((device, k) => em.create(LineupDeviceSchema, { lineup, device, position: k + 1 }));
}
