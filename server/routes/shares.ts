/**
 * /api/teams/:teamId/studies/:studyId/shares — the what-if share simulator. Reads: every role
 * with 'runs:read' may load a run's share model, its segments and simulate (nothing stored).
 */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams, parseQuery } from '../middleware/validate';
import { memberOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../services/study-access';
import {
  shareGroupsQuerySchema,
  shareModelQuerySchema,
  simulateSharesSchema,
} from '../../shared/schemas/shares';
import { getShareGroups, getShareModel, simulateStudyShares } from '../services/shares';

export function createSharesRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  router.get('/model', requireTeam(deps, 'runs:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { runId } = parseQuery(shareModelQuerySchema, req);
    res.json(await getShareModel(deps, memberOf(req), studyId, runId));
  });
  router.get('/groups', requireTeam(deps, 'runs:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const query = parseQuery(shareGroupsQuerySchema, req);
    res.json(await getShareGroups(deps, memberOf(req), studyId, query));
  });
  router.post('/simulate', requireTeam(deps, 'runs:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(simulateSharesSchema, req);
    res.json(await simulateStudyShares(deps, memberOf(req), studyId, input));
  });
  return router;
}
