/** /api/teams/:teamId/studies/:studyId/questionnaire — read (every role) and save (study:write). */
import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../../shared/schemas/study-params';
import { updateQuestionnaireSchema } from '../../shared/schemas/questionnaire';
import * as questionnaire from '../services/questionnaire';

export function createQuestionnaireRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));

  router.get('/', requireTeam(deps, 'study:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    res.json(await questionnaire.getQuestionnaire(deps, actorOf(req).teamId, studyId));
  });
  router.put('/', requireTeam(deps, 'study:write'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(updateQuestionnaireSchema, req);
    res.json(
      await questionnaire.saveQuestionnaire(
        deps,
        actorOf(req).teamId,
        studyId,
        input.questionnaire,
      ),
    );
  });
  return router;
}
