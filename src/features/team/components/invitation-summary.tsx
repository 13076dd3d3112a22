import { roleDescriptions } from '@shared/permissions';
import type { InvitationPreview } from '@shared/schemas/team';
import { Badge } from '@/components/ui/badge';
import { roleLabels } from './role-label';
import { formatDate } from '@/utils/format';

/** Who invites whom to which team, in which role, until when. */
export function InvitationSummary({ invitation }: { invitation: InvitationPreview }) {
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink">
        {invitation.invitedBy ? <strong>{invitation.invitedBy}</strong> : 'A team owner'} invited{' '}
        <strong className="break-all">{invitation.email}</strong> to join
      </p>
      <div className="rounded-lg border border-line bg-canvas p-4">
        <p className="text-lg font-semibold text-ink">{invitation.teamName}</p>
        <dl className="mt-2 space-y-1 text-sm">
          <div className="flex flex-wrap items-center gap-2">
            <dt className="text-ink-muted">Role</dt>
            <dd>
              <Badge tone="primary">{roleLabels[invitation.role]}</Badge>
            </dd>
          </div>
          <div className="text-ink-soft">
            <dt className="sr-only">What this role may do</dt>
            <dd>{roleDescriptions[invitation.role]}.</dd>
          </div>
          <div className="flex flex-wrap gap-1 text-ink-muted">
            <dt>Link valid until</dt>
            <dd>{formatDate(invitation.expiresAt)}</dd>
          </div>
        </dl>
      </div>
    </div>
  );
}
