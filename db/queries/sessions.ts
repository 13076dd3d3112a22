/**
 * Sign-in sessions: open one, find an open one (and mark it seen), list and revoke. Tenant: none
 * applies: sign-in sessions belong to a user; every query names the user (and the session id from
 * that user's own cookie).
 */
import { and, desc, eq, gt, isNull, ne, type SQL } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { userSessions, users } from '../schema/accounts';

const openAt = (now: Date, idleSince: Date) =>
  and(
    isNull(userSessions.revokedAt),
    gt(userSessions.expiresAt, now),
    gt(userSessions.lastSeenAt, idleSince),
  );

export async function insertSession(
  db: DbOrTx,
  params: { userId: string; expiresAt: Date; device: string },
) {
  const [row] = await db
    .insert(userSessions)
    .values(params)
    .returning({ id: userSessions.id, expiresAt: userSessions.expiresAt });
  return row;
}

/**
 * Marks an open session seen now and returns its user; null when the session is unknown, someone
 * else's, revoked, idle too long or past its absolute end.
 */
export async function touchOpenSession(
  db: DbOrTx,
  params: { id: string; userId: string; now: Date; idleSince: Date },
) {
  const [s] = await db
    .update(userSessions)
    .set({ lastSeenAt: params.now })
    .where(
      and(
        eq(userSessions.id, params.id),
        eq(userSessions.userId, params.userId),
        openAt(params.now, params.idleSince),
      ),
    )
    .returning({ userId: userSessions.userId });
  if (!s) return null;
  const [u] = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      emailVerifiedAt: users.emailVerifiedAt,
    })
    .from(users)
    .where(eq(users.id, s.userId));
  return u ?? null;
}

export async function listOpenSessions(
  db: DbOrTx,
  params: { userId: string; now: Date; idleSince: Date },
) {
  return db
    .select({
      id: userSessions.id,
      device: userSessions.device,
      createdAt: userSessions.createdAt,
      lastSeenAt: userSessions.lastSeenAt,
      expiresAt: userSessions.expiresAt,
    })
    .from(userSessions)
    .where(and(eq(userSessions.userId, params.userId), openAt(params.now, params.idleSince)))
    .orderBy(desc(userSessions.lastSeenAt));
}

/** Revokes the user's sessions not revoked yet, narrowed by `only`; returns how many. */
async function revokeOpenSessions(
  db: DbOrTx,
  params: { userId: string; now: Date; reason: string },
  only: SQL | undefined,
) {
  const rows = await db
    .update(userSessions)
    .set({ revokedAt: params.now, revokedReason: params.reason })
    .where(and(eq(userSessions.userId, params.userId), isNull(userSessions.revokedAt), only))
    .returning({ id: userSessions.id });
  return rows.length;
}

/** Revokes one session of a user; false when there was no such open session. */
export async function revokeSession(
  db: DbOrTx,
  params: { id: string; userId: string; now: Date; reason: string },
) {
  return (await revokeOpenSessions(db, params, eq(userSessions.id, params.id))) > 0;
}

/** Revokes every session of a user, or every one but `exceptId`; returns how many. */
export function revokeUserSessions(
  db: DbOrTx,
  params: { userId: string; now: Date; reason: string; exceptId?: string },
) {
  const except = params.exceptId ? ne(userSessions.id, params.exceptId) : undefined;
  return revokeOpenSessions(db, params, except);
}
