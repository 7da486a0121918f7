import type { EntityManager } from '@mikro-orm/sqlite';
import { isLithiumChemistry } from '@splitcase/calc';
import type { TeardownDto } from '@splitcase/contracts';
import type { AuthUser } from '../../http/route';
import { PackSchema } from '../power/pack.entity';
import { toTeardownDto } from './dto';
import type { Teardown } from './teardown.entity';

/** The recorded cells of a teardown, for the cautions (null when no pack is recorded yet). */
export async function cellOf(em: EntityManager, teardownId: number): Promise<TeardownDto['cell']> {
  const pack = await em.findOne(PackSchema, { teardown: teardownId }, { fields: ['id', 'chemistry'] as never });
  return pack ? { chemistry: pack.chemistry, lithium: isLithiumChemistry(pack.chemistry) } : null;
}

/** The full DTO of a teardown (device and engineer loaded), with its cell. */
export async function teardownDto(em: EntityManager, t: Teardown, user: AuthUser): Promise<TeardownDto> {
  return toTeardownDto(t, user, await cellOf(em, t.id));
}

/** The fields the overview edits, as plain values (for audit diffs). */
export function teardownSnapshot(t: Teardown) {
  return {
    date: t.date,
    unitLabel: t.unitLabel ?? null,
    summary: t.summary ?? null,
    safetyNotes: t.safetyNotes ?? null,
    contactSeconds: t.contactSeconds ?? null,
  };
}

export const teardownName = (t: Teardown) => `${t.device.maker} ${t.device.model}${t.unitLabel ? ` (${t.unitLabel})` : ''}`;
