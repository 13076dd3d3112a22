/**
 * /api/teams/:teamId/studies/:studyId/exports — downloads for every role with 'exports:read';
 * the services leave personal columns out unless the role has 'personal:read'. Files are sent
 * as attachments and never cached (they may hold personal data).
 */
import { Router, type Request, type Response } from 'express';
import type { AppDeps } from '../deps';
import { parseParams, parseQuery } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../../shared/schemas/study-params';
import {
  covarianceQuerySchema,
  estimateTableQuerySchema,
  exportRunQuerySchema,
  optionalRunQuerySchema,
} from '../../shared/schemas/exports';
import { sendFile } from './send-download';
import type { Download, RunExporter, StudyExporter } from '../services/exports/download';
import { auditPersonalDownload } from '../services/exports/audit-download';
import { getExportManifest } from '../services/exports/manifest';
import {
  exportProfilesCsv,
  exportProfilesXlsx,
  exportRunReport,
} from '../services/exports/profiles-export';
import { exportCovarianceCsv } from '../services/exports/covariance-export';
import { exportChoicesCsv } from '../services/exports/choices-export';
import { exportDesign } from '../services/exports/design-export';
import { exportAnswerHistoryCsv, exportAnswersCsv } from '../services/exports/respondent-exports';
import { exportRandomisationCsv } from '../services/exports/randomisation-export';
import {
  exportStudyCodebookCsv,
  exportWideCsv,
  exportWideRScript,
} from '../services/exports/wide-export';
import {
  exportEstimateTableCsv,
  exportEstimateTablesXlsx,
} from '../services/exports/estimate-tables-export';

export async function send(
  deps: AppDeps,
  req: Request,
  res: Response,
  file: Download,
  inline = false,
): Promise<void> {
  const { studyId } = parseParams(studyParamsSchema, req);
  await auditPersonalDownload(deps, actorOf(req), studyId, file);
  sendFile(res, file, inline);
}

export function createExportsRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const read = requireTeam(deps, 'exports:read');

  /** A download of one finished run (?runId=). */
  const runFile = (path: string, make: RunExporter, inline = false) =>
    router.get(path, read, async (req, res) => {
      const { studyId } = parseParams(studyParamsSchema, req);
      const { runId } = parseQuery(exportRunQuerySchema, req);
      send(deps, req, res, await make(deps, actorOf(req), studyId, runId), inline);
    });
  /** A download of the study's data. */
  const studyFile = (path: string, make: StudyExporter) =>
    router.get(path, read, async (req, res) => {
      const { studyId } = parseParams(studyParamsSchema, req);
      send(deps, req, res, await make(deps, actorOf(req), studyId));
    });

  router.get('/', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    res.json(await getExportManifest(deps, actorOf(req), studyId));
  });
  runFile('/taste-profiles.csv', exportProfilesCsv);
  runFile('/taste-profiles.xlsx', exportProfilesXlsx);
  runFile('/estimates.xlsx', exportEstimateTablesXlsx);
  runFile('/run-report.html', exportRunReport, true);
  router.get('/estimates.csv', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { runId, table } = parseQuery(estimateTableQuerySchema, req);
    send(deps, req, res, await exportEstimateTableCsv(deps, actorOf(req), studyId, runId, table));
  });
  router.get('/covariance.csv', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { runId, kind } = parseQuery(covarianceQuerySchema, req);
    send(deps, req, res, await exportCovarianceCsv(deps, actorOf(req), studyId, runId, kind));
  });
  router.get('/choices.csv', read, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { runId } = parseQuery(optionalRunQuerySchema, req);
    send(deps, req, res, await exportChoicesCsv(deps, actorOf(req), studyId, runId));
  });
  studyFile('/design.csv', exportDesign);
  studyFile('/background-answers.csv', exportAnswersCsv);
  studyFile('/randomisation.csv', exportRandomisationCsv);
  studyFile('/answer-history.csv', exportAnswerHistoryCsv);
  studyFile('/respondents-wide.csv', exportWideCsv);
  studyFile('/respondents-wide.R', exportWideRScript);
  studyFile('/codebook.csv', exportStudyCodebookCsv);
  return router;
}
