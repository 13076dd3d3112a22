/**
 * /teams/:teamId/studies/:studyId/erasure — erase one respondent on a data-protection request
 * (owners: 'respondents:erase'). Both calls are POSTs so that the address or external id the
 * respondent is found by travels in the body, never in a URL.
 */
import type { Router } from 'express';
import type { AppDeps } from '../deps';
import { createTeamRouter } from './team-router';
import { eraseRespondentSchema, erasureLookupSchema } from '../../shared/schemas/erasure';
import * as erasure from '../services/erasure';

export function createErasureRouter(deps: AppDeps): Router {
  const r = createTeamRouter(deps);
  r.post('/preview', 'respondents:erase', {
    body: erasureLookupSchema,
    run: ({ actor, params, body }) =>
      erasure.previewErasure(deps, actor.teamId, params.studyId, body),
  });
  r.post('/', 'respondents:erase', {
    body: eraseRespondentSchema,
    run: ({ actor, params, body }) => erasure.eraseRespondent(deps, actor, params.studyId, body),
  });
  return r.router;
}
