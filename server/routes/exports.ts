/**
 * /api/teams/:teamId/studies/:studyId/exports — downloads for every role with 'exports:read';
 * the services leave personal columns out unless the role has 'personal:read'. Files are sent
 * as attachments and never cached (they may hold personal data).
 */
import { Router, type Request, type Response } from 'express';
import type { AppDeps } from '../deps';
import { parseParams, parseQuery } from '../middleware/validate';
import { actorOf, memberOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../services/study-access';
import {
  covarianceQuerySchema,
  exportRunQuerySchema,
  optionalRunQuerySchema,
} from '../../shared/schemas/exports';
import * as exportsService from '../services/exports';

async function send(
  deps: AppDeps,
  req: Request,
  res: Response,
  file: exportsService.Download,
  inline = false,
): Promise<void> {
  const { studyId } = parseParams(studyParamsSchema, req);
  await exportsService.auditPersonalDownload(deps, memberOf(req), actorOf(req), studyId, file);
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Cache-Control', 'no-store');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader(
    'Content-Disposition',
    `${inline ? 'inline' : 'attachment'}; filename="${file.filename}"`,
  );
  res.send(file.body);
}

export function createExportsRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const read = requireTeam(deps, 'exports:read');

  router.get('/', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    res.json(await exportsService.getExportManifest(deps, memberOf(req), studyId));
  });
  router.get('/taste-profiles.csv', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { runId } = parseQuery(exportRunQuerySchema, req);
    send(
      deps,
      req,
      res,
      await exportsService.exportProfilesCsv(deps, memberOf(req), studyId, runId),
    );
  });
  router.get('/taste-profiles.xlsx', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { runId } = parseQuery(exportRunQuerySchema, req);
    send(
      deps,
      req,
      res,
      await exportsService.exportProfilesXlsx(deps, memberOf(req), studyId, runId),
    );
  });
  router.get('/covariance.csv', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { runId, kind } = parseQuery(covarianceQuerySchema, req);
    send(
      deps,
      req,
      res,
      await exportsService.exportCovarianceCsv(deps, memberOf(req), studyId, runId, kind),
    );
  });
  router.get('/run-report.html', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { runId } = parseQuery(exportRunQuerySchema, req);
    send(
      deps,
      req,
      res,
      await exportsService.exportRunReport(deps, memberOf(req), studyId, runId),
      true,
    );
  });
  router.get('/choices.csv', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { runId } = parseQuery(optionalRunQuerySchema, req);
    send(
      deps,
      req,
      res,
      await exportsService.exportChoicesCsv(deps, memberOf(req), studyId, runId),
    );
  });
  router.get('/design.csv', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    send(deps, req, res, await exportsService.exportDesign(deps, memberOf(req), studyId));
  });
  router.get('/background-answers.csv', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    send(deps, req, res, await exportsService.exportAnswersCsv(deps, memberOf(req), studyId));
  });
  router.get('/answer-history.csv', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    send(deps, req, res, await exportsService.exportAnswerHistoryCsv(deps, memberOf(req), studyId));
  });
  return router;
}
