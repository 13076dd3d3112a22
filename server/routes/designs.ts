/** /api/teams/:teamId/studies/:studyId/design — the Tasks section (design, jobs, CSV). */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams, parseQuery } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { acceptOneFile, requireFile } from '../middleware/upload';
import { studyParamsSchema } from '../services/study-access';
import { designJobParamsSchema } from '../../shared/schemas/design-job';
import { designSpecSchema } from '../../shared/schemas/design-spec';
import * as designs from '../services/designs';
import * as redesign from '../services/redesign';
import { candidateParamsSchema, runPriorsQuerySchema } from '../../shared/schemas/redesign';

const MAX_CSV_BYTES = 1024 * 1024;

export function createDesignsRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const read = requireTeam(deps, 'study:read');
  const write = requireTeam(deps, 'study:write');

  router.get('/', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    res.json(await designs.getDesignState(deps, actorOf(req).teamId, studyId));
  });
  router.post('/jobs', write, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const spec = parseBody(designSpecSchema, req);
    res.status(202).json(await designs.startDesignJob(deps, actorOf(req), studyId, spec));
  });
  router.get('/jobs/:jobId', read, async (req, res) => {
    const { studyId, jobId } = parseParams(designJobParamsSchema, req);
    res.json(await designs.getDesignJobView(deps, actorOf(req).teamId, studyId, jobId));
  });
  router.post('/jobs/:jobId/cancel', write, async (req, res) => {
    const { studyId, jobId } = parseParams(designJobParamsSchema, req);
    res.json(await designs.cancelDesignJob(deps, actorOf(req).teamId, studyId, jobId));
  });
  router.post('/import', write, acceptOneFile('file', MAX_CSV_BYTES), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const file = requireFile(req, 'file');
    const text = file.buffer.toString('utf8');
    res.status(201).json(await designs.importDesign(deps, actorOf(req), studyId, text));
  });
  router.get('/export.csv', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { filename, csv } = await designs.exportDesign(deps, actorOf(req).teamId, studyId);
    res.type('text/csv; charset=utf-8').attachment(filename).send(csv);
  });
  // Pilot → priors → redesign (services/redesign.ts).
  router.get('/priors-from-run', requireTeam(deps, 'runs:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const query = parseQuery(runPriorsQuerySchema, req);
    res.json(await redesign.getRunPriors(deps, actorOf(req).teamId, studyId, query));
  });
  router.post('/candidates', write, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const spec = parseBody(designSpecSchema, req);
    res.status(202).json(await redesign.startCandidateJob(deps, actorOf(req), studyId, spec));
  });
  router.post('/candidates/:designId/adopt', write, async (req, res) => {
    const { studyId, designId } = parseParams(candidateParamsSchema, req);
    res.json(await redesign.adoptCandidate(deps, actorOf(req), studyId, designId));
  });
  router.delete('/candidates/:designId', write, async (req, res) => {
    const { studyId, designId } = parseParams(candidateParamsSchema, req);
    await redesign.discardCandidate(deps, actorOf(req), studyId, designId);
    res.status(204).end();
  });

  return router;
}
