import { adminUserResponse, createInvitationBody, idParam, invitationResponse, invitationsResponse, updateUserBody, usersResponse, ROLE_LABELS } from '@splitcase/contracts';
import { AppError, notFound } from '../../http/errors';
import { route, type RouteDef } from '../../http/route';
import { diffChanges, recordAudit } from '../audit/audit.service';
import { InvitationSchema, type Invitation } from '../auth/invitation.entity';
import { deleteStoredSessions, raiseSessionEpoch } from '../auth/sessions';
import { INVITATION_TTL_MS, newToken } from '../auth/tokens';
import { linkMail } from '../mail/templates';
import { UserSchema, type User } from './user.entity';

export const toAdminUserDto = (u: User) => ({
  id: u.id,
  email: u.email,
  name: u.name,
  role: u.role,
  active: u.active,
  createdAt: u.createdAt.toISOString(),
  lastSignInAt: u.lastSignInAt ? u.lastSignInAt.toISOString() : null,
});

function invitationStatus(i: Invitation): 'pending' | 'accepted' | 'expired' | 'revoked' {
  if (i.acceptedAt) return 'accepted';
  if (i.revokedAt) return 'revoked';
  if (i.expiresAt.getTime() < Date.now()) return 'expired';
  return 'pending';
}

export const toInvitationDto = (i: Invitation) => ({
  id: i.id,
  email: i.email,
  role: i.role,
  status: invitationStatus(i),
  invitedBy: i.invitedBy ? i.invitedBy.name : null,
  createdAt: i.createdAt.toISOString(),
  expiresAt: i.expiresAt.toISOString(),
});

export const userRoutes: RouteDef[] = [
  route({ method: 'get', path: '/api/users', tag: 'Admin', summary: 'All users', access: ['admin'], response: usersResponse }, async ({ em }) => ({
    users: (await em.find(UserSchema, {}, { orderBy: { name: 'asc' } })).map(toAdminUserDto),
  })),
  route(
    {
      method: 'patch',
      path: '/api/users/:id',
      tag: 'Admin',
      summary: "Change a user's role or deactivate/reactivate them (a deactivated user's sessions end)",
      access: ['admin'],
      params: idParam,
      body: updateUserBody,
      response: adminUserResponse,
    },
    async ({ em, params, body, user: me, req }) => {
      const user = await em.findOne(UserSchema, { id: params.id });
      if (!user) throw notFound('The user');
      if (user.id === me.id && (body.active === false || (body.role && body.role !== 'admin'))) {
        throw new AppError('conflict', 'You cannot deactivate yourself or remove your own admin role; ask another admin.');
      }
      const losesAdmin = user.role === 'admin' && user.active && ((body.role && body.role !== 'admin') || body.active === false);
      if (losesAdmin && (await em.count(UserSchema, { role: 'admin', active: true })) <= 1) {
        throw new AppError('conflict', 'The workspace needs at least one active admin.');
      }
      const changes = diffChanges({ role: user.role, active: user.active }, body);
      if (body.role) user.role = body.role;
      const deactivated = user.active && body.active === false;
      if (body.active !== undefined) user.active = body.active;
      // A deactivated user's sessions end now (not at their next request), and reactivation does not revive them.
      if (deactivated) raiseSessionEpoch(user);
      if (Object.keys(changes).length) {
        recordAudit(em, me, {
          action: 'user.updated',
          entityType: 'user',
          entityId: user.id,
          summary: [
            changes.role ? `${user.email}: role ${ROLE_LABELS[changes.role.from as User['role']]} → ${ROLE_LABELS[user.role]}` : null,
            changes.active ? `${user.email}: ${user.active ? 'reactivated' : 'deactivated'}` : null,
          ]
            .filter(Boolean)
            .join('; '),
          changes,
        });
      }
      await em.flush();
      if (deactivated) await deleteStoredSessions(req, user.id);
      return { user: toAdminUserDto(user) };
    },
  ),
  route({ method: 'get', path: '/api/invitations', tag: 'Admin', summary: 'Invitations, newest first', access: ['admin'], response: invitationsResponse }, async ({ em }) => ({
    invitations: (await em.find(InvitationSchema, {}, { orderBy: { id: 'desc' }, populate: ['invitedBy'] })).map(toInvitationDto),
  })),
  route(
    {
      method: 'post',
      path: '/api/invitations',
      tag: 'Admin',
      summary: 'Invite an e-mail address with a role; the invitee gets a one-time link by e-mail',
      access: ['admin'],
      body: createInvitationBody,
      response: invitationResponse,
      status: 201,
    },
    async ({ em, body, user: me, deps }) => {
      if (await em.count(UserSchema, { email: body.email })) {
        throw new AppError('conflict', 'A user with this e-mail address already exists.', { email: 'Already a user' });
      }
      const { token, hash } = newToken();
      const invitation = await em.transactional(async (tx) => {
        // A new invitation replaces any pending one for the same address.
        await tx.nativeUpdate(InvitationSchema, { email: body.email, acceptedAt: null, revokedAt: null }, { revokedAt: new Date() });
        const inv = tx.create(InvitationSchema, {
          email: body.email,
          role: body.role,
          tokenHash: hash,
          invitedBy: tx.getReference(UserSchema, me.id),
          expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
        });
        await tx.flush();
        recordAudit(tx, me, { action: 'invitation.created', entityType: 'invitation', entityId: inv.id, summary: `Invited ${body.email} as ${ROLE_LABELS[body.role]}` });
        return inv;
      });
      try {
        await deps.mailer.send(
          linkMail({
            to: body.email,
            subject: `${me.name} invited you to Splitcase`,
            lines: [
              'Hello,',
              `${me.name} invited you to the team's Splitcase workspace as ${ROLE_LABELS[body.role]}.`,
              'Open the link to choose your name and password. It works once and expires in 7 days.',
            ],
            linkLabel: 'Accept the invitation',
            url: `${deps.env.publicUrl}/accept-invitation?token=${token}`,
          }),
        );
      } catch (err) {
        // The mail server refused: take the invitation back so nothing is left half-done.
        await em.nativeDelete(InvitationSchema, { id: invitation.id });
        deps.log('Invitation e-mail failed', err);
        throw new AppError('internal', 'The invitation e-mail could not be sent, so no invitation was created. Check the mail settings and try again.', undefined, undefined, 502);
      }
      await em.populate(invitation, ['invitedBy']);
      return { invitation: toInvitationDto(invitation) };
    },
  ),
  route({ method: 'delete', path: '/api/invitations/:id', tag: 'Admin', summary: 'Revoke a pending invitation', access: ['admin'], params: idParam }, async ({ em, params, user: me }) => {
    const inv = await em.findOne(InvitationSchema, { id: params.id });
    if (!inv) throw notFound('The invitation');
    if (inv.acceptedAt) throw new AppError('conflict', 'This invitation has already been accepted.');
    if (!inv.revokedAt) {
      inv.revokedAt = new Date();
      recordAudit(em, me, { action: 'invitation.revoked', entityType: 'invitation', entityId: inv.id, summary: `Revoked the invitation of ${inv.email}` });
      await em.flush();
    }
    return undefined;
  }),
];
