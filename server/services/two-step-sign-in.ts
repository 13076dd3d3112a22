/**
 * Two-step sign-in: after the password, a time-based one-time password from an authenticator app
 * (TOTP, RFC 6238: HMAC-SHA1, 6 digits, 30-second steps, one step of clock drift either way), or
 * one of ten single-use recovery codes. Turning it on needs a code from the app, so nobody is
 * locked out by a secret their app never saved; turning it off needs the password and a code.
 */
import { createHash, randomInt } from 'node:crypto';
import * as OTPAuth from 'otpauth';
import type { AppDeps } from '../deps';
import type { DbOrTx } from '../../db/client';
import { AppError, ConflictError, UnauthenticatedError, ValidationError } from '../lib/errors';
import { verifyPassword } from '../lib/passwords';
import { getUserById } from '../../db/queries/users';
import {
  acceptTotpStep,
  consumeRecoveryCode,
  countUnusedRecoveryCodes,
  deleteUserTotp,
  getUserTotp,
  replaceRecoveryCodes,
  upsertPendingTotp,
} from '../../db/queries/totp';
import { endUserSessions, openSession } from './sessions';
import { recordAudit } from './audit';
import type {
  DisableTwoStepInput,
  EnableTwoStepInput,
  RecoveryCodes,
  SecondStepInput,
  TwoStepSetup,
  TwoStepStatus,
} from '../../shared/schemas/two-step';
import type { AuditName } from './actor';

const PERIOD_SECONDS = 30;
/** Codes one step early or late still count: phone clocks drift (RFC 6238 §5.2 allows one). */
const DRIFT_STEPS = 1;
const RECOVERY_CODE_COUNT = 10;
/** Crockford-style alphabet without 0/O and 1/I/L, so a code read off paper is typed right. */
const RECOVERY_ALPHABET = 'ABCDEFGHJKMNPQRSTUVWXYZ23456789';

const totpOf = (secret: string, label = '') =>
  new OTPAuth.TOTP({
    issuer: 'Choicewright',
    label,
    algorithm: 'SHA1',
    digits: 6,
    period: PERIOD_SECONDS,
    secret: OTPAuth.Secret.fromBase32(secret),
  });

/** The 30-second step a valid code belongs to, or null when it is not valid now. */
export function totpStep(secret: string, code: string, now: Date): number | null {
  if (!/^\d{6}$/.test(code)) return null;
  const delta = totpOf(secret).validate({
    token: code,
    timestamp: now.getTime(),
    window: DRIFT_STEPS,
  });
  return delta === null ? null : Math.floor(now.getTime() / 1000 / PERIOD_SECONDS) + delta;
}

const normaliseRecoveryCode = (code: string) => code.toUpperCase().replace(/[\s-]/g, '');
const hashRecoveryCode = (code: string) =>
  createHash('sha256').update(normaliseRecoveryCode(code)).digest('hex');

function newRecoveryCodes(): string[] {
  return Array.from({ length: RECOVERY_CODE_COUNT }, () => {
    const chars = Array.from(
      { length: 10 },
      () => RECOVERY_ALPHABET[randomInt(RECOVERY_ALPHABET.length)],
    );
    return `${chars.slice(0, 5).join('')}-${chars.slice(5).join('')}`;
  });
}

async function issueRecoveryCodes(db: DbOrTx, userId: string): Promise<string[]> {
  const codes = newRecoveryCodes();
  await replaceRecoveryCodes(db, { userId, codeHashes: codes.map(hashRecoveryCode) });
  return codes;
}

const wrongCode = (field = 'code') =>
  new ValidationError(
    'That code is not right, or was used already. Wait for the next code from your app, or use an unused recovery code.',
    [{ path: field, message: 'Wrong or already used code' }],
    'wrong_code',
  );

export async function getTwoStepStatus(deps: AppDeps, userId: string): Promise<TwoStepStatus> {
  const row = await getUserTotp(deps.db, { userId });
  const enabled = !!row?.enabledAt;
  return {
    enabled,
    enabledAt: row?.enabledAt?.toISOString() ?? null,
    recoveryCodesLeft: enabled ? await countUnusedRecoveryCodes(deps.db, { userId }) : 0,
  };
}

export async function hasTwoStep(db: DbOrTx, userId: string): Promise<boolean> {
  return !!(await getUserTotp(db, { userId }))?.enabledAt;
}

/** A new secret for the app to store; replaces an unfinished enrolment, never an enabled one. */
export async function startTwoStepSetup(deps: AppDeps, actor: AuditName): Promise<TwoStepSetup> {
  const secret = new OTPAuth.Secret({ size: 20 }).base32;
  const row = await upsertPendingTotp(deps.db, { userId: actor.userId, secret });
  if (!row)
    throw new ConflictError(
      'two_step_enabled',
      'Two-step sign-in is already on. Turn it off first to move it to another app.',
    );
  return { secret, uri: totpOf(secret, actor.email).toString() };
}

/** Finishes the enrolment with a code from the app; other sessions end; codes shown once. */
export async function enableTwoStep(
  deps: AppDeps,
  current: AuditName & { sessionId: string },
  input: EnableTwoStepInput,
  now = new Date(),
): Promise<RecoveryCodes> {
  const row = await getUserTotp(deps.db, { userId: current.userId });
  if (!row || row.enabledAt)
    throw new ConflictError(
      row ? 'two_step_enabled' : 'two_step_not_started',
      row ? 'Two-step sign-in is already on.' : 'Start the set-up first: scan the new QR code.',
    );
  const step = totpStep(row.secret, input.code, now);
  return deps.db.transaction(async (tx) => {
    if (
      step === null ||
      !(await acceptTotpStep(tx, { userId: current.userId, step, enable: true, now }))
    )
      throw wrongCode();
    const recoveryCodes = await issueRecoveryCodes(tx, current.userId);
    const ended = await endUserSessions(tx, current.userId, 'two_step_enabled', current.sessionId);
    await recordAudit(tx, {
      action: 'auth.two_step_enabled',
      actor: current,
      details: { otherSessionsEnded: ended },
    });
    return { recoveryCodes };
  });
}

/**
 * Checks a second-step code (app code or recovery code) and uses it up, inside the caller's
 * transaction; the kind used, or null when wrong, replayed or already used.
 */
async function useSecondFactor(
  tx: DbOrTx,
  userId: string,
  code: string,
  now: Date,
): Promise<'app_code' | 'recovery_code' | null> {
  const row = await getUserTotp(tx, { userId });
  if (!row?.enabledAt) return null;
  const trimmed = code.trim();
  if (/^\d{6}$/.test(trimmed)) {
    const step = totpStep(row.secret, trimmed, now);
    return step !== null && (await acceptTotpStep(tx, { userId, step, enable: false, now }))
      ? 'app_code'
      : null;
  }
  const ok = await consumeRecoveryCode(tx, { userId, codeHash: hashRecoveryCode(trimmed), now });
  return ok ? 'recovery_code' : null;
}

/** The second step of a sign-in whose password was right: opens the session. */
export async function finishTwoStepSignIn(
  deps: AppDeps,
  userId: string,
  input: SecondStepInput,
  client: { userAgent?: string },
  now = new Date(),
) {
  const user = await getUserById(deps.db, { id: userId });
  if (!user) throw new UnauthenticatedError('Sign in again.');
  const actor = { userId: user.id, email: user.email };
  const done = await deps.db.transaction(async (tx) => {
    const used = await useSecondFactor(tx, user.id, input.code, now);
    if (!used) return null;
    const session = await openSession(deps, user.id, client.userAgent, tx);
    await recordAudit(tx, {
      action: 'auth.sign_in',
      actor,
      targetType: 'session',
      targetId: session.sessionId,
      details: { secondStep: used },
    });
    return { user, session };
  });
  if (done) return done;
  await recordAudit(deps.db, { action: 'auth.second_step_failed', actor });
  throw new AppError(
    401,
    'wrong_code',
    'That code is not right, or was used already. Wait for the next code from your app.',
    [{ path: 'code', message: 'Wrong or already used code' }],
  );
}

export async function disableTwoStep(deps: AppDeps, actor: AuditName, input: DisableTwoStepInput) {
  const user = await getUserById(deps.db, { id: actor.userId });
  if (!user) throw new UnauthenticatedError();
  const { ok } = await verifyPassword(user.passwordHash, input.password);
  if (!ok)
    throw new ValidationError('Your password is wrong.', [
      { path: 'password', message: 'Password is wrong' },
    ]);
  await deps.db.transaction(async (tx) => {
    if (!(await useSecondFactor(tx, actor.userId, input.code, new Date()))) throw wrongCode();
    await deleteUserTotp(tx, { userId: actor.userId });
    await recordAudit(tx, { action: 'auth.two_step_disabled', actor });
  });
}

/** New recovery codes (the old ones stop working), for a code from the app. */
export async function renewRecoveryCodes(
  deps: AppDeps,
  actor: AuditName,
  input: EnableTwoStepInput,
): Promise<RecoveryCodes> {
  return deps.db.transaction(async (tx) => {
    if ((await useSecondFactor(tx, actor.userId, input.code, new Date())) !== 'app_code')
      throw wrongCode();
    const recoveryCodes = await issueRecoveryCodes(tx, actor.userId);
    await recordAudit(tx, { action: 'auth.recovery_codes_renewed', actor });
    return { recoveryCodes };
  });
}
