import type { InviteeState } from '@shared/schemas/invitees';
import { Badge, type BadgeTone } from '@/components/ui/badge';

const look: Record<InviteeState, { label: string; tone: BadgeTone }> = {
  not_sent: { label: 'Not invited yet', tone: 'neutral' },
  invited: { label: 'Invited', tone: 'neutral' },
  started: { label: 'Started', tone: 'accent' },
  completed: { label: 'Completed', tone: 'primary' },
  unsubscribed: { label: 'Unsubscribed', tone: 'neutral' },
};

export function InviteeStateBadge({ state }: { state: InviteeState }) {
  return <Badge tone={look[state].tone}>{look[state].label}</Badge>;
}

export const inviteeStateOptions = Object.entries(look).map(([value, l]) => ({
  value: value as InviteeState,
  label: l.label,
}));
