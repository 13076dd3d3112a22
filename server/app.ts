/**
 * createApp builds the Express application without listening, so tests run it in-process.
 * In production it also serves the built client (dist/client) with a history fallback.
 */
import express from 'express';
import helmet from 'helmet';
import cookieParser from 'cookie-parser';
import path from 'node:path';
import fs from 'node:fs';
import type { AppDeps } from './deps';
import { projectRoot } from './env';
import { errorHandler, notFoundHandler } from './middleware/error-handler';
import { mountApiRoutes } from './routes/index';
import { createRequestLog } from './lib/request-log';
import { createPatternLookup, listApiRoutes } from './lib/route-table';
import { refuseCrossSiteWrites } from './middleware/same-origin';

export function createApp(deps: AppDeps): express.Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', deps.env.TRUST_PROXY);
  app.use(
    helmet({
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
    }),
  );
  app.use(
    createRequestLog(
      deps.logger,
      createPatternLookup(() => listApiRoutes(app)),
    ),
  );
  app.use(cookieParser());
  app.use('/api', refuseCrossSiteWrites([deps.env.APP_URL, ...deps.env.TRUSTED_ORIGINS]));
  app.use(express.json({ limit: '2mb' }));

  const api = express.Router();
  mountApiRoutes(api, deps);
  api.use(notFoundHandler);
  app.use('/api', api);

  const clientDir = path.join(projectRoot, 'dist/client');
  if (deps.env.NODE_ENV === 'production' && fs.existsSync(clientDir)) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get(/^\/(?!api\/).*/, (_req, res) => {
      res.sendFile(path.join(clientDir, 'index.html'));
    });
  }
  app.use(errorHandler);
  return app;
}
