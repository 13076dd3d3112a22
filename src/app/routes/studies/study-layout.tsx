/**
 * The study page: name, state and the pipeline of sections, with the current section below.
 * Section screens are child routes (see section-modules.ts).
 */
import { useState } from 'react';
import { Navigate, Outlet, useParams } from 'react-router';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { paths } from '@/config/paths';
import { Spinner } from '@/components/ui/feedback';
import { ErrorText, PanelErrorBoundary } from '@/components/ui/error-boundary';
import { getStudyQueryOptions, useStudy } from '@/features/studies/api/get-study';
import { StudyPipeline } from '@/features/studies/components/study-pipeline';
import { getStepsDone } from '@/features/studies/utils/steps-done';
import { StudyStatusBadge } from '@/features/studies/components/study-status-badge';
import { StudyDetailsForm } from '@/features/studies/components/study-details-form';
import { Button } from '@/components/ui/button';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { builtSections } from './section-modules';
import { BackLink } from '@/components/ui/back-link';

export const createStudyLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.teamId && params.studyId)
      void queryClient.prefetchQuery(getStudyQueryOptions(params.teamId, params.studyId));
    return null;
  };

export function StudyLayout() {
  const { teamId = '', studyId = '' } = useParams();
  const { data: study, error, isPending } = useStudy(teamId, studyId);
  const { can } = useCurrentTeam();
  const [editing, setEditing] = useState(false);
  if (isPending) return <Spinner label="Loading the study…" />;
  if (error || !study) return <ErrorText error={error} />;

  const done = getStepsDone(study);

  return (
    <div>
      <div className="mb-4 flex flex-col gap-1">
        <BackLink to={paths.studies.getHref(teamId)}>Studies</BackLink>
        {editing ? (
          <StudyDetailsForm teamId={teamId} study={study} onDone={() => setEditing(false)} />
        ) : (
          <>
            <div className="flex flex-wrap items-center gap-3">
              <h1 className="text-2xl font-semibold tracking-tight text-ink">{study.name}</h1>
              <StudyStatusBadge
                status={study.status}
                source={study.source}
                archived={study.archivedAt !== null}
              />
              {can('study:write') && (
                <Button size="sm" variant="ghost" onClick={() => setEditing(true)}>
                  Edit details
                </Button>
              )}
            </div>
            {study.publicTitle !== study.name && (
              <p className="text-sm text-ink-soft">
                Respondents see: <span className="font-medium text-ink">{study.publicTitle}</span>
              </p>
            )}
            {study.description && <p className="text-sm text-ink-soft">{study.description}</p>}
          </>
        )}
      </div>
      <div className="mb-6 border-b border-line pb-3">
        <StudyPipeline
          teamId={teamId}
          studyId={studyId}
          available={builtSections}
          done={done}
          imported={study.source === 'imported'}
        />
      </div>
      <PanelErrorBoundary title="This section could not be shown">
        <Outlet />
      </PanelErrorBoundary>
    </div>
  );
}

/** /teams/:teamId/studies/:studyId opens the first section that has a screen. */
export function StudyIndexRedirect() {
  const { teamId = '', studyId = '' } = useParams();
  const [first] = builtSections;
  if (!first) return null;
  return <Navigate to={paths.studySection.getHref(teamId, studyId, first)} replace />;
}
