/**
 * Public unsubscribe API (no sign-in): the token of the personal link identifies the invitee.
 * GET only reads, so mail scanners that open links unsubscribe nobody; POST unsubscribes and is
 * also the one-click target of the List-Unsubscribe-Post header (RFC 8058).
 */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseParams } from '../middleware/validate';
import { authRateLimit } from '../middleware/rate-limits';
import { publicRoute } from '../middleware/access';
import { unsubscribeParamsSchema } from '../../shared/schemas/invitees';
import * as invitees from '../services/invitees';

export function createUnsubscribeRouter(deps: AppDeps): Router {
  const router = Router();
  router.use(publicRoute('the personal-link token is the credential (RFC 8058 one-click)'));
  const limited = authRateLimit(deps, 'unsubscribe');
  router.get('/:token', limited, async (req, res) => {
    const { token } = parseParams(unsubscribeParamsSchema, req);
    res.json(await invitees.getUnsubscribeStatus(deps, token));
  });
  router.post('/:token', limited, async (req, res) => {
    const { token } = parseParams(unsubscribeParamsSchema, req);
    res.json(await invitees.unsubscribeInvitee(deps, token));
  });
  return router;
}
