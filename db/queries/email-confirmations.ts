/**
 * E-mail confirmation: one-time tokens (hash only) and the verified stamp on the user. Tenant:
 * none applies: confirmations belong to a user account, not to a team, and are found by the hash
 * of the token mailed to that user.
 */
import { and, eq, isNull } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { consumeOneTimeToken } from './one-time-token';
import { emailConfirmations, users } from '../schema/accounts';

export async function insertEmailConfirmation(
  db: DbOrTx,
  params: { userId: string; tokenHash: string; expiresAt: Date },
) {
  await db.insert(emailConfirmations).values(params);
}

/** Consumes a token atomically; returns the user id, or null when unknown, used or expired. */
export async function consumeEmailConfirmation(
  db: DbOrTx,
  params: { tokenHash: string; now: Date },
) {
  return consumeOneTimeToken(db, emailConfirmations, params);
}

export async function markEmailVerified(db: DbOrTx, params: { userId: string; now: Date }) {
  await db
    .update(users)
    .set({ emailVerifiedAt: params.now })
    .where(and(eq(users.id, params.userId), isNull(users.emailVerifiedAt)));
}
