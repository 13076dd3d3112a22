import { describe, expect, it } from 'vitest';
import { useTestApp } from '../../support/test-app';
import { signUpOwner, TEST_PASSWORD } from '../../support/factories';
import { getUserById } from '../../../db/queries/users';

const t = useTestApp();

const NEW_PASSWORD = 'river health is good';

async function canSignIn(email: string, password: string): Promise<boolean> {
  const res = await t.request().post('/api/auth/sign-in').send({ email, password });
  return res.status === 200;
}

describe('PATCH /api/account (name)', () => {
  it('renames the user, trimmed, and /me shows the new name', async () => {
    const { agent } = await signUpOwner(t, { name: 'Old Name' });
    const res = await agent.patch('/api/account').send({ name: '  Priya Raman ' }).expect(200);
    expect(res.body.name).toBe('Priya Raman');
    expect((await agent.get('/api/auth/me').expect(200)).body.name).toBe('Priya Raman');
  });

  it('when the name is blank, returns 400 on the name field and keeps the old one', async () => {
    const { agent, user } = await signUpOwner(t, { name: 'Kept Name' });
    const res = await agent.patch('/api/account').send({ name: '   ' }).expect(400);
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: 'name' })]);
    expect((await getUserById(t.deps.db, { id: user.id }))?.name).toBe('Kept Name');
  });

  it('when nobody is signed in, returns 401', async () => {
    await t.request().patch('/api/account').send({ name: 'Nobody' }).expect(401);
  });
});

describe('PATCH /api/account (password)', () => {
  it('changes the password, keeps this session and signs out the others', async () => {
    const { agent, user } = await signUpOwner(t);
    const otherSession = t.request();
    await otherSession
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: TEST_PASSWORD })
      .expect(200);
    await agent
      .patch('/api/account')
      .send({ currentPassword: TEST_PASSWORD, newPassword: NEW_PASSWORD })
      .expect(200);
    await agent.get('/api/auth/me').expect(200);
    await otherSession.get('/api/auth/me').expect(401);
    expect(await canSignIn(user.email, NEW_PASSWORD)).toBe(true);
    expect(await canSignIn(user.email, TEST_PASSWORD)).toBe(false);
  });

  it('when the current password is wrong, returns 400 on that field and keeps the old one', async () => {
    const { agent, user } = await signUpOwner(t);
    const res = await agent
      .patch('/api/account')
      .send({ currentPassword: 'not my password', newPassword: NEW_PASSWORD })
      .expect(400);
    expect(res.body.error.fields).toEqual([
      { path: 'currentPassword', message: expect.any(String) },
    ]);
    expect(await canSignIn(user.email, TEST_PASSWORD)).toBe(true);
    await agent.get('/api/auth/me').expect(200);
  });

  it('when the current password is missing, returns 400 on currentPassword', async () => {
    const { agent, user } = await signUpOwner(t);
    const res = await agent.patch('/api/account').send({ newPassword: NEW_PASSWORD }).expect(400);
    expect(res.body.error.fields[0].path).toBe('currentPassword');
    expect(await canSignIn(user.email, TEST_PASSWORD)).toBe(true);
  });

  it('when the new password is too short, returns 400 on newPassword', async () => {
    const { agent, user } = await signUpOwner(t);
    const res = await agent
      .patch('/api/account')
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'short' })
      .expect(400);
    expect(res.body.error.fields[0]).toMatchObject({
      path: 'newPassword',
      message: 'Use at least 10 characters',
    });
    expect(await canSignIn(user.email, TEST_PASSWORD)).toBe(true);
  });
});

describe('GET /api/auth/me (teams of the account)', () => {
  it('lists every team of the user with the role held there', async () => {
    const { agent, teamId } = await signUpOwner(t, { teamName: 'First' });
    await signUpOwner(t, { teamName: 'Somebody else' });
    const created = await agent.post('/api/teams').send({ name: 'Second' }).expect(201);
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.teams).toEqual([
      { id: teamId, name: 'First', role: 'owner' },
      { id: created.body.id, name: 'Second', role: 'owner' },
    ]);
  });
});
