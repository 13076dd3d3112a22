/**
 * Questionnaire section: the pages around the choice tasks, and going live (status, readiness,
 * links, close date, quota, redirects, versions).
 */
import { useParams } from 'react-router';
import { Spinner } from '@/components/ui/feedback';
import { ErrorText, PanelErrorBoundary } from '@/components/ui/error-boundary';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { useStudy } from '@/features/studies/api/get-study';
import { useQuestionnaire } from '@/features/questionnaire/api/get-questionnaire';
import { QuestionnaireEditor } from '@/features/questionnaire/components/questionnaire-editor';
import { LifecyclePanel } from '@/features/lifecycle/components/lifecycle-panel';

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const { can } = useCurrentTeam();
  const study = useStudy(teamId, studyId);
  const q = useQuestionnaire(teamId, studyId);
  if (study.isPending || q.isPending) return <Spinner label="Loading the questionnaire…" />;
  if (study.error || q.error) return <ErrorText error={study.error ?? q.error} />;
  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
      <div className="min-w-0 space-y-2">
        <h2 className="text-xl font-semibold text-ink">Questionnaire</h2>
        <PanelErrorBoundary title="The questionnaire editor could not be shown">
          <QuestionnaireEditor
            key={`${q.data.saved}-${q.data.editable}-${study.data.status}`}
            teamId={teamId}
            studyId={studyId}
            initial={q.data.questionnaire}
            saved={q.data.saved}
            editable={q.data.editable && can('study:write')}
            definition={study.data.definition}
          />
        </PanelErrorBoundary>
      </div>
      <div className="min-w-0">
        <PanelErrorBoundary title="Going live could not be shown">
          <LifecyclePanel teamId={teamId} studyId={studyId} canManage={can('fieldwork:manage')} />
        </PanelErrorBoundary>
      </div>
    </div>
  );
}
