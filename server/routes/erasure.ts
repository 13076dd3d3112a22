/**
 * /teams/:teamId/studies/:studyId/erasure — erase one respondent on a data-protection request
 * (owners: 'respondents:erase'). Both calls are POSTs so that the address or external id the
 * respondent is found by travels in the body, never in a URL.
 */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../services/study-access';
import { eraseRespondentSchema, erasureLookupSchema } from '../../shared/schemas/erasure';
import * as erasure from '../services/erasure';

export function createErasureRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const erase = requireTeam(deps, 'respondents:erase');

  router.post('/preview', erase, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const lookup = parseBody(erasureLookupSchema, req);
    res.json(await erasure.previewErasure(deps, actorOf(req).teamId, studyId, lookup));
  });

  router.post('/', erase, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(eraseRespondentSchema, req);
    res.json(await erasure.eraseRespondent(deps, actorOf(req), studyId, input));
  });

  return router;
}
