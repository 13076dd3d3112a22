/**
 * /api/teams/:teamId/studies/:studyId/tastes — taste profiles of finished runs, segments and
 * one respondent's page. Every role with 'runs:read'; personal columns need 'personal:read'.
 */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseParams, parseQuery } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../services/study-access';
import {
  compareTastesQuerySchema,
  listTastesQuerySchema,
  respondentProfileParamsSchema,
  segmentsQuerySchema,
} from '../../shared/schemas/tastes';
import * as tastes from '../services/tastes';

export function createTastesRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const read = requireTeam(deps, 'runs:read');

  router.get('/runs', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    res.json(await tastes.listTastesRuns(deps, actorOf(req), studyId));
  });
  router.get('/', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const query = parseQuery(listTastesQuerySchema, req);
    res.json(await tastes.listTastes(deps, actorOf(req), studyId, query));
  });
  router.get('/segments', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const query = parseQuery(segmentsQuerySchema, req);
    res.json(await tastes.getSegments(deps, actorOf(req), studyId, query));
  });
  router.get('/compare', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const query = parseQuery(compareTastesQuerySchema, req);
    res.json(await tastes.compareRuns(deps, actorOf(req), studyId, query));
  });
  router.get('/runs/:runId/respondents/:respondentId', read, async (req, res) => {
    const p = parseParams(respondentProfileParamsSchema, req);
    res.json(
      await tastes.getRespondentProfile(deps, actorOf(req), p.studyId, p.runId, p.respondentId),
    );
  });
  return router;
}
