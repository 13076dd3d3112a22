/**
 * /api/r/:publicId — the respondent API. No sign-in: the public id names the survey and the
 * session token (header X-Respondent-Token) names the respondent's own session; a token from
 * another session or survey finds nothing (404). Starting sessions is rate-limited per address
 * and per personal link; every session-bound request per session token.
 */
import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { AppDeps } from '../deps';
import { parseBody } from '../middleware/validate';
import {
  personalLinkStartLimit,
  respondentSessionLimit,
  respondentStartLimit,
} from '../middleware/rate-limits';
import { publicRoute } from '../middleware/access';
import { AppError, NotFoundError } from '../lib/errors';
import { sendJson, sendJsonText } from '../lib/send-json';
import {
  publicIdParamsSchema,
  RESPONDENT_TOKEN_HEADER,
  sessionTokenSchema,
  startSessionSchema,
  submitAnswerSchema,
} from '../../shared/schemas/respondent';
import * as sessions from '../services/respondent-session';
import { startSession } from '../services/session-start';
import { sessionJson } from '../services/survey-view';
import { submitAnswer } from '../services/answers';
import { reviseAnswer } from '../services/answer-revisions';
import { chooseLanguage } from '../services/choose-language';
import { z } from 'zod';

const linkQuerySchema = z.record(z.string().max(40), z.string().max(200));

function publicIdOf(req: Request): string {
  const parsed = publicIdParamsSchema.safeParse(req.params);
  if (!parsed.success)
    throw new AppError(404, 'survey_not_found', 'This survey link does not exist.');
  return parsed.data.publicId;
}

function tokenOf(req: Request): string {
  const parsed = sessionTokenSchema.safeParse(req.get(RESPONDENT_TOKEN_HEADER));
  if (!parsed.success) throw new NotFoundError('Session');
  return parsed.data;
}

/** Answers and sessions are personal: never cached by the browser or a proxy. */
const noStore: RequestHandler = (_req, res, next) => {
  res.set('Cache-Control', 'no-store');
  next();
};

/** An answer or a revision: 201 when stored, 200 when it replays one already stored. */
const answerRoute =
  (deps: AppDeps, save: typeof submitAnswer | typeof reviseAnswer): RequestHandler =>
  async (req: Request, res: Response) => {
    const publicId = publicIdOf(req);
    const token = tokenOf(req);
    const input = parseBody(submitAnswerSchema, req);
    const receipt = await save(deps, publicId, token, input);
    // A receipt is never cached or revalidated: no ETag to compute (send-json.ts).
    sendJson(res, receipt.replay ? 200 : 201, receipt);
  };

/**
 * The per-session limit and each answer route's steps after the router's own, built once per
 * app: the router below and the answer lane (server/middleware/answer-lane.ts) run the same
 * instances, so a session's requests are counted in one place whichever way they come.
 */
export type RespondentSteps = {
  perSession: RequestHandler;
  answers: RequestHandler[];
  revisions: RequestHandler[];
};

export function createRespondentSteps(deps: AppDeps): RespondentSteps {
  const perSession = respondentSessionLimit(deps);
  return {
    perSession,
    answers: [noStore, perSession, answerRoute(deps, submitAnswer)],
    revisions: [noStore, perSession, answerRoute(deps, reviseAnswer)],
  };
}

export function createRespondRouter(
  deps: AppDeps,
  steps: RespondentSteps = createRespondentSteps(deps),
): Router {
  const router = Router({ mergeParams: true });
  const startLimits = [respondentStartLimit(deps), personalLinkStartLimit(deps)];
  const { perSession } = steps;
  router.use(publicRoute('respondents have no account: link id and session token'));
  router.use(noStore);

  router.get('/', async (req, res) => {
    const publicId = publicIdOf(req);
    const query = linkQuerySchema.safeParse(req.query);
    res.json(await sessions.getLinkInfo(deps, publicId, query.success ? query.data : {}));
  });
  router.post('/sessions', ...startLimits, async (req, res) => {
    const publicId = publicIdOf(req);
    const input = parseBody(startSessionSchema, req);
    // A session is never cached or revalidated (no-store): no ETag to compute (send-json.ts).
    sendJsonText(res, 201, sessionJson(await startSession(deps, publicId, input)));
  });
  router.get('/session', perSession, async (req, res) => {
    const publicId = publicIdOf(req);
    res.json(await sessions.getSession(deps, publicId, tokenOf(req)));
  });
  // noStore has run already (router.use above): the routes take the steps after it.
  router.post('/answers', ...steps.answers.slice(1));
  router.post('/language', perSession, async (req, res) => {
    const publicId = publicIdOf(req);
    const token = tokenOf(req);
    // The session is checked before the body: another session's token is a 404 whatever it sends.
    res.json(await chooseLanguage(deps, publicId, token, req.body));
  });
  router.post('/revisions', ...steps.revisions.slice(1));
  return router;
}
