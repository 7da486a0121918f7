import { defineEntity, p, type InferEntity } from '@mikro-orm/core';
import { UserSchema } from '../users/user.entity';

/** One workspace setting (key → JSON value). Defaults live in contracts' workspaceSettingsSchema. */
export const SettingSchema = defineEntity({
  name: 'Setting',
  tableName: 'settings',
  properties: {
    key: p.string().length(80).primary(),
    value: p.json<unknown>(),
    updatedBy: () => p.manyToOne(UserSchema).nullable().deleteRule('set null'),
    updatedAt: p
      .datetime()
      .onCreate(() => new Date())
      .onUpdate(() => new Date()),
  },
});
export type Setting = InferEntity<typeof SettingSchema>;
