/** /teams/:teamId/studies/:studyId/fieldwork — aggregate fieldwork figures (every role). */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseParams } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../../shared/schemas/study-params';
import { getFieldworkStats } from '../services/fieldwork-stats';

export function createFieldworkRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  router.get('/', requireTeam(deps, 'responses:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    res.json(await getFieldworkStats(deps, actorOf(req).teamId, studyId));
  });
  return router;
}
