/**
 * Sign up (with e-mail confirmation), sign in, password reset and the signed-in user's account.
 * Sign-up and forgot-password answer the same way whether or not the address has an account,
 * and do their work after the answer has gone out, so neither the answer nor its timing tells.
 */
import type { AppDeps } from '../deps';
import { AppError, UnauthenticatedError, ValidationError } from '../lib/errors';
import { createOneTimeToken, hashToken } from '../lib/tokens';
import { dummyHash, hashPassword, verifyPassword } from '../lib/passwords';
import { assertUncommonPassword } from '../lib/common-passwords';
import { runAfterResponse } from '../lib/after-response';
import { getUserByEmail, getUserById, insertUser, updateUser } from '../../db/queries/users';
import { insertMembership, insertTeam, listTeamsOfUser } from '../../db/queries/memberships';
import { consumePasswordReset, insertPasswordReset } from '../../db/queries/tokens';
import {
  consumeEmailConfirmation,
  insertEmailConfirmation,
  markEmailVerified,
} from '../../db/queries/email-confirmations';
import { passwordResetMail } from '../mail/templates';
import { accountExistsMail, confirmEmailMail } from '../mail/account-templates';
import { endUserSessions, openSession } from './sessions';
import { recordAudit } from './audit';
import { hasTwoStep } from './two-step-sign-in';
import type {
  AcceptedMessage,
  ConfirmEmailInput,
  CurrentUser,
  ForgotPasswordInput,
  ResetPasswordInput,
  SignInInput,
  SignUpInput,
  UpdateAccountInput,
} from '../../shared/schemas/auth';

export const RESET_TTL_MINUTES = 30;
export const CONFIRM_TTL_HOURS = 48;

type Client = { userAgent?: string };

const invalidLink = (kind: string, then: string) =>
  new ValidationError(
    `This ${kind} link is invalid, used or expired. ${then}`,
    [{ path: 'token', message: 'Invalid, used or expired link' }],
    'invalid_token',
  );

export async function getCurrentUser(deps: AppDeps, userId: string): Promise<CurrentUser> {
  const user = await getUserById(deps.db, { id: userId });
  if (!user) throw new UnauthenticatedError();
  const teams = await listTeamsOfUser(deps.db, { userId });
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    teams: teams.map(({ id, name, role }) => ({ id, name, role })),
  };
}

async function sendConfirmation(
  deps: AppDeps,
  user: { id: string; email: string },
  redirectTo?: string,
) {
  const { token, hash } = createOneTimeToken();
  await insertEmailConfirmation(deps.db, {
    userId: user.id,
    tokenHash: hash,
    expiresAt: new Date(Date.now() + CONFIRM_TTL_HOURS * 3_600_000),
  });
  const next = redirectTo ? `&redirectTo=${encodeURIComponent(redirectTo)}` : '';
  const link = `${deps.env.APP_URL}/confirm-email?token=${encodeURIComponent(token)}${next}`;
  await deps.mailer.send(confirmEmailMail({ to: user.email, link, hours: CONFIRM_TTL_HOURS }));
}

/**
 * A new address gets an unconfirmed account with its own team and a confirmation link; an
 * address that already has an account gets a notice instead (or, if still unconfirmed, a new
 * link). The caller always hears the same thing.
 */
export function signUp(deps: AppDeps, input: SignUpInput): AcceptedMessage {
  // Before anything else, so the answer never depends on whether the address exists.
  assertUncommonPassword(input.password, 'password');
  runAfterResponse(deps.logger, 'sign-up', async () => {
    const passwordHash = await hashPassword(input.password);
    const existing = await getUserByEmail(deps.db, { email: input.email });
    if (existing) {
      if (!existing.emailVerifiedAt) return sendConfirmation(deps, existing, input.redirectTo);
      return deps.mailer.send(
        accountExistsMail({
          to: existing.email,
          signInLink: `${deps.env.APP_URL}/sign-in`,
          resetLink: `${deps.env.APP_URL}/forgot-password`,
        }),
      );
    }
    const user = await deps.db.transaction(async (tx) => {
      const u = await insertUser(tx, { email: input.email, name: input.name, passwordHash });
      const team = await insertTeam(tx, { name: input.teamName });
      await insertMembership(tx, { teamId: team.id, userId: u.id, role: 'owner' });
      return u;
    });
    await sendConfirmation(deps, user, input.redirectTo);
  });
  return {
    message: `Check your inbox: we sent a message to ${input.email} to confirm the address.`,
  };
}

/** Opens the confirmation link: marks the address confirmed and signs the user in. */
export async function confirmEmail(deps: AppDeps, input: ConfirmEmailInput, client: Client) {
  return deps.db.transaction(async (tx) => {
    const now = new Date();
    const userId = await consumeEmailConfirmation(tx, { tokenHash: hashToken(input.token), now });
    if (!userId) throw invalidLink('confirmation', 'Sign in to get a new one.');
    await markEmailVerified(tx, { userId, now });
    const user = (await getUserById(tx, { id: userId }))!;
    await recordAudit(tx, {
      action: 'auth.email_confirmed',
      actor: { userId, email: user.email },
    });
    return { user, session: await openSession(deps, userId, client.userAgent, tx) };
  });
}

export async function signIn(deps: AppDeps, input: SignInInput, client: Client) {
  const user = await getUserByEmail(deps.db, { email: input.email });
  const { ok, rehash } = await verifyPassword(
    user?.passwordHash ?? (await dummyHash()),
    input.password,
  );
  if (!user || !ok) {
    await recordAudit(deps.db, {
      action: 'auth.sign_in_failed',
      actor: user ? { userId: user.id, email: user.email } : null,
      details: { reason: user ? 'wrong_password' : 'unknown_account' },
    });
    throw new UnauthenticatedError('E-mail or password is wrong.');
  }
  if (!user.emailVerifiedAt) {
    runAfterResponse(deps.logger, 'confirmation mail', () => sendConfirmation(deps, user));
    throw new AppError(
      403,
      'email_unconfirmed',
      'Confirm your e-mail address first: we have sent you a new link.',
    );
  }
  if (rehash)
    await updateUser(deps.db, { id: user.id, passwordHash: await hashPassword(input.password) });
  // The password was right; the session opens only after the second step.
  if (await hasTwoStep(deps.db, user.id)) return { user, twoStep: true as const };
  const session = await openSession(deps, user.id, client.userAgent);
  await recordAudit(deps.db, {
    action: 'auth.sign_in',
    actor: { userId: user.id, email: user.email },
    targetType: 'session',
    targetId: session.sessionId,
  });
  return { user, session };
}

/** Always answers the same way, so the form cannot be used to find out who has an account. */
export function requestPasswordReset(deps: AppDeps, input: ForgotPasswordInput): AcceptedMessage {
  runAfterResponse(deps.logger, 'password reset mail', async () => {
    const user = await getUserByEmail(deps.db, { email: input.email });
    if (!user) return;
    const { token, hash } = createOneTimeToken();
    await insertPasswordReset(deps.db, {
      userId: user.id,
      tokenHash: hash,
      expiresAt: new Date(Date.now() + RESET_TTL_MINUTES * 60_000),
    });
    const link = `${deps.env.APP_URL}/reset-password?token=${encodeURIComponent(token)}`;
    await deps.mailer.send(passwordResetMail({ to: user.email, link, minutes: RESET_TTL_MINUTES }));
  });
  return { message: 'If an account exists for this address, a reset link is on its way.' };
}

/** Sets a new password from a reset link: every other session ends, this browser signs in. */
export async function resetPassword(deps: AppDeps, input: ResetPasswordInput, client: Client) {
  assertUncommonPassword(input.password, 'password');
  const passwordHash = await hashPassword(input.password);
  return deps.db.transaction(async (tx) => {
    const now = new Date();
    const userId = await consumePasswordReset(tx, { tokenHash: hashToken(input.token), now });
    if (!userId) throw invalidLink('reset', 'Ask for a new one.');
    const user = (await updateUser(tx, { id: userId, passwordHash }))!;
    // The link came by e-mail, so the address is proven too.
    await markEmailVerified(tx, { userId, now });
    const ended = await endUserSessions(tx, userId, 'password_reset');
    await recordAudit(tx, {
      action: 'auth.password_reset',
      actor: { userId, email: user.email },
      details: { sessionsEnded: ended },
    });
    return { user, session: await openSession(deps, userId, client.userAgent, tx) };
  });
}

/** Renames the user and, with the current password, changes it: other sessions then end. */
export async function updateAccount(
  deps: AppDeps,
  current: { userId: string; sessionId: string },
  input: UpdateAccountInput,
) {
  const user = await getUserById(deps.db, { id: current.userId });
  if (!user) throw new UnauthenticatedError();
  let passwordHash: string | undefined;
  if (input.newPassword) {
    assertUncommonPassword(input.newPassword, 'newPassword');
    const { ok } = await verifyPassword(user.passwordHash, input.currentPassword ?? '');
    if (!ok) {
      throw new ValidationError('Your current password is wrong.', [
        { path: 'currentPassword', message: 'Current password is wrong' },
      ]);
    }
    passwordHash = await hashPassword(input.newPassword);
  }
  await deps.db.transaction(async (tx) => {
    await updateUser(tx, { id: current.userId, name: input.name, passwordHash });
    if (!passwordHash) return;
    const ended = await endUserSessions(tx, current.userId, 'password_changed', current.sessionId);
    await recordAudit(tx, {
      action: 'auth.password_changed',
      actor: { userId: user.id, email: user.email },
      details: { otherSessionsEnded: ended },
    });
  });
}
