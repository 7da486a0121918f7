import { RequestContext } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/sqlite';
import type { RequestHandler, Response } from 'express';
import multer from 'multer';
import type { ZodType } from 'zod';
import {
  calloutResponse,
  calloutsResponse,
  calloutTargetsResponse,
  createCalloutBody,
  idParam,
  photoResponse,
  photosResponse,
  photoVariantParams,
  placedCalloutsResponse,
  teardownCalloutsQuery,
  updateCalloutBody,
  updatePhotoBody,
  uploadPhotoFields,
} from '@splitcase/contracts';
import { forbidden, notFound, validationError } from '../../http/errors';
import { uploadOne } from '../../http/multipart';
import { confirmsUnpublish, route, type AuthUser, type RouteDef } from '../../http/route';
import type { AppDeps } from '../../http/deps';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { FindingSchema } from '../findings/finding.entity';
import { PartSchema } from '../parts/part.entity';
import { assertWritable, CONTENT_EDITORS, canSee, editableTeardown, readableTeardown } from '../teardowns/access';
import { CalloutSchema, type Callout } from './callout.entity';
import { removePhotoFiles, uploadLimits, variantMime, variantPath } from './photo-files';
import { PhotoSchema, type Photo } from './photo.entity';
import { findingLabel, nextCalloutNumber, partLabel, photoUrls, resolveLinks, savePhoto, teardownPhotos, toCalloutDto, toPhotoDto } from './photos.service';

const TAG = 'Photos';
const getEm = () => RequestContext.getEntityManager() as EntityManager;

/**
 * Before the body is read: the teardown must exist for this user, their role must edit it, it must
 * not be in review, and a published one needs the confirm header — so a refused upload is refused
 * before 25 MB arrive.
 */
const precheckUploadTarget: RequestHandler = async (req, _res, next) => {
  const id = Number(req.params.id);
  if (!Number.isInteger(id) || id <= 0) return next(validationError({ 'params.id': 'Must be a positive whole number' }));
  const t = await readableTeardown(getEm(), req.authUser as AuthUser, id);
  if (!CONTENT_EDITORS.includes((req.authUser as AuthUser).role)) return next(forbidden());
  assertWritable(t, confirmsUnpublish(req));
  next();
};

/** A PATCH of a photo or a pin by its id, by content editors. */
const editSpec = <B extends ZodType>(path: string, summary: string, body: B, response: ZodType) =>
  ({ method: 'patch', path, tag: TAG, summary, access: CONTENT_EDITORS, params: idParam, body, response }) as const;

/** Load a photo with its teardown; a user who may not read that teardown gets 404. */
async function readablePhoto(em: EntityManager, user: AuthUser, id: number): Promise<Photo> {
  const photo = await em.findOne(PhotoSchema, { id }, { populate: ['teardown', 'uploadedBy'] });
  if (!photo || !canSee(user, photo.teardown)) throw notFound('The photo');
  return photo;
}

async function readableCallout(em: EntityManager, user: AuthUser, id: number): Promise<Callout> {
  const callout = await em.findOne(CalloutSchema, { id }, { populate: ['photo', 'photo.teardown', 'part', 'finding'] });
  if (!callout || !canSee(user, callout.photo.teardown)) throw notFound('The callout');
  return callout;
}

function sendFile(res: Response, path: string): Promise<void> {
  return new Promise((resolve, reject) => {
    res.sendFile(path, { dotfiles: 'deny', lastModified: true, etag: true }, (err) => {
      if (!err) return resolve();
      const code = (err as NodeJS.ErrnoException).code;
      reject(code === 'ENOENT' ? notFound('The photo file') : err);
    });
  });
}

/** "moved; label, partId changed" */
function describeCalloutChanges(keys: string[]): string {
  const moved = keys.includes('x') || keys.includes('y');
  const others = keys.filter((k) => k !== 'x' && k !== 'y');
  return [moved ? 'moved' : null, others.length ? `${others.join(', ')} changed` : null].filter(Boolean).join('; ');
}

const pinSummary = (c: { number: number; label: string }) => `#${c.number} "${c.label}"`;

export function photoRoutes(deps: AppDeps): RouteDef[] {
  const upload = uploadOne({ field: 'file', maxBytes: deps.env.uploadMaxBytes, storage: multer.memoryStorage(), fields: 10, fieldSize: 4000 });

  return [
    route(
      {
        method: 'get',
        path: '/api/teardowns/:id/photos',
        tag: TAG,
        summary: 'Photos of a teardown ordered by layer and step, with their pins and the upload limits',
        access: 'signed-in',
        params: idParam,
        response: photosResponse,
      },
      async ({ em, user, params }) => {
        const t = await readableTeardown(em, user, params.id);
        return { photos: await teardownPhotos(em, t.id), limits: uploadLimits(deps.env.uploadMaxBytes) };
      },
    ),
    route(
      {
        method: 'post',
        path: '/api/teardowns/:id/photos',
        tag: TAG,
        summary:
          'Upload one photo (multipart field "file", JPEG/PNG/WebP, HEIC when the server can decode it). The type is read from the bytes; EXIF is applied and then every piece of metadata is removed. 413 over the size limit, 415 other types, 422 over the pixel limit or undecodable.',
        access: CONTENT_EDITORS,
        params: idParam,
        body: uploadPhotoFields,
        multipart: { file: 'file', caption: 'string', layer: 'string', step: 'string' },
        before: [precheckUploadTarget, upload],
        response: photoResponse,
        status: 201,
      },
      async (ctx) => {
        const file = ctx.req.file;
        if (!file || file.size === 0) throw validationError({ file: file ? 'The file is empty' : 'Choose a photo to upload (multipart field "file")' });
        const teardown = await editableTeardown(ctx, ctx.params.id);
        const photo = await savePhoto(ctx.em, deps.env.uploadsDir, {
          teardown,
          buffer: file.buffer,
          clientName: file.originalname,
          caption: ctx.body.caption ?? null,
          layer: ctx.body.layer,
          step: ctx.body.step,
          uploadedBy: ctx.user.id,
          actor: ctx.user,
        });
        await ctx.em.populate(photo, ['uploadedBy']);
        return { photo: toPhotoDto(photo, []) };
      },
    ),
    route(editSpec('/api/photos/:id', "Change a photo's caption, layer or step", updatePhotoBody, photoResponse), async (ctx) => {
      const { em, params, body, user } = ctx;
      const photo = await readablePhoto(em, user, params.id);
      await editableTeardown(ctx, photo.teardown.id);
      const changes = diffChanges({ caption: photo.caption ?? null, layer: photo.layer, step: photo.step }, body);
      if (body.caption !== undefined) photo.caption = body.caption;
      if (body.layer !== undefined) photo.layer = body.layer;
      if (body.step !== undefined) photo.step = body.step;
      if (Object.keys(changes).length) {
        recordAudit(em, user, {
          action: 'photo.updated',
          entityType: 'photo',
          entityId: photo.id,
          scope: { type: 'teardown', id: photo.teardown.id },
          summary: `Photo "${photo.originalName}": changed ${Object.keys(changes).join(', ')}`,
          changes,
        });
      }
      await em.flush();
      const callouts = await em.find(CalloutSchema, { photo: photo.id }, { populate: ['part', 'finding'] });
      return { photo: toPhotoDto(photo, callouts) };
    }),
    route(
      {
        method: 'delete',
        path: '/api/photos/:id',
        tag: TAG,
        summary: 'Delete a photo, its pins and its files',
        access: CONTENT_EDITORS,
        params: idParam,
      },
      async (ctx) => {
        const { em, params, user } = ctx;
        const photo = await readablePhoto(em, user, params.id);
        await editableTeardown(ctx, photo.teardown.id);
        const { storageKey } = photo;
        recordAudit(em, user, {
          action: 'photo.deleted',
          entityType: 'photo',
          entityId: photo.id,
          scope: { type: 'teardown', id: photo.teardown.id },
          summary: `Deleted photo "${photo.originalName}" (layer ${photo.layer}, step ${photo.step}) and its pins`,
        });
        await em.transactional(async (tx) => {
          await tx.nativeDelete(CalloutSchema, { photo: photo.id });
          tx.remove(photo);
        });
        // The row is gone: now the files (a failure here leaves only unreachable files behind).
        await removePhotoFiles(deps.env.uploadsDir, storageKey).catch((err) => deps.log('Could not remove photo files', storageKey, err));
        return undefined;
      },
    ),
    route(
      {
        method: 'get',
        path: '/api/photos/:id/callouts',
        tag: TAG,
        summary: 'The numbered pins of a photo',
        access: 'signed-in',
        params: idParam,
        response: calloutsResponse,
      },
      async ({ em, user, params }) => {
        const photo = await readablePhoto(em, user, params.id);
        const callouts = await em.find(CalloutSchema, { photo: photo.id }, { orderBy: { number: 'asc' }, populate: ['part', 'finding'] });
        return { callouts: callouts.map(toCalloutDto) };
      },
    ),
    route(
      {
        method: 'post',
        path: '/api/photos/:id/callouts',
        tag: TAG,
        summary: 'Place a numbered pin at relative x, y (0..1); the number is one after the highest on the photo',
        access: CONTENT_EDITORS,
        params: idParam,
        body: createCalloutBody,
        response: calloutResponse,
        status: 201,
      },
      async (ctx) => {
        const { em, params, body, user } = ctx;
        const photo = await readablePhoto(em, user, params.id);
        await editableTeardown(ctx, photo.teardown.id);
        const links = await resolveLinks(em, photo.teardown.id, body);
        const callout = await em.transactional(async (tx) => {
          const c = tx.create(CalloutSchema, {
            photo,
            number: await nextCalloutNumber(tx, photo.id),
            x: body.x,
            y: body.y,
            label: body.label,
            part: links.part ?? null,
            finding: links.finding ?? null,
          });
          await tx.flush();
          recordAudit(tx, user, {
            action: 'callout.created',
            entityType: 'callout',
            entityId: c.id,
            scope: { type: 'teardown', id: photo.teardown.id },
            summary: `Pin ${pinSummary(c)} placed on photo "${photo.originalName}"${c.part ? ` → part ${partLabel(c.part)}` : ''}`,
          });
          return c;
        });
        return { callout: toCalloutDto(callout) };
      },
    ),
    route(editSpec('/api/callouts/:id', 'Move a pin, change its label, or link/unlink a part or finding of the same teardown', updateCalloutBody, calloutResponse), async (ctx) => {
      const { em, params, body, user } = ctx;
      const callout = await readableCallout(em, user, params.id);
      const teardownId = callout.photo.teardown.id;
      await editableTeardown(ctx, teardownId);
      const links = await resolveLinks(em, teardownId, body);
      const before = { x: callout.x, y: callout.y, label: callout.label, partId: callout.part?.id ?? null, findingId: callout.finding?.id ?? null };
      const changes = diffChanges(before, body);
      if (body.x !== undefined) callout.x = body.x;
      if (body.y !== undefined) callout.y = body.y;
      if (body.label !== undefined) callout.label = body.label;
      if (links.part !== undefined) callout.part = links.part;
      if (links.finding !== undefined) callout.finding = links.finding;
      if (Object.keys(changes).length) {
        recordAudit(em, user, {
          action: 'callout.updated',
          entityType: 'callout',
          entityId: callout.id,
          scope: { type: 'teardown', id: teardownId },
          summary: `Pin ${pinSummary(callout)}: ${describeCalloutChanges(Object.keys(changes))}`,
          changes,
        });
      }
      await em.flush();
      return { callout: toCalloutDto(callout) };
    }),
    route({ method: 'delete', path: '/api/callouts/:id', tag: TAG, summary: 'Remove a pin', access: CONTENT_EDITORS, params: idParam }, async (ctx) => {
      const { em, params, user } = ctx;
      const callout = await readableCallout(em, user, params.id);
      await editableTeardown(ctx, callout.photo.teardown.id);
      recordAudit(em, user, {
        action: 'callout.deleted',
        entityType: 'callout',
        entityId: callout.id,
        scope: { type: 'teardown', id: callout.photo.teardown.id },
        summary: `Pin ${pinSummary(callout)} removed from photo "${callout.photo.originalName}"`,
      });
      em.remove(callout);
      await em.flush();
      return undefined;
    }),
    route(
      {
        method: 'get',
        path: '/api/teardowns/:id/callouts',
        tag: TAG,
        summary: 'Pins of a teardown with their photos; filter by partId and/or findingId (both given: pins linked to either)',
        access: 'signed-in',
        params: idParam,
        query: teardownCalloutsQuery,
        response: placedCalloutsResponse,
      },
      async ({ em, user, params, query }) => {
        const t = await readableTeardown(em, user, params.id);
        const links = [query.partId ? { part: query.partId } : null, query.findingId ? { finding: query.findingId } : null].filter((x) => x !== null);
        const callouts = await em.find(
          CalloutSchema,
          { photo: { teardown: t.id }, ...(links.length ? { $or: links } : {}) },
          { populate: ['photo', 'part', 'finding'], orderBy: { photo: { layer: 'asc', step: 'asc', id: 'asc' }, number: 'asc' } },
        );
        return {
          callouts: callouts.map((c) => ({
            ...toCalloutDto(c),
            photo: { id: c.photo.id, caption: c.photo.caption ?? null, width: c.photo.width, height: c.photo.height, layer: c.photo.layer, step: c.photo.step, urls: photoUrls(c.photo.id) },
          })),
        };
      },
    ),
    route(
      {
        method: 'get',
        path: '/api/teardowns/:id/callout-targets',
        tag: TAG,
        summary: 'Parts and findings of a teardown that a pin may link to',
        access: 'signed-in',
        params: idParam,
        response: calloutTargetsResponse,
      },
      async ({ em, user, params }) => {
        const t = await readableTeardown(em, user, params.id);
        const parts = await em.find(PartSchema, { teardown: t.id }, { orderBy: { position: 'asc', id: 'asc' } });
        const findings = await em.find(FindingSchema, { teardown: t.id }, { orderBy: { id: 'asc' } });
        return { parts: parts.map((p) => ({ id: p.id, label: partLabel(p) })), findings: findings.map((f) => ({ id: f.id, label: findingLabel(f) })) };
      },
    ),
    // Last: '/api/photos/:id/callouts' must match its own route first.
    route(
      {
        method: 'get',
        path: '/api/photos/:id/:variant',
        tag: TAG,
        summary: 'A photo file: thumb (320 px, WebP), display (1600 px, WebP) or original (re-encoded, no metadata)',
        access: 'signed-in',
        params: photoVariantParams,
        produces: 'image/*',
      },
      async ({ em, user, params, res }) => {
        const photo = await readablePhoto(em, user, params.id);
        res.setHeader('Content-Type', variantMime(params.variant, photo.mime));
        res.setHeader('X-Content-Type-Options', 'nosniff');
        // Private: only the signed-in browser may keep it; the file behind an id never changes.
        res.setHeader('Cache-Control', 'private, max-age=86400');
        res.setHeader('Content-Disposition', 'inline');
        await sendFile(res, variantPath(deps.env.uploadsDir, photo.storageKey, params.variant, photo.originalExt));
        return undefined;
      },
    ),
  ];
}
