/**
 * The estimates' covariance matrix of a run as a table: a header row with the parameter names
 * and one row per parameter (empty where a value is unknown, e.g. a parameter on a flat
 * direction of the Hessian). Written as CSV for download and as XLSX sheets.
 */
import type { RunResult } from '../../../shared/schemas/run';

export type CovarianceKind = 'classical' | 'robust';

export function buildCovarianceTable(
  results: RunResult,
  kind: CovarianceKind,
): { header: string[]; rows: (string | number | null)[][] } | null {
  const cov = results.covariance;
  const matrix = cov?.[kind];
  if (!cov || !matrix) return null;
  return {
    header: ['parameter', ...cov.names],
    rows: cov.names.map((name, i) => [name, ...matrix[i]]),
  };
}

export function describeCovariance(results: RunResult, kind: CovarianceKind): string {
  const cov = results.covariance;
  if (!cov) return 'not stored (run estimated before covariance matrices were kept)';
  if (kind === 'robust')
    return `clustered by respondent (sandwich A⁻¹BA⁻¹ × G/(G−1), G = ${cov.clusters})`;
  return cov.method === 'bhhh'
    ? 'BHHH (inverse outer product of respondent scores)'
    : 'inverse of the negative Hessian';
}
