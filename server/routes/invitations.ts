/** Public look-up of an invitation by its token, and acceptance by the signed-in invitee. */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseParams } from '../middleware/validate';
import { requireUser } from '../middleware/auth';
import { publicRoute } from '../middleware/access';
import { authRateLimit } from '../middleware/rate-limits';
import { invitationTokenParamsSchema } from '../../shared/schemas/team';
import * as invitations from '../services/invitations';

export function createInvitationsRouter(deps: AppDeps): Router {
  const router = Router();
  const limited = authRateLimit(deps, 'invitations');
  router.get(
    '/:token',
    publicRoute('the invitation token is the credential'),
    limited,
    async (req, res) => {
      res.json(
        await invitations.previewInvitation(
          deps,
          parseParams(invitationTokenParamsSchema, req).token,
        ),
      );
    },
  );
  router.post('/:token/accept', limited, requireUser(deps), async (req, res) => {
    const { token } = parseParams(invitationTokenParamsSchema, req);
    res.json(
      await invitations.acceptInvitation(
        deps,
        { userId: req.auth!.userId, email: req.auth!.email },
        token,
      ),
    );
  });
  return router;
}
