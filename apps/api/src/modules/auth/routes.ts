import {
  acceptInvitationBody,
  changePasswordBody,
  acceptedResponse,
  csrfResponse,
  invitationPreview,
  loginBody,
  resetConfirmBody,
  resetRequestBody,
  tokenQuery,
  userResponse,
} from '@splitcase/contracts';
import type { EntityManager } from '@mikro-orm/sqlite';
import type { Request } from 'express';
import { AppError } from '../../http/errors';
import { route, type RouteDef } from '../../http/route';
import type { AppDeps } from '../../http/deps';
import { recordAudit } from '../audit/audit.service';
import { linkMail } from '../mail/templates';
import { UserSchema, type User } from '../users/user.entity';
import { InvitationSchema, type Invitation } from './invitation.entity';
import { getSettings } from '../settings/settings.service';
import { LoginThrottle } from './login-throttle';
import { dummyHash, hashPassword, passwordProblem, verifyPassword } from './passwords';
import { loginIpLimiter, mailLimiter } from './rate-limit';
import { deleteStoredSessions, raiseSessionEpoch, startSession } from './sessions';
import { ResetTokenSchema } from './reset-token.entity';
import { hashToken, newToken, RESET_TTL_MS } from './tokens';

export const toUserDto = (u: User) => ({ id: u.id, email: u.email, name: u.name, role: u.role });

/** Start a fresh session for the user with the workspace's session limits. */
async function signIn(req: Request, em: EntityManager, user: User): Promise<void> {
  const settings = await getSettings(em);
  await startSession(req, user, { maxHours: settings.sessionMaxHours, idleMinutes: settings.sessionIdleMinutes });
}

/** A refused new password names the field it was typed in. */
function checkNewPassword(field: string, password: string, who: { email: string; name?: string | null }): void {
  const problem = passwordProblem(password, who);
  if (problem) throw new AppError('validation_failed', problem, { [field]: problem });
}

export async function findUsableInvitation(em: EntityManager, token: string): Promise<Invitation> {
  const inv = await em.findOne(InvitationSchema, { tokenHash: hashToken(token) });
  if (!inv || inv.revokedAt) throw new AppError('token_invalid', 'This invitation link is not valid. Ask an admin for a new one.', { token: 'Unknown or revoked invitation' });
  if (inv.acceptedAt) throw new AppError('token_used', 'This invitation has already been used. Sign in instead.', { token: 'Already used' });
  if (inv.expiresAt.getTime() < Date.now()) throw new AppError('token_expired', 'This invitation has expired. Ask an admin for a new one.', { token: 'Expired' });
  return inv;
}

export function authRoutes(deps: AppDeps): RouteDef[] {
  const { env } = deps;
  const throttle = new LoginThrottle({ freeFailures: env.loginLimitPerAccount, baseDelayMs: 250, maxDelayMs: env.loginDelayMaxMs, windowMs: 15 * 60_000 });
  return [
    route(
      {
        method: 'get',
        path: '/api/auth/csrf',
        tag: 'Auth',
        summary: 'A CSRF token for this session; send it back as the X-CSRF-Token header on every state-changing request',
        access: 'public',
        response: csrfResponse,
      },
      ({ req }) => ({ token: req.csrfToken!() }),
    ),
    route(
      {
        method: 'post',
        path: '/api/auth/login',
        tag: 'Auth',
        summary: 'Sign in with e-mail and password. Failed attempts are limited per client address (429); an account under attack is slowed down (each attempt waits longer), never locked',
        access: 'public',
        body: loginBody,
        response: userResponse,
        before: [loginIpLimiter(env.loginLimitPerIp)],
      },
      async ({ req, em, body }) => {
        const key = `account:${body.email}`;
        await throttle.wait(key);
        const user = await em.findOne(UserSchema, { email: body.email });
        const ok = user ? await verifyPassword(user.passwordHash, body.password) : (await verifyPassword(await dummyHash(), body.password), false);
        if (ok) throttle.succeeded(key);
        else throttle.failed(key);
        if (!user || !ok) {
          throw new AppError('invalid_credentials', 'The e-mail address or the password is wrong.', {
            password: 'E-mail or password is wrong',
          });
        }
        if (!user.active) throw new AppError('account_inactive', 'This account has been deactivated. Ask an admin to reactivate it.');
        user.lastSignInAt = new Date();
        await em.flush();
        await signIn(req, em, user);
        return { user: toUserDto(user) };
      },
    ),
    route({ method: 'post', path: '/api/auth/logout', tag: 'Auth', summary: 'Sign out (ends the session)', access: 'public' }, async ({ req, res }) => {
      await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
      res.clearCookie('splitcase.sid');
      return undefined;
    }),
    route({ method: 'get', path: '/api/auth/me', tag: 'Auth', summary: 'The signed-in user (401 when signed out)', access: 'signed-in', response: userResponse }, ({ user }) => ({ user })),
    route(
      {
        method: 'get',
        path: '/api/auth/invitations/preview',
        tag: 'Auth',
        summary: 'Check an invitation link before accepting it',
        access: 'public',
        query: tokenQuery,
        response: invitationPreview,
      },
      async ({ em, query }) => {
        const inv = await findUsableInvitation(em, query.token);
        return { invitation: { email: inv.email, role: inv.role, expiresAt: inv.expiresAt.toISOString() } };
      },
    ),
    route(
      {
        method: 'post',
        path: '/api/auth/invitations/accept',
        tag: 'Auth',
        summary: 'Accept an invitation: set name and password, and sign in',
        access: 'public',
        body: acceptInvitationBody,
        response: userResponse,
        status: 201,
      },
      async ({ req, em, body }) => {
        const user = await em.transactional(async (tx) => {
          const inv = await findUsableInvitation(tx, body.token);
          checkNewPassword('password', body.password, { email: inv.email, name: body.name });
          if (await tx.count(UserSchema, { email: inv.email })) {
            throw new AppError('conflict', 'An account with this e-mail address already exists. Sign in instead.');
          }
          const created = tx.create(UserSchema, {
            email: inv.email,
            name: body.name,
            role: inv.role,
            passwordHash: await hashPassword(body.password),
            active: true,
            lastSignInAt: new Date(),
          });
          inv.acceptedAt = new Date();
          await tx.flush();
          recordAudit(
            tx,
            { id: created.id, email: created.email, name: created.name, role: created.role },
            {
              action: 'invitation.accepted',
              entityType: 'user',
              entityId: created.id,
              summary: `${created.name} accepted an invitation as ${created.role}`,
            },
          );
          return created;
        });
        await signIn(req, em, user);
        return { user: toUserDto(user) };
      },
    ),
    route(
      {
        method: 'post',
        path: '/api/auth/password',
        tag: 'Auth',
        summary: 'Change your own password (the current one is needed); your other sessions end, this one goes on',
        access: 'signed-in',
        body: changePasswordBody,
        before: [loginIpLimiter(env.loginLimitPerIp)],
      },
      async ({ req, em, body, user: me }) => {
        const key = `account:${me.email}`;
        await throttle.wait(key);
        const user = await em.findOneOrFail(UserSchema, { id: me.id });
        if (!(await verifyPassword(user.passwordHash, body.currentPassword))) {
          throttle.failed(key);
          throw new AppError('invalid_credentials', 'The current password is wrong.', { currentPassword: 'The current password is wrong' });
        }
        checkNewPassword('newPassword', body.newPassword, user);
        user.passwordHash = await hashPassword(body.newPassword);
        raiseSessionEpoch(user);
        recordAudit(em, me, { action: 'password.changed', entityType: 'user', entityId: user.id, summary: `${user.email} changed their password; their other sessions were ended` });
        await em.flush();
        await deleteStoredSessions(req, user.id, req.sessionID);
        // This session goes on under the new epoch, with a new id.
        await signIn(req, em, user);
        return undefined;
      },
    ),
    route(
      {
        method: 'post',
        path: '/api/auth/password-reset/request',
        tag: 'Auth',
        summary: 'Ask for a password-reset link by e-mail (the answer is the same whether or not the account exists)',
        access: 'public',
        body: resetRequestBody,
        response: acceptedResponse,
        status: 202,
        before: [mailLimiter(env.loginLimitPerIp)],
      },
      async ({ em, body, deps }) => {
        const user = await em.findOne(UserSchema, { email: body.email, active: true });
        if (user) {
          const { token, hash } = newToken();
          const created = await em.transactional(async (tx) => {
            // Earlier unused links stop working when a new one is sent.
            await tx.nativeUpdate(ResetTokenSchema, { user: user.id, usedAt: null }, { usedAt: new Date() });
            return tx.create(ResetTokenSchema, { user, tokenHash: hash, expiresAt: new Date(Date.now() + RESET_TTL_MS) });
          });
          try {
            await deps.mailer.send(
              linkMail({
                to: user.email,
                subject: 'Reset your Splitcase password',
                lines: [
                  `Hello ${user.name},`,
                  'Someone (we hope you) asked to reset the password of your Splitcase account. The link works once, for one hour.',
                  'If it was not you, ignore this message; your password stays as it is.',
                ],
                linkLabel: 'Choose a new password',
                url: `${deps.env.publicUrl}/reset-password?token=${token}`,
              }),
            );
          } catch (err) {
            await em.nativeDelete(ResetTokenSchema, { id: created.id });
            deps.log('Reset e-mail failed', err);
            throw new AppError('internal', 'The reset e-mail could not be sent. Try again later.', undefined, undefined, 502);
          }
        }
        return { ok: true as const, message: 'If an account exists for that address, a reset link is on its way.' };
      },
    ),
    route(
      {
        method: 'post',
        path: '/api/auth/password-reset/confirm',
        tag: 'Auth',
        summary: 'Set a new password with a reset link',
        access: 'public',
        body: resetConfirmBody,
      },
      async ({ em, body, req }) => {
        const userId = await em.transactional(async (tx) => {
          const rt = await tx.findOne(ResetTokenSchema, { tokenHash: hashToken(body.token) }, { populate: ['user'] });
          if (!rt) throw new AppError('token_invalid', 'This reset link is not valid. Ask for a new one.', { token: 'Unknown link' });
          if (rt.usedAt) throw new AppError('token_used', 'This reset link has already been used. Ask for a new one.', { token: 'Already used' });
          if (rt.expiresAt.getTime() < Date.now()) throw new AppError('token_expired', 'This reset link has expired. Ask for a new one.', { token: 'Expired' });
          const user = rt.user;
          if (!user.active) throw new AppError('account_inactive', 'This account has been deactivated. Ask an admin to reactivate it.');
          checkNewPassword('password', body.password, user);
          user.passwordHash = await hashPassword(body.password);
          raiseSessionEpoch(user);
          rt.usedAt = new Date();
          recordAudit(tx, null, { action: 'password.reset', entityType: 'user', entityId: user.id, summary: `${user.email} reset their password by e-mail link; every session was ended` });
          await tx.flush();
          return user.id;
        });
        await deleteStoredSessions(req, userId);
        return undefined;
      },
    ),
  ];
}
