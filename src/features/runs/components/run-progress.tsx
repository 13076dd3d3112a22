/**
 * Progress of a queued or running run: a bar of the progress toward convergence (the gradient
 * norm falling from its first value to the tolerance, on a log scale), the stage by name
 * (estimating, standard errors, WTP, taste profiles, saving) with the iteration, the
 * log-likelihood, the elapsed time and, for runs over a minute, about how long is left; and,
 * when a worker took the run up again after the one running it was lost, from where.
 */
import type { Run, RunStage } from '@shared/schemas/run';
import { ProgressBar } from '@/components/ui/feedback';
import { formatDuration, formatNumber } from '@/utils/format';

/** Gradient tolerance of the mixed logit (server check-mixed-logit-options.ts). */
const TOLERANCE = 1e-3;

const AFTER_ESTIMATION = { standard_errors: 0.97, wtp: 0.98, profiles: 0.99 } as const;

const STAGE_LABELS: Record<RunStage, string> = {
  preparing: 'Preparing the choice data…',
  estimating: 'Estimating…',
  standard_errors: 'Computing standard errors…',
  wtp: 'Computing WTP and derived quantities…',
  profiles: 'Computing taste profiles…',
  saving: 'Saving the results…',
};

/** The words for where a run is: the stage, with the iteration while estimating. */
export function describeRunStage(run: Run): string {
  const p = run.progress;
  if (run.status === 'queued')
    return run.attempts > 0
      ? 'Waiting for a worker to take it up again after a worker restart…'
      : 'Waiting for a worker…';
  const stage = p.stage ?? 'preparing';
  if (stage === 'estimating' && p.iteration) {
    if (run.model === 'latent_class')
      return `Estimating: EM start ${p.iteration} of ${p.maxIterations ?? '?'}`;
    if (run.model === 'hb')
      return `Sampling: iteration ${p.iteration} of ${p.maxIterations ?? '?'} (slowest chain)`;
    return `Estimating: iteration ${p.iteration}`;
  }
  return STAGE_LABELS[stage];
}

export function getConvergenceShare(run: Run): number {
  const { stage, gradientNorm, initialGradientNorm } = run.progress;
  if (run.status === 'queued' || stage === 'preparing' || stage === undefined) return 0;
  if (stage === 'saving') return 1;
  // After the optimisation the bar stays near full while the stage is named beside it.
  if (stage in AFTER_ESTIMATION) return AFTER_ESTIMATION[stage as keyof typeof AFTER_ESTIMATION];
  // HB and latent class have no gradient: the share of sampler iterations or EM starts done.
  if (run.model === 'hb' || run.model === 'latent_class') {
    const { iteration, maxIterations } = run.progress;
    if (!iteration || !maxIterations) return 0.02;
    return Math.min(0.97, Math.max(0.02, iteration / maxIterations));
  }
  if (!gradientNorm || !initialGradientNorm || initialGradientNorm <= TOLERANCE) return 0.05;
  const share =
    Math.log(initialGradientNorm / gradientNorm) / Math.log(initialGradientNorm / TOLERANCE);
  return Math.min(0.97, Math.max(0.02, share));
}

/** Where a run went on after its worker was lost (null when it never was). */
export function describeResume(p: Run['progress']): string | null {
  if (!p.resumed) return null;
  const times = p.resumed.attempt > 2 ? ` (${p.resumed.attempt - 1} restarts)` : '';
  return p.resumed.fromIteration > 0
    ? `Resumed from iteration ${p.resumed.fromIteration} after a worker restart${times}`
    : `Started again from the beginning after a worker restart${times}`;
}

/** Runs that take over a minute show the estimate of the time left (a short run needs none). */
export function showsTimeLeft(p: Run['progress']): boolean {
  if (p.secondsLeft === undefined || p.stage !== 'estimating') return false;
  return (p.elapsedMs ?? 0) + p.secondsLeft * 1000 > 60_000;
}

export function RunProgress({ run }: { run: Run }) {
  const p = run.progress;
  const label = describeRunStage(run);
  const resumed = describeResume(p);
  return (
    <div className="space-y-1.5">
      <ProgressBar value={getConvergenceShare(run)} label={`Progress of ${run.name}`} />
      <div className="flex flex-wrap gap-x-4 gap-y-0.5 text-xs text-ink-soft">
        <span>{label}</span>
        {p.loglik !== undefined && (
          <span>
            Log-likelihood{' '}
            <span className="font-mono tabular-nums">{formatNumber(p.loglik, 2)}</span>
          </span>
        )}
        {run.status === 'running' && <span>Elapsed {formatDuration(p.elapsedMs)}</span>}
        {run.status === 'running' && showsTimeLeft(p) && (
          <span>About {formatDuration(p.secondsLeft! * 1000)} left</span>
        )}
        {run.cancelRequested && run.status === 'running' && <span>Stopping…</span>}
      </div>
      {resumed && <p className="text-xs text-ink-soft">{resumed}</p>}
    </div>
  );
}
