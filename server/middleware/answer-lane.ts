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
 */
import type { ErrorRequestHandler, Request, RequestHandler } from 'express';

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
