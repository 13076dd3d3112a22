/**
 * Who may call a route, declared where the route is registered. requireUser and requireTeam
 * (server/middleware/auth.ts) carry their own declaration; routes open to anyone say so with
 * `publicRoute(why)`. The route table (server/lib/route-table.ts) reads these declarations, and
 * the generated access matrix (tests/server/route-matrix.test.ts) fails for a route without one.
 */
import type { RequestHandler } from 'express';
import type { Permission } from '../../shared/permissions';

export type RouteAccess =
  { kind: 'public'; why: string } | { kind: 'user' } | { kind: 'team'; permission: Permission };

const ACCESS = Symbol.for('choicewright.route-access');

type Tagged = { [ACCESS]?: RouteAccess };

/** Attaches an access declaration to a middleware (returns the same function). */
export function declareAccess<T extends RequestHandler>(handler: T, access: RouteAccess): T {
  (handler as T & Tagged)[ACCESS] = access;
  return handler;
}

export function accessOf(handler: unknown): RouteAccess | undefined {
  return typeof handler === 'function' ? (handler as Tagged)[ACCESS] : undefined;
}

/** Marks a route (or, with router.use, a whole router) as open to anonymous callers. */
export function publicRoute(why: string): RequestHandler {
  return declareAccess((_req, _res, next) => next(), { kind: 'public', why });
}
