/**
 * /api/teams/:teamId/studies/:studyId/runs — estimation runs. Everyone in the team may read
 * ('runs:read'); starting and cancelling needs 'runs:manage' (owner, analyst).
 */
import type { Router } from 'express';
import type { AppDeps } from '../deps';
import { createTeamRouter } from './team-router';
import {
  createRespondentFilterSchema,
  createRunSchema,
  runParamsSchema,
} from '../../shared/schemas/run';
import * as runs from '../services/runs';

export function createRunsRouter(deps: AppDeps): Router {
  const r = createTeamRouter(deps);
  r.get('/', 'runs:read', {
    run: ({ actor, params }) => runs.listRuns(deps, actor, params.studyId),
  });
  r.get('/options', 'runs:read', {
    run: ({ actor, params }) => runs.getRunOptions(deps, actor, params.studyId),
  });
  r.post('/', 'runs:manage', {
    body: createRunSchema,
    status: 201,
    run: ({ actor, params, body }) => runs.createRun(deps, actor, params.studyId, body),
  });
  r.post('/filters', 'runs:manage', {
    body: createRespondentFilterSchema,
    status: 201,
    run: ({ actor, params, body }) => runs.saveRespondentFilter(deps, actor, params.studyId, body),
  });
  r.get('/:runId', 'runs:read', {
    params: runParamsSchema,
    run: ({ actor, params }) => runs.getRun(deps, actor, params.studyId, params.runId),
  });
  r.get('/:runId/conditional-means', 'runs:read', {
    params: runParamsSchema,
    run: ({ actor, params }) => runs.getConditionalMeans(deps, actor, params.studyId, params.runId),
  });
  r.post('/:runId/cancel', 'runs:manage', {
    params: runParamsSchema,
    run: ({ actor, params }) => runs.cancelRun(deps, actor, params.studyId, params.runId),
  });
  return r.router;
}
