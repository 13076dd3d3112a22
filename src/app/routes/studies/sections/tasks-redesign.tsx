/**
 * Pilot → priors → redesign on the Tasks screen: priors from a finished run, a new design
 * generated beside the current one, both compared under the new priors, then adopted (a new
 * frozen version when the study is live) or discarded. Composes the design and runs features.
 */
import { useState } from 'react';
import { useSearchParams } from 'react-router';
import type { DesignSpec } from '@shared/schemas/design-spec';
import type { PriorSpread } from '@shared/schemas/redesign';
import type { CodedColumn } from '@shared/engine/coding/coded-columns';
import type { Study } from '@shared/schemas/study';
import { ApiError } from '@/lib/api-client';
import { ErrorText } from '@/components/ui/error-boundary';
import { useRuns } from '@/features/runs/api/list-runs';
import type { StudyDesignState } from '@/features/design/api/get-design-state';
import { useRunPriors } from '@/features/design/api/get-run-priors';
import { useStartCandidateJob } from '@/features/design/api/start-candidate-job';
import { useAdoptCandidate } from '@/features/design/api/adopt-candidate';
import { useDiscardCandidate } from '@/features/design/api/discard-candidate';
import { RunPriorsCard, type PriorRunOption } from '@/features/design/components/run-priors-card';
import { DesignSpecForm } from '@/features/design/components/design-spec-form';
import { DesignComparison } from '@/features/design/components/design-comparison';

type Props = {
  teamId: string;
  study: Study;
  columns: CodedColumn[];
  state: StudyDesignState;
  /** Owner or editor: may generate, adopt and discard. */
  canWrite: boolean;
  running: boolean;
};

export function RedesignPanel({ teamId, study, columns, state, canWrite, running }: Props) {
  const [search, setSearch] = useSearchParams();
  const runId = search.get('priorsFromRun') ?? '';
  const [spread, setSpread] = useState<PriorSpread>('se');
  const [seeded, setSeeded] = useState<{ key: number; initial: Partial<DesignSpec> } | null>(null);
  const runs = useRuns(teamId, study.id);
  const priors = useRunPriors(teamId, study.id, runId, spread);
  const start = useStartCandidateJob(teamId, study.id);
  const adopt = useAdoptCandidate(teamId, study.id);
  const discard = useDiscardCandidate(teamId, study.id);
  const options: PriorRunOption[] = (runs.data ?? []).flatMap((r) =>
    r.status === 'done' && (r.model === 'mnl' || r.model === 'mixed')
      ? [{ id: r.id, name: r.name, model: r.model }]
      : [],
  );
  const { design, candidate } = state;
  const startError = start.error instanceof ApiError ? start.error : null;
  const serverErrors = new Map((startError?.fields ?? []).map((f) => [f.path, f.message]));

  return (
    <>
      {canWrite && (
        <RunPriorsCard
          runs={options}
          runId={runId}
          spread={spread}
          onRunChange={(id) =>
            setSearch(
              (old) => {
                const next = new URLSearchParams(old);
                if (id) next.set('priorsFromRun', id);
                else next.delete('priorsFromRun');
                return next;
              },
              { replace: true },
            )
          }
          onSpreadChange={setSpread}
          priors={priors.data}
          error={priors.error}
          loading={priors.isFetching}
          onUse={(p) =>
            setSeeded({
              key: Date.now(),
              initial: {
                ...(design?.spec as Partial<DesignSpec> | undefined),
                method: 'd_efficient',
                // Four significant digits: priors are approximate, and the form stays readable.
                priors: {
                  ...p.priors,
                  columns: p.priors.columns.map((c) => ({
                    key: c.key,
                    mean: Number(c.mean.toPrecision(4)),
                    sd: Number(c.sd.toPrecision(4)),
                  })),
                },
                priorsSource: { runId: p.runId, spread: p.spread },
              },
            })
          }
        />
      )}
      {canWrite && seeded && (
        <DesignSpecForm
          key={seeded.key}
          title="Generate a new design to compare"
          submitLabel="Generate and compare"
          definition={study.definition}
          columns={columns}
          disabled={running}
          busy={start.isPending}
          serverErrors={serverErrors}
          initial={seeded.initial}
          onGenerate={(spec) => start.mutate(spec)}
        />
      )}
      {startError && serverErrors.size === 0 && <ErrorText error={startError} />}
      {candidate && (
        <DesignComparison
          comparison={candidate.comparison}
          status={study.status}
          currentVersion={study.currentVersion}
          canDecide={canWrite}
          busy={adopt.isPending || discard.isPending}
          onAdopt={() => adopt.mutate(candidate.id, { onSuccess: () => setSeeded(null) })}
          onKeep={() => discard.mutate(candidate.id, { onSuccess: () => setSeeded(null) })}
        />
      )}
      {(adopt.error || discard.error) && <ErrorText error={adopt.error ?? discard.error} />}
    </>
  );
}
