/** Sign up, sign in, password reset and the account of the signed-in user. */
import type { AppDeps } from '../deps';
import { ConflictError, UnauthenticatedError, ValidationError } from '../lib/errors';
import { createOneTimeToken, hashToken } from '../lib/tokens';
import { passwordStamp, signSession } from '../lib/session';
import { dummyHash, hashPassword, verifyPassword } from '../lib/passwords';
import { getUserByEmail, getUserById, insertUser, updateUser } from '../../db/queries/users';
import { insertMembership, insertTeam, listTeamsOfUser } from '../../db/queries/memberships';
import { consumePasswordReset, insertPasswordReset } from '../../db/queries/tokens';
import { passwordResetMail } from '../mail/templates';
import type {
  CurrentUser,
  ForgotPasswordInput,
  ResetPasswordInput,
  SignInInput,
  SignUpInput,
  UpdateAccountInput,
} from '../../shared/schemas/auth';

export const RESET_TTL_MINUTES = 30;

export function issueSession(deps: AppDeps, user: { id: string; passwordHash: string }): string {
  return signSession(deps.env.JWT_SECRET, { sub: user.id, pwd: passwordStamp(user.passwordHash) });
}

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

/** A new account always gets its own team, owned by the new user. */
export async function signUp(deps: AppDeps, input: SignUpInput) {
  if (await getUserByEmail(deps.db, { email: input.email })) {
    throw new ConflictError('email_taken', 'An account with this e-mail already exists.', [
      { path: 'email', message: 'An account with this e-mail already exists' },
    ]);
  }
  const passwordHash = await hashPassword(input.password);
  const user = await deps.db.transaction(async (tx) => {
    const u = await insertUser(tx, { email: input.email, name: input.name, passwordHash });
    const team = await insertTeam(tx, { name: input.teamName });
    await insertMembership(tx, { teamId: team.id, userId: u.id, role: 'owner' });
    return u;
  });
  return { user, token: issueSession(deps, user) };
}

export async function signIn(deps: AppDeps, input: SignInInput) {
  const user = await getUserByEmail(deps.db, { email: input.email });
  const { ok, rehash } = await verifyPassword(
    user?.passwordHash ?? (await dummyHash()),
    input.password,
  );
  if (!user || !ok) throw new UnauthenticatedError('E-mail or password is wrong.');
  const current = rehash
    ? ((await updateUser(deps.db, {
        id: user.id,
        passwordHash: await hashPassword(input.password),
      })) ?? user)
    : user;
  return { user: current, token: issueSession(deps, current) };
}

/** Always answers the same way, so the form cannot be used to find out who has an account. */
export async function requestPasswordReset(
  deps: AppDeps,
  input: ForgotPasswordInput,
): Promise<void> {
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
}

export async function resetPassword(deps: AppDeps, input: ResetPasswordInput) {
  const passwordHash = await hashPassword(input.password);
  const user = await deps.db.transaction(async (tx) => {
    const userId = await consumePasswordReset(tx, {
      tokenHash: hashToken(input.token),
      now: new Date(),
    });
    if (!userId) return null;
    return updateUser(tx, { id: userId, passwordHash });
  });
  if (!user) {
    throw new ValidationError(
      'This reset link is invalid, used or expired. Ask for a new one.',
      [{ path: 'token', message: 'Invalid, used or expired link' }],
      'invalid_token',
    );
  }
  return { user, token: issueSession(deps, user) };
}

export async function updateAccount(deps: AppDeps, userId: string, input: UpdateAccountInput) {
  const user = await getUserById(deps.db, { id: userId });
  if (!user) throw new UnauthenticatedError();
  let passwordHash: string | undefined;
  if (input.newPassword) {
    const { ok } = await verifyPassword(user.passwordHash, input.currentPassword ?? '');
    if (!ok) {
      throw new ValidationError('Your current password is wrong.', [
        { path: 'currentPassword', message: 'Current password is wrong' },
      ]);
    }
    passwordHash = await hashPassword(input.newPassword);
  }
  const updated = await updateUser(deps.db, { id: userId, name: input.name, passwordHash });
  // A password change signs out other sessions; this one gets a fresh cookie.
  return { user: updated!, token: passwordHash ? issueSession(deps, updated!) : null };
}
