import { useParams } from 'react-router';
import { Alert, Card, PageHeader, Spinner } from '@/components/ui/feedback';
import { useMe } from '@/features/auth/api/get-me';
import { useMembers } from '@/features/team/api/get-members';
import { AuditLog } from '@/features/audit/components/audit-log';

export function Component() {
  const { teamId = '' } = useParams();
  const { data: me } = useMe();
  const members = useMembers(teamId);
  const role = me?.teams.find((t) => t.id === teamId)?.role;
  if (!me || members.isPending) return <Spinner />;

  return (
    <div className="mx-auto max-w-5xl">
      <PageHeader
        title="Audit trail"
        description="Who did what and when in this team: sign-ins, roles, study status, exclusions, runs, personal-data downloads and erasures. Events can be read and downloaded, never changed."
      />
      {role !== 'owner' ? (
        <Alert tone="warning">Only owners can read the audit trail.</Alert>
      ) : (
        <Card title="Events">
          <AuditLog
            teamId={teamId}
            members={(members.data ?? []).map((m) => ({ id: m.userId, name: m.name }))}
          />
        </Card>
      )}
    </div>
  );
}
