/**
 * Password hashing with Argon2id (RFC 9106) through the maintained `argon2` package, whose
 * prebuilt binding ships inside the npm package (nothing is downloaded at install).
 * Parameters: 19 MiB memory, 2 iterations, 1 lane — the minimum the OWASP Password Storage
 * Cheat Sheet recommends for Argon2id. Argon2 reads the whole password (no 72-byte cut-off as in
 * bcrypt); the schemas still cap passwords at 200 characters so a huge body costs nothing.
 * Hashes written by earlier versions (bcrypt, "$2…") still verify and are replaced on sign-in.
 */
import argon2 from 'argon2';
import bcrypt from 'bcryptjs';
import { readPasswordHashStrength } from '../env';

const STANDARD_OPTIONS = {
  type: argon2.argon2id,
  memoryCost: 19_456,
  timeCost: 2,
  parallelism: 1,
} as const;

/**
 * PASSWORD_HASH_STRENGTH=test (only under NODE_ENV=test, server/env.ts): the least cost
 * Argon2 allows (RFC 9106 section 3.1: memory at least 8 KiB per lane, one pass). Same
 * algorithm and format, so the code paths the tests exercise are those of production.
 */
const TEST_OPTIONS = { type: argon2.argon2id, memoryCost: 8, timeCost: 1, parallelism: 1 } as const;

let options: typeof STANDARD_OPTIONS | typeof TEST_OPTIONS | undefined;
/** Read on first use so that a test can set the environment before importing this module. */
export function argon2Options() {
  options ??= readPasswordHashStrength() === 'test' ? TEST_OPTIONS : STANDARD_OPTIONS;
  return options;
}

export async function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, argon2Options());
}

const isLegacyBcrypt = (hash: string) => /^\$2[aby]\$/.test(hash);

/** Checks a password; `rehash` says the stored hash should be replaced by a current one. */
export async function verifyPassword(
  hash: string,
  password: string,
): Promise<{ ok: boolean; rehash: boolean }> {
  if (isLegacyBcrypt(hash)) return { ok: await bcrypt.compare(password, hash), rehash: true };
  try {
    const ok = await argon2.verify(hash, password);
    return { ok, rehash: ok && argon2.needsRehash(hash, argon2Options()) };
  } catch {
    // Not a hash we can read (e.g. a placeholder written by a test): never a match.
    return { ok: false, rehash: false };
  }
}

/** Verified against when the e-mail is unknown, so a sign-in takes as long either way. */
let dummy: Promise<string> | null = null;
export function dummyHash(): Promise<string> {
  dummy ??= hashPassword('not-a-real-password');
  return dummy;
}
