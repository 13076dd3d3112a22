/**
 * Questionnaire section: the pages around the choice tasks, and going live (status, readiness,
 * links, close date, quota, redirects, versions).
 */
import { Link, useParams, useSearchParams } from 'react-router';
import { Spinner } from '@/components/ui/feedback';
import { ErrorText, PanelErrorBoundary } from '@/components/ui/error-boundary';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { useStudy } from '@/features/studies/api/get-study';
import { useQuestionnaire } from '@/features/questionnaire/api/get-questionnaire';
import { QuestionnaireEditor } from '@/features/questionnaire/components/questionnaire-editor';
import { LifecyclePanel } from '@/features/lifecycle/components/lifecycle-panel';
import { LanguagesPanel } from '@/features/languages/components/languages-panel';
import { paths } from '@/config/paths';
import { cn } from '@/lib/cn';

function Tabs({ teamId, studyId, tab }: { teamId: string; studyId: string; tab: string }) {
  const tabs = [
    {
      id: 'pages',
      label: 'Pages',
      href: paths.studySection.getHref(teamId, studyId, 'questionnaire'),
    },
    { id: 'languages', label: 'Languages', href: paths.studyLanguages.getHref(teamId, studyId) },
  ];
  return (
    <nav aria-label="Questionnaire views" className="flex gap-1 border-b border-line">
      {tabs.map((t) => (
        <Link
          key={t.id}
          to={t.href}
          aria-current={tab === t.id ? 'page' : undefined}
          className={cn(
            '-mb-px border-b-2 px-3 py-2 text-sm font-medium',
            tab === t.id
              ? 'border-primary text-primary'
              : 'border-transparent text-ink-soft hover:text-primary',
          )}
        >
          {t.label}
        </Link>
      ))}
    </nav>
  );
}

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const { can } = useCurrentTeam();
  const study = useStudy(teamId, studyId);
  const q = useQuestionnaire(teamId, studyId);
  const [search] = useSearchParams();
  const tab = search.get('tab') === 'languages' ? 'languages' : 'pages';
  if (study.isPending || q.isPending) return <Spinner label="Loading the questionnaire…" />;
  if (study.error || q.error) return <ErrorText error={study.error ?? q.error} />;
  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
      <div className="min-w-0 space-y-2">
        <h2 className="text-xl font-semibold text-ink">Questionnaire</h2>
        <Tabs teamId={teamId} studyId={studyId} tab={tab} />
        {tab === 'languages' ? (
          <PanelErrorBoundary title="The languages could not be shown">
            <div className="pt-4">
              <LanguagesPanel teamId={teamId} studyId={studyId} canEdit={can('study:write')} />
            </div>
          </PanelErrorBoundary>
        ) : (
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
        )}
      </div>
      <div className="min-w-0">
        <PanelErrorBoundary title="Going live could not be shown">
          <LifecyclePanel teamId={teamId} studyId={studyId} canManage={can('fieldwork:manage')} />
        </PanelErrorBoundary>
      </div>
    </div>
  );
}
