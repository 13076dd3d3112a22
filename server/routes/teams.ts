import { Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import {
  changeRoleSchema,
  createInvitationSchema,
  createTeamSchema,
  invitationParamsSchema,
  memberParamsSchema,
  renameTeamSchema,
} from '../../shared/schemas/team';
import * as teams from '../services/teams';
import * as invitations from '../services/invitations';

export function createTeamsRouter(deps: AppDeps): Router {
  const router = Router();
  router.use(requireUser(deps));

  router.get('/', async (req, res) => {
    res.json(await teams.listMyTeams(deps, req.auth!.userId));
  });
  router.post('/', async (req, res) => {
    res
      .status(201)
      .json(await teams.createTeam(deps, req.auth!.userId, parseBody(createTeamSchema, req).name));
  });

  router.get('/:teamId', requireTeam(deps, 'team:read'), async (req, res) => {
    const m = actorOf(req);
    res.json(await teams.getTeam(deps, m.teamId, m.role));
  });
  router.patch('/:teamId', requireTeam(deps, 'team:manage'), async (req, res) => {
    res.json(
      await teams.renameTeam(deps, actorOf(req).teamId, parseBody(renameTeamSchema, req).name),
    );
  });

  router.get('/:teamId/members', requireTeam(deps, 'team:read'), async (req, res) => {
    res.json(await teams.getMembers(deps, actorOf(req).teamId));
  });
  router.patch('/:teamId/members/:userId', requireTeam(deps, 'team:manage'), async (req, res) => {
    const { userId } = parseParams(memberParamsSchema, req);
    const { role } = parseBody(changeRoleSchema, req);
    res.json(await teams.changeMemberRole(deps, actorOf(req), userId, role));
  });
  router.delete('/:teamId/members/:userId', requireTeam(deps, 'team:manage'), async (req, res) => {
    const { userId } = parseParams(memberParamsSchema, req);
    await teams.removeMember(deps, actorOf(req), userId);
    res.status(204).end();
  });

  router.get('/:teamId/invitations', requireTeam(deps, 'team:manage'), async (req, res) => {
    res.json(await invitations.listInvitations(deps, actorOf(req).teamId));
  });
  router.post('/:teamId/invitations', requireTeam(deps, 'team:manage'), async (req, res) => {
    const input = parseBody(createInvitationSchema, req);
    res.status(201).json(await invitations.inviteTeammate(deps, actorOf(req), input));
  });
  router.delete(
    '/:teamId/invitations/:invitationId',
    requireTeam(deps, 'team:manage'),
    async (req, res) => {
      const { invitationId } = parseParams(invitationParamsSchema, req);
      await invitations.cancelInvitation(deps, actorOf(req), invitationId);
      res.status(204).end();
    },
  );

  return router;
}
