/**
 * Estimates of one run: parameters, fit statistics, WTP, and for each random coefficient the
 * population density with respondents' conditional means. While the run is queued or running
 * it shows its progress; a failed run shows its reason.
 */
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import type { QueryClient } from '@tanstack/react-query';
import { Alert, Card, Spinner } from '@/components/ui/feedback';
import { ErrorText, PanelErrorBoundary } from '@/components/ui/error-boundary';
import { Button } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { erasureNotice } from '@shared/schemas/exports';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { getRunQueryOptions, useRun } from '@/features/runs/api/get-run';
import { useCancelRun } from '@/features/runs/api/cancel-run';
import { isRunActive } from '@/features/runs/api/run-keys';
import { RunStatusBadge } from '@/features/runs/components/run-status-badge';
import { describeResume, RunProgress } from '@/features/runs/components/run-progress';
import { RunCautions } from '@/features/runs/components/run-cautions';
import { ParameterTable } from '@/features/runs/components/parameter-table';
import { FitStatistics } from '@/features/runs/components/fit-statistics';
import { WtpTable } from '@/features/runs/components/wtp-table';
import { RandomTastes } from '@/features/runs/components/random-tastes';
import { formatDateTime } from '@/utils/format';
import { ConvergencePanel } from '@/features/runs/components/convergence-panel';
import { RunWarnings } from '@/features/runs/components/run-warnings';
import { DerivedTable } from '@/features/runs/components/derived-table';
import { ImpliedCovariance } from '@/features/runs/components/implied-covariance';
import { CovarianceDownloads } from '@/features/runs/components/covariance-downloads';
import { exportsPath } from '@/features/exports/api/get-export-manifest';
import { HbDiagnostics } from '@/features/runs/components/hb-diagnostics';
import { LatentClassPanel } from '@/features/runs/components/latent-class-panel';
import { MODEL_LABELS } from '@shared/schemas/estimation-families';
import { BackLink } from '@/components/ui/back-link';

export const createRunLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.teamId && params.studyId && params.runId)
      void queryClient.prefetchQuery(
        getRunQueryOptions(params.teamId, params.studyId, params.runId),
      );
    return null;
  };

export function Component() {
  const { teamId = '', studyId = '', runId = '' } = useParams();
  const { can } = useCurrentTeam();
  const { data: run, error, isPending } = useRun(teamId, studyId, runId);
  const cancel = useCancelRun(teamId, studyId);
  if (isPending) return <Spinner label="Loading the run…" />;
  if (error || !run) return <ErrorText error={error} />;
  const results = run.results;
  // HB reports posterior draws, latent class its own SEs: no covariance files to download.
  const classicalFit = run.model === 'mnl' || run.model === 'mixed';

  return (
    <div className="space-y-6">
      <div className="space-y-1">
        <BackLink to={paths.studySection.getHref(teamId, studyId, 'models')}>All runs</BackLink>
        <div className="flex flex-wrap items-center gap-3">
          <h2 className="text-xl font-semibold text-ink">{run.name}</h2>
          <RunStatusBadge status={run.status} />
          {can('runs:manage') && isRunActive(run.status) && !run.cancelRequested && (
            <Button
              size="sm"
              variant="secondary"
              busy={cancel.isPending}
              onClick={() => cancel.mutate(run.id)}
            >
              Cancel run
            </Button>
          )}
          {can('study:write') &&
            run.status === 'done' &&
            (run.model === 'mnl' || run.model === 'mixed') && (
              <Link
                to={paths.redesignFromRun.getHref(teamId, studyId, run.id)}
                className="text-sm font-medium text-primary underline"
              >
                Use as priors for a new design
              </Link>
            )}
        </div>
        <p className="text-xs text-ink-muted">
          {MODEL_LABELS[run.model]} · started {formatDateTime(run.createdAt)}
          {run.dataHash && (
            <>
              {' '}
              · data SHA-256 <span className="font-mono">{run.dataHash.slice(0, 12)}…</span>
            </>
          )}
          {!isRunActive(run.status) && run.progress.resumed && (
            <> · {describeResume(run.progress)?.toLowerCase()}</>
          )}
        </p>
      </div>

      {isRunActive(run.status) && (
        <Card title="Progress">
          <RunProgress run={run} />
        </Card>
      )}
      {run.status === 'failed' && (
        <Alert tone="danger" title="The run failed">
          {run.error}
        </Alert>
      )}
      {run.status === 'cancelled' && <Alert tone="warning" title="The run was cancelled" />}
      {run.erasedRespondents > 0 && (
        <Alert tone="warning" title="Respondents erased since this run">
          {erasureNotice(run.erasedRespondents)}
        </Alert>
      )}

      {results && (
        <>
          <RunCautions screen="run" />
          <RunWarnings results={results} />
          <Card title="Convergence">
            <ConvergencePanel results={results} />
          </Card>
          {results.diagnostics && (
            <Card title="Sampler diagnostics">
              <PanelErrorBoundary>
                <HbDiagnostics results={results} />
              </PanelErrorBoundary>
            </Card>
          )}
          {(results.classes?.length ?? 0) > 0 && (
            <Card title="Classes">
              <PanelErrorBoundary>
                <LatentClassPanel results={results} />
              </PanelErrorBoundary>
            </Card>
          )}
          <Card title="Parameters">
            <PanelErrorBoundary>
              <ParameterTable results={results} />
            </PanelErrorBoundary>
          </Card>
          <div className="grid gap-6 lg:grid-cols-2">
            <Card title="Fit" className="min-w-0">
              <FitStatistics results={results} />
            </Card>
            <Card title="Willingness to pay" className="min-w-0">
              <PanelErrorBoundary>
                <WtpTable results={results} />
              </PanelErrorBoundary>
            </Card>
          </div>
          {(results.derived ?? []).length > 0 && (
            <Card title="Derived quantities">
              <PanelErrorBoundary>
                <DerivedTable results={results} />
              </PanelErrorBoundary>
            </Card>
          )}
          {(results.derived ?? []).some((d) => d.quantity === 'correlation') && (
            <Card title="Correlated tastes">
              <PanelErrorBoundary>
                <ImpliedCovariance results={results} />
              </PanelErrorBoundary>
            </Card>
          )}
          {classicalFit && (
            <Card title="Covariance of the estimates">
              <CovarianceDownloads
                results={results}
                hrefOf={(kind) =>
                  `${exportsPath(teamId, studyId)}/covariance.csv?runId=${encodeURIComponent(run.id)}&kind=${kind}`
                }
              />
            </Card>
          )}
          {results.population.some((m) => m.distribution !== 'fixed') && (
            <Card title="How tastes vary across respondents">
              <PanelErrorBoundary>
                <RandomTastes teamId={teamId} studyId={studyId} runId={run.id} results={results} />
              </PanelErrorBoundary>
            </Card>
          )}
        </>
      )}
    </div>
  );
}
