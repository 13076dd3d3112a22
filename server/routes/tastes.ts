/**
 * /api/teams/:teamId/studies/:studyId/tastes — taste profiles of finished runs, segments and
 * one respondent's page. Every role with 'runs:read'; personal columns need 'personal:read'.
 */
import type { Router } from 'express';
import type { AppDeps } from '../deps';
import { createTeamRouter } from './team-router';
import {
  compareTastesQuerySchema,
  listTastesQuerySchema,
  respondentProfileParamsSchema,
  segmentsQuerySchema,
} from '../../shared/schemas/tastes';
import * as tastes from '../services/tastes';

export function createTastesRouter(deps: AppDeps): Router {
  const r = createTeamRouter(deps);
  r.get('/runs', 'runs:read', {
    run: ({ actor, params }) => tastes.listTastesRuns(deps, actor, params.studyId),
  });
  r.get('/', 'runs:read', {
    query: listTastesQuerySchema,
    run: ({ actor, params, query }) => tastes.listTastes(deps, actor, params.studyId, query),
  });
  r.get('/segments', 'runs:read', {
    query: segmentsQuerySchema,
    run: ({ actor, params, query }) => tastes.getSegments(deps, actor, params.studyId, query),
  });
  r.get('/compare', 'runs:read', {
    query: compareTastesQuerySchema,
    run: ({ actor, params, query }) => tastes.compareRuns(deps, actor, params.studyId, query),
  });
  r.get('/runs/:runId/respondents/:respondentId', 'runs:read', {
    params: respondentProfileParamsSchema,
    run: ({ actor, params: p }) =>
      tastes.getRespondentProfile(deps, actor, p.studyId, p.runId, p.respondentId),
  });
  return r.router;
}
