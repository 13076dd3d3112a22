/**
 * Team invitations and password resets: one-time tokens stored as hashes. Tenant: invitations are
 * listed and revoked by team; an invitation or reset is found by the hash of its token (the token
 * is the proof), and password resets belong to a user.
 */
import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { consumeOneTimeToken } from './one-time-token';
import { passwordResets, teamInvitations, teams, users } from '../schema/accounts';
import type { Role } from '../../shared/permissions';

const invitationColumns = {
  id: teamInvitations.id,
  teamId: teamInvitations.teamId,
  email: teamInvitations.email,
  role: teamInvitations.role,
  expiresAt: teamInvitations.expiresAt,
  acceptedAt: teamInvitations.acceptedAt,
  revokedAt: teamInvitations.revokedAt,
  createdAt: teamInvitations.createdAt,
};

/** Neither accepted nor revoked, and not yet expired at `now`. */
function isOpenInvitation(now: Date) {
  return and(
    isNull(teamInvitations.acceptedAt),
    isNull(teamInvitations.revokedAt),
    gt(teamInvitations.expiresAt, now),
  );
}

export async function insertInvitation(
  db: DbOrTx,
  params: {
    teamId: string;
    email: string;
    role: Role;
    tokenHash: string;
    invitedBy: string;
    expiresAt: Date;
  },
) {
  const [row] = await db.insert(teamInvitations).values(params).returning(invitationColumns);
  return row;
}

export async function listOpenInvitations(db: DbOrTx, params: { teamId: string; now: Date }) {
  return db
    .select(invitationColumns)
    .from(teamInvitations)
    .where(and(eq(teamInvitations.teamId, params.teamId), isOpenInvitation(params.now)))
    .orderBy(asc(teamInvitations.createdAt));
}

export async function getInvitationByTokenHash(db: DbOrTx, params: { tokenHash: string }) {
  const [row] = await db
    .select({ ...invitationColumns, teamName: teams.name, invitedBy: users.name })
    .from(teamInvitations)
    .innerJoin(teams, eq(teams.id, teamInvitations.teamId))
    .leftJoin(users, eq(users.id, teamInvitations.invitedBy))
    .where(eq(teamInvitations.tokenHash, params.tokenHash));
  return row ?? null;
}

/** Marks an invitation accepted only if it still is open: the one-time guarantee. */
export async function markInvitationAccepted(db: DbOrTx, params: { id: string; now: Date }) {
  const rows = await db
    .update(teamInvitations)
    .set({ acceptedAt: params.now })
    .where(and(eq(teamInvitations.id, params.id), isOpenInvitation(params.now)))
    .returning({ id: teamInvitations.id });
  return rows.length > 0;
}

export async function revokeInvitation(
  db: DbOrTx,
  params: { id: string; teamId: string; now: Date },
) {
  const rows = await db
    .update(teamInvitations)
    .set({ revokedAt: params.now })
    .where(
      and(
        eq(teamInvitations.id, params.id),
        eq(teamInvitations.teamId, params.teamId),
        isNull(teamInvitations.acceptedAt),
        // Cancelling twice is a 404 rather than a silent rewrite of the first cancellation time.
        isNull(teamInvitations.revokedAt),
      ),
    )
    .returning({ id: teamInvitations.id });
  return rows.length > 0;
}

export async function insertPasswordReset(
  db: DbOrTx,
  params: { userId: string; tokenHash: string; expiresAt: Date },
) {
  await db.insert(passwordResets).values(params);
}

/** Consumes a reset token atomically; returns the user id, or null when unknown, used or expired. */
export async function consumePasswordReset(db: DbOrTx, params: { tokenHash: string; now: Date }) {
  return consumeOneTimeToken(db, passwordResets, params);
}
