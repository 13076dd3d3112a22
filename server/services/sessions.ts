/**
 * Sign-in sessions as use cases: open one at sign-in, check one on every request (idle and
 * absolute timeouts from the settings), list a user's open sessions, sign one or all out.
 */
import type { AppDeps } from '../deps';
import type { DbOrTx } from '../../db/client';
import { NotFoundError } from '../lib/errors';
import { signSession, verifySession } from '../lib/session';
import { describeDevice } from '../lib/device-class';
import {
  insertSession,
  listOpenSessions,
  revokeSession,
  revokeUserSessions,
  touchOpenSession,
} from '../../db/queries/sessions';
import type { AccountSession } from '../../shared/schemas/auth';

export type OpenedSession = { token: string; sessionId: string; ttlSeconds: number };

const idleSince = (deps: AppDeps, now: Date) =>
  new Date(now.getTime() - deps.env.SESSION_IDLE_MINUTES * 60_000);

export async function openSession(
  deps: AppDeps,
  userId: string,
  userAgent: string | undefined,
  db: DbOrTx = deps.db,
): Promise<OpenedSession> {
  const ttlSeconds = deps.env.SESSION_ABSOLUTE_HOURS * 3600;
  const row = await insertSession(db, {
    userId,
    expiresAt: new Date(Date.now() + ttlSeconds * 1000),
    device: describeDevice(userAgent),
  });
  const token = signSession(deps.env.JWT_SECRET, { sub: userId, sid: row.id }, ttlSeconds);
  return { token, sessionId: row.id, ttlSeconds };
}

/** The user of a session cookie, if the session is open; marks it seen. */
export async function resumeSession(deps: AppDeps, token: string, now = new Date()) {
  const claims = verifySession(deps.env.JWT_SECRET, token);
  if (!claims) return null;
  const user = await touchOpenSession(deps.db, {
    id: claims.sid,
    userId: claims.sub,
    now,
    idleSince: idleSince(deps, now),
  });
  return user ? { user, sessionId: claims.sid } : null;
}

export async function listSessions(
  deps: AppDeps,
  userId: string,
  currentId: string,
  now = new Date(),
): Promise<AccountSession[]> {
  const rows = await listOpenSessions(deps.db, { userId, now, idleSince: idleSince(deps, now) });
  return rows.map((r) => ({
    id: r.id,
    device: r.device,
    createdAt: r.createdAt.toISOString(),
    lastSeenAt: r.lastSeenAt.toISOString(),
    expiresAt: r.expiresAt.toISOString(),
    current: r.id === currentId,
  }));
}

export async function signOutSession(deps: AppDeps, userId: string, sessionId: string) {
  const ok = await revokeSession(deps.db, {
    id: sessionId,
    userId,
    now: new Date(),
    reason: 'signed_out',
  });
  if (!ok) throw new NotFoundError('Session');
}

/** Ends every session of a user (or all but one); returns how many were open. */
export async function endUserSessions(
  db: DbOrTx,
  userId: string,
  reason: string,
  exceptId?: string,
): Promise<number> {
  return revokeUserSessions(db, { userId, now: new Date(), reason, exceptId });
}
