import { describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { addMember, signUpAndConfirm, signUpOwner, uniqueEmail } from '../../support/factories';
import { firstLink, listMailTo, waitForMailTo } from '../../support/mailbox';
import { getMembership } from '../../../db/queries/memberships';
import type { Role } from '../../../shared/permissions';

const t = useTestApp();

/** Invites an address as the owner and reads the token back from the mail, as the invitee would. */
async function inviteAndReadToken(
  owner: Awaited<ReturnType<typeof signUpOwner>>,
  email: string,
  role: Role = 'analyst',
) {
  const res = await owner.agent
    .post(`/api/teams/${owner.teamId}/invitations`)
    .send({ email, role })
    .expect(201);
  const mail = await waitForMailTo(email);
  const link = new URL(firstLink(mail.text));
  return {
    invitation: res.body as { id: string },
    mail,
    link,
    token: decodeURIComponent(link.pathname.split('/').pop()!),
  };
}

/** A new account for the invited address (sign-up gives it a team of its own). */
async function signUpAs(email: string) {
  const { agent, user } = await signUpAndConfirm(t, { email });
  return { agent, userId: user.id };
}

/** The link neither previews nor joins the team, even for the invited address. */
async function expectLinkDead(token: string, email: string, teamId: string): Promise<void> {
  await t.request().get(`/api/invitations/${token}`).expect(400);
  const invitee = await signUpAs(email);
  const res = await invitee.agent.post(`/api/invitations/${token}/accept`).expect(400);
  expect(res.body.error.code).toBe('invalid_token');
  expect(await getMembership(t.deps.db, { teamId, userId: invitee.userId })).toBeNull();
}

async function countInvitations(teamId: string): Promise<number> {
  const r = await t.deps.db.execute(
    sql`select count(*)::int as n from team_invitations where team_id = ${teamId}`,
  );
  return (r.rows[0] as { n: number }).n;
}

describe('POST /api/teams/:teamId/invitations', () => {
  it('stores the invitation and mails a one-time link to the invitee', async () => {
    const owner = await signUpOwner(t, { name: 'Maren Okafor', teamName: 'Larkspur research' });
    const email = uniqueEmail('invitee');
    const { invitation, mail, link } = await inviteAndReadToken(owner, email, 'editor');
    expect(invitation).toMatchObject({ email, role: 'editor' });
    expect(mail.subject).toBe('Maren Okafor invited you to Larkspur research on Choicewright');
    expect(mail.text).toContain('as editor');
    expect(link.origin).toBe(t.deps.env.APP_URL);
    expect(link.pathname).toMatch(/^\/invitations\/[\w-]{20,}$/);
    const list = await owner.agent.get(`/api/teams/${owner.teamId}/invitations`).expect(200);
    expect(list.body).toEqual([expect.objectContaining({ id: invitation.id, email })]);
  });

  it('when the person is already a member, returns 409 on the e-mail field and sends nothing', async () => {
    const owner = await signUpOwner(t);
    const email = uniqueEmail('member');
    await addMember(t, owner.teamId, 'viewer', email);
    const res = await owner.agent
      .post(`/api/teams/${owner.teamId}/invitations`)
      .send({ email: email.toUpperCase(), role: 'editor' })
      .expect(409);
    expect(res.body.error).toMatchObject({ code: 'already_member', fields: [{ path: 'email' }] });
    expect(await countInvitations(owner.teamId)).toBe(0);
    expect(await listMailTo(email)).toHaveLength(0);
  });

  it('when the e-mail or role is invalid, returns 400 with both fields and creates nothing', async () => {
    const owner = await signUpOwner(t);
    const res = await owner.agent
      .post(`/api/teams/${owner.teamId}/invitations`)
      .send({ email: 'not-an-address', role: 'superuser' })
      .expect(400);
    const paths = res.body.error.fields.map((f: { path: string }) => f.path);
    expect(paths).toEqual(expect.arrayContaining(['email', 'role']));
    expect(await countInvitations(owner.teamId)).toBe(0);
  });
});

describe('GET /api/invitations/:token', () => {
  it('shows team, role, inviter and address to anyone holding the link', async () => {
    const owner = await signUpOwner(t, { name: 'Maren Okafor', teamName: 'Larkspur research' });
    const email = uniqueEmail('invitee');
    const { token } = await inviteAndReadToken(owner, email, 'analyst');
    const res = await t.request().get(`/api/invitations/${token}`).expect(200);
    expect(res.body).toMatchObject({
      teamName: 'Larkspur research',
      email,
      role: 'analyst',
      invitedBy: 'Maren Okafor',
    });
    expect(Date.parse(res.body.expiresAt)).toBeGreaterThan(Date.now() + 6 * 86_400_000);
  });

  it('when the token is unknown, returns 400 invalid_token', async () => {
    const res = await t
      .request()
      .get(`/api/invitations/${'x'.repeat(43)}`)
      .expect(400);
    expect(res.body.error.code).toBe('invalid_token');
  });

  it('when the token is too short to be one of ours, returns 400', async () => {
    await t.request().get('/api/invitations/short').expect(400);
  });
});

describe('POST /api/invitations/:token/accept', () => {
  it('adds the invitee with the invited role exactly once', async () => {
    const owner = await signUpOwner(t);
    const email = uniqueEmail('invitee');
    const { token } = await inviteAndReadToken(owner, email, 'analyst');
    const invitee = await signUpAs(email);
    const res = await invitee.agent.post(`/api/invitations/${token}/accept`).expect(200);
    expect(res.body).toEqual({ teamId: owner.teamId });
    const m = await getMembership(t.deps.db, { teamId: owner.teamId, userId: invitee.userId });
    expect(m?.role).toBe('analyst');
    const me = await invitee.agent.get('/api/auth/me').expect(200);
    expect(me.body.teams).toEqual(
      expect.arrayContaining([expect.objectContaining({ id: owner.teamId, role: 'analyst' })]),
    );

    const again = await invitee.agent.post(`/api/invitations/${token}/accept`).expect(400);
    expect(again.body.error.code).toBe('invalid_token');
    await t.request().get(`/api/invitations/${token}`).expect(400);
    const open = await owner.agent.get(`/api/teams/${owner.teamId}/invitations`).expect(200);
    expect(open.body).toEqual([]);
  });

  it('accepts for an existing account whatever the case of the address', async () => {
    const owner = await signUpOwner(t);
    const existing = await signUpOwner(t);
    const { token } = await inviteAndReadToken(owner, existing.user.email.toUpperCase(), 'viewer');
    await existing.agent.post(`/api/invitations/${token}/accept`).expect(200);
    const m = await getMembership(t.deps.db, { teamId: owner.teamId, userId: existing.user.id });
    expect(m?.role).toBe('viewer');
  });

  it('when signed in with another address, returns 403 wrong_account and leaves the link open', async () => {
    const owner = await signUpOwner(t);
    const email = uniqueEmail('invitee');
    const { token } = await inviteAndReadToken(owner, email);
    const other = await signUpOwner(t);
    const res = await other.agent.post(`/api/invitations/${token}/accept`).expect(403);
    expect(res.body.error.code).toBe('wrong_account');
    expect(res.body.error.message).toContain(email);
    expect(
      await getMembership(t.deps.db, { teamId: owner.teamId, userId: other.user.id }),
    ).toBeNull();
    const invitee = await signUpAs(email);
    await invitee.agent.post(`/api/invitations/${token}/accept`).expect(200);
  });

  it('when nobody is signed in, returns 401', async () => {
    const owner = await signUpOwner(t);
    const { token } = await inviteAndReadToken(owner, uniqueEmail('invitee'));
    await t.request().post(`/api/invitations/${token}/accept`).expect(401);
  });

  it('when the invitation has expired, refuses preview and acceptance', async () => {
    const owner = await signUpOwner(t);
    const email = uniqueEmail('invitee');
    const { token, invitation } = await inviteAndReadToken(owner, email);
    await t.deps.db.execute(
      sql`update team_invitations set expires_at = now() - interval '1 minute' where id = ${invitation.id}`,
    );
    await expectLinkDead(token, email, owner.teamId);
    const open = await owner.agent.get(`/api/teams/${owner.teamId}/invitations`).expect(200);
    expect(open.body).toEqual([]);
  });
});

describe('DELETE /api/teams/:teamId/invitations/:invitationId', () => {
  it('cancels an open invitation so its link stops working', async () => {
    const owner = await signUpOwner(t);
    const email = uniqueEmail('invitee');
    const { token, invitation } = await inviteAndReadToken(owner, email);
    await owner.agent.delete(`/api/teams/${owner.teamId}/invitations/${invitation.id}`).expect(204);
    const open = await owner.agent.get(`/api/teams/${owner.teamId}/invitations`).expect(200);
    expect(open.body).toEqual([]);
    await expectLinkDead(token, email, owner.teamId);
  });

  it('when the invitation was already cancelled or accepted, returns 404', async () => {
    const owner = await signUpOwner(t);
    const first = await inviteAndReadToken(owner, uniqueEmail('first'));
    await owner.agent
      .delete(`/api/teams/${owner.teamId}/invitations/${first.invitation.id}`)
      .expect(204);
    await owner.agent
      .delete(`/api/teams/${owner.teamId}/invitations/${first.invitation.id}`)
      .expect(404);

    const email = uniqueEmail('second');
    const second = await inviteAndReadToken(owner, email);
    const invitee = await signUpAs(email);
    await invitee.agent.post(`/api/invitations/${second.token}/accept`).expect(200);
    await owner.agent
      .delete(`/api/teams/${owner.teamId}/invitations/${second.invitation.id}`)
      .expect(404);
  });

  it('when the invitation belongs to another team, returns 404 and leaves it open', async () => {
    const owner = await signUpOwner(t);
    const otherOwner = await signUpOwner(t);
    const { token, invitation } = await inviteAndReadToken(otherOwner, uniqueEmail('invitee'));
    await owner.agent.delete(`/api/teams/${owner.teamId}/invitations/${invitation.id}`).expect(404);
    await t.request().get(`/api/invitations/${token}`).expect(200);
  });
});
