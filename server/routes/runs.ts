/**
 * /api/teams/:teamId/studies/:studyId/runs — estimation runs. Everyone in the team may read
 * ('runs:read'); starting and cancelling needs 'runs:manage' (owner, analyst).
 */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../services/study-access';
import {
  createRespondentFilterSchema,
  createRunSchema,
  runParamsSchema,
} from '../../shared/schemas/run';
import * as runs from '../services/runs';

export function createRunsRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const read = requireTeam(deps, 'runs:read');
  const manage = requireTeam(deps, 'runs:manage');

  router.get('/', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    res.json(await runs.listRuns(deps, actorOf(req), studyId));
  });
  router.get('/options', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    res.json(await runs.getRunOptions(deps, actorOf(req), studyId));
  });
  router.post('/', manage, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(createRunSchema, req);
    res.status(201).json(await runs.createRun(deps, actorOf(req), studyId, input));
  });
  router.post('/filters', manage, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(createRespondentFilterSchema, req);
    res.status(201).json(await runs.saveRespondentFilter(deps, actorOf(req), studyId, input));
  });
  router.get('/:runId', read, async (req, res) => {
    const { studyId, runId } = parseParams(runParamsSchema, req);
    res.json(await runs.getRun(deps, actorOf(req), studyId, runId));
  });
  router.get('/:runId/conditional-means', read, async (req, res) => {
    const { studyId, runId } = parseParams(runParamsSchema, req);
    res.json(await runs.getConditionalMeans(deps, actorOf(req), studyId, runId));
  });
  router.post('/:runId/cancel', manage, async (req, res) => {
    const { studyId, runId } = parseParams(runParamsSchema, req);
    res.json(await runs.cancelRun(deps, actorOf(req), studyId, runId));
  });

  return router;
}
