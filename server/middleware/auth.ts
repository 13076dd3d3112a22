/**
 * The one authorisation layer: requireUser checks the session cookie, requireTeam(permission)
 * checks the caller's role in the team named by :teamId against shared/permissions.ts.
 * Every team-scoped router is mounted behind both.
 */
import type { RequestHandler } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { ForbiddenError, NotFoundError, UnauthenticatedError } from '../lib/errors';
import { SESSION_COOKIE } from '../lib/session';
import { resumeSession } from '../services/sessions';
import { getMembership } from '../../db/queries/memberships';
import { roleCan, type Permission } from '../../shared/permissions';
import { declareAccess } from './access';
import type { Actor } from '../services/actor';

export function requireUser(deps: AppDeps): RequestHandler {
  return declareAccess(
    async (req, _res, next) => {
      const token = req.cookies?.[SESSION_COOKIE];
      const open = typeof token === 'string' ? await resumeSession(deps, token) : null;
      if (!open) return next(new UnauthenticatedError());
      const { user, sessionId } = open;
      req.auth = { userId: user.id, email: user.email, name: user.name, sessionId };
      next();
    },
    { kind: 'user' },
  );
}

const teamParams = z.object({ teamId: z.uuid('Unknown team') });

/** Loads the membership for :teamId (404 when the caller is not a member) and checks the permission. */
export function requireTeam(deps: AppDeps, permission: Permission): RequestHandler {
  return declareAccess(
    async (req, _res, next) => {
      if (!req.auth) return next(new UnauthenticatedError());
      const parsed = teamParams.safeParse(req.params);
      if (!parsed.success) return next(new NotFoundError('Team'));
      const m = await getMembership(deps.db, {
        teamId: parsed.data.teamId,
        userId: req.auth.userId,
      });
      if (!m) return next(new NotFoundError('Team'));
      req.member = { teamId: m.teamId, role: m.role };
      if (!roleCan(m.role, permission)) return next(new ForbiddenError());
      next();
    },
    { kind: 'team', permission },
  );
}

/** The caller of a team route (behind requireTeam): who they are and their role in the team. */
export function actorOf(req: Express.Request): Actor {
  if (!req.member || !req.auth) throw new UnauthenticatedError();
  const { userId, email, name } = req.auth;
  return { userId, email, name, ...req.member };
}
