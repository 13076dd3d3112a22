/**
 * /api/teams/:teamId/studies/:studyId/lifecycle — readiness, go live, close, reopen, back to
 * draft, fieldwork settings (links, close date, quota, redirects) and versions. Reading needs
 * study:read; every change needs fieldwork:manage (owner, editor).
 */
import { Router, type Request } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../services/study-access';
import { updateFieldworkSettingsSchema } from '../../shared/schemas/study-lifecycle';
import * as lifecycle from '../services/lifecycle';

export function createLifecycleRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const read = requireTeam(deps, 'study:read');
  const manage = requireTeam(deps, 'fieldwork:manage');
  const ids = (req: Request) => ({
    teamId: actorOf(req).teamId,
    studyId: parseParams(studyParamsSchema, req).studyId,
  });

  router.get('/', read, async (req, res) => {
    const { teamId, studyId } = ids(req);
    res.json(await lifecycle.getLifecycle(deps, teamId, studyId));
  });
  router.get('/readiness', read, async (req, res) => {
    const { teamId, studyId } = ids(req);
    res.json(await lifecycle.getReadiness(deps, teamId, studyId));
  });
  router.get('/versions', read, async (req, res) => {
    const { teamId, studyId } = ids(req);
    res.json(await lifecycle.listVersions(deps, teamId, studyId));
  });
  router.post('/go-live', manage, async (req, res) => {
    const { teamId, studyId } = ids(req);
    res.json(await lifecycle.goLive(deps, teamId, studyId, { from: 'draft', actor: actorOf(req) }));
  });
  router.post('/close', manage, async (req, res) => {
    const { teamId, studyId } = ids(req);
    res.json(await lifecycle.closeStudy(deps, teamId, studyId, new Date(), actorOf(req)));
  });
  router.post('/reopen', manage, async (req, res) => {
    const { teamId, studyId } = ids(req);
    res.json(
      await lifecycle.goLive(deps, teamId, studyId, { from: 'closed', actor: actorOf(req) }),
    );
  });
  router.post('/return-to-draft', manage, async (req, res) => {
    const { teamId, studyId } = ids(req);
    res.json(await lifecycle.returnToDraft(deps, teamId, studyId, actorOf(req)));
  });
  router.patch('/settings', manage, async (req, res) => {
    const { teamId, studyId } = ids(req);
    const input = parseBody(updateFieldworkSettingsSchema, req);
    res.json(await lifecycle.updateSettings(deps, teamId, studyId, input));
  });
  return router;
}
