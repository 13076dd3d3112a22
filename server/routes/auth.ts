import { Router, type Response } from 'express';
import type { AppDeps } from '../deps';
import { parseBody } from '../middleware/validate';
import { authRateLimit } from '../middleware/rate-limits';
import { requireUser } from '../middleware/auth';
import { publicRoute } from '../middleware/access';
import { SESSION_COOKIE, sessionCookieOptions } from '../lib/session';
import {
  forgotPasswordSchema,
  resetPasswordSchema,
  signInSchema,
  signUpSchema,
} from '../../shared/schemas/auth';
import * as auth from '../services/auth';

export function setSessionCookie(deps: AppDeps, res: Response, token: string): void {
  res.cookie(SESSION_COOKIE, token, sessionCookieOptions(deps.env.APP_URL.startsWith('https:')));
}

export function createAuthRouter(deps: AppDeps): Router {
  const router = Router();
  const limited = authRateLimit(deps.env.AUTH_RATE_LIMIT);
  const open = publicRoute('signing in and account recovery happen before a session exists');

  router.post('/sign-up', open, limited, async (req, res) => {
    const { user, token } = await auth.signUp(deps, parseBody(signUpSchema, req));
    setSessionCookie(deps, res, token);
    res.status(201).json(await auth.getCurrentUser(deps, user.id));
  });

  router.post('/sign-in', open, limited, async (req, res) => {
    const { user, token } = await auth.signIn(deps, parseBody(signInSchema, req));
    setSessionCookie(deps, res, token);
    res.json(await auth.getCurrentUser(deps, user.id));
  });

  router.post('/sign-out', publicRoute('signing out needs no valid session'), (_req, res) => {
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.status(204).end();
  });

  router.get('/me', requireUser(deps), async (req, res) => {
    res.json(await auth.getCurrentUser(deps, req.auth!.userId));
  });

  router.post('/forgot-password', open, limited, async (req, res) => {
    await auth.requestPasswordReset(deps, parseBody(forgotPasswordSchema, req));
    res
      .status(202)
      .json({ message: 'If an account exists for this address, a reset link is on its way.' });
  });

  router.post('/reset-password', open, limited, async (req, res) => {
    const { user, token } = await auth.resetPassword(deps, parseBody(resetPasswordSchema, req));
    setSessionCookie(deps, res, token);
    res.json(await auth.getCurrentUser(deps, user.id));
  });

  return router;
}
