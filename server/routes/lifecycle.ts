/**
 * /api/teams/:teamId/studies/:studyId/lifecycle — readiness, go live, close, reopen, back to
 * draft, fieldwork settings (links, close date, quota, redirects) and versions. Reading needs
 * study:read; every change needs fieldwork:manage (owner, editor).
 */
import type { Router } from 'express';
import type { AppDeps } from '../deps';
import { createTeamRouter } from './team-router';
import { updateFieldworkSettingsSchema } from '../../shared/schemas/study-lifecycle';
import * as lifecycle from '../services/lifecycle';

export function createLifecycleRouter(deps: AppDeps): Router {
  const r = createTeamRouter(deps);
  r.get('/', 'study:read', {
    run: ({ actor, params }) => lifecycle.getLifecycle(deps, actor.teamId, params.studyId),
  });
  r.get('/readiness', 'study:read', {
    run: ({ actor, params }) => lifecycle.getReadiness(deps, actor.teamId, params.studyId),
  });
  r.get('/versions', 'study:read', {
    run: ({ actor, params }) => lifecycle.listVersions(deps, actor.teamId, params.studyId),
  });
  r.post('/go-live', 'fieldwork:manage', {
    run: ({ actor, params }) =>
      lifecycle.goLive(deps, actor.teamId, params.studyId, { from: 'draft', actor }),
  });
  r.post('/close', 'fieldwork:manage', {
    run: ({ actor, params }) =>
      lifecycle.closeStudy(deps, actor.teamId, params.studyId, new Date(), actor),
  });
  r.post('/reopen', 'fieldwork:manage', {
    run: ({ actor, params }) =>
      lifecycle.goLive(deps, actor.teamId, params.studyId, { from: 'closed', actor }),
  });
  r.post('/return-to-draft', 'fieldwork:manage', {
    run: ({ actor, params }) => lifecycle.returnToDraft(deps, actor.teamId, params.studyId, actor),
  });
  r.patch('/settings', 'fieldwork:manage', {
    body: updateFieldworkSettingsSchema,
    run: ({ actor, params, body }) =>
      lifecycle.updateSettings(deps, actor.teamId, params.studyId, body),
  });
  return r.router;
}
