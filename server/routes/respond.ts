/**
 * /api/r/:publicId — the respondent API. No sign-in: the public id names the survey and the
 * session token (header X-Respondent-Token) names the respondent's own session; a token from
 * another session or survey finds nothing (404). Starting sessions is rate-limited per address
 * and per personal link; every session-bound request per session token.
 */
import { Router, type Request, type Response } from 'express';
import type { AppDeps } from '../deps';
import { parseBody } from '../middleware/validate';
import {
  personalLinkStartLimit,
  respondentSessionLimit,
  respondentStartLimit,
} from '../middleware/rate-limits';
import { publicRoute } from '../middleware/access';
import { AppError, NotFoundError } from '../lib/errors';
import {
  publicIdParamsSchema,
  RESPONDENT_TOKEN_HEADER,
  sessionTokenSchema,
  startSessionSchema,
  submitAnswerSchema,
} from '../../shared/schemas/respondent';
import * as sessions from '../services/respondent-session';
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

export function createRespondRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  const startLimits = [respondentStartLimit(deps), personalLinkStartLimit(deps)];
  const perSession = respondentSessionLimit(deps);
  router.use(publicRoute('respondents have no account: link id and session token'));
  router.use((_req, res, next) => {
    // Answers and sessions are personal: never cached by the browser or a proxy.
    res.set('Cache-Control', 'no-store');
    next();
  });

  router.get('/', async (req, res) => {
    const publicId = publicIdOf(req);
    const query = linkQuerySchema.safeParse(req.query);
    res.json(await sessions.getLinkInfo(deps, publicId, query.success ? query.data : {}));
  });
  router.post('/sessions', ...startLimits, async (req, res) => {
    const publicId = publicIdOf(req);
    const input = parseBody(startSessionSchema, req);
    res.status(201).json(await sessions.startSession(deps, publicId, input));
  });
  router.get('/session', perSession, async (req, res) => {
    const publicId = publicIdOf(req);
    res.json(await sessions.getSession(deps, publicId, tokenOf(req)));
  });
  /** An answer or a revision: 201 when stored, 200 when it replays one already stored. */
  const answerRoute =
    (save: typeof submitAnswer | typeof reviseAnswer) => async (req: Request, res: Response) => {
      const publicId = publicIdOf(req);
      const token = tokenOf(req);
      const input = parseBody(submitAnswerSchema, req);
      const receipt = await save(deps, publicId, token, input);
      res.status(receipt.replay ? 200 : 201).json(receipt);
    };
  router.post('/answers', perSession, answerRoute(submitAnswer));
  router.post('/language', perSession, async (req, res) => {
    const publicId = publicIdOf(req);
    const token = tokenOf(req);
    // The session is checked before the body: another session's token is a 404 whatever it sends.
    res.json(await chooseLanguage(deps, publicId, token, req.body));
  });
  router.post('/revisions', perSession, answerRoute(reviseAnswer));
  return router;
}
