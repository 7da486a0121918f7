import type { EntityManager } from '@mikro-orm/sqlite';
import type { CalloutDto, PhotoDto, PhotoVariant } from '@splitcase/contracts';
import { validationError } from '../../http/errors';
import type { AuthUser } from '../../http/route';
import { recordAudit } from '../audit/audit.service';
import { FindingSchema, type Finding } from '../findings/finding.entity';
import { PartSchema, type Part } from '../parts/part.entity';
import type { Teardown } from '../teardowns/teardown.entity';
import { UserSchema } from '../users/user.entity';
import { CalloutSchema, type Callout } from './callout.entity';
import { sweepFolders, type SweepResult } from '../../lib/leftovers';
import { AuditEntrySchema } from '../audit/audit-entry.entity';
import { newStorageKey, photosRoot, photosStaging, processImage, publishPhotoFiles, removeStagedPhotoFiles, sanitiseFileName, sniffImage, STORAGE_KEY, writePhotoFiles } from './photo-files';
import { PhotoSchema, type Photo } from './photo.entity';

export const photoUrl = (id: number, variant: PhotoVariant) => `/api/photos/${id}/${variant}`;
export const photoUrls = (id: number) => ({ thumb: photoUrl(id, 'thumb'), display: photoUrl(id, 'display'), original: photoUrl(id, 'original') });

const clip = (s: string, n: number) => (s.length > n ? `${s.slice(0, n - 1)}…` : s);

/** How a part reads in a picker and beside a pin: designators, then the description. */
export const partLabel = (p: Pick<Part, 'designators' | 'description'>) => clip(p.designators ? `${p.designators} · ${p.description}` : p.description, 160);
export const findingLabel = (f: Pick<Finding, 'kind' | 'text'>) => clip(`${f.kind}: ${f.text.replace(/\s+/g, ' ')}`, 160);

/** Callout → DTO (part and finding must be loaded when set). */
export function toCalloutDto(c: Callout): CalloutDto {
  return {
    id: c.id,
    photoId: c.photo.id,
    number: c.number,
    x: Number(c.x),
    y: Number(c.y),
    label: c.label,
    part: c.part ? { id: Number(c.part.id), label: partLabel(c.part) } : null,
    finding: c.finding ? { id: Number(c.finding.id), label: findingLabel(c.finding) } : null,
  };
}

export function toPhotoDto(p: Photo, callouts: Callout[]): PhotoDto {
  return {
    id: p.id,
    teardownId: p.teardown.id,
    name: p.originalName,
    mime: p.mime,
    width: p.width,
    height: p.height,
    bytes: p.bytes,
    caption: p.caption ?? null,
    layer: p.layer,
    step: p.step,
    uploadedBy: p.uploadedBy ? { id: p.uploadedBy.id, name: p.uploadedBy.name } : null,
    createdAt: p.createdAt.toISOString(),
    urls: photoUrls(p.id),
    callouts: callouts
      .filter((c) => c.photo.id === p.id)
      .sort((a, b) => a.number - b.number)
      .map(toCalloutDto),
  };
}

/** The photos of a teardown ordered by layer, step, then upload order, with their pins. */
export async function teardownPhotos(em: EntityManager, teardownId: number): Promise<PhotoDto[]> {
  const photos = await em.find(PhotoSchema, { teardown: teardownId }, { orderBy: { layer: 'asc', step: 'asc', id: 'asc' }, populate: ['uploadedBy'] });
  const callouts = photos.length ? await em.find(CalloutSchema, { photo: { $in: photos.map((p) => p.id) } }, { populate: ['part', 'finding'] }) : [];
  return photos.map((p) => toPhotoDto(p, callouts));
}

/** Check that a part / finding to link belongs to this teardown (400 naming the field otherwise). */
export async function resolveLinks(em: EntityManager, teardownId: number, body: { partId?: number | null; findingId?: number | null }): Promise<{ part?: Part | null; finding?: Finding | null }> {
  const out: { part?: Part | null; finding?: Finding | null } = {};
  const fields: Record<string, string> = {};
  if (body.partId !== undefined) {
    if (body.partId === null) out.part = null;
    else {
      const part = await em.findOne(PartSchema, { id: body.partId });
      if (!part) fields.partId = `There is no part ${body.partId}`;
      else if (part.teardown.id !== teardownId) fields.partId = 'This part belongs to another teardown';
      else out.part = part;
    }
  }
  if (body.findingId !== undefined) {
    if (body.findingId === null) out.finding = null;
    else {
      const finding = await em.findOne(FindingSchema, { id: body.findingId });
      if (!finding) fields.findingId = `There is no finding ${body.findingId}`;
      else if (finding.teardown.id !== teardownId) fields.findingId = 'This finding belongs to another teardown';
      else out.finding = finding;
    }
  }
  if (Object.keys(fields).length) throw validationError(fields);
  return out;
}

export interface SavePhotoInput {
  teardown: Teardown;
  buffer: Buffer;
  clientName?: string;
  caption?: string | null;
  layer?: number;
  step?: number;
  uploadedBy?: number | null;
  /** Who to name in the audit log (no entry without one, e.g. the demo seed). */
  actor?: AuthUser;
}

/**
 * The one way a photo is stored (uploads and the demo seed): sniff, process, write the three files
 * to the staging folder, commit the row, then move the files into place. If the row cannot be
 * written the staged files go; if they cannot be moved into place the row goes: nothing is kept
 * half-saved. A crash in between is finished or undone by the start-up sweep.
 */
export async function savePhoto(em: EntityManager, uploadsDir: string, input: SavePhotoInput): Promise<Photo> {
  const type = await sniffImage(input.buffer);
  const processed = await processImage(input.buffer, type);
  const storageKey = newStorageKey();
  await writePhotoFiles(uploadsDir, storageKey, processed);
  let photo: Photo;
  try {
    const layer = input.layer ?? 1;
    let step = input.step;
    if (step === undefined) {
      const last = await em.findOne(PhotoSchema, { teardown: input.teardown.id, layer }, { orderBy: { step: 'desc' } });
      step = (last?.step ?? 0) + 1;
    }
    const name = sanitiseFileName(input.clientName);
    photo = await em.transactional(async (tx) => {
      const created = tx.create(PhotoSchema, {
        teardown: input.teardown,
        storageKey,
        originalName: name,
        mime: processed.original.mime,
        originalExt: processed.original.ext,
        width: processed.width,
        height: processed.height,
        bytes: processed.original.data.length,
        caption: input.caption ?? null,
        layer,
        step,
        uploadedBy: input.uploadedBy ? tx.getReference(UserSchema, input.uploadedBy) : null,
      });
      await tx.flush();
      if (input.actor) {
        recordAudit(tx, input.actor, {
          action: 'photo.uploaded',
          entityType: 'photo',
          entityId: created.id,
          scope: { type: 'teardown', id: input.teardown.id },
          summary: `Added photo "${name}" (layer ${layer}, step ${step}, ${processed.width} × ${processed.height} px)`,
        });
      }
      return created;
    });
  } catch (err) {
    await removeStagedPhotoFiles(uploadsDir, storageKey);
    throw err;
  }
  try {
    await publishPhotoFiles(uploadsDir, storageKey);
  } catch (err) {
    // The files cannot be served: take the row (and its audit entry) back.
    await em.transactional(async (tx) => {
      await tx.nativeDelete(AuditEntrySchema, { entityType: 'photo', entityId: String(photo.id), action: 'photo.uploaded' });
      await tx.nativeDelete(PhotoSchema, { id: photo.id });
    });
    em.getUnitOfWork().unsetIdentity(photo);
    await removeStagedPhotoFiles(uploadsDir, storageKey);
    throw err;
  }
  return photo;
}

/** Start-up: finish or undo photo uploads a crash interrupted, and remove folders without a photo. */
export async function sweepPhotoLeftovers(em: EntityManager, uploadsDir: string): Promise<SweepResult> {
  const rows = (await em.getConnection().execute('select storage_key from photos')) as { storage_key: string }[];
  return sweepFolders({ root: photosRoot(uploadsDir), staging: photosStaging(uploadsDir), keys: new Set(rows.map((r) => r.storage_key)), keyPattern: STORAGE_KEY });
}

/** The next pin number on a photo: one after the highest in use (numbers of deleted pins are not reused). */
export async function nextCalloutNumber(em: EntityManager, photoId: number): Promise<number> {
  const last = await em.findOne(CalloutSchema, { photo: photoId }, { orderBy: { number: 'desc' } });
  return (last?.number ?? 0) + 1;
}
