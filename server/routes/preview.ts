/** /api/teams/:teamId/studies/:studyId/preview — the study as a respondent sees it (every role). */
import type { Router } from 'express';
import type { AppDeps } from '../deps';
import { createTeamRouter } from './team-router';
import { getStudyPreview } from '../services/study-preview';
import { studyPreviewQuerySchema } from '../../shared/schemas/respondent';

export function createPreviewRouter(deps: AppDeps): Router {
  const r = createTeamRouter(deps);
  r.get('/', 'study:read', {
    query: studyPreviewQuerySchema,
    run: ({ actor, params, query }) => getStudyPreview(deps, actor.teamId, params.studyId, query),
  });
  return r.router;
}
