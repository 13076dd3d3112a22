/**
 * Two-step sign-in (TOTP, RFC 6238, and one-time recovery codes): turning it on needs a code
 * from the app; sign-in then stops after the password until a code is given; a code is accepted
 * once (RFC 6238 §5.2); recovery codes work once; turning it off needs the password and a code;
 * wrong codes are limited per account. The codes are computed with the otpauth package from the
 * secret the API handed out, as an authenticator app would.
 */
import { describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import * as OTPAuth from 'otpauth';
import { useTestApp } from '../../support/test-app';
import { signUpOwner, TEST_PASSWORD } from '../../support/factories';

const t = useTestApp({ ACCOUNT_SIGN_IN_LIMIT: '4' });

/** The app's code `steps` 30-second steps from now (the server accepts one step either way). */
const codeAt = (secret: string, steps = 0) =>
  OTPAuth.TOTP.generate({
    secret: OTPAuth.Secret.fromBase32(secret),
    algorithm: 'SHA1',
    digits: 6,
    period: 30,
    timestamp: Date.now() + steps * 30_000,
  });

const cookiesOf = (res: { headers: Record<string, unknown> }) =>
  ((res.headers['set-cookie'] as string[] | undefined) ?? []).map((c) => c.split(';')[0]!);

/** An owner with two-step sign-in on: their agent (still signed in), secret and recovery codes. */
async function ownerWithTwoStep() {
  const owner = await signUpOwner(t);
  const setup = await owner.agent.post('/api/account/two-step/setup').expect(200);
  const secret = setup.body.secret as string;
  const usedCode = codeAt(secret);
  const on = await owner.agent
    .post('/api/account/two-step/enable')
    .send({ code: usedCode })
    .expect(200);
  return { ...owner, secret, usedCode, recoveryCodes: on.body.recoveryCodes as string[] };
}

/** Signs in with the password: the agent then holds the pending second-step cookie only. */
async function passwordStep(email: string) {
  const agent = t.request();
  const res = await agent
    .post('/api/auth/sign-in')
    .send({ email, password: TEST_PASSWORD })
    .expect(200);
  return { agent, res };
}

const auditCount = async (userId: string, action: string) =>
  Number(
    (
      await t.deps.db.execute<{ n: string }>(
        sql`select count(*) as n from audit_events where actor_id = ${userId} and action = ${action}`,
      )
    ).rows[0]!.n,
  );

describe('turning two-step sign-in on', () => {
  it('hands out a secret and its otpauth URI, and is not on until a code proves the app', async () => {
    const owner = await signUpOwner(t);
    const setup = await owner.agent.post('/api/account/two-step/setup').expect(200);
    expect(setup.body.secret).toMatch(/^[A-Z2-7]{32}$/);
    const uri = OTPAuth.URI.parse(setup.body.uri as string) as OTPAuth.TOTP;
    expect(uri.secret.base32).toBe(setup.body.secret);
    expect(uri.issuer).toBe('Choicewright');
    expect(uri.label).toBe(owner.user.email);
    const status = await owner.agent.get('/api/account/two-step').expect(200);
    expect(status.body).toEqual({ enabled: false, enabledAt: null, recoveryCodesLeft: 0 });
  });

  it('refuses a wrong, malformed or early code and changes nothing', async () => {
    const owner = await signUpOwner(t);
    const none = await owner.agent
      .post('/api/account/two-step/enable')
      .send({ code: '123456' })
      .expect(409);
    expect(none.body.error.code).toBe('two_step_not_started');
    const { body } = await owner.agent.post('/api/account/two-step/setup').expect(200);
    const right = codeAt(body.secret);
    const wrong = right === '000000' ? '000001' : '000000';
    const res = await owner.agent
      .post('/api/account/two-step/enable')
      .send({ code: wrong })
      .expect(400);
    expect(res.body.error).toMatchObject({ code: 'wrong_code', fields: [{ path: 'code' }] });
    const bad = await owner.agent
      .post('/api/account/two-step/enable')
      .send({ code: '12ab' })
      .expect(400);
    expect(bad.body.error).toMatchObject({ code: 'invalid_input', fields: [{ path: 'code' }] });
    const status = await owner.agent.get('/api/account/two-step').expect(200);
    expect(status.body.enabled).toBe(false);
    // Still signed in directly: nothing was switched on.
    const { res: signIn } = await passwordStep(owner.user.email);
    expect(signIn.body.email).toBe(owner.user.email);
  });

  it('turns on with the right code: ten recovery codes once, other sessions end, audited', async () => {
    const owner = await signUpOwner(t);
    const { agent: elsewhere } = await passwordStep(owner.user.email);
    await elsewhere.get('/api/auth/me').expect(200);
    const { body } = await owner.agent.post('/api/account/two-step/setup').expect(200);
    const on = await owner.agent
      .post('/api/account/two-step/enable')
      .send({ code: codeAt(body.secret) })
      .expect(200);
    const codes = on.body.recoveryCodes as string[];
    expect(codes).toHaveLength(10);
    expect(new Set(codes).size).toBe(10);
    for (const c of codes) expect(c).toMatch(/^[A-HJKMNP-Z2-9]{5}-[A-HJKMNP-Z2-9]{5}$/);
    await elsewhere.get('/api/auth/me').expect(401);
    await owner.agent.get('/api/auth/me').expect(200);
    const status = await owner.agent.get('/api/account/two-step').expect(200);
    expect(status.body).toMatchObject({ enabled: true, recoveryCodesLeft: 10 });
    // Only hashes are stored.
    const stored = await t.deps.db.execute<{ code_hash: string }>(
      sql`select code_hash from recovery_codes where user_id = ${owner.user.id}`,
    );
    expect(stored.rows.map((r) => r.code_hash)).not.toContain(codes[0]);
    expect(await auditCount(owner.user.id, 'auth.two_step_enabled')).toBe(1);
    // A second set-up would silently move the account to another app: refused.
    const again = await owner.agent.post('/api/account/two-step/setup').expect(409);
    expect(again.body.error.code).toBe('two_step_enabled');
  });
});

describe('signing in with two steps', () => {
  it('stops after a right password: no session until the second step', async () => {
    const { user } = await ownerWithTwoStep();
    const { agent, res } = await passwordStep(user.email);
    expect(res.body).toEqual({ twoStepRequired: true });
    const cookies = cookiesOf(res);
    expect(cookies.some((c) => c.startsWith('cw_session='))).toBe(false);
    const pending = cookies.find((c) => c.startsWith('cw_two_step='))!;
    expect(pending).toBeDefined();
    await agent.get('/api/auth/me').expect(401);
    // The pending token is no session, even when sent as one.
    const asSession = `cw_session=${pending.slice('cw_two_step='.length)}`;
    await t.request().get('/api/auth/me').set('Cookie', asSession).expect(401);
  });

  it('a wrong password still answers as before (no hint that two-step is on)', async () => {
    const { user } = await ownerWithTwoStep();
    const res = await t
      .request()
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: 'not the password at all' })
      .expect(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('opens the session with the next code from the app, and never accepts a code twice', async () => {
    const { user, secret, usedCode } = await ownerWithTwoStep();
    const { agent } = await passwordStep(user.email);
    // The code used to turn it on is spent; the next step's code is still valid.
    const spent = await agent
      .post('/api/auth/sign-in/second-step')
      .send({ code: usedCode })
      .expect(401);
    expect(spent.body.error).toMatchObject({ code: 'wrong_code', fields: [{ path: 'code' }] });
    const next = codeAt(secret, 1);
    const ok = await agent.post('/api/auth/sign-in/second-step').send({ code: next }).expect(200);
    expect(ok.body.email).toBe(user.email);
    expect(cookiesOf(ok).some((c) => c.startsWith('cw_session='))).toBe(true);
    await agent.get('/api/auth/me').expect(200);
    // The same code a second time, from another browser: refused.
    const { agent: other } = await passwordStep(user.email);
    await other.post('/api/auth/sign-in/second-step').send({ code: next }).expect(401);
    await other.get('/api/auth/me').expect(401);
    expect(await auditCount(user.id, 'auth.second_step_failed')).toBe(2);
  });

  it('accepts each recovery code once, dashes and case aside', async () => {
    const { user, recoveryCodes } = await ownerWithTwoStep();
    const { agent } = await passwordStep(user.email);
    const typed = recoveryCodes[3]!.replace('-', '').toLowerCase();
    await agent.post('/api/auth/sign-in/second-step').send({ code: typed }).expect(200);
    const status = await agent.get('/api/account/two-step').expect(200);
    expect(status.body.recoveryCodesLeft).toBe(9);
    const { agent: again } = await passwordStep(user.email);
    await again.post('/api/auth/sign-in/second-step').send({ code: recoveryCodes[3] }).expect(401);
  });

  it('without a pending sign-in the second step is refused (expired), and nothing opens', async () => {
    const { recoveryCodes } = await ownerWithTwoStep();
    const res = await t
      .request()
      .post('/api/auth/sign-in/second-step')
      .send({ code: recoveryCodes[0] })
      .expect(401);
    expect(res.body.error.code).toBe('two_step_expired');
  });

  it('refuses malformed bodies with the field named', async () => {
    const { user } = await ownerWithTwoStep();
    const { agent } = await passwordStep(user.email);
    const res = await agent.post('/api/auth/sign-in/second-step').send({ code: '12' }).expect(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_input', fields: [{ path: 'code' }] });
  });

  it('limits wrong codes per account (429), without touching other accounts', async () => {
    const { user, secret } = await ownerWithTwoStep();
    const wrong = ['000000', '111111', '222222', '333333', '444444'].filter(
      (c) => ![-1, 0, 1, 2].some((k) => codeAt(secret, k) === c),
    );
    const statuses: number[] = [];
    for (const code of wrong.slice(0, 4)) {
      // A fresh password step each time: a new pending cookie does not reset the count.
      const { agent } = await passwordStep(user.email);
      statuses.push((await agent.post('/api/auth/sign-in/second-step').send({ code })).status);
    }
    expect(statuses).toEqual([401, 401, 401, 401]);
    const { agent } = await passwordStep(user.email);
    const limited = await agent
      .post('/api/auth/sign-in/second-step')
      .send({ code: codeAt(secret, 1) })
      .expect(429);
    expect(limited.body.error.code).toBe('rate_limited');
    const other = await ownerWithTwoStep();
    const { agent: b } = await passwordStep(other.user.email);
    await b
      .post('/api/auth/sign-in/second-step')
      .send({ code: other.recoveryCodes[0] })
      .expect(200);
  });
});

describe('turning two-step sign-in off and renewing recovery codes', () => {
  it('needs the password and a code; then sign-in is one step again', async () => {
    const { agent, user, recoveryCodes } = await ownerWithTwoStep();
    const noPassword = await agent
      .post('/api/account/two-step/disable')
      .send({ password: 'wrong password here', code: recoveryCodes[0] })
      .expect(400);
    expect(noPassword.body.error.fields).toEqual([
      { path: 'password', message: expect.any(String) },
    ]);
    const noCode = await agent
      .post('/api/account/two-step/disable')
      .send({ password: TEST_PASSWORD, code: 'AAAAA-AAAAA' })
      .expect(400);
    expect(noCode.body.error).toMatchObject({ code: 'wrong_code', fields: [{ path: 'code' }] });
    expect((await agent.get('/api/account/two-step').expect(200)).body.enabled).toBe(true);
    await agent
      .post('/api/account/two-step/disable')
      .send({ password: TEST_PASSWORD, code: recoveryCodes[0] })
      .expect(204);
    expect((await agent.get('/api/account/two-step').expect(200)).body).toEqual({
      enabled: false,
      enabledAt: null,
      recoveryCodesLeft: 0,
    });
    const { res } = await passwordStep(user.email);
    expect(res.body.email).toBe(user.email);
    expect(await auditCount(user.id, 'auth.two_step_disabled')).toBe(1);
  });

  it('new recovery codes replace the old ones, for a code from the app', async () => {
    const { agent, user, secret, recoveryCodes } = await ownerWithTwoStep();
    const fresh = await agent
      .post('/api/account/two-step/recovery-codes')
      .send({ code: codeAt(secret, 1) })
      .expect(200);
    const codes = fresh.body.recoveryCodes as string[];
    expect(codes).toHaveLength(10);
    const { agent: a } = await passwordStep(user.email);
    await a.post('/api/auth/sign-in/second-step').send({ code: recoveryCodes[0] }).expect(401);
    await a.post('/api/auth/sign-in/second-step').send({ code: codes[0] }).expect(200);
    expect(await auditCount(user.id, 'auth.recovery_codes_renewed')).toBe(1);
  });

  it('every two-step account route needs a signed-in user', async () => {
    for (const [method, path] of [
      ['get', '/api/account/two-step'],
      ['post', '/api/account/two-step/setup'],
      ['post', '/api/account/two-step/enable'],
      ['post', '/api/account/two-step/disable'],
      ['post', '/api/account/two-step/recovery-codes'],
    ] as const) {
      const res = await t.request()[method](path).send({});
      expect(res.status, path).toBe(401);
    }
  });
});
