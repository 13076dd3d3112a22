/**
 * Every rate limit of the API, counted in PostgreSQL (rate-limit-store.ts) so that several API
 * instances share the counts. Clients are told apart by address (req.ip, which honours
 * TRUST_PROXY), by account (the e-mail address a sign-in names) and, for respondents, by their
 * personal link token and their session token — so one noisy client or one shared address never
 * locks out everybody else.
 */
import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import type pg from 'pg';
import type { AppDeps } from '../deps';
import { PostgresRateLimitStore } from './rate-limit-store';
import { LocalFirstRateLimitStore } from './local-first-rate-limit-store';
import { createRateLimiter } from './rate-limiter';
import { RESPONDENT_TOKEN_HEADER } from '../../shared/schemas/respondent';
import { TWO_STEP_COOKIE, verifyTwoStepToken } from '../lib/session';

const FIFTEEN_MINUTES = 15 * 60 * 1000;

type LimitSpec = {
  /** Unique per limiter: names its counters. */
  name: string;
  limit: number;
  windowMs?: number;
  /** The client's key; requests it returns null for are not counted. */
  key: (req: Request) => string | null;
  message: string;
  /** Count only requests that fail (e.g. wrong passwords). */
  failuresOnly?: boolean;
  /**
   * Share of the limit each process may count in memory before it writes a key through to the
   * shared counters (local-first-rate-limit-store.ts). Only for the limits every respondent
   * request passes; sign-in, account and mail limits stay exact across instances.
   */
  localShare?: number;
};

/** Respondent keys: a process counts a quarter of the limit alone (a session sends ~15–30). */
const RESPONDENT_LOCAL_SHARE = 0.25;

const poolOf = (deps: AppDeps) => (deps.db as unknown as { $client: pg.Pool }).$client;

function createLimit(deps: AppDeps, spec: LimitSpec): RequestHandler {
  const shared = new PostgresRateLimitStore(poolOf(deps), spec.name);
  return createRateLimiter({
    windowMs: spec.windowMs ?? FIFTEEN_MINUTES,
    limit: spec.limit,
    store: spec.localShare ? new LocalFirstRateLimitStore(shared, spec.localShare) : shared,
    key: spec.key,
    failuresOnly: spec.failuresOnly ?? false,
    refuse: (_req, res) => {
      res.status(429).json({ error: { code: 'rate_limited', message: spec.message } });
    },
    // A database hiccup must not turn away respondents or lock people out.
    onStoreError: (err) =>
      deps.logger.warn(
        { err, limit: spec.name },
        'rate-limit counters unavailable: request let through',
      ),
  });
}

const byAddress = (req: Request) => `ip:${ipKeyGenerator(req.ip ?? 'unknown')}`;

const bodyEmail = (req: Request): string | null => {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' && email.length <= 254 ? email.trim().toLowerCase() : null;
};

/** Sign-in, sign-up, password reset, invitation and unsubscribe links, per address. */
export function authRateLimit(deps: AppDeps, name = 'auth'): RequestHandler {
  return createLimit(deps, {
    name: `${name}:address`,
    limit: deps.env.AUTH_RATE_LIMIT,
    key: byAddress,
    message: 'Too many attempts. Try again in a few minutes.',
  });
}

/**
 * Failed sign-ins per account, whatever address they come from: guessing one person's password
 * from many addresses is slowed, and a busy office behind one address is not locked out.
 */
export function accountSignInLimit(deps: AppDeps): RequestHandler {
  return createLimit(deps, {
    name: 'sign-in:account',
    limit: deps.env.ACCOUNT_SIGN_IN_LIMIT,
    key: (req) => (bodyEmail(req) ? `account:${bodyEmail(req)}` : null),
    failuresOnly: true,
    message: 'Too many failed sign-ins for this account. Wait a few minutes or reset the password.',
  });
}

/**
 * Wrong second-step codes per account (the user the pending sign-in names): six digits allow a
 * million guesses, and a right password must not buy unlimited tries at them.
 */
export function secondStepLimit(deps: AppDeps): RequestHandler {
  return createLimit(deps, {
    name: 'second-step:account',
    limit: deps.env.ACCOUNT_SIGN_IN_LIMIT,
    key: (req) => {
      const userId = verifyTwoStepToken(deps.env.JWT_SECRET, req.cookies?.[TWO_STEP_COOKIE]);
      return userId ? `user:${userId}` : null;
    },
    failuresOnly: true,
    message: 'Too many wrong codes for this account. Wait a few minutes, then sign in again.',
  });
}

/** Mail-sending requests (sign-up, forgot-password) per address they mail, so no inbox is flooded. */
export function mailPerRecipientLimit(deps: AppDeps): RequestHandler {
  return createLimit(deps, {
    name: 'mail:recipient',
    limit: 5,
    windowMs: 60 * 60 * 1000,
    key: (req) => (bodyEmail(req) ? `to:${bodyEmail(req)}` : null),
    message: 'Too many messages to this address. Try again in an hour.',
  });
}

/** New respondent sessions per address (a panel behind one address needs headroom). */
export function respondentStartLimit(deps: AppDeps): RequestHandler {
  return createLimit(deps, {
    name: 'respondent-start:address',
    limit: deps.env.RESPONDENT_START_RATE_LIMIT,
    key: byAddress,
    localShare: RESPONDENT_LOCAL_SHARE,
    message: 'Too many new sessions from this network. Try again later.',
  });
}

/** Session starts per personal link token (?inv=…): one link cannot mint respondents in bulk. */
export function personalLinkStartLimit(deps: AppDeps): RequestHandler {
  return createLimit(deps, {
    name: 'respondent-start:link',
    limit: 30,
    key: (req) => {
      const inv = (req.body as { params?: Record<string, unknown> } | undefined)?.params?.inv;
      return typeof inv === 'string' && inv.length > 0 ? `inv:${inv}` : null;
    },
    message: 'This personal link was opened too often. Try again later.',
  });
}

/** Requests per respondent session token: a runaway client cannot flood the answer path. */
export function respondentSessionLimit(deps: AppDeps): RequestHandler {
  return createLimit(deps, {
    name: 'respondent:session',
    limit: deps.env.RESPONDENT_SESSION_RATE_LIMIT,
    localShare: RESPONDENT_LOCAL_SHARE,
    key: (req) => {
      const token = req.get(RESPONDENT_TOKEN_HEADER);
      return token ? `session:${token}` : null;
    },
    message: 'Too many requests from this session. Wait a moment and try again.',
  });
}
