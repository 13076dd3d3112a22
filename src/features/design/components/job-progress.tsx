import type { DesignJobView } from '@shared/schemas/design-job';
import { criterionNames, searchCriteria } from '../utils/criterion-names';
import { Alert, ProgressBar } from '@/components/ui/feedback';
import { Button } from '@/components/ui/button';
import { formatSignificant } from '@/utils/format';

const phaseText = {
  building: 'Preparing',
  searching: 'Searching for an efficient design',
  blocking: 'Assigning blocks',
  diagnosing: 'Computing diagnostics',
  done: 'Done',
};

/** The latest generation job: live progress while it runs, its outcome once it ends. */
export function JobProgress({
  job,
  canCancel,
  cancelling,
  onCancel,
}: {
  job: DesignJobView;
  canCancel: boolean;
  cancelling: boolean;
  onCancel: () => void;
}) {
  if (job.status === 'failed')
    return (
      <Alert tone="danger" title="The design could not be generated">
        {job.error}
      </Alert>
    );
  if (job.status === 'cancelled')
    return <Alert tone="info">The last generation was cancelled.</Alert>;
  if (job.status === 'done') return null;
  const p = job.progress;
  return (
    <div
      className="space-y-2 rounded-lg border border-primary/30 bg-primary-soft p-4"
      aria-live="polite"
    >
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-sm font-semibold text-ink">
          {job.status === 'queued'
            ? 'Waiting for a worker…'
            : (phaseText[p.phase ?? 'building'] ?? 'Working')}
          {job.cancelRequested && ' — cancelling'}
        </p>
        {canCancel && (
          <Button
            size="sm"
            variant="secondary"
            onClick={onCancel}
            busy={cancelling}
            disabled={job.cancelRequested}
          >
            Cancel
          </Button>
        )}
      </div>
      <ProgressBar value={p.fraction ?? 0} label="Design generation progress" />
      <dl className="flex flex-wrap gap-x-6 gap-y-1 text-xs text-ink-soft">
        {p.start !== undefined && (
          <div className="flex gap-1">
            <dt>Start</dt>
            <dd className="num">
              {p.start} of {p.starts}
            </dd>
          </div>
        )}
        {p.pass !== undefined && (
          <div className="flex gap-1">
            <dt>Pass</dt>
            <dd className="num">{p.pass}</dd>
          </div>
        )}
        {p.bestDError !== undefined && (
          <div className="flex gap-1">
            <dt>
              Best{' '}
              {job.spec.criterion && job.spec.criterion !== 'd_error'
                ? searchCriteria[job.spec.criterion].name
                : criterionNames[job.spec.priors.kind]}{' '}
              so far
            </dt>
            <dd className="num">{formatSignificant(p.bestDError)}</dd>
          </div>
        )}
      </dl>
    </div>
  );
}
