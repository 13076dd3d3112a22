/** /teams/:teamId/studies/:studyId/fieldwork — aggregate fieldwork figures (every role). */
import type { Router } from 'express';
import type { AppDeps } from '../deps';
import { createTeamRouter } from './team-router';
import { getFieldworkStats } from '../services/fieldwork-stats';

export function createFieldworkRouter(deps: AppDeps): Router {
  const r = createTeamRouter(deps);
  r.get('/', 'responses:read', {
    run: ({ actor, params }) => getFieldworkStats(deps, actor.teamId, params.studyId),
  });
  return r.router;
}
