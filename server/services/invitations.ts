/** Inviting teammates by e-mail with a one-time, expiring link. */
import { recordAudit } from './audit';
import type { AppDeps } from '../deps';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../lib/errors';
import { createOneTimeToken, hashToken } from '../lib/tokens';
import { getTeamById, getMembership, insertMembership } from '../../db/queries/memberships';
import { getUserByEmail } from '../../db/queries/users';
import {
  getInvitationByTokenHash,
  insertInvitation,
  listOpenInvitations,
  markInvitationAccepted,
  revokeInvitation,
} from '../../db/queries/tokens';
import { teamInvitationMail } from '../mail/templates';
import type {
  CreateInvitationInput,
  Invitation,
  InvitationPreview,
} from '../../shared/schemas/team';
import type { Actor } from './actor';

export const INVITATION_TTL_DAYS = 7;

const toInvitation = (r: {
  id: string;
  email: string;
  role: Invitation['role'];
  expiresAt: Date;
  createdAt: Date;
}): Invitation => ({
  id: r.id,
  email: r.email,
  role: r.role,
  expiresAt: r.expiresAt.toISOString(),
  createdAt: r.createdAt.toISOString(),
});

export async function inviteTeammate(
  deps: AppDeps,
  actor: Actor,
  input: CreateInvitationInput,
): Promise<Invitation> {
  const existing = await getUserByEmail(deps.db, { email: input.email });
  if (existing && (await getMembership(deps.db, { teamId: actor.teamId, userId: existing.id }))) {
    throw new ConflictError('already_member', 'This person is already in the team.', [
      { path: 'email', message: 'Already a member' },
    ]);
  }
  const team = await getTeamById(deps.db, { id: actor.teamId });
  if (!team) throw new NotFoundError('Team');
  const { token, hash } = createOneTimeToken();
  const row = await insertInvitation(deps.db, {
    teamId: actor.teamId,
    email: input.email,
    role: input.role,
    tokenHash: hash,
    invitedBy: actor.userId,
    expiresAt: new Date(Date.now() + INVITATION_TTL_DAYS * 86_400_000),
  });
  await recordAudit(deps.db, {
    teamId: actor.teamId,
    actor,
    action: 'invitation.created',
    targetType: 'invitation',
    targetId: row.id,
    details: { role: input.role },
  });
  const link = `${deps.env.APP_URL}/invitations/${encodeURIComponent(token)}`;
  await deps.mailer.send(
    teamInvitationMail({
      to: input.email,
      teamName: team.name,
      inviter: actor.name,
      role: input.role,
      link,
      days: INVITATION_TTL_DAYS,
    }),
  );
  return toInvitation(row);
}

export async function listInvitations(deps: AppDeps, teamId: string): Promise<Invitation[]> {
  const rows = await listOpenInvitations(deps.db, { teamId, now: new Date() });
  return rows.map(toInvitation);
}

export async function cancelInvitation(deps: AppDeps, actor: Actor, invitationId: string) {
  const { teamId } = actor;
  if (!(await revokeInvitation(deps.db, { id: invitationId, teamId, now: new Date() })))
    throw new NotFoundError('Invitation');
  await recordAudit(deps.db, {
    teamId,
    actor,
    action: 'invitation.cancelled',
    targetType: 'invitation',
    targetId: invitationId,
  });
}

async function openInvitation(deps: AppDeps, token: string) {
  const inv = await getInvitationByTokenHash(deps.db, { tokenHash: hashToken(token) });
  if (!inv || inv.acceptedAt || inv.revokedAt || inv.expiresAt <= new Date()) {
    throw new ValidationError(
      'This invitation link is invalid, used or expired. Ask for a new one.',
      undefined,
      'invalid_token',
    );
  }
  return inv;
}

export async function previewInvitation(deps: AppDeps, token: string): Promise<InvitationPreview> {
  const inv = await openInvitation(deps, token);
  return {
    teamName: inv.teamName,
    email: inv.email,
    role: inv.role,
    invitedBy: inv.invitedBy,
    expiresAt: inv.expiresAt.toISOString(),
  };
}

/** The signed-in user must hold the invited address; the link then works exactly once. */
export async function acceptInvitation(
  deps: AppDeps,
  user: { userId: string; email: string },
  token: string,
) {
  const inv = await openInvitation(deps, token);
  if (inv.email.toLowerCase() !== user.email.toLowerCase()) {
    throw new ForbiddenError(
      `This invitation is for ${inv.email}. Sign in with that address to accept it.`,
      'wrong_account',
    );
  }
  await deps.db.transaction(async (tx) => {
    if (!(await markInvitationAccepted(tx, { id: inv.id, now: new Date() }))) {
      throw new ValidationError('This invitation was already used.', undefined, 'invalid_token');
    }
    await insertMembership(tx, { teamId: inv.teamId, userId: user.userId, role: inv.role });
    await recordAudit(tx, {
      teamId: inv.teamId,
      actor: user,
      action: 'member.joined',
      targetType: 'user',
      targetId: user.userId,
      details: { role: inv.role, invitationId: inv.id },
    });
  });
  return { teamId: inv.teamId };
}
