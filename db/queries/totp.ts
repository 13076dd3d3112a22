/**
 * Two-step sign-in rows: the authenticator secret of a user (pending or enabled) and their
 * one-time recovery codes (hash only). Every query is keyed by the user id it is given; callers
 * pass the signed-in user's own id, so no tenant filter applies (Tenant: the user).
 */
import { and, eq, isNotNull, isNull, lt, or } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { recoveryCodes, userTotp } from '../schema/accounts';

export async function getUserTotp(db: DbOrTx, params: { userId: string }) {
  const [row] = await db.select().from(userTotp).where(eq(userTotp.userId, params.userId));
  return row ?? null;
}

/** Starts (or restarts) an enrolment; never touches an enabled secret. Null when enabled. */
export async function upsertPendingTotp(db: DbOrTx, params: { userId: string; secret: string }) {
  const [row] = await db
    .insert(userTotp)
    .values({ userId: params.userId, secret: params.secret })
    .onConflictDoUpdate({
      target: userTotp.userId,
      set: { secret: params.secret, createdAt: new Date(), lastStep: null },
      setWhere: isNull(userTotp.enabledAt),
    })
    .returning({ userId: userTotp.userId });
  return row ?? null;
}

/**
 * Accepts the code of `step` (enabling a pending enrolment when asked) only if no code of this
 * or a later step was accepted before: one statement, so two racing requests cannot both pass.
 */
export async function acceptTotpStep(
  db: DbOrTx,
  params: { userId: string; step: number; enable: boolean; now: Date },
) {
  const [row] = await db
    .update(userTotp)
    .set({ lastStep: params.step, ...(params.enable ? { enabledAt: params.now } : {}) })
    .where(
      and(
        eq(userTotp.userId, params.userId),
        params.enable ? isNull(userTotp.enabledAt) : isNotNull(userTotp.enabledAt),
        or(isNull(userTotp.lastStep), lt(userTotp.lastStep, params.step)),
      ),
    )
    .returning({ userId: userTotp.userId });
  return !!row;
}

export async function deleteUserTotp(db: DbOrTx, params: { userId: string }) {
  await db.delete(recoveryCodes).where(eq(recoveryCodes.userId, params.userId));
  await db.delete(userTotp).where(eq(userTotp.userId, params.userId));
}

/** Replaces every recovery code of the user with new ones. */
export async function replaceRecoveryCodes(
  db: DbOrTx,
  params: { userId: string; codeHashes: string[] },
) {
  await db.delete(recoveryCodes).where(eq(recoveryCodes.userId, params.userId));
  await db
    .insert(recoveryCodes)
    .values(params.codeHashes.map((codeHash) => ({ userId: params.userId, codeHash })));
}

/** Uses up one recovery code atomically; false when unknown or already used. */
export async function consumeRecoveryCode(
  db: DbOrTx,
  params: { userId: string; codeHash: string; now: Date },
) {
  const [row] = await db
    .update(recoveryCodes)
    .set({ usedAt: params.now })
    .where(
      and(
        eq(recoveryCodes.userId, params.userId),
        eq(recoveryCodes.codeHash, params.codeHash),
        isNull(recoveryCodes.usedAt),
      ),
    )
    .returning({ id: recoveryCodes.id });
  return !!row;
}

export async function countUnusedRecoveryCodes(db: DbOrTx, params: { userId: string }) {
  return db.$count(
    recoveryCodes,
    and(eq(recoveryCodes.userId, params.userId), isNull(recoveryCodes.usedAt)),
  );
}
