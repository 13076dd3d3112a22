/**
 * /api/teams/:teamId/studies/:studyId/shares — the what-if share simulator. A read: every role
 * with 'runs:read' may simulate (nothing is stored).
 */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams } from '../middleware/validate';
import { memberOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../services/study-access';
import { simulateSharesSchema } from '../../shared/schemas/shares';
import { simulateStudyShares } from '../services/shares';

export function createSharesRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  router.post('/simulate', requireTeam(deps, 'runs:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(simulateSharesSchema, req);
    res.json(await simulateStudyShares(deps, memberOf(req), studyId, input));
  });
  return router;
}
