// Sessions: what a session holds, its lifetime limits, and ending every session of a user at once.
import type { Request } from 'express';
import type session from 'express-session';
import type { User } from '../users/user.entity';

declare module 'express-session' {
  interface SessionData {
    userId?: number;
    /** The user's session epoch at sign-in: a raised epoch ends the session. */
    epoch?: number;
    /** ms since 1970: when the user signed in, and the last request. */
    signedInAt?: number;
    lastSeenAt?: number;
  }
}

/** A request updates lastSeenAt at most this often (fewer session writes under load). */
export const SEEN_RESOLUTION_MS = 30_000;

export interface SessionLimits {
  maxHours: number;
  idleMinutes: number;
}

/** Why a session is over (absolute or idle limit), or null while it lasts. */
export function sessionExpiry(s: Pick<session.SessionData, 'signedInAt' | 'lastSeenAt'>, limits: SessionLimits, now = Date.now()): 'absolute' | 'idle' | null {
  const signedInAt = s.signedInAt ?? 0;
  const lastSeenAt = s.lastSeenAt ?? signedInAt;
  if (now - signedInAt >= limits.maxHours * 3600_000) return 'absolute';
  if (now - lastSeenAt >= limits.idleMinutes * 60_000) return 'idle';
  return null;
}

/** The cookie lives as long as the session may: the idle limit, cut at the absolute one. */
export function cookieMaxAge(s: Pick<session.SessionData, 'signedInAt'>, limits: SessionLimits, now = Date.now()): number {
  const left = (s.signedInAt ?? now) + limits.maxHours * 3600_000 - now;
  return Math.max(1000, Math.min(limits.idleMinutes * 60_000, left));
}

/** Start a fresh session for the user (a new id, so a session id known before sign-in is worthless). */
export async function startSession(req: Request, user: Pick<User, 'id' | 'sessionEpoch'>, limits: SessionLimits): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  const now = Date.now();
  Object.assign(req.session, { userId: user.id, epoch: user.sessionEpoch, signedInAt: now, lastSeenAt: now });
  req.session.cookie.maxAge = cookieMaxAge(req.session, limits, now);
  await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

interface SqliteStore {
  db?: { run(sql: string, params: unknown[], cb: (err: Error | null) => void): void };
  table?: string;
}

/**
 * End every session of a user (but `keep`, the caller's own, when given): raise the user's epoch
 * (the caller flushes), which every later request checks, and delete the stored sessions at once.
 */
export function raiseSessionEpoch(user: User): void {
  user.sessionEpoch = (user.sessionEpoch ?? 0) + 1;
}

export async function deleteStoredSessions(req: Request, userId: number, keep?: string): Promise<void> {
  const store = req.sessionStore as unknown as SqliteStore;
  if (!store?.db || !store.table || !/^\w+$/.test(store.table)) return; // another store: the epoch alone ends them
  await new Promise<void>((resolve, reject) =>
    store.db!.run(`DELETE FROM ${store.table} WHERE json_extract(sess, '$.userId') = ? AND sid IS NOT ?`, [userId, keep ?? null], (err) => (err ? reject(err) : resolve())),
  );
}
