import { useMemo } from 'react';
import { useParams, useSearchParams } from 'react-router';
import { getCodedColumns } from '@shared/engine/coding/coded-columns';
import type { DesignSpec } from '@shared/schemas/design-spec';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { ApiError } from '@/lib/api-client';
import { Alert, Card, EmptyState, Spinner } from '@/components/ui/feedback';
import { ErrorText, PanelErrorBoundary } from '@/components/ui/error-boundary';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { useStudy } from '@/features/studies/api/get-study';
import { designExportHref, useDesignState } from '@/features/design/api/get-design-state';
import { useStartDesignJob } from '@/features/design/api/start-design-job';
import { useCancelDesignJob } from '@/features/design/api/cancel-design-job';
import { useImportDesign } from '@/features/design/api/import-design';
import { DesignSpecForm } from '@/features/design/components/design-spec-form';
import { JobProgress } from '@/features/design/components/job-progress';
import { DesignTable } from '@/features/design/components/design-table';
import { DiagnosticsPanel } from '@/features/design/components/diagnostics-panel';
import { CsvImport } from '@/features/design/components/csv-import';
import { RedesignPanel } from './tasks-redesign';
import { EmptyUntilSection } from './empty-until-section';

const methodNames = {
  full_factorial: 'Full factorial',
  random: 'Random, level-balanced',
  d_efficient: 'D-efficient',
  imported: 'Imported from CSV',
};

function alternativeNamesOf(d: StudyDefinition): string[] {
  const designed = Array.from({ length: d.alternatives.count }, (_, j) =>
    d.alternatives.labeled
      ? (d.alternatives.labels[j]?.name ?? `Alternative ${j + 1}`)
      : `Option ${'ABCDE'[j]}`,
  );
  return d.fixedAlternative ? [...designed, d.fixedAlternative.label] : designed;
}

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const { can } = useCurrentTeam();
  const [search] = useSearchParams();
  const { data: study } = useStudy(teamId, studyId);
  const state = useDesignState(teamId, studyId);
  const start = useStartDesignJob(teamId, studyId);
  const cancel = useCancelDesignJob(teamId, studyId);
  const importCsv = useImportDesign(teamId, studyId);
  const columns = useMemo(() => (study ? getCodedColumns(study.definition) : []), [study]);
  if (!study || state.isPending) return <Spinner />;
  if (state.error) return <ErrorText error={state.error} />;

  const { design, job } = state.data;
  const canWrite = can('study:write') && study.status === 'draft';
  // Redesign from a run's priors: beside the current design, in any status (a draft shows it
  // when a run's priors are asked for, or a candidate waits).
  const redesign =
    design !== null &&
    (study.status !== 'draft' || state.data.candidate !== null || search.has('priorsFromRun'));
  const running = job?.status === 'queued' || job?.status === 'running';
  if (study.definition.attributes.length === 0)
    return (
      <EmptyUntilSection
        teamId={teamId}
        studyId={studyId}
        title="Add attributes first"
        section="attributes"
        label="Attributes"
      >
        Choice tasks combine the levels of your attributes.
      </EmptyUntilSection>
    );
  const startError = start.error instanceof ApiError ? start.error : null;
  const serverErrors = new Map((startError?.fields ?? []).map((f) => [f.path, f.message]));

  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <div className="space-y-6">
        {study.status !== 'draft' && (
          <Alert tone="info">
            This study is {study.status}: its choice tasks are frozen.
            {can('study:write') &&
              ' You can still generate a new design from a run’s estimates, compare it and adopt it as a new version.'}
          </Alert>
        )}
        {redesign && (
          <RedesignPanel
            teamId={teamId}
            study={study}
            columns={columns}
            state={state.data}
            canWrite={can('study:write')}
            running={running}
          />
        )}
        {canWrite && (
          <DesignSpecForm
            definition={study.definition}
            columns={columns}
            disabled={running}
            busy={start.isPending}
            serverErrors={serverErrors}
            initial={design?.spec as Partial<DesignSpec> | undefined}
            onGenerate={(spec) => start.mutate(spec)}
          />
        )}
        {startError && serverErrors.size === 0 && <ErrorText error={startError} />}
        {job && (
          <JobProgress
            job={job}
            canCancel={canWrite || (redesign && can('study:write'))}
            cancelling={cancel.isPending}
            onCancel={() => cancel.mutate(job.id)}
          />
        )}
        {design ? (
          <Card
            title={`Choice tasks — ${methodNames[design.method]}`}
            actions={
              <a
                className="text-sm font-medium text-primary underline"
                href={designExportHref(teamId, studyId)}
                download
              >
                Export CSV
              </a>
            }
          >
            <DesignTable definition={study.definition} design={design.design} />
          </Card>
        ) : (
          !running && (
            <EmptyState title="No choice tasks yet">
              Generate a design or import one from CSV.
            </EmptyState>
          )
        )}
        {canWrite && (
          <Card title="Import">
            <CsvImport
              disabled={running}
              busy={importCsv.isPending}
              onImport={(f) => importCsv.mutateAsync(f)}
            />
          </Card>
        )}
      </div>
      <aside aria-label="Diagnostics">
        <PanelErrorBoundary title="Diagnostics could not be shown">
          {design ? (
            <DiagnosticsPanel
              d={design.diagnostics}
              alternativeNames={alternativeNamesOf(study.definition)}
              fixedLabel={study.definition.fixedAlternative?.label ?? null}
            />
          ) : (
            <p className="text-sm text-ink-muted">
              Diagnostics appear here once there is a design.
            </p>
          )}
        </PanelErrorBoundary>
      </aside>
    </div>
  );
}
