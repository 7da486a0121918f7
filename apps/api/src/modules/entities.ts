// Every entity of the API. Add a new module's entities here (and create a migration).
import { AuditEntrySchema } from './audit/audit-entry.entity';
import { InvitationSchema } from './auth/invitation.entity';
import { ResetTokenSchema } from './auth/reset-token.entity';
import { OutboxMessageSchema } from './mail/outbox-message.entity';
import { UserSchema } from './users/user.entity';

export const entities = [UserSchema, InvitationSchema, ResetTokenSchema, OutboxMessageSchema, AuditEntrySchema];
