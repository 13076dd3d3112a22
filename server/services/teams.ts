/** Teams, their members and roles. The last owner of a team can never be removed or demoted. */
import type { AppDeps } from '../deps';
import { ConflictError, NotFoundError } from '../lib/errors';
import {
  countOwners,
  deleteMembership,
  getMembership,
  getTeamById,
  insertMembership,
  insertTeam,
  listMembers,
  listTeamsOfUser,
  lockTeam,
  updateMembershipRole,
  updateTeam,
} from '../../db/queries/memberships';
import type { Role } from '../../shared/permissions';
import { recordAudit } from './audit';
import { endUserSessions } from './sessions';
import type { Member } from '../../shared/schemas/team';
import type { Actor } from './actor';

export async function listMyTeams(deps: AppDeps, userId: string) {
  const rows = await listTeamsOfUser(deps.db, { userId });
  return rows.map(({ id, name, role }) => ({ id, name, role }));
}

export async function createTeam(deps: AppDeps, userId: string, name: string) {
  return deps.db.transaction(async (tx) => {
    const team = await insertTeam(tx, { name });
    await insertMembership(tx, { teamId: team.id, userId, role: 'owner' });
    return { ...team, role: 'owner' as Role };
  });
}

export async function getTeam(deps: AppDeps, teamId: string, role: Role) {
  const team = await getTeamById(deps.db, { id: teamId });
  if (!team) throw new NotFoundError('Team');
  return { ...team, role };
}

export async function renameTeam(deps: AppDeps, teamId: string, name: string) {
  const team = await updateTeam(deps.db, { id: teamId, name });
  if (!team) throw new NotFoundError('Team');
  return team;
}

export async function getMembers(deps: AppDeps, teamId: string): Promise<Member[]> {
  const rows = await listMembers(deps.db, { teamId });
  return rows.map((r) => ({ ...r, joinedAt: r.joinedAt.toISOString() }));
}

const lastOwner = () =>
  new ConflictError(
    'last_owner',
    'A team needs at least one owner. Make someone else owner first.',
  );

/** Changes a member's role and records who did it, in one transaction. */
export async function changeMemberRole(deps: AppDeps, actor: Actor, userId: string, role: Role) {
  const { teamId } = actor;
  return deps.db.transaction(async (tx) => {
    await lockTeam(tx, { teamId });
    const m = await getMembership(tx, { teamId, userId });
    if (!m) throw new NotFoundError('Member');
    if (m.role === 'owner' && role !== 'owner' && (await countOwners(tx, { teamId })) <= 1)
      throw lastOwner();
    const updated = await updateMembershipRole(tx, { teamId, userId, role });
    if (m.role !== role)
      await recordAudit(tx, {
        teamId,
        actor,
        action: 'member.role_changed',
        targetType: 'user',
        targetId: userId,
        details: { from: m.role, to: role },
      });
    return updated;
  });
}

/**
 * Removes a member. Their sign-in sessions end too, so a copied session cannot outlive the
 * removal; the removal and its audit record are one transaction.
 */
export async function removeMember(deps: AppDeps, actor: Actor, userId: string) {
  const { teamId } = actor;
  await deps.db.transaction(async (tx) => {
    await lockTeam(tx, { teamId });
    const m = await getMembership(tx, { teamId, userId });
    if (!m) throw new NotFoundError('Member');
    if (m.role === 'owner' && (await countOwners(tx, { teamId })) <= 1) throw lastOwner();
    await deleteMembership(tx, { teamId, userId });
    const ended = await endUserSessions(tx, userId, 'removed_from_team');
    await recordAudit(tx, {
      teamId,
      actor,
      action: 'member.removed',
      targetType: 'user',
      targetId: userId,
      details: { role: m.role, sessionsEnded: ended },
    });
  });
}
