/**
 * /api/teams/:teamId/studies/:studyId/shares — the what-if share simulator. Reads: every role
 * with 'runs:read' may load a run's share model, its segments, simulate, and list saved
 * scenarios; saving, renaming and deleting scenarios needs 'scenarios:write'.
 */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams, parseQuery } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../services/study-access';
import {
  shareExportSchema,
  scenarioBodySchema,
  scenarioParamsSchema,
  shareGroupsQuerySchema,
  shareModelQuerySchema,
  simulateSharesSchema,
} from '../../shared/schemas/shares';
import { getShareGroups, getShareModel, simulateStudyShares } from '../services/shares';
import { exportShares } from '../services/shares/share-export';
import { send as sendDownload } from './exports';
import {
  createScenario,
  listScenarios,
  removeScenario,
  updateScenario,
} from '../services/share-scenarios';

export function createSharesRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  router.get('/model', requireTeam(deps, 'runs:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { runId } = parseQuery(shareModelQuerySchema, req);
    res.json(await getShareModel(deps, actorOf(req), studyId, runId));
  });
  router.get('/groups', requireTeam(deps, 'runs:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const query = parseQuery(shareGroupsQuerySchema, req);
    res.json(await getShareGroups(deps, actorOf(req), studyId, query));
  });
  router.post('/simulate', requireTeam(deps, 'runs:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(simulateSharesSchema, req);
    res.json(await simulateStudyShares(deps, actorOf(req), studyId, input));
  });
  // A download built from the scenario in the body (which need not be saved): POST, not GET.
  router.post('/export', requireTeam(deps, 'exports:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(shareExportSchema, req);
    await sendDownload(deps, req, res, await exportShares(deps, actorOf(req), studyId, input));
  });
  router.get('/scenarios', requireTeam(deps, 'runs:read'), async (req, res) => {
    const { teamId, studyId } = parseParams(studyParamsSchema, req);
    res.json(await listScenarios(deps, { teamId, studyId }));
  });
  router.post('/scenarios', requireTeam(deps, 'scenarios:write'), async (req, res) => {
    const { teamId, studyId } = parseParams(studyParamsSchema, req);
    const body = parseBody(scenarioBodySchema, req);
    res
      .status(201)
      .json(await createScenario(deps, { teamId, studyId }, actorOf(req).userId, body));
  });
  router.put('/scenarios/:scenarioId', requireTeam(deps, 'scenarios:write'), async (req, res) => {
    const { teamId, studyId, scenarioId } = parseParams(scenarioParamsSchema, req);
    const body = parseBody(scenarioBodySchema, req);
    res.json(await updateScenario(deps, { teamId, studyId }, scenarioId, body));
  });
  router.delete(
    '/scenarios/:scenarioId',
    requireTeam(deps, 'scenarios:write'),
    async (req, res) => {
      const { teamId, studyId, scenarioId } = parseParams(scenarioParamsSchema, req);
      await removeScenario(deps, { teamId, studyId }, scenarioId);
      res.status(204).end();
    },
  );
  return router;
}
