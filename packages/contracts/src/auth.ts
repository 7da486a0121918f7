import { z } from 'zod';
import { email, password, text, safeString } from './common';
import { roleSchema } from './roles';

export const userSchema = z.object({
  id: z.number().int(),
  email: safeString(),
  name: safeString(),
  role: roleSchema,
});
export type User = z.infer<typeof userSchema>;

export const csrfResponse = z.object({ token: safeString() });
export const loginBody = z.object({ email, password: safeString().min(1, 'Required').max(200) });
export type LoginBody = z.infer<typeof loginBody>;
export const userResponse = z.object({ user: userSchema });
export type UserResponse = z.infer<typeof userResponse>;

export const tokenQuery = z.object({ token: safeString().min(16, 'The link is incomplete').max(200) });
export const invitationPreview = z.object({
  invitation: z.object({ email: safeString(), role: roleSchema, expiresAt: safeString() }),
});
export const acceptInvitationBody = z.object({
  token: safeString().min(16, 'The link is incomplete').max(200),
  name: text(120),
  password,
});
export type AcceptInvitationBody = z.infer<typeof acceptInvitationBody>;

export const resetRequestBody = z.object({ email });
export type ResetRequestBody = z.infer<typeof resetRequestBody>;
export const resetConfirmBody = z.object({
  token: safeString().min(16, 'The link is incomplete').max(200),
  password,
});
export type ResetConfirmBody = z.infer<typeof resetConfirmBody>;
/** POST /api/auth/password: change your own password (your other sessions end). */
export const changePasswordBody = z.object({
  currentPassword: safeString().min(1, 'Required').max(200),
  newPassword: password,
});
export type ChangePasswordBody = z.infer<typeof changePasswordBody>;
export const acceptedResponse = z.object({ ok: z.literal(true), message: safeString() });
