/**
 * /teams/:teamId/studies/:studyId/responses — the respondent table with quality flags (every
 * role; personal columns only with personal:read), include/exclude and the speeder threshold
 * (responses:manage).
 */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams, parseQuery } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../services/study-access';
import {
  excludeFlaggedSchema,
  listResponsesQuerySchema,
  respondentParamsSchema,
  setInclusionSchema,
  updateQualitySettingsSchema,
} from '../../shared/schemas/responses';
import * as responses from '../services/responses';

export function createResponsesRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const read = requireTeam(deps, 'responses:read');
  const manage = requireTeam(deps, 'responses:manage');

  router.get('/', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const q = parseQuery(listResponsesQuerySchema, req);
    res.json(await responses.listResponses(deps, actorOf(req), studyId, q));
  });

  router.put('/quality-settings', manage, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(updateQualitySettingsSchema, req);
    res.json(await responses.saveQualitySettings(deps, actorOf(req).teamId, studyId, input));
  });

  router.post('/exclude-flagged', manage, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(excludeFlaggedSchema, req);
    res.json(await responses.excludeFlagged(deps, actorOf(req), studyId, input));
  });

  router.put('/:respondentId/inclusion', manage, async (req, res) => {
    const { studyId, respondentId } = parseParams(respondentParamsSchema, req);
    const input = parseBody(setInclusionSchema, req);
    res.json(await responses.setInclusion(deps, actorOf(req), studyId, respondentId, input));
  });

  return router;
}
