/**
 * The access log: one line per request with its method, the route *pattern* that answered it
 * (`/api/unsubscribe/:token`, never the token itself), status and duration. No headers, no query
 * string, no body: those are where link tokens, session cookies and respondent tokens travel.
 */
import type { Request } from 'express';
import { pinoHttp } from 'pino-http';
import type { Logger } from './logger';
import { serializeError } from './log-error';

/** Filled by createApp once the routers are mounted: method + path → route pattern. */
export type RoutePatternOf = (method: string, path: string) => string | null;

/** A path outside the API (client pages, assets) reduced to its first segment. */
function coarsePath(path: string): string {
  const [first, ...rest] = path.split('/').filter(Boolean);
  if (!first) return '/';
  return `/${first}${rest.length > 0 ? '/…' : ''}`;
}

/** Each request's route, once: the log line asks for it twice (its fields and its message). */
const routeOfRequest = new WeakMap<object, string>();

export function describeRoute(req: Request, patternOf: RoutePatternOf): string {
  const known = routeOfRequest.get(req);
  if (known !== undefined) return known;
  const path = (req.originalUrl ?? req.url).split('?')[0] ?? '/';
  const route =
    path === '/api' || path.startsWith('/api/')
      ? (patternOf(req.method, path) ?? '/api (no such route)')
      : coarsePath(path);
  routeOfRequest.set(req, route);
  return route;
}

export function createRequestLog(logger: Logger, patternOf: RoutePatternOf) {
  return pinoHttp({
    logger,
    autoLogging: { ignore: (req) => req.url === '/api/health' },
    customLogLevel: (_req, res, err) =>
      err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info',
    // Our own serializers replace pino-http's, which would copy every header and the raw URL.
    wrapSerializers: false,
    serializers: {
      req: (req: { raw?: Request } & Request) => {
        const raw = req.raw ?? req;
        return { id: raw.id, method: raw.method, route: describeRoute(raw, patternOf) };
      },
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      err: serializeError,
    },
    customSuccessMessage: (req, res) =>
      `${req.method} ${describeRoute(req as Request, patternOf)} ${res.statusCode}`,
    customErrorMessage: (req, res) =>
      `${req.method} ${describeRoute(req as Request, patternOf)} ${res.statusCode}`,
  });
}
