/**
 * createApp builds the Express application without listening, so tests run it in-process.
 * In production it also serves the built client (server/static-client.ts), compressed.
 */
import express from 'express';
import helmet from 'helmet';
import cookieParser from 'cookie-parser';
import compression from 'compression';
import { pinoHttp } from 'pino-http';
import path from 'node:path';
import fs from 'node:fs';
import type { AppDeps } from './deps';
import { projectRoot } from './env';
import { errorHandler, notFoundHandler } from './middleware/error-handler';
import { mountApiRoutes } from './routes/index';
import { serveClient } from './static-client';

export function createApp(deps: AppDeps): express.Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
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
    pinoHttp({
      logger: deps.logger,
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      customLogLevel: (_req, res, err) =>
        err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info',
    }),
  );
  // gzip or brotli, whichever the browser prefers, for pages, scripts, styles and JSON.
  app.use(compression());
  app.use(cookieParser());
  app.use(express.json({ limit: '2mb' }));

  const api = express.Router();
  mountApiRoutes(api, deps);
  api.use(notFoundHandler);
  app.use('/api', api);

  const clientDir = path.join(projectRoot, 'dist/client');
  if (deps.env.NODE_ENV === 'production' && fs.existsSync(clientDir)) serveClient(app, clientDir);
  app.use(errorHandler);
  return app;
}
