import { useNavigate, type LoaderFunctionArgs } from 'react-router';
import type { QueryClient } from '@tanstack/react-query';
import { paths } from '@/config/paths';
import { Alert, Card, PageHeader, Spinner } from '@/components/ui/feedback';
import { ErrorText, PanelErrorBoundary } from '@/components/ui/error-boundary';
import { useMe } from '@/features/auth/api/get-me';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { useRefreshMe } from '@/features/auth/hooks/use-refresh-me';
import { getMembersQueryOptions, useMembers } from '@/features/team/api/get-members';
import { MemberList } from '@/features/team/components/member-list';
import { InviteForm } from '@/features/team/components/invite-form';
import { PendingInvitations } from '@/features/team/components/pending-invitations';
import { RoleGuide } from '@/features/team/components/role-guide';
import { RenameTeamForm } from '@/features/team/components/rename-team-form';
import { roleLabels } from '@/features/team/components/role-label';

/** Starts loading the member list with the route; a refusal is shown by the page, not here. */
export function createMembersLoader(queryClient: QueryClient) {
  return ({ params }: LoaderFunctionArgs) => {
    if (params.teamId) void queryClient.prefetchQuery(getMembersQueryOptions(params.teamId));
    return null;
  };
}

export function Component() {
  const { teamId, teamName, role, can } = useCurrentTeam();
  const { data: me } = useMe();
  const members = useMembers(teamId);
  const refreshMe = useRefreshMe();
  const navigate = useNavigate();
  const canManage = can('team:manage');

  const onOwnMembershipChanged = async (change: 'role' | 'removed') => {
    await refreshMe();
    if (change === 'removed') navigate(paths.home.getHref(), { replace: true });
  };

  if (!role) {
    return (
      <Alert tone="danger" title="Team not found">
        You are not a member of this team, or it no longer exists.
      </Alert>
    );
  }

  return (
    <div>
      <PageHeader
        title="Team members"
        description={
          <>
            {teamName} · your role: <strong>{roleLabels[role]}</strong>
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-3">
        <div className="space-y-6 lg:col-span-2">
          <Card title="Members">
            {!canManage && (
              <p className="mb-3 text-sm text-ink-soft">
                Only owners can invite people, change roles or remove members. Ask an owner if
                someone needs a different role.
              </p>
            )}
            <PanelErrorBoundary title="The member list could not be shown">
              {members.isPending ? (
                <Spinner />
              ) : members.isError ? (
                <ErrorText error={members.error} />
              ) : (
                <MemberList
                  teamId={teamId}
                  members={members.data}
                  currentUserId={me?.id ?? ''}
                  canManage={canManage}
                  onOwnMembershipChanged={onOwnMembershipChanged}
                />
              )}
            </PanelErrorBoundary>
          </Card>
          {canManage && (
            <Card title="Pending invitations">
              <PanelErrorBoundary>
                <PendingInvitations teamId={teamId} />
              </PanelErrorBoundary>
            </Card>
          )}
        </div>
        <div className="space-y-6">
          {canManage && (
            <Card title="Invite a teammate">
              <p className="mb-4 text-sm text-ink-soft">
                We e-mail a link that works once and expires after 7 days.
              </p>
              <InviteForm teamId={teamId} />
            </Card>
          )}
          {canManage && (
            <Card title="Rename the team">
              <RenameTeamForm
                key={teamId}
                teamId={teamId}
                currentName={teamName}
                onRenamed={refreshMe}
              />
            </Card>
          )}
          <Card title="What each role may do">
            <RoleGuide currentRole={role} />
          </Card>
        </div>
      </div>
    </div>
  );
}
