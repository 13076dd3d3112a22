import type { FieldworkStats } from '@shared/schemas/fieldwork';
import { formatCount } from '@/utils/format';
import { StatTile } from './stat-tile';

export function InvitationSummary({ invitations }: { invitations: FieldworkStats['invitations'] }) {
  const i = invitations;
  return (
    <dl className="grid grid-cols-2 gap-2 sm:grid-cols-3 sm:gap-3 lg:grid-cols-6">
      <StatTile label="On the list" value={formatCount(i.total)} />
      <StatTile label="Invited" value={formatCount(i.sent)} />
      <StatTile label="Reminded" value={formatCount(i.reminded)} />
      <StatTile label="Unsubscribed" value={formatCount(i.unsubscribed)} />
      <StatTile label="Started" value={formatCount(i.started)} />
      <StatTile label="Completed" value={formatCount(i.completed)} tone="primary" />
    </dl>
  );
}
