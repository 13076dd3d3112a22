/**
 * /api/account — the signed-in user's own account: name and password, and the open sign-in
 * sessions (list, sign one out, sign out everywhere), and two-step sign-in.
 */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams } from '../middleware/validate';
import { requireUser } from '../middleware/auth';
import { sessionParamsSchema, updateAccountSchema } from '../../shared/schemas/auth';
import * as auth from '../services/auth';
import { endUserSessions, listSessions, signOutSession } from '../services/sessions';
import { recordAudit } from '../services/audit';
import { clearSessionCookie } from './auth';
import { disableTwoStepSchema, enableTwoStepSchema } from '../../shared/schemas/two-step';
import * as twoStep from '../services/two-step-sign-in';

export function createAccountRouter(deps: AppDeps): Router {
  const router = Router();
  router.use(requireUser(deps));
  router.patch('/', async (req, res) => {
    const { userId, sessionId } = req.auth!;
    await auth.updateAccount(deps, { userId, sessionId }, parseBody(updateAccountSchema, req));
    res.json(await auth.getCurrentUser(deps, userId));
  });

  router.get('/sessions', async (req, res) => {
    res.json(await listSessions(deps, req.auth!.userId, req.auth!.sessionId));
  });
  router.delete('/sessions/:sessionId', async (req, res) => {
    const { sessionId } = parseParams(sessionParamsSchema, req);
    await signOutSession(deps, req.auth!.userId, sessionId);
    if (sessionId === req.auth!.sessionId) clearSessionCookie(res);
    res.status(204).end();
  });
  router.post('/sessions/sign-out-everywhere', async (req, res) => {
    const { userId, email } = req.auth!;
    await deps.db.transaction(async (tx) => {
      const ended = await endUserSessions(tx, userId, 'signed_out_everywhere');
      await recordAudit(tx, {
        action: 'auth.sessions_revoked',
        actor: { userId, email },
        details: { sessionsEnded: ended },
      });
    });
    clearSessionCookie(res);
    res.status(204).end();
  });

  router.get('/two-step', async (req, res) => {
    res.json(await twoStep.getTwoStepStatus(deps, req.auth!.userId));
  });
  router.post('/two-step/setup', async (req, res) => {
    const { userId, email } = req.auth!;
    res.json(await twoStep.startTwoStepSetup(deps, { userId, email }));
  });
  router.post('/two-step/enable', async (req, res) => {
    const { userId, email, sessionId } = req.auth!;
    const body = parseBody(enableTwoStepSchema, req);
    res.json(await twoStep.enableTwoStep(deps, { userId, email, sessionId }, body));
  });
  router.post('/two-step/disable', async (req, res) => {
    const { userId, email } = req.auth!;
    await twoStep.disableTwoStep(deps, { userId, email }, parseBody(disableTwoStepSchema, req));
    res.status(204).end();
  });
  router.post('/two-step/recovery-codes', async (req, res) => {
    const { userId, email } = req.auth!;
    const body = parseBody(enableTwoStepSchema, req);
    res.json(await twoStep.renewRecoveryCodes(deps, { userId, email }, body));
  });
  return router;
}
