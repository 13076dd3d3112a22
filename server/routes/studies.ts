/** /api/teams/:teamId/studies — studies and their definition (attributes, alternatives). */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams, parseQuery } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../services/study-access';
import {
  archiveStudySchema,
  createStudySchema,
  listStudiesQuerySchema,
  updateDefinitionSchema,
  updateStudySchema,
} from '../../shared/schemas/study';
import * as studies from '../services/studies';

export function createStudiesRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const read = requireTeam(deps, 'study:read');
  const write = requireTeam(deps, 'study:write');

  router.get('/', read, async (req, res) => {
    const { archived } = parseQuery(listStudiesQuerySchema, req);
    res.json(await studies.listStudies(deps, actorOf(req).teamId, archived === 'true'));
  });
  router.post('/', write, async (req, res) => {
    const m = actorOf(req);
    res.status(201).json(await studies.createStudy(deps, m, parseBody(createStudySchema, req)));
  });

  router.get('/:studyId', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    res.json(await studies.getStudy(deps, actorOf(req).teamId, studyId));
  });
  router.patch('/:studyId', write, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(updateStudySchema, req);
    res.json(await studies.describeStudy(deps, actorOf(req).teamId, studyId, input));
  });
  router.post('/:studyId/duplicate', write, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    res.status(201).json(await studies.duplicateStudy(deps, actorOf(req), studyId));
  });
  router.put('/:studyId/archived', write, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { archived } = parseBody(archiveStudySchema, req);
    res.json(await studies.setStudyArchived(deps, actorOf(req).teamId, studyId, archived));
  });
  router.put('/:studyId/definition', write, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { definition } = parseBody(updateDefinitionSchema, req);
    res.json(await studies.saveDefinition(deps, actorOf(req).teamId, studyId, definition));
  });

  return router;
}
