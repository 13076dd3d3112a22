/**
 * /api/teams/:teamId/studies/:studyId/shares — the what-if share simulator. Reads: every role
 * with 'runs:read' may load a run's share model, its segments, simulate, and list saved
 * scenarios; saving, renaming and deleting scenarios needs 'scenarios:write'.
 */
import type { Router } from 'express';
import type { AppDeps } from '../deps';
import { createTeamRouter } from './team-router';
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
  const r = createTeamRouter(deps);
  r.get('/model', 'runs:read', {
    query: shareModelQuerySchema,
    run: ({ actor, params, query }) => getShareModel(deps, actor, params.studyId, query.runId),
  });
  r.get('/groups', 'runs:read', {
    query: shareGroupsQuerySchema,
    run: ({ actor, params, query }) => getShareGroups(deps, actor, params.studyId, query),
  });
  r.post('/simulate', 'runs:read', {
    body: simulateSharesSchema,
    run: ({ actor, params, body }) => simulateStudyShares(deps, actor, params.studyId, body),
  });
  // A download built from the scenario in the body (which need not be saved): POST, not GET.
  r.post('/export', 'exports:read', {
    body: shareExportSchema,
    run: ({ actor, params, body }) => exportShares(deps, actor, params.studyId, body),
    send: (res, file, req) => sendDownload(deps, req, res, file),
  });
  r.get('/scenarios', 'runs:read', {
    run: ({ params: { teamId, studyId } }) => listScenarios(deps, { teamId, studyId }),
  });
  r.post('/scenarios', 'scenarios:write', {
    body: scenarioBodySchema,
    status: 201,
    run: ({ actor, params: { teamId, studyId }, body }) =>
      createScenario(deps, { teamId, studyId }, actor.userId, body),
  });
  r.put('/scenarios/:scenarioId', 'scenarios:write', {
    params: scenarioParamsSchema,
    body: scenarioBodySchema,
    run: ({ params: { teamId, studyId, scenarioId }, body }) =>
      updateScenario(deps, { teamId, studyId }, scenarioId, body),
  });
  r.delete('/scenarios/:scenarioId', 'scenarios:write', {
    params: scenarioParamsSchema,
    status: 204,
    run: ({ params: { teamId, studyId, scenarioId } }) =>
      removeScenario(deps, { teamId, studyId }, scenarioId),
  });
  return r.router;
}
