import type { EntityManager } from '@mikro-orm/sqlite';
import { FINDING_KIND, SEVERITY, type FindingDto, type FindingKind, type LinkablePart, type LinkablePhoto, type Severity } from '@splitcase/contracts';
import { validationError } from '../../http/errors';
import type { AuthUser } from '../../http/route';
import { recordAudit } from '../audit/audit.service';
import { PartSchema, type Part } from '../parts/part.entity';
import { PhotoSchema, type Photo } from '../photos/photo.entity';
import type { Teardown } from '../teardowns/teardown.entity';
import { UserSchema } from '../users/user.entity';
import { FindingSchema, type Finding } from './finding.entity';

export const toLinkablePart = (p: Part): LinkablePart => ({ id: p.id, designators: p.designators ?? null, description: p.description, category: p.category });
export const toLinkablePhoto = (p: Photo): LinkablePhoto => ({ id: p.id, caption: p.caption ?? null, layer: p.layer });

/** Finding → DTO (parts, photos and createdBy must be loaded). */
export function toFindingDto(f: Finding): FindingDto {
  return {
    id: f.id,
    teardownId: typeof f.teardown === 'object' ? f.teardown.id : (f.teardown as number),
    kind: f.kind,
    severity: f.severity,
    text: f.text,
    tags: f.tags ?? [],
    suggestionKey: f.suggestionKey ?? null,
    parts: f.parts
      .getItems()
      .sort((a, b) => a.position - b.position || a.id - b.id)
      .map(toLinkablePart),
    photos: f.photos
      .getItems()
      .sort((a, b) => a.layer - b.layer || a.step - b.step || a.id - b.id)
      .map(toLinkablePhoto),
    createdBy: f.createdBy ? { id: f.createdBy.id, name: f.createdBy.name } : null,
    createdAt: f.createdAt.toISOString(),
    updatedAt: f.updatedAt.toISOString(),
  };
}

export const FINDING_POPULATE = ['parts', 'photos', 'createdBy'] as const;

/** Parts and photos of this teardown with these ids; any other id is refused, naming the field. */
export async function linkedRecords(em: EntityManager, teardownId: number, partIds?: number[], photoIds?: number[]) {
  const errors: Record<string, string> = {};
  let parts: Part[] | undefined;
  let photos: Photo[] | undefined;
  if (partIds) {
    const unique = [...new Set(partIds)];
    parts = unique.length ? await em.find(PartSchema, { id: { $in: unique }, teardown: teardownId }) : [];
    const missing = unique.filter((id) => !parts!.some((p) => p.id === id));
    if (missing.length) errors.partIds = `Not parts of this teardown: ${missing.join(', ')}`;
  }
  if (photoIds) {
    const unique = [...new Set(photoIds)];
    photos = unique.length ? await em.find(PhotoSchema, { id: { $in: unique }, teardown: teardownId }) : [];
    const missing = unique.filter((id) => !photos!.some((p) => p.id === id));
    if (missing.length) errors.photoIds = `Not photos of this teardown: ${missing.join(', ')}`;
  }
  if (Object.keys(errors).length) throw validationError(errors);
  return { parts, photos };
}

export const findingSummary = (f: { kind: FindingKind; severity: Severity; text: string }) =>
  `${SEVERITY.labels[f.severity]} ${FINDING_KIND.labels[f.kind].toLowerCase()} finding: ${f.text.length > 100 ? `${f.text.slice(0, 97)}…` : f.text}`;

/** Create a finding in the unit of work (flushes to get its id, audits; the caller's transaction commits). */
export async function createFinding(
  em: EntityManager,
  user: AuthUser | null,
  t: Teardown,
  data: { kind: FindingKind; severity: Severity; text: string; tags: string[]; suggestionKey?: string | null; parts?: Part[]; photos?: Photo[] },
  createdAt?: Date,
): Promise<Finding> {
  const f = em.create(FindingSchema, {
    teardown: t,
    kind: data.kind,
    severity: data.severity,
    text: data.text,
    tags: data.tags,
    suggestionKey: data.suggestionKey ?? null,
    createdBy: user ? em.getReference(UserSchema, user.id) : null,
    ...(createdAt ? { createdAt, updatedAt: createdAt } : {}),
  });
  if (data.parts) f.parts.set(data.parts);
  if (data.photos) f.photos.set(data.photos);
  await em.flush();
  recordAudit(em, user, {
    action: 'finding.created',
    entityType: 'finding',
    entityId: f.id,
    scope: { type: 'teardown', id: t.id },
    summary: findingSummary(f) + (data.suggestionKey ? ` (accepted suggestion ${data.suggestionKey})` : ''),
  });
  return f;
}
