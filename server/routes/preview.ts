/** /api/teams/:teamId/studies/:studyId/preview — the study as a respondent sees it (every role). */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseParams, parseQuery } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../../shared/schemas/study-params';
import { getStudyPreview } from '../services/study-preview';
import { studyPreviewQuerySchema } from '../../shared/schemas/respondent';

export function createPreviewRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  router.get('/', requireTeam(deps, 'study:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const query = parseQuery(studyPreviewQuerySchema, req);
    res.json(await getStudyPreview(deps, actorOf(req).teamId, studyId, query));
  });
  return router;
}
