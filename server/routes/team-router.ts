/**
 * A team-scoped router declared route by route: permission, the zod schemas of the request
 * parts and the service call. Every route goes through the same steps (requireUser, then
 * requireTeam(permission), then any extra middleware; params, query and body parsed in that
 * order; the result sent as JSON with the route's status), so those steps are written once here
 * instead of in each handler.
 */
import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { z } from 'zod';
import type { AppDeps } from '../deps';
import { parseBody, parseParams, parseQuery } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../../shared/schemas/study-params';
import type { Actor } from '../services/actor';
import type { Permission } from '../../shared/permissions';

type StudyParams = z.infer<typeof studyParamsSchema>;

export interface TeamRequest<P, Q, B> {
  actor: Actor;
  params: P;
  query: Q;
  body: B;
  req: Request;
}

export interface TeamRouteSpec<P, Q, B, R> {
  /** Path parameters; the study's (teamId, studyId) unless given. */
  params?: z.ZodType<P>;
  query?: z.ZodType<Q>;
  body?: z.ZodType<B>;
  /** 200 unless given; 204 sends no body. */
  status?: 200 | 201 | 202 | 204;
  /** Middleware run after the permission check (an upload, say). */
  use?: RequestHandler[];
  run: (r: TeamRequest<P, Q, B>) => Promise<R>;
  /** Sends the result itself (a download) instead of as JSON. */
  send?: (res: Response, result: R, req: Request) => Promise<void> | void;
}

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
type AddRoute = <P = StudyParams, Q = undefined, B = undefined, R = unknown>(
  path: string,
  permission: Permission,
  spec: TeamRouteSpec<P, Q, B, R>,
) => void;

export type TeamRouter = { [M in Method]: AddRoute } & { router: Router };

export function createTeamRouter(deps: AppDeps): TeamRouter {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const add =
    (method: Method): AddRoute =>
    (path, permission, spec) => {
      const handle: RequestHandler = async (req, res) => {
        const params = parseParams(spec.params ?? studyParamsSchema, req) as never;
        const query = (spec.query ? parseQuery(spec.query, req) : undefined) as never;
        const body = (spec.body ? parseBody(spec.body, req) : undefined) as never;
        const result = await spec.run({ actor: actorOf(req), params, query, body, req });
        if (spec.send) await spec.send(res, result, req);
        else if (spec.status === 204) res.status(204).end();
        else res.status(spec.status ?? 200).json(result);
      };
      router[method](path, requireTeam(deps, permission), ...(spec.use ?? []), handle);
    };
  return {
    router,
    get: add('get'),
    post: add('post'),
    put: add('put'),
    patch: add('patch'),
    delete: add('delete'),
  };
}
