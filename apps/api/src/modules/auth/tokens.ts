import { createHash, randomBytes } from 'node:crypto';

/** A one-time token for links: 32 random bytes, base64url. Only its SHA-256 is stored. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;
export const RESET_TTL_MS = 60 * 60 * 1000;
