/** /api/teams/:teamId/studies/:studyId/design — the Tasks section (design, jobs, CSV). */
import type { Router } from 'express';
import type { AppDeps } from '../deps';
import { createTeamRouter } from './team-router';
import { acceptOneFile, requireFile } from '../middleware/upload';
import { decodeText } from '../../shared/text/decode-text';
import { designJobParamsSchema } from '../../shared/schemas/design-job';
import { designSpecSchema } from '../../shared/schemas/design-spec';
import * as designs from '../services/designs';
import * as redesign from '../services/redesign';
import { candidateParamsSchema, runPriorsQuerySchema } from '../../shared/schemas/redesign';

const MAX_CSV_BYTES = 1024 * 1024;

export function createDesignsRouter(deps: AppDeps): Router {
  const r = createTeamRouter(deps);
  r.get('/', 'study:read', {
    run: ({ actor, params }) => designs.getDesignState(deps, actor.teamId, params.studyId),
  });
  r.post('/jobs', 'study:write', {
    body: designSpecSchema,
    status: 202,
    run: ({ actor, params, body }) => designs.startDesignJob(deps, actor, params.studyId, body),
  });
  r.get('/jobs/:jobId', 'study:read', {
    params: designJobParamsSchema,
    run: ({ actor, params: p }) => designs.getDesignJobView(deps, actor.teamId, p.studyId, p.jobId),
  });
  r.post('/jobs/:jobId/cancel', 'study:write', {
    params: designJobParamsSchema,
    run: ({ actor, params: p }) => designs.cancelDesignJob(deps, actor.teamId, p.studyId, p.jobId),
  });
  r.post('/import', 'study:write', {
    use: [acceptOneFile('file', MAX_CSV_BYTES)],
    status: 201,
    run: ({ actor, params, req }) => {
      const text = decodeText(requireFile(req, 'file').buffer);
      return designs.importDesign(deps, actor, params.studyId, text);
    },
  });
  r.get('/export.csv', 'study:read', {
    run: ({ actor, params }) => designs.exportDesign(deps, actor.teamId, params.studyId),
    send: (res, { filename, csv }) => {
      res.type('text/csv; charset=utf-8').attachment(filename).send(csv);
    },
  });
  // Pilot → priors → redesign (services/redesign.ts).
  r.get('/priors-from-run', 'runs:read', {
    query: runPriorsQuerySchema,
    run: ({ actor, params, query }) =>
      redesign.getRunPriors(deps, actor.teamId, params.studyId, query),
  });
  r.post('/candidates', 'study:write', {
    body: designSpecSchema,
    status: 202,
    run: ({ actor, params, body }) => redesign.startCandidateJob(deps, actor, params.studyId, body),
  });
  r.post('/candidates/:designId/adopt', 'study:write', {
    params: candidateParamsSchema,
    run: ({ actor, params: p }) => redesign.adoptCandidate(deps, actor, p.studyId, p.designId),
  });
  r.delete('/candidates/:designId', 'study:write', {
    params: candidateParamsSchema,
    status: 204,
    run: ({ actor, params: p }) => redesign.discardCandidate(deps, actor, p.studyId, p.designId),
  });
  return r.router;
}
