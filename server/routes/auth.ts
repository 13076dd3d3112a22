import { Router, type Request, type Response } from 'express';
import type { AppDeps } from '../deps';
import { parseBody } from '../middleware/validate';
import {
  accountSignInLimit,
  authRateLimit,
  mailPerRecipientLimit,
} from '../middleware/rate-limits';
import { requireUser } from '../middleware/auth';
import { publicRoute } from '../middleware/access';
import { SESSION_COOKIE, sessionCookieOptions } from '../lib/session';
import {
  confirmEmailSchema,
  forgotPasswordSchema,
  resetPasswordSchema,
  signInSchema,
  signUpSchema,
} from '../../shared/schemas/auth';
import * as auth from '../services/auth';
import { resumeSession, signOutSession, type OpenedSession } from '../services/sessions';

export function setSessionCookie(deps: AppDeps, res: Response, session: OpenedSession): void {
  res.cookie(
    SESSION_COOKIE,
    session.token,
    sessionCookieOptions(deps.env.APP_URL.startsWith('https:'), session.ttlSeconds),
  );
}

export function clearSessionCookie(res: Response): void {
  res.clearCookie(SESSION_COOKIE, { path: '/' });
}

const clientOf = (req: Request) => ({ userAgent: req.get('user-agent') });

/** Sets the cookie of a freshly opened session and answers with the signed-in user. */
async function answerSignedIn(
  deps: AppDeps,
  res: Response,
  done: { user: { id: string }; session: OpenedSession },
) {
  setSessionCookie(deps, res, done.session);
  res.json(await auth.getCurrentUser(deps, done.user.id));
}

export function createAuthRouter(deps: AppDeps): Router {
  const router = Router();
  const limited = authRateLimit(deps);
  const perAccount = accountSignInLimit(deps);
  const perRecipient = mailPerRecipientLimit(deps);
  const open = publicRoute('signing in and account recovery happen before a session exists');

  router.post('/sign-up', open, limited, perRecipient, async (req, res) => {
    res.status(202).json(auth.signUp(deps, parseBody(signUpSchema, req)));
  });

  router.post('/confirm-email', open, limited, async (req, res) => {
    const body = parseBody(confirmEmailSchema, req);
    await answerSignedIn(deps, res, await auth.confirmEmail(deps, body, clientOf(req)));
  });

  router.post('/sign-in', open, limited, perAccount, async (req, res) => {
    const body = parseBody(signInSchema, req);
    await answerSignedIn(deps, res, await auth.signIn(deps, body, clientOf(req)));
  });

  router.post('/sign-out', publicRoute('signing out needs no valid session'), async (req, res) => {
    const token = req.cookies?.[SESSION_COOKIE];
    const current = typeof token === 'string' ? await resumeSession(deps, token) : null;
    if (current) await signOutSession(deps, current.user.id, current.sessionId);
    clearSessionCookie(res);
    res.status(204).end();
  });

  router.get('/me', requireUser(deps), async (req, res) => {
    res.json(await auth.getCurrentUser(deps, req.auth!.userId));
  });

  router.post('/forgot-password', open, limited, perRecipient, async (req, res) => {
    res.status(202).json(auth.requestPasswordReset(deps, parseBody(forgotPasswordSchema, req)));
  });

  router.post('/reset-password', open, limited, async (req, res) => {
    const body = parseBody(resetPasswordSchema, req);
    await answerSignedIn(deps, res, await auth.resetPassword(deps, body, clientOf(req)));
  });

  return router;
}
