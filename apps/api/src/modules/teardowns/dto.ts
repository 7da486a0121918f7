import type { TeardownDto } from '@splitcase/contracts';
import type { AuthUser } from '../../http/route';
import { permissionsFor } from './access';
import type { Teardown } from './teardown.entity';

/** Teardown → DTO (device and engineer must be loaded). `cell` comes from the pack, when one is recorded. */
export function toTeardownDto(t: Teardown, user: AuthUser, cell: TeardownDto['cell'] = null): TeardownDto {
  return {
    id: t.id,
    device: { id: t.device.id, maker: t.device.maker, model: t.device.model, category: t.device.category },
    engineer: { id: t.engineer.id, name: t.engineer.name },
    unitLabel: t.unitLabel ?? null,
    date: t.date,
    status: t.status,
    summary: t.summary ?? null,
    safetyNotes: t.safetyNotes ?? null,
    contactSeconds: t.contactSeconds ?? null,
    version: t.version,
    submittedAt: t.submittedAt?.toISOString() ?? null,
    publishedAt: t.publishedAt?.toISOString() ?? null,
    lastReviewNote: t.lastReviewNote ?? null,
    updatedAt: t.updatedAt.toISOString(),
    permissions: permissionsFor(user, t),
    cell,
  };
}
