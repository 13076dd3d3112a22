/**
 * createApp builds the Express application without listening, so tests run it in-process.
 * In production it also serves the built client (server/static-client.ts), compressed.
 */
import express from 'express';
import helmet from 'helmet';
import cookieParser from 'cookie-parser';
import compression from 'compression';
import path from 'node:path';
import fs from 'node:fs';
import type { AppDeps } from './deps';
import { projectRoot } from './env';
import { errorHandler, notFoundHandler } from './middleware/error-handler';
import { mountApiRoutes } from './routes/index';
import { createRequestLog } from './lib/request-log';
import { createPatternLookup, listApiRoutes } from './lib/route-table';
import { refuseCrossSiteWrites } from './middleware/same-origin';
import { serveClient } from './static-client';
import { answerLane, enterAnswersFirst } from './middleware/answer-lane';
import { createRespondentSteps } from './routes/respond';
import { createRespondentJson } from './middleware/respondent-json';

/** The largest answer is a 2,000-character text (under 12 kB as JSON, even fully escaped). */
export const RESPONDENT_BODY_LIMIT = 32 * 1024;

/** Respondent replies smaller than TCP's initial window (10 × 1,460 bytes, RFC 6928) go plain. */
export const RESPONDENT_COMPRESSION_THRESHOLD = 10 * 1460;

/** POST /api/r/:publicId/answers or …/revisions: a respondent's answer. */
const ANSWER_PATH = /^\/api\/r\/[^/]+\/(answers|revisions)$/;
const isAnswerPost = (req: express.Request) => req.method === 'POST' && ANSWER_PATH.test(req.path);

export function createApp(deps: AppDeps): express.Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', deps.env.TRUST_PROXY);
  const securityHeaders = helmet({
    contentSecurityPolicy: {
      useDefaults: true,
      directives: {
        'default-src': ["'self'"],
        'script-src': ["'self'"],
        // React sets inline style attributes (progress bars, chart sizing).
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        'frame-ancestors': ["'self'"],
        'upgrade-insecure-requests': null,
      },
    },
    crossOriginEmbedderPolicy: false,
  });
  const requestLog = createRequestLog(
    deps.logger,
    createPatternLookup(() => listApiRoutes(app)),
  );
  const cookies = cookieParser();
  const sameOrigin = refuseCrossSiteWrites([deps.env.APP_URL, ...deps.env.TRUSTED_ORIGINS]);
  // Respondents send small bodies (an answer, link parameters): anything larger is refused
  // (413) before it is parsed. Researchers' routes take larger ones (questionnaires, designs).
  const respondentJson = createRespondentJson(RESPONDENT_BODY_LIMIT);
  const respondent = createRespondentSteps(deps);
  // An answer skips the routing below but passes the same steps (answer-lane.ts); compression
  // is not among them (see below). Of the cookies only the origin check reads one, and only
  // from a request that sends any: a phone without cookies is spared the parser's objects.
  const cookiesIfSent: express.RequestHandler = (req, res, next) =>
    req.headers.cookie === undefined ? next() : cookies(req, res, next);
  const lane = answerLane(
    {
      common: [securityHeaders, requestLog, cookiesIfSent, sameOrigin, respondentJson],
      ...respondent,
    },
    errorHandler,
  );
  enterAnswersFirst(app, lane);
  app.use(lane);
  app.use(securityHeaders);
  app.use(requestLog);
  // gzip or brotli, whichever the browser prefers, for pages, scripts, styles and JSON — but
  // not around a respondent's answer: its reply is a receipt far below compression's 1 kB
  // threshold, and wrapping the response for it costs CPU on the busiest route of a launch.
  // Other respondent replies (a session: the whole questionnaire) are compressed only when
  // they do not fit in TCP's initial window of ten segments (RFC 6928, about 14.6 kB): a reply
  // that fits arrives in one round trip either way, and compressing it cost the web process
  // about 1 ms of CPU per session start under a panel launch (bench:fieldwork profile).
  const compress = compression();
  const compressRespondent = compression({ threshold: RESPONDENT_COMPRESSION_THRESHOLD });
  app.use((req, res, next) =>
    isAnswerPost(req)
      ? next()
      : req.path.startsWith('/api/r/')
        ? compressRespondent(req, res, next)
        : compress(req, res, next),
  );
  app.use(cookies);
  app.use('/api', sameOrigin);
  app.use('/api/r', respondentJson);
  app.use(express.json({ limit: '2mb' }));

  const api = express.Router();
  mountApiRoutes(api, deps, respondent);
  api.use(notFoundHandler);
  app.use('/api', api);

  const clientDir = path.join(projectRoot, 'dist/client');
  if (deps.env.NODE_ENV === 'production' && fs.existsSync(clientDir)) serveClient(app, clientDir);
  app.use(errorHandler);
  return app;
}
