import { Router, type Request, type Response } from 'express';
import type { AppDeps } from '../deps';
import { parseBody } from '../middleware/validate';
import {
  accountSignInLimit,
  authRateLimit,
  mailPerRecipientLimit,
  secondStepLimit,
} from '../middleware/rate-limits';
import { requireUser } from '../middleware/auth';
import { publicRoute } from '../middleware/access';
import { AppError } from '../lib/errors';
import {
  SESSION_COOKIE,
  TWO_STEP_COOKIE,
  sessionCookieOptions,
  signTwoStepToken,
  twoStepCookieOptions,
  verifyTwoStepToken,
} from '../lib/session';
import {
  confirmEmailSchema,
  forgotPasswordSchema,
  resetPasswordSchema,
  signInSchema,
  signUpSchema,
} from '../../shared/schemas/auth';
import { secondStepSchema } from '../../shared/schemas/two-step';
import * as auth from '../services/auth';
import { finishTwoStepSignIn } from '../services/two-step-sign-in';
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
    const done = await auth.signIn(deps, body, clientOf(req));
    if ('twoStep' in done) {
      const secure = deps.env.APP_URL.startsWith('https:');
      const token = signTwoStepToken(deps.env.JWT_SECRET, done.user.id);
      res.cookie(TWO_STEP_COOKIE, token, twoStepCookieOptions(secure));
      res.json({ twoStepRequired: true });
      return;
    }
    await answerSignedIn(deps, res, done);
  });

  router.post('/sign-in/second-step', open, limited, secondStepLimit(deps), async (req, res) => {
    const userId = verifyTwoStepToken(deps.env.JWT_SECRET, req.cookies?.[TWO_STEP_COOKIE]);
    if (!userId)
      throw new AppError(
        401,
        'two_step_expired',
        'This sign-in has expired. Enter your e-mail and password again.',
      );
    const body = parseBody(secondStepSchema, req);
    const done = await finishTwoStepSignIn(deps, userId, body, clientOf(req));
    res.clearCookie(TWO_STEP_COOKIE, { path: '/api/auth' });
    await answerSignedIn(deps, res, done);
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
