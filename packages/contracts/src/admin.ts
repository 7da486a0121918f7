import { z } from 'zod';
import { email, safeString } from './common';
import { roleSchema } from './roles';

export const adminUserSchema = z.object({
  id: z.number().int(),
  email: safeString(),
  name: safeString(),
  role: roleSchema,
  active: z.boolean(),
  createdAt: safeString(),
  lastSignInAt: safeString().nullable(),
});
export type AdminUser = z.infer<typeof adminUserSchema>;
export const usersResponse = z.object({ users: z.array(adminUserSchema) });
export const updateUserBody = z
  .object({ role: roleSchema.optional(), active: z.boolean().optional() })
  .refine((b) => b.role !== undefined || b.active !== undefined, { message: 'Give a role or an active flag' });
export type UpdateUserBody = z.infer<typeof updateUserBody>;
export const adminUserResponse = z.object({ user: adminUserSchema });

export const invitationSchema = z.object({
  id: z.number().int(),
  email: safeString(),
  role: roleSchema,
  status: z.enum(['pending', 'accepted', 'expired', 'revoked']),
  invitedBy: safeString().nullable(),
  createdAt: safeString(),
  expiresAt: safeString(),
});
export type Invitation = z.infer<typeof invitationSchema>;
export const invitationsResponse = z.object({ invitations: z.array(invitationSchema) });
export const createInvitationBody = z.object({ email, role: roleSchema });
export type CreateInvitationBody = z.infer<typeof createInvitationBody>;
export const invitationResponse = z.object({ invitation: invitationSchema });

export const outboxMessageSchema = z.object({
  id: z.number().int(),
  receivedAt: safeString(),
  from: safeString(),
  to: safeString(),
  subject: safeString(),
  text: safeString(),
  html: safeString().nullable(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
export const outboxResponse = z.object({ enabled: z.boolean(), messages: z.array(outboxMessageSchema) });

export const auditEntrySchema = z.object({
  id: z.number().int(),
  at: safeString(),
  actor: safeString().nullable(),
  action: safeString(),
  entityType: safeString(),
  entityId: safeString(),
  summary: safeString(),
  changes: z.record(safeString(), z.object({ from: z.unknown(), to: z.unknown() })).nullable(),
});
export type AuditEntry = z.infer<typeof auditEntrySchema>;
export const auditQuery = z.object({
  entityType: safeString().max(60).optional(),
  entityId: safeString().max(60).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  before: z.coerce.number().int().positive().optional(),
});
export const auditResponse = z.object({ entries: z.array(auditEntrySchema) });

/** The newest complete backup (`npm run backup`) in the server's backups folder, or null. */
export const backupStatusResponse = z.object({
  lastBackup: z
    .object({
      /** When the snapshot was taken (ISO 8601). */
      at: safeString(),
      /** The dated folder name, as `npm run restore` takes it. */
      folder: safeString(),
      bytes: z.number().int(),
      files: z.number().int(),
    })
    .nullable(),
});
export type BackupStatus = z.infer<typeof backupStatusResponse>;
