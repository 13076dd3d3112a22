/**
 * A respondent's answer (POST /api/r/:publicId/answers and …/revisions) without Express's
 * routing. It is the busiest request of a panel launch, and walking the app's middleware
 * list and the mounted routers to reach it (matching every layer's path, trimming and
 * restoring the URL, merging params at each mount) cost more of the web process's CPU than
 * the answer itself (bench:fieldwork profile). The lane runs exactly the steps the routers
 * would — the same middleware instances, in the same order — as one flat list, and hands any
 * error to the same error handler. A request it does not recognise (another method or path, a
 * trailing slash, another letter case, a malformed escape) goes on through the routers, which
 * answer it as before.
 *
 * `enterAnswersFirst` also lets an answer skip Express's own entry (app.handle: a final
 * handler built per request, settings looked up, the router's walk to this lane's layer): it
 * prepares the request as app.handle does and hands it straight to the lane. The lane stays
 * mounted as the app's first middleware for what the entrance does not take (a query string).
 */
import type { ErrorRequestHandler, Express, Request, RequestHandler, Response } from 'express';

const ANSWER_PATH = /^\/api\/r\/([^/]+)\/(answers|revisions)$/;

export type AnswerLaneSteps = {
  /** The app-wide steps every API request passes first (headers, log, origin, body). */
  common: RequestHandler[];
  /** The respondent router's steps for each route, its handler last. */
  answers: RequestHandler[];
  revisions: RequestHandler[];
};

function publicIdOf(encoded: string): string | null {
  try {
    return decodeURIComponent(encoded);
  } catch {
    return null;
  }
}

export function answerLane(steps: AnswerLaneSteps, onError: ErrorRequestHandler): RequestHandler {
  const chains = {
    answers: [...steps.common, ...steps.answers],
    revisions: [...steps.common, ...steps.revisions],
  };
  return (req, res, next) => {
    if (req.method !== 'POST') return next();
    const match = ANSWER_PATH.exec(req.path);
    const publicId = match ? publicIdOf(match[1]) : null;
    if (!match || publicId === null) return next();
    req.params = { publicId };
    run(chains[match[2] as 'answers' | 'revisions'], req, res, onError);
  };
}

/** Calls each step in turn as Express would: on next(), the following one; on an error, onError. */
function run(
  chain: RequestHandler[],
  req: Request,
  res: Parameters<RequestHandler>[1],
  onError: ErrorRequestHandler,
): void {
  let i = 0;
  const fail = (err: unknown) => {
    // As Express's final handler: a reply already under way can only be cut off.
    if (res.headersSent) req.socket?.destroy();
    else onError(err, req, res, () => {});
  };
  const step = (err?: unknown): void => {
    if (err) return fail(err);
    const handler = chain[i++];
    if (!handler) return;
    try {
      const result: unknown = handler(req, res, step);
      if (result instanceof Promise) result.catch(fail);
    } catch (thrown) {
      fail(thrown);
    }
  };
  step();
}

/** What the entrance takes: an answer's exact path with nothing after it. */
const ANSWER_URL = /^\/api\/r\/[^/?]+\/(?:answers|revisions)$/;

type Handle = (req: Request, res: Response, callback?: (err?: unknown) => void) => void;

export function enterAnswersFirst(app: Express, lane: RequestHandler): void {
  const express = app as unknown as { handle: Handle; request: object; response: object };
  const handle = express.handle.bind(app);
  // createApp disables it before this: no per-request settings lookup.
  const poweredBy = app.enabled('x-powered-by');
  express.handle = (req, res, callback) => {
    if (req.method !== 'POST' || !ANSWER_URL.test(req.url)) return handle(req, res, callback);
    // As app.handle and the router's handle do before the first middleware (Express 5).
    if (poweredBy) res.setHeader('X-Powered-By', 'Express');
    req.res = res;
    res.req = req;
    Object.setPrototypeOf(req, express.request);
    Object.setPrototypeOf(res, express.response);
    if (!res.locals) res.locals = Object.create(null) as Response['locals'];
    req.baseUrl = '';
    req.originalUrl = req.originalUrl || req.url;
    // A path the lane declines after all (a malformed escape) goes the long way.
    lane(req, res, () => handle(req, res, callback));
  };
}
