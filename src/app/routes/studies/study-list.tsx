import { useState } from 'react';
import { useNavigate } from 'react-router';
import { PageHeader, EmptyState, Spinner, Card } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { Button } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { useStudies } from '@/features/studies/api/list-studies';
import { useDuplicateStudy } from '@/features/studies/api/duplicate-study';
import { useSetStudyArchived } from '@/features/studies/api/archive-study';
import { CreateStudyForm } from '@/features/studies/components/create-study-form';
import { StudyCard } from '@/features/studies/components/study-card';

export function Component() {
  const { teamId, teamName, can } = useCurrentTeam();
  const navigate = useNavigate();
  const [archived, setArchived] = useState(false);
  const [creating, setCreating] = useState(false);
  const studies = useStudies(teamId, { archived });
  const duplicate = useDuplicateStudy(teamId);
  const archive = useSetStudyArchived(teamId);
  const canWrite = can('study:write');

  return (
    <div>
      <PageHeader
        title="Studies"
        description={teamName}
        actions={
          <>
            <Button variant="ghost" onClick={() => setArchived((a) => !a)}>
              {archived ? 'Show active studies' : 'Show archived'}
            </Button>
            {canWrite && (
              <Button
                variant="secondary"
                onClick={() => navigate(paths.importStudy.getHref(teamId))}
              >
                Import choice data
              </Button>
            )}
            {canWrite && !creating && <Button onClick={() => setCreating(true)}>New study</Button>}
          </>
        }
      />
      {creating && (
        <Card title="New study" className="mb-6 max-w-xl">
          <CreateStudyForm
            teamId={teamId}
            onCancel={() => setCreating(false)}
            onCreated={(s) => navigate(paths.studySection.getHref(teamId, s.id, 'attributes'))}
          />
        </Card>
      )}
      <ErrorText error={duplicate.error ?? archive.error} />
      {studies.isPending ? (
        <Spinner label="Loading studies…" />
      ) : studies.error ? (
        <ErrorText error={studies.error} />
      ) : studies.data.length === 0 ? (
        <EmptyState title={archived ? 'No archived studies' : 'No studies yet'}>
          A study holds one choice experiment: its attributes, choice tasks, questionnaire,
          fieldwork and models.
        </EmptyState>
      ) : (
        <ul className="space-y-3" aria-label="Studies">
          {studies.data.map((s) => (
            <StudyCard
              key={s.id}
              teamId={teamId}
              study={s}
              canWrite={canWrite}
              busy={duplicate.isPending || archive.isPending}
              onDuplicate={() => duplicate.mutate(s.id)}
              onArchive={(a) => archive.mutate({ studyId: s.id, archived: a })}
            />
          ))}
        </ul>
      )}
    </div>
  );
}
