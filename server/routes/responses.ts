/**
 * /teams/:teamId/studies/:studyId/responses — the respondent table with quality flags (every
 * role; personal columns only with personal:read), include/exclude and the speeder threshold
 * (responses:manage).
 */
import type { Router } from 'express';
import type { AppDeps } from '../deps';
import { createTeamRouter } from './team-router';
import {
  excludeFlaggedSchema,
  listResponsesQuerySchema,
  respondentParamsSchema,
  setInclusionSchema,
  updateQualitySettingsSchema,
} from '../../shared/schemas/responses';
import * as responses from '../services/responses';

export function createResponsesRouter(deps: AppDeps): Router {
  const r = createTeamRouter(deps);
  r.get('/', 'responses:read', {
    query: listResponsesQuerySchema,
    run: ({ actor, params, query }) => responses.listResponses(deps, actor, params.studyId, query),
  });
  r.put('/quality-settings', 'responses:manage', {
    body: updateQualitySettingsSchema,
    run: ({ actor, params, body }) =>
      responses.saveQualitySettings(deps, actor.teamId, params.studyId, body),
  });
  r.post('/exclude-flagged', 'responses:manage', {
    body: excludeFlaggedSchema,
    run: ({ actor, params, body }) => responses.excludeFlagged(deps, actor, params.studyId, body),
  });
  r.put('/:respondentId/inclusion', 'responses:manage', {
    params: respondentParamsSchema,
    body: setInclusionSchema,
    run: ({ actor, params, body }) =>
      responses.setInclusion(deps, actor, params.studyId, params.respondentId, body),
  });
  return r.router;
}
