/** /api/teams/:teamId/studies — studies and their definition (attributes, alternatives). */
import type { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { createTeamRouter } from './team-router';
import {
  archiveStudySchema,
  createStudySchema,
  listStudiesQuerySchema,
  updateDefinitionSchema,
  updateStudySchema,
} from '../../shared/schemas/study';
import * as studies from '../services/studies';

/** The list and the create route sit above any one study: no study id to parse. */
const noStudyParams = z.object({});

export function createStudiesRouter(deps: AppDeps): Router {
  const r = createTeamRouter(deps);
  r.get('/', 'study:read', {
    params: noStudyParams,
    query: listStudiesQuerySchema,
    run: ({ actor, query }) => studies.listStudies(deps, actor.teamId, query.archived === 'true'),
  });
  r.post('/', 'study:write', {
    params: noStudyParams,
    body: createStudySchema,
    status: 201,
    run: ({ actor, body }) => studies.createStudy(deps, actor, body),
  });
  r.get('/:studyId', 'study:read', {
    run: ({ actor, params }) => studies.getStudy(deps, actor.teamId, params.studyId),
  });
  r.patch('/:studyId', 'study:write', {
    body: updateStudySchema,
    run: ({ actor, params, body }) =>
      studies.describeStudy(deps, actor.teamId, params.studyId, body),
  });
  r.post('/:studyId/duplicate', 'study:write', {
    status: 201,
    run: ({ actor, params }) => studies.duplicateStudy(deps, actor, params.studyId),
  });
  r.put('/:studyId/archived', 'study:write', {
    body: archiveStudySchema,
    run: ({ actor, params, body }) =>
      studies.setStudyArchived(deps, actor.teamId, params.studyId, body.archived),
  });
  r.put('/:studyId/definition', 'study:write', {
    body: updateDefinitionSchema,
    run: ({ actor, params, body }) =>
      studies.saveDefinition(deps, actor.teamId, params.studyId, body.definition),
  });
  return r.router;
}
