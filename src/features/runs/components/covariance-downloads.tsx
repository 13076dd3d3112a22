/**
 * Downloads of the run's full covariance matrix of the estimates (robust and classical, CSV),
 * with which one the intervals on this page use. The XLSX of the Exports section holds both too.
 */
import type { RunResult } from '@shared/schemas/run';

export function CovarianceDownloads({
  results,
  hrefOf,
}: {
  results: RunResult;
  /** URL of the CSV download of one kind. */
  hrefOf: (kind: 'robust' | 'classical') => string;
}) {
  const cov = results.covariance;
  if (!cov)
    return (
      <p className="text-sm text-ink-soft">
        This run was estimated before covariance matrices were stored; run it again to download
        them.
      </p>
    );
  const classicalLabel =
    cov.method === 'bhhh' ? 'BHHH (outer product of scores)' : 'Classical (inverse −Hessian)';
  return (
    <div className="space-y-2 text-sm">
      <ul className="flex flex-wrap gap-3">
        {cov.robust && (
          <li>
            <a className="font-medium text-primary underline" href={hrefOf('robust')} download>
              Robust, clustered by respondent (CSV)
            </a>
          </li>
        )}
        {cov.classical && (
          <li>
            <a className="font-medium text-primary underline" href={hrefOf('classical')} download>
              {classicalLabel} (CSV)
            </a>
          </li>
        )}
      </ul>
      <p className="text-xs text-ink-muted">
        Intervals, WTP and derived quantities on this page use the {cov.used} covariance
        {cov.used === 'robust'
          ? ` (sandwich with the G/(G−1) correction, G = ${cov.clusters} respondents)`
          : ''}
        .
      </p>
    </div>
  );
}
