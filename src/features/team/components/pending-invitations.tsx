import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { useInvitations } from '../api/get-invitations';
import { useCancelInvitation } from '../api/cancel-invitation';
import { roleLabels } from './role-label';
import { formatDate } from '@/utils/format';

/** Invitations sent but not yet accepted; an owner can take one back. */
export function PendingInvitations({ teamId }: { teamId: string }) {
  const invitations = useInvitations(teamId);
  const cancel = useCancelInvitation();

  if (invitations.isPending) return <Spinner />;
  if (invitations.isError) return <ErrorText error={invitations.error} />;
  if (invitations.data.length === 0) {
    return <p className="text-sm text-ink-muted">No invitations are waiting for an answer.</p>;
  }
  return (
    <div className="space-y-2">
      <ErrorText error={cancel.error} />
      <ul className="divide-y divide-line" aria-label="Pending invitations">
        {invitations.data.map((inv) => (
          <li key={inv.id} className="flex flex-wrap items-center gap-x-3 gap-y-1 py-2">
            <div className="min-w-0 flex-1 basis-40">
              <p className="break-all text-sm font-medium text-ink">{inv.email}</p>
              <p className="text-xs text-ink-muted">Link valid until {formatDate(inv.expiresAt)}</p>
            </div>
            <div className="flex items-center gap-2">
              <Badge tone="primary">{roleLabels[inv.role]}</Badge>
              <Button
                variant="ghost"
                size="sm"
                busy={cancel.isPending && cancel.variables?.invitationId === inv.id}
                aria-label={`Cancel the invitation to ${inv.email}`}
                onClick={() => cancel.mutate({ teamId, invitationId: inv.id })}
              >
                Cancel
              </Button>
            </div>
          </li>
        ))}
      </ul>
    </div>
  );
}
