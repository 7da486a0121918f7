import { hash, verify } from '@node-rs/argon2';

// Argon2id with the library's defaults (memory-hard; OWASP-recommended family).
export const hashPassword = (password: string) => hash(password);

export async function verifyPassword(stored: string, password: string): Promise<boolean> {
  try {
    return await verify(stored, password);
  } catch {
    return false;
  }
}

/** A hash of a random password, verified against when the account is unknown, so timing does not tell. */
let dummy: Promise<string> | undefined;
export const dummyHash = () => (dummy ??= hash('splitcase-timing-equaliser'));
