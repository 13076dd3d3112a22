/**
 * Revocable sessions: listed on the account page, signed out one by one or everywhere, ended by
 * idle and absolute timeouts, by a password change (others only) and by removal from a team.
 */
import { describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { addMember, signUpOwner, TEST_PASSWORD } from '../../support/factories';

const t = useTestApp({ SESSION_IDLE_MINUTES: '30', SESSION_ABSOLUTE_HOURS: '12' });

const me = (cookie: string) => t.request().get('/api/auth/me').set('Cookie', cookie);

async function signInCookie(
  email: string,
  userAgent = 'Mozilla/5.0 (X11; Linux x86_64; rv:128.0) Gecko/20100101 Firefox/128.0',
) {
  const res = await t
    .request()
    .post('/api/auth/sign-in')
    .set('User-Agent', userAgent)
    .send({ email, password: TEST_PASSWORD })
    .expect(200);
  return (res.headers['set-cookie'] as unknown as string[])[0]!.split(';')[0]!;
}

describe('GET /api/account/sessions', () => {
  it('lists the open sessions with a coarse device description and marks the current one', async () => {
    const { user } = await signUpOwner(t);
    const laptop = await signInCookie(user.email);
    await signInCookie(
      user.email,
      'Mozilla/5.0 (iPhone; CPU iPhone OS 17_0 like Mac OS X) AppleWebKit/605.1.15 Mobile/15E148',
    );
    const res = await t.request().get('/api/account/sessions').set('Cookie', laptop).expect(200);
    expect(res.body).toHaveLength(3);
    const current = res.body.filter((s: { current: boolean }) => s.current);
    expect(current).toEqual([expect.objectContaining({ device: 'Firefox on Linux (desktop)' })]);
    expect(res.body.map((s: { device: string }) => s.device)).toContain('Safari on iOS (phone)');
    expect(JSON.stringify(res.body)).not.toContain('Mozilla/5.0');
  });
});

describe('DELETE /api/account/sessions/:sessionId', () => {
  it('signs out another session, which then fails', async () => {
    const { user } = await signUpOwner(t);
    const a = await signInCookie(user.email);
    const b = await signInCookie(user.email);
    const list = await t.request().get('/api/account/sessions').set('Cookie', a).expect(200);
    const other = list.body.find((s: { current: boolean; id: string }) => !s.current && s.id) as {
      id: string;
    };
    // b is one of the non-current ones; revoke every other session one by one.
    for (const s of list.body as { id: string; current: boolean }[])
      if (!s.current)
        await t.request().delete(`/api/account/sessions/${s.id}`).set('Cookie', a).expect(204);
    await me(b).expect(401);
    await me(a).expect(200);
    const again = await t.request().delete(`/api/account/sessions/${other.id}`).set('Cookie', a);
    expect(again.status).toBe(404);
  });

  it("cannot touch another user's session (404, nothing changes)", async () => {
    const one = await signUpOwner(t);
    const two = await signUpOwner(t);
    const twoCookie = await signInCookie(two.user.email);
    const twoSessions = await t.request().get('/api/account/sessions').set('Cookie', twoCookie);
    const target = (twoSessions.body as { id: string }[])[0]!.id;
    await one.agent.delete(`/api/account/sessions/${target}`).expect(404);
    await me(twoCookie).expect(200);
  });
});

describe('POST /api/account/sessions/sign-out-everywhere', () => {
  it('ends every session of the user, this one included, and records it', async () => {
    const { user } = await signUpOwner(t);
    const a = await signInCookie(user.email);
    const b = await signInCookie(user.email);
    await t
      .request()
      .post('/api/account/sessions/sign-out-everywhere')
      .set('Cookie', a)
      .expect(204);
    await me(a).expect(401);
    await me(b).expect(401);
    const { rows } = await t.deps.db.execute(
      sql`select details from audit_events where actor_id = ${user.id} and action = 'auth.sessions_revoked'`,
    );
    expect(rows).toEqual([{ details: { sessionsEnded: 3 } }]);
  });
});

describe('timeouts', () => {
  it('ends a session idle for longer than SESSION_IDLE_MINUTES', async () => {
    const { user } = await signUpOwner(t);
    const cookie = await signInCookie(user.email);
    await me(cookie).expect(200);
    await t.deps.db.execute(
      sql`update user_sessions set last_seen_at = now() - interval '31 minutes' where user_id = ${user.id}`,
    );
    await me(cookie).expect(401);
  });

  it('ends a session past its absolute end even while in use', async () => {
    const { user } = await signUpOwner(t);
    const cookie = await signInCookie(user.email);
    await t.deps.db.execute(
      sql`update user_sessions set expires_at = now() - interval '1 second' where user_id = ${user.id}`,
    );
    await me(cookie).expect(401);
  });

  it('fixes the absolute end at sign-in, 12 hours later by default', async () => {
    const { user } = await signUpOwner(t);
    await signInCookie(user.email);
    const { rows } = await t.deps.db.execute<{ h: number }>(
      sql`select round(extract(epoch from (expires_at - created_at)) / 3600)::int as h
          from user_sessions where user_id = ${user.id} limit 1`,
    );
    expect(rows[0]!.h).toBe(12);
  });
});

describe('what ends other sessions', () => {
  it('a password change ends the other sessions and keeps this one', async () => {
    const { user } = await signUpOwner(t);
    const here = await signInCookie(user.email);
    const there = await signInCookie(user.email);
    await t
      .request()
      .patch('/api/account')
      .set('Cookie', here)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a changed passphrase' })
      .expect(200);
    await me(here).expect(200);
    await me(there).expect(401);
  });

  it('removal from a team ends every session of the removed member', async () => {
    const owner = await signUpOwner(t);
    const editor = await addMember(t, owner.teamId, 'editor');
    await editor.agent.get('/api/auth/me').expect(200);
    await owner.agent.delete(`/api/teams/${owner.teamId}/members/${editor.user.id}`).expect(204);
    await editor.agent.get('/api/auth/me').expect(401);
  });
});
