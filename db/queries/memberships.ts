/**
 * Teams and memberships. Tenant: memberships by team, or by the signed-in user's own id (their
 * teams); teams by the id a membership check has already admitted (requireTeam).
 */
import { and, asc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { memberships, teams, users } from '../schema/accounts';
import type { Role } from '../../shared/permissions';

/** What a membership query answers with. */
const membershipColumns = {
  teamId: memberships.teamId,
  userId: memberships.userId,
  role: memberships.role,
};

/** The one membership of `userId` in `teamId`. */
const isMembership = (params: { teamId: string; userId: string }) =>
  and(eq(memberships.teamId, params.teamId), eq(memberships.userId, params.userId));

export async function getMembership(db: DbOrTx, params: { teamId: string; userId: string }) {
  const [row] = await db.select(membershipColumns).from(memberships).where(isMembership(params));
  return row ?? null;
}

export async function listTeamsOfUser(db: DbOrTx, params: { userId: string }) {
  return db
    .select({ id: teams.id, name: teams.name, role: memberships.role, createdAt: teams.createdAt })
    .from(memberships)
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, params.userId))
    .orderBy(asc(teams.createdAt));
}

export async function listMembers(db: DbOrTx, params: { teamId: string }) {
  return db
    .select({
      userId: users.id,
      email: users.email,
      name: users.name,
      role: memberships.role,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.teamId, params.teamId))
    .orderBy(asc(memberships.createdAt));
}

export async function insertTeam(db: DbOrTx, params: { name: string }) {
  const [row] = await db
    .insert(teams)
    .values({ name: params.name })
    .returning({ id: teams.id, name: teams.name });
  return row;
}

export async function getTeamById(db: DbOrTx, params: { id: string }) {
  const [row] = await db
    .select({ id: teams.id, name: teams.name })
    .from(teams)
    .where(eq(teams.id, params.id));
  return row ?? null;
}

export async function updateTeam(db: DbOrTx, params: { id: string; name: string }) {
  const [row] = await db
    .update(teams)
    .set({ name: params.name })
    .where(eq(teams.id, params.id))
    .returning({ id: teams.id, name: teams.name });
  return row ?? null;
}

export async function insertMembership(
  db: DbOrTx,
  params: { teamId: string; userId: string; role: Role },
) {
  const [row] = await db
    .insert(memberships)
    .values(params)
    .onConflictDoNothing()
    .returning(membershipColumns);
  return row ?? null;
}

export async function updateMembershipRole(
  db: DbOrTx,
  params: { teamId: string; userId: string; role: Role },
) {
  const [row] = await db
    .update(memberships)
    .set({ role: params.role })
    .where(isMembership(params))
    .returning(membershipColumns);
  return row ?? null;
}

export async function deleteMembership(db: DbOrTx, params: { teamId: string; userId: string }) {
  const rows = await db
    .delete(memberships)
    .where(isMembership(params))
    .returning({ userId: memberships.userId });
  return rows.length > 0;
}

export async function countOwners(db: DbOrTx, params: { teamId: string }) {
  return db.$count(
    memberships,
    and(eq(memberships.teamId, params.teamId), eq(memberships.role, 'owner')),
  );
}

/**
 * Locks the team row until the transaction ends, so membership changes of one team run one at
 * a time (the last-owner check would otherwise race: two demotions could each see two owners).
 */
export async function lockTeam(db: DbOrTx, params: { teamId: string }) {
  const [row] = await db
    .select({ id: teams.id })
    .from(teams)
    .where(eq(teams.id, params.teamId))
    .for('update');
  return row ?? null;
}
