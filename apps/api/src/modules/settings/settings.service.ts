import type { EntityManager } from '@mikro-orm/sqlite';
import { workspaceSettingsSchema, type WorkspaceSettings } from '@splitcase/contracts';
import type { AuthUser } from '../../http/route';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { UserSchema } from '../users/user.entity';
import { SettingSchema } from './setting.entity';

/** The workspace settings: stored values over the defaults. */
export async function getSettings(em: EntityManager): Promise<WorkspaceSettings> {
  const rows = await em.find(SettingSchema, {});
  const stored = Object.fromEntries(rows.map((r) => [r.key, r.value]));
  const parsed = workspaceSettingsSchema.safeParse(stored);
  // A stored value that no longer validates falls back to its default rather than breaking every page.
  return parsed.success ? parsed.data : workspaceSettingsSchema.parse({});
}

export async function updateSettings(em: EntityManager, user: AuthUser, patch: Partial<WorkspaceSettings>): Promise<WorkspaceSettings> {
  const before = await getSettings(em);
  for (const [key, value] of Object.entries(patch)) {
    if (value === undefined) continue;
    const row = await em.findOne(SettingSchema, { key });
    if (row) {
      row.value = value;
      row.updatedBy = em.getReference(UserSchema, user.id);
    } else em.create(SettingSchema, { key, value, updatedBy: em.getReference(UserSchema, user.id) });
  }
  const changes = diffChanges(before as Record<string, unknown>, patch);
  if (Object.keys(changes).length) {
    recordAudit(em, user, { action: 'settings.updated', entityType: 'settings', entityId: 'workspace', summary: `Changed ${Object.keys(changes).join(', ')}`, changes });
  }
  await em.flush();
  return getSettings(em);
}
