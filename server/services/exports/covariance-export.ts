/** The run's classical or robust covariance matrix of the estimates (user units) as CSV. */
import type { AppDeps } from '../../deps';
import { ConflictError } from '../../lib/errors';
import { loadRunContext } from '../tastes/run-context';
import { writeCsv } from '../../lib/safe-csv';
import { buildCovarianceTable, type CovarianceKind } from './covariance-table';
import { makeDownload, type Download } from './download';
import type { Actor } from '../actor';

export async function exportCovarianceCsv(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  runId: string,
  kind: CovarianceKind,
  at = new Date(),
): Promise<Download> {
  const ctx = await loadRunContext(deps, actor, studyId, runId);
  const table = buildCovarianceTable(ctx.results, kind);
  if (!table)
    throw new ConflictError(
      'covariance_unavailable',
      kind === 'robust' && ctx.results.covariance?.method === 'bhhh'
        ? 'This run used the BHHH covariance, which has no robust (sandwich) form.'
        : 'This run has no stored covariance matrix of this kind; run it again to get one.',
    );
  return makeDownload(
    ctx.study.name,
    `covariance-${kind}`,
    'csv',
    at,
    writeCsv(table.header, table.rows),
  );
}
