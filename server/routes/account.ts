import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody } from '../middleware/validate';
import { requireUser } from '../middleware/auth';
import { updateAccountSchema } from '../../shared/schemas/auth';
import * as auth from '../services/auth';
import { setSessionCookie } from './auth';

export function createAccountRouter(deps: AppDeps): Router {
  const router = Router();
  router.use(requireUser(deps));
  router.patch('/', async (req, res) => {
    const { token } = await auth.updateAccount(
      deps,
      req.auth!.userId,
      parseBody(updateAccountSchema, req),
    );
    if (token) setSessionCookie(deps, res, token);
    res.json(await auth.getCurrentUser(deps, req.auth!.userId));
  });
  return router;
}
