import { Card, PageHeader, Spinner } from '@/components/ui/feedback';
import { useMe } from '@/features/auth/api/get-me';
import { useRefreshMe } from '@/features/auth/hooks/use-refresh-me';
import { ProfileForm } from '@/features/account/components/profile-form';
import { PasswordForm } from '@/features/account/components/password-form';
import { SessionsList } from '@/features/account/components/sessions-list';
import { TwoStepCard } from '@/features/account/components/two-step-card';
import { useNavigate } from 'react-router';
import { paths } from '@/config/paths';
import { MyTeams } from '@/features/team/components/my-teams';
import { CreateTeamForm } from '@/features/team/components/create-team-form';

export function Component() {
  const { data: me } = useMe();
  const refreshMe = useRefreshMe();
  const navigate = useNavigate();
  if (!me) return <Spinner />;

  return (
    <div className="mx-auto max-w-3xl">
      <PageHeader title="Account settings" description={me.email} />
      <div className="space-y-6">
        <Card title="Profile">
          <ProfileForm user={me} onSaved={refreshMe} />
        </Card>
        <Card title="Password">
          <PasswordForm onChanged={refreshMe} />
        </Card>
        <Card title="Two-step sign-in">
          <TwoStepCard />
        </Card>
        <Card title="Where you are signed in">
          <SessionsList
            onSignedOutEverywhere={() => navigate(paths.signIn.getHref(), { replace: true })}
          />
        </Card>
        <Card title="Your teams">
          <MyTeams />
          <div className="mt-6 border-t border-line pt-6">
            <h3 className="mb-3 text-sm font-semibold text-ink">Create another team</h3>
            <CreateTeamForm onCreated={refreshMe} />
          </div>
        </Card>
      </div>
    </div>
  );
}
