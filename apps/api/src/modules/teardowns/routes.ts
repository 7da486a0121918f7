import { OptimisticLockError } from '@mikro-orm/core';
import { createTeardownBody, idParam, teardownResponse, updateTeardownBody, TEARDOWN_FIELD_LABELS } from '@splitcase/contracts';
import { AppError, forbidden } from '../../http/errors';
import { route, type RouteDef } from '../../http/route';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { DeviceSchema } from '../devices/device.entity';
import { UserSchema } from '../users/user.entity';
import { CONTENT_EDITORS, editableTeardown, readableTeardown } from './access';
import { commentRoutes } from './comments.routes';
import { reviewRoutes } from './review.routes';
import { teardownDto, teardownName, teardownSnapshot } from './teardown.service';
import { TeardownSchema } from './teardown.entity';

const today = () => new Date().toISOString().slice(0, 10);

const crudRoutes: RouteDef[] = [
  route(
    {
      method: 'get',
      path: '/api/teardowns/:id',
      tag: 'Teardowns',
      summary: 'One teardown with what the caller may do with it (viewers: published only)',
      access: 'signed-in',
      params: idParam,
      response: teardownResponse,
    },
    async ({ em, user, params }) => ({ teardown: await teardownDto(em, await readableTeardown(em, user, params.id), user) }),
  ),
  route(
    {
      method: 'post',
      path: '/api/teardowns',
      tag: 'Teardowns',
      summary: 'Start a teardown of a device (a draft, by the caller; the date defaults to today)',
      access: CONTENT_EDITORS,
      body: createTeardownBody,
      response: teardownResponse,
      status: 201,
    },
    async ({ em, user, body }) => {
      const device = await em.findOne(DeviceSchema, { id: body.deviceId });
      if (!device) throw new AppError('validation_failed', 'There is no device with this id.', { deviceId: 'No such device' });
      const t = await em.transactional(async (tx) => {
        const created = tx.create(TeardownSchema, {
          device,
          engineer: tx.getReference(UserSchema, user.id),
          date: body.date ?? today(),
          unitLabel: body.unitLabel ?? null,
          summary: body.summary ?? null,
          safetyNotes: body.safetyNotes ?? null,
          contactSeconds: body.contactSeconds ?? null,
          status: 'draft',
        });
        await tx.flush();
        recordAudit(tx, user, {
          action: 'teardown.created',
          entityType: 'teardown',
          entityId: created.id,
          scope: { type: 'teardown', id: created.id },
          summary: `Started a teardown of ${device.maker} ${device.model}${created.unitLabel ? ` (${created.unitLabel})` : ''} dated ${created.date}`,
        });
        return created;
      });
      const loaded = await readableTeardown(em, user, t.id);
      return { teardown: await teardownDto(em, loaded, user) };
    },
  ),
  route(
    {
      method: 'patch',
      path: '/api/teardowns/:id',
      tag: 'Teardowns',
      summary: 'Change a teardown. Send the version you edited: a stale one gets 409 stale_version with details.current. A published teardown needs X-Confirm-Unpublish: yes and goes back to draft.',
      access: CONTENT_EDITORS,
      params: idParam,
      body: updateTeardownBody,
      response: teardownResponse,
    },
    async (ctx) => {
      const { em, user, params, body } = ctx;
      const t = await readableTeardown(em, user, params.id);
      if (!CONTENT_EDITORS.includes(user.role)) throw forbidden();
      if (body.version !== t.version) {
        throw new AppError(
          'stale_version',
          `Someone changed this teardown after you opened it (you edited version ${body.version}; it is now version ${t.version}). Compare and re-apply your changes.`,
          undefined,
          { current: await teardownDto(em, t, user) },
        );
      }
      await editableTeardown(ctx, t.id);
      const before = teardownSnapshot(t);
      if (body.date !== undefined) t.date = body.date;
      if (body.unitLabel !== undefined) t.unitLabel = body.unitLabel;
      if (body.summary !== undefined) t.summary = body.summary;
      if (body.safetyNotes !== undefined) t.safetyNotes = body.safetyNotes;
      if (body.contactSeconds !== undefined) t.contactSeconds = body.contactSeconds;
      const changes = diffChanges(before, teardownSnapshot(t));
      if (Object.keys(changes).length) {
        recordAudit(em, user, {
          action: 'teardown.updated',
          entityType: 'teardown',
          entityId: t.id,
          scope: { type: 'teardown', id: t.id },
          summary: `Edited ${Object.keys(changes)
            .map((k) => TEARDOWN_FIELD_LABELS[k as keyof typeof TEARDOWN_FIELD_LABELS].toLowerCase())
            .join(', ')}`,
          changes,
        });
      }
      try {
        await em.flush();
      } catch (err) {
        if (!(err instanceof OptimisticLockError)) throw err;
        // Someone saved between our read and our write: answer like any stale version.
        const fresh = await readableTeardown(em.fork(), user, t.id);
        throw new AppError('stale_version', `Someone changed ${teardownName(fresh)} while you were saving. Compare and re-apply your changes.`, undefined, {
          current: await teardownDto(em.fork(), fresh, user),
        });
      }
      return { teardown: await teardownDto(em, t, user) };
    },
  ),
];

export const teardownRoutes: RouteDef[] = [...crudRoutes, ...reviewRoutes, ...commentRoutes];
