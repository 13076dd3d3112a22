/**
 * The study's runs, newest first: state, progress while running, the readable reason when a
 * run failed, cancel for those who may, and a check box to compare finished runs.
 */
import { Link } from 'react-router';
import type { Run } from '@shared/schemas/run';
import { Button } from '@/components/ui/button';
import { CompareCheckbox } from '@/components/ui/checkbox-field';
import { paths } from '@/config/paths';
import { useCancelRun } from '../api/cancel-run';
import { isRunActive } from '../api/run-keys';
import { formatDateTime, formatDuration, formatNumber } from '@/utils/format';
import { RunProgress } from './run-progress';
import { RunStatusBadge } from './run-status-badge';

const SHORT_LABELS: Record<Run['model'], string> = {
  mnl: 'MNL',
  mixed: 'Mixed logit',
  hb: 'HB logit',
  latent_class: 'Latent class',
};
const modelLabel = (run: Run) => SHORT_LABELS[run.model] ?? run.model;

export function RunsList({
  teamId,
  studyId,
  runs,
  canManage,
  selected,
  onToggle,
}: {
  teamId: string;
  studyId: string;
  runs: Run[];
  canManage: boolean;
  selected: ReadonlySet<string>;
  onToggle: (runId: string) => void;
}) {
  const cancel = useCancelRun(teamId, studyId);
  return (
    <ul className="divide-y divide-line rounded-lg border border-line bg-white">
      {runs.map((run) => (
        <li key={run.id} className="space-y-2 px-4 py-3">
          <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
            {run.status === 'done' && (
              <CompareCheckbox
                name={run.name}
                checked={selected.has(run.id)}
                onToggle={() => onToggle(run.id)}
              />
            )}
            <Link
              to={paths.runEstimates.getHref(teamId, studyId, run.id)}
              className="font-medium text-ink hover:text-primary"
            >
              {run.name}
            </Link>
            <RunStatusBadge status={run.status} />
            <span className="text-xs text-ink-muted">
              {modelLabel(run)} · {run.spec.coefficients.length} coefficients ·{' '}
              {formatDateTime(run.createdAt)}
            </span>
            {canManage && isRunActive(run.status) && !run.cancelRequested && (
              <Button
                size="sm"
                variant="secondary"
                className="ml-auto"
                busy={cancel.isPending && cancel.variables === run.id}
                onClick={() => cancel.mutate(run.id)}
              >
                Cancel
              </Button>
            )}
          </div>
          {isRunActive(run.status) && <RunProgress run={run} />}
          {run.status === 'done' && run.results && (
            <p className="text-xs text-ink-soft">
              Log-likelihood{' '}
              <span className="font-mono tabular-nums">{formatNumber(run.results.loglik, 2)}</span>{' '}
              · {run.results.respondents} respondents · {run.results.iterations} iterations ·{' '}
              {run.results.converged ? 'converged' : 'did not converge'} ·{' '}
              {formatDuration(run.results.elapsedSeconds * 1000)}
            </p>
          )}
          {run.status === 'failed' && (
            <p role="alert" className="text-sm text-danger">
              {run.error ?? 'The run failed.'}
            </p>
          )}
        </li>
      ))}
    </ul>
  );
}
