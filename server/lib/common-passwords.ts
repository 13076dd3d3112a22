/**
 * Refuses passwords from a list of commonly used ones (OWASP ASVS 4.0.3 V2.1.7: check new
 * passwords against breached or common passwords, locally or through an API; section from
 * memory). The list is the maintained `@zxcvbn-ts/language-common` password dictionary
 * (≈49,000 passwords ranked by frequency in public breach corpora), compared without regard to
 * case; the ones the length rule already refuses never get this far. Checked offline: no
 * password leaves the server.
 */
import { dictionary } from '@zxcvbn-ts/language-common';
import { ValidationError } from './errors';

const COMMON = new Set(dictionary['passwords-common'].map((p) => p.toLowerCase()));

export function isCommonPassword(password: string): boolean {
  return COMMON.has(password.toLowerCase());
}

/** Throws 400 `common_password` on `path` for a password from the list. */
export function assertUncommonPassword(password: string, path: string): void {
  if (isCommonPassword(password))
    throw new ValidationError(
      'This password is on a list of commonly used passwords, so it is easy to guess. Choose another one.',
      [{ path, message: 'Choose a less common password' }],
      'common_password',
    );
}
