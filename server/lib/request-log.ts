/**
 * The access log: one line per request with its method, the route *pattern* that answered it
 * (`/api/unsubscribe/:token`, never the token itself), status and duration. No headers, no query
 * string, no body: those are where link tokens, session cookies and respondent tokens travel.
 */
import type { Request, RequestHandler } from 'express';
import type { IncomingMessage } from 'node:http';
import { pinoHttp, type ReqId } from 'pino-http';
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

/**
 * Successful respondent requests logged: one in this many. A panel launch sends hundreds a
 * second, and a line each (a child logger, redaction, a write to the log file) cost the web
 * process about a tenth of its CPU per answer (bench:fieldwork profile); the sampled lines
 * say `sampledOneIn`, so counts read from the log are multiplied back. Every respondent
 * request that fails (4xx, 5xx, an error) and every other request keeps its line.
 */
export const RESPONDENT_LOG_SAMPLE = 50;

const isRespondentRequest = (req: Request) => (req.originalUrl ?? req.url).startsWith('/api/r/');

type LogLevel = 'info' | 'warn' | 'error';
const levelOf = (status: number, err?: unknown): LogLevel =>
  err || status >= 500 ? 'error' : status >= 400 ? 'warn' : 'info';

export function createRequestLog(logger: Logger, patternOf: RoutePatternOf): RequestHandler {
  let lastId = 0;
  const genReqId = (req: IncomingMessage): ReqId => req.id ?? ++lastId;
  const serializeReq = (raw: Request) => ({
    id: raw.id,
    method: raw.method,
    route: describeRoute(raw, patternOf),
  });
  const full = pinoHttp({
    logger,
    genReqId,
    autoLogging: { ignore: (req) => req.url === '/api/health' },
    customLogLevel: (_req, res, err) => levelOf(res.statusCode, err),
    // Our own serializers replace pino-http's, which would copy every header and the raw URL.
    wrapSerializers: false,
    serializers: {
      req: (req: { raw?: Request } & Request) => serializeReq(req.raw ?? req),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      err: serializeError,
    },
    customSuccessMessage: (req, res) =>
      `${req.method} ${describeRoute(req as Request, patternOf)} ${res.statusCode}`,
    customErrorMessage: (req, res) =>
      `${req.method} ${describeRoute(req as Request, patternOf)} ${res.statusCode}`,
  });
  let respondentSuccesses = 0;
  /**
   * The same line as pino-http's, written only for failures and one success in the sample.
   * Per request it adds one listener, on 'close' (emitted once the reply is sent or the
   * connection is gone, after 'finish'), and no per-request property definition: the child
   * logger a handler may ask for (the error handler) is made on first use by `req.log`.
   */
  const respondentLog: RequestHandler = (req, res, next) => {
    const started = Date.now();
    req.id = genReqId(req);
    req.log = lazyChild(logger, () => ({ req: serializeReq(req) }));
    res.once('close', () => {
      const status = res.statusCode;
      const ok = status < 400;
      if (ok && respondentSuccesses++ % RESPONDENT_LOG_SAMPLE !== 0) return;
      const line = {
        req: serializeReq(req),
        res: { statusCode: status },
        responseTime: Date.now() - started,
        ...(ok ? { sampledOneIn: RESPONDENT_LOG_SAMPLE } : {}),
      };
      logger[levelOf(status)](line, `${req.method} ${line.req.route} ${status}`);
    });
    next();
  };
  return (req, res, next) =>
    isRespondentRequest(req) ? respondentLog(req, res, next) : full(req, res, next);
}

/**
 * A logger whose child (with the request's fields) is made on the first call: most
 * respondent requests never log from a handler, and a child logger costs a serializer pass.
 */
function lazyChild(logger: Logger, bindings: () => Record<string, unknown>): Logger {
  let child: Logger | undefined;
  return new Proxy(logger, {
    get: (_target, prop) => {
      child ??= logger.child(bindings());
      const value: unknown = Reflect.get(child, prop, child);
      return typeof value === 'function'
        ? (value as (...a: unknown[]) => unknown).bind(child)
        : value;
    },
  });
}
