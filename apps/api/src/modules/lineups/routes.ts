import {
  lineupMetricsQuery,
  comparisonPreviewBody,
  comparisonQuery,
  comparisonResponse,
  createLineupBody,
  DEFAULT_LINEUP_MODE,
  DEFAULT_LINEUP_WEIGHTS,
  idParam,
  LINEUP_STATUS,
  LINEUP_WEIGHT_MAX,
  lineupListQuery,
  lineupMetricsResponse,
  lineupResponse,
  lineupsResponse,
  updateLineupBody,
  type LineupStatus,
} from '@splitcase/contracts';
import { AppError, forbidden } from '../../http/errors';
import { route, type RouteDef } from '../../http/route';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { getSettings } from '../settings/settings.service';
import { UserSchema } from '../users/user.entity';
import { lineupComparison, metricCatalogue } from './comparison.service';
import { LineupSchema, type Lineup } from './lineup.entity';
import { checkLineupCurrency, devicesByIds, fullWeights, LINEUP_EDITORS, lineupDevices, lineupPermissions, readableLineup, setLineupDevices, toLineupDto, toLineupDtos } from './lineups.service';

const TAG = 'Lineups';

async function snapshot(em: Parameters<typeof lineupDevices>[0], l: Lineup) {
  const devices = (await lineupDevices(em, [l.id])).get(l.id) ?? [];
  return {
    name: l.name,
    description: l.description ?? null,
    currency: l.currency,
    weights: fullWeights(l.weights),
    mode: l.modeChoice ?? DEFAULT_LINEUP_MODE,
    status: l.status,
    deviceIds: devices.map((d) => d.id),
  };
}

export const lineupRoutes: RouteDef[] = [
  route(
    {
      method: 'get',
      path: '/api/lineups/metrics',
      tag: TAG,
      summary: 'The metrics a lineup compares (label, unit, better direction, formula, source) and the default weights',
      access: 'signed-in',
      query: lineupMetricsQuery,
      response: lineupMetricsResponse,
    },
    async ({ em, query }) => ({
      metrics: metricCatalogue(query.currency ?? (await getSettings(em)).reportingCurrency),
      defaults: DEFAULT_LINEUP_WEIGHTS,
      weightMax: LINEUP_WEIGHT_MAX,
    }),
  ),
  route(
    {
      method: 'get',
      path: '/api/lineups',
      tag: TAG,
      summary: 'Lineups, newest change first (viewers: published lineups only)',
      access: 'signed-in',
      query: lineupListQuery,
      response: lineupsResponse,
    },
    async ({ em, user, query }) => {
      const where: Record<string, unknown> = {};
      if (!LINEUP_EDITORS.includes(user.role)) where.status = 'published';
      else if (query.status) where.status = query.status;
      if (query.status && where.status !== query.status) return { lineups: [], canCreate: false };
      const lineups = await em.find(LineupSchema, where, { orderBy: { updatedAt: 'desc', id: 'desc' }, populate: ['createdBy', 'publishedBy'] });
      return { lineups: await toLineupDtos(em, user, lineups), canCreate: LINEUP_EDITORS.includes(user.role) };
    },
  ),
  route(
    {
      method: 'post',
      path: '/api/lineups',
      tag: TAG,
      summary: 'Build a lineup from 2 to 30 devices; currency defaults to the reporting currency, weights to the defaults',
      access: LINEUP_EDITORS,
      body: createLineupBody,
      response: lineupResponse,
      status: 201,
    },
    async ({ em, user, body }) => {
      const currency = body.currency ?? (await getSettings(em)).reportingCurrency;
      const devices = await devicesByIds(em, body.deviceIds);
      await checkLineupCurrency(em, currency);
      const lineup = await em.transactional(async (tx) => {
        const l = tx.create(LineupSchema, {
          name: body.name,
          description: body.description ?? null,
          currency,
          weights: fullWeights(body.weights ?? DEFAULT_LINEUP_WEIGHTS),
          modeChoice: body.mode ?? null,
          status: 'draft',
          createdBy: tx.getReference(UserSchema, user.id),
        });
        await tx.flush();
        await setLineupDevices(tx, l, devices);
        recordAudit(tx, user, {
          action: 'lineup.created',
          entityType: 'lineup',
          entityId: l.id,
          scope: { type: 'lineup', id: l.id },
          summary: `Built the lineup "${l.name}" of ${devices.length} devices in ${currency}`,
        });
        await tx.flush();
        return l;
      });
      await em.populate(lineup, ['createdBy', 'publishedBy']);
      return { lineup: await toLineupDto(em, user, lineup) };
    },
  ),
  route(
    { method: 'get', path: '/api/lineups/:id', tag: TAG, summary: 'One lineup with its devices (a viewer gets 404 for a draft)', access: 'signed-in', params: idParam, response: lineupResponse },
    async ({ em, user, params }) => ({ lineup: await toLineupDto(em, user, await readableLineup(em, user, params.id)) }),
  ),
  route(
    {
      method: 'patch',
      path: '/api/lineups/:id',
      tag: TAG,
      summary:
        'Change a lineup: name, description, devices (replaces the set), currency, weights; status (publish or back to draft) by a lead or admin. A published lineup is changed by a lead or admin. Send the version you edited to be told of a stale edit (409).',
      access: LINEUP_EDITORS,
      params: idParam,
      body: updateLineupBody,
      response: lineupResponse,
    },
    async ({ em, user, params, body }) => {
      const lineup = await readableLineup(em, user, params.id);
      const perms = lineupPermissions(user, lineup);
      if (body.version !== undefined && body.version !== lineup.version) {
        throw new AppError(
          'stale_version',
          `Someone changed this lineup after you opened it (you edited version ${body.version}; it is now version ${lineup.version}). Reload and re-apply your changes.`,
          undefined,
          { current: await toLineupDto(em, user, lineup) },
        );
      }
      if (body.status !== undefined && body.status !== lineup.status && !perms.publish) {
        throw forbidden('Only a lead or an admin publishes a lineup or takes it back to draft.');
      }
      const content = body.name !== undefined || body.description !== undefined || body.deviceIds !== undefined || body.currency !== undefined || body.weights !== undefined || body.mode !== undefined;
      if (content && !perms.edit) throw forbidden('This lineup is published: a lead or an admin changes it.');
      const devices = body.deviceIds ? await devicesByIds(em, body.deviceIds) : null;
      if (body.currency !== undefined && body.currency !== lineup.currency) await checkLineupCurrency(em, body.currency);

      const before = await snapshot(em, lineup);
      await em.transactional(async (tx) => {
        const l = await tx.findOneOrFail(LineupSchema, { id: lineup.id });
        if (body.name !== undefined) l.name = body.name;
        if (body.description !== undefined) l.description = body.description;
        if (body.currency !== undefined) l.currency = body.currency;
        if (body.weights !== undefined) l.weights = fullWeights(body.weights);
        if (body.mode !== undefined) l.modeChoice = body.mode;
        if (body.status !== undefined && body.status !== l.status) {
          l.status = body.status;
          l.publishedAt = body.status === 'published' ? new Date() : null;
          l.publishedBy = body.status === 'published' ? tx.getReference(UserSchema, user.id) : null;
        }
        if (devices) await setLineupDevices(tx, l, devices);
        // Every change bumps the version, a change of devices too.
        l.updatedAt = new Date();
        const after = {
          ...before,
          ...(devices ? { deviceIds: devices.map((d) => d.id) } : {}),
          name: l.name,
          description: l.description ?? null,
          currency: l.currency,
          weights: fullWeights(l.weights),
          mode: l.modeChoice ?? DEFAULT_LINEUP_MODE,
          status: l.status,
        };
        const changes = diffChanges(before, after);
        if (Object.keys(changes).length) {
          const published = changes.status ? (l.status === 'published' ? 'published' : 'back to draft') : null;
          recordAudit(tx, user, {
            action: changes.status && Object.keys(changes).length === 1 ? (l.status === 'published' ? 'lineup.published' : 'lineup.unpublished') : 'lineup.updated',
            entityType: 'lineup',
            entityId: l.id,
            scope: { type: 'lineup', id: l.id },
            summary: `Changed the lineup "${l.name}": ${Object.keys(changes)
              .map((k) => (k === 'status' ? published : k === 'deviceIds' ? 'devices' : k))
              .join(', ')}`,
            changes,
          });
        }
        await tx.flush();
      });
      const fresh = em.fork();
      return { lineup: await toLineupDto(fresh, user, await readableLineup(fresh, user, lineup.id)) };
    },
  ),
  route(
    {
      method: 'delete',
      path: '/api/lineups/:id',
      tag: TAG,
      summary: 'Delete a lineup: its maker while it is a draft, or a lead or admin',
      access: LINEUP_EDITORS,
      params: idParam,
    },
    async ({ em, user, params }) => {
      const lineup = await readableLineup(em, user, params.id);
      if (!lineupPermissions(user, lineup).delete) {
        throw forbidden(lineup.status === 'published' ? 'This lineup is published: a lead or an admin deletes it.' : 'Only the maker of a draft lineup, a lead or an admin deletes it.');
      }
      recordAudit(em, user, {
        action: 'lineup.deleted',
        entityType: 'lineup',
        entityId: lineup.id,
        scope: { type: 'lineup', id: lineup.id },
        summary: `Deleted the lineup "${lineup.name}" (${LINEUP_STATUS.labels[lineup.status as LineupStatus]})`,
      });
      em.remove(lineup);
      await em.flush();
      return undefined;
    },
  ),
  route(
    {
      method: 'get',
      path: '/api/lineups/:id/comparison',
      tag: TAG,
      summary:
        'The normalised comparison: per device the metrics (null when missing, with the reason), weighted score and rank with the saved weights, and the Pareto frontier of the metrics x and y (default retail price and pack energy)',
      access: 'signed-in',
      params: idParam,
      query: comparisonQuery,
      response: comparisonResponse,
    },
    async ({ em, user, params, query }) => {
      const lineup = await readableLineup(em, user, params.id);
      return lineupComparison(em, user, lineup, { weights: fullWeights(lineup.weights), weightsFrom: 'saved', mode: lineup.modeChoice ?? DEFAULT_LINEUP_MODE, x: query.x, y: query.y });
    },
  ),
  route(
    {
      method: 'post',
      path: '/api/lineups/:id/comparison',
      tag: TAG,
      summary: 'The comparison ranked with the weights sent, without saving them (the sliders); PATCH the lineup to save',
      access: 'signed-in',
      params: idParam,
      body: comparisonPreviewBody,
      response: comparisonResponse,
    },
    async ({ em, user, params, body }) => {
      const lineup = await readableLineup(em, user, params.id);
      return lineupComparison(em, user, lineup, { weights: fullWeights(body.weights), weightsFrom: 'preview', mode: body.mode ?? lineup.modeChoice ?? DEFAULT_LINEUP_MODE, x: body.x, y: body.y });
    },
  ),
];
