import { PageHeader, EmptyState } from '@/components/ui/feedback';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';

export function Component() {
  const { teamName } = useCurrentTeam();
  return (
    <div>
      <PageHeader title="Studies" description={teamName} />
      <EmptyState title="No studies yet">
        A study holds one choice experiment: its attributes, choice tasks, questionnaire, fieldwork
        and models.
      </EmptyState>
    </div>
  );
}
