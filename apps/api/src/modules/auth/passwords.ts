import { hash, verify } from '@node-rs/argon2';
import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import * as common from '@zxcvbn-ts/language-common';

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

/**
 * Why a new password is refused, or null. The rule (contracts' PASSWORD_RULE): at least 12
 * characters (the schema), not the e-mail address or the name, and not a common or easily guessed
 * password — judged by zxcvbn-ts with its common-password and word lists (score 3 of 4 at least),
 * with the e-mail address, its name part and the name as words a guesser would try first.
 */
export function passwordProblem(password: string, who: { email: string; name?: string | null }): string | null {
  const squash = (s: string) => s.toLowerCase().replace(/[\s._-]+/g, '');
  const local = who.email.split('@')[0] ?? '';
  const own = [who.email, local, who.name ?? ''].filter((s) => s.trim().length > 0);
  if (own.some((s) => squash(s) === squash(password))) return 'Your password cannot be your e-mail address or your name.';
  const result = strength().check(password, [...own, 'splitcase']);
  if (result.score < 3) return 'This password is too easy to guess: it is, or is close to, a common password. Use a longer phrase of unrelated words.';
  return null;
}

let factory: ZxcvbnFactory | undefined;
function strength(): ZxcvbnFactory {
  factory ??= new ZxcvbnFactory({ dictionary: { ...common.dictionary }, graphs: common.adjacencyGraphs });
  return factory;
}
