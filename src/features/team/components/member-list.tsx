import { useState } from 'react';
import type { Role } from '@shared/permissions';
import type { Member } from '@shared/schemas/team';
import { Alert } from '@/components/ui/feedback';
import { ApiError } from '@/lib/api-client';
import { useChangeMemberRole } from '../api/change-member-role';
import { useRemoveMember } from '../api/remove-member';
import { MemberRow } from './member-row';
import { roleLabels } from './role-label';

/** Turns the server's refusals into a message that says what to do next. */
function ProblemAlert({ error }: { error: unknown }) {
  if (!error) return null;
  if (error instanceof ApiError && error.code === 'last_owner') {
    return (
      <Alert tone="danger" title="A team needs at least one owner">
        This is the only owner, so the role cannot change and they cannot be removed. Make another
        member owner first, then try again.
      </Alert>
    );
  }
  return (
    <Alert tone="danger" title="That did not work">
      {error instanceof Error ? error.message : 'Something went wrong.'}
    </Alert>
  );
}

export function MemberList({
  teamId,
  members,
  currentUserId,
  canManage,
  onOwnMembershipChanged,
}: {
  teamId: string;
  members: Member[];
  currentUserId: string;
  canManage: boolean;
  /** The signed-in user changed their own role or left: the session must be refreshed. */
  onOwnMembershipChanged: (change: 'role' | 'removed') => void;
}) {
  const [notice, setNotice] = useState('');
  const changeRole = useChangeMemberRole({
    onSuccess: ({ userId }) => userId === currentUserId && onOwnMembershipChanged('role'),
  });
  const remove = useRemoveMember({
    onSuccess: ({ userId }) => userId === currentUserId && onOwnMembershipChanged('removed'),
  });
  const busyId = changeRole.isPending
    ? changeRole.variables?.userId
    : remove.isPending
      ? remove.variables?.userId
      : undefined;

  const onChangeRole = async (m: Member, role: Role) => {
    remove.reset();
    setNotice('');
    try {
      await changeRole.mutateAsync({ teamId, userId: m.userId, role });
      setNotice(`${m.name} is now ${roleLabels[role].toLowerCase()}.`);
    } catch {
      // Shown by ProblemAlert from the mutation state.
    }
  };
  const onRemove = (m: Member) => {
    changeRole.reset();
    setNotice('');
    remove.mutate(
      { teamId, userId: m.userId },
      { onSuccess: () => setNotice(`${m.name} was removed from the team.`) },
    );
  };

  return (
    <div className="space-y-3">
      <ProblemAlert error={changeRole.error ?? remove.error} />
      <p role="status" className="text-sm text-success empty:hidden">
        {notice}
      </p>
      <ul className="divide-y divide-line" aria-label="Team members">
        {members.map((m) => (
          <MemberRow
            key={m.userId}
            member={m}
            isSelf={m.userId === currentUserId}
            canManage={canManage}
            busy={busyId === m.userId}
            onChangeRole={(role) => onChangeRole(m, role)}
            onRemove={() => onRemove(m)}
          />
        ))}
      </ul>
    </div>
  );
}
