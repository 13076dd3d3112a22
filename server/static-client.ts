/**
 * Serving the built client (dist/client) in production. Hashed files under /assets never
 * change, so browsers keep them for a year without asking again; the HTML pages are always
 * revalidated so a new build reaches everyone. Respondent links (/s/:publicId) get their own
 * lean page (respond.html); every other path gets the researcher app (index.html).
 */
import express, { type Express, type Response } from 'express';
import path from 'node:path';
import fs from 'node:fs';

const YEAR_SECONDS = 365 * 24 * 3600;

function sendPage(res: Response, file: string): void {
  res.set('Cache-Control', 'no-cache');
  res.sendFile(file);
}

export function serveClient(app: Express, clientDir: string): void {
  const respondPage = path.join(clientDir, 'respond.html');
  const mainPage = path.join(clientDir, 'index.html');
  const hasRespondPage = fs.existsSync(respondPage);
  app.use(
    '/assets',
    express.static(path.join(clientDir, 'assets'), {
      index: false,
      fallthrough: false,
      immutable: true,
      maxAge: YEAR_SECONDS * 1000,
    }),
  );
  app.use(
    express.static(clientDir, {
      index: false,
      maxAge: '1h',
      // The pages themselves are answered below, with revalidation.
      setHeaders: (res, file) => {
        if (file.endsWith('.html')) res.set('Cache-Control', 'no-cache');
      },
    }),
  );
  app.get(/^\/s\/[^/]+\/?$/, (_req, res) => sendPage(res, hasRespondPage ? respondPage : mainPage));
  app.get(/^\/(?!api\/).*/, (_req, res) => sendPage(res, mainPage));
}
