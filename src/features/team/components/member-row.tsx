import { useRef, useState } from 'react';
import { roles, type Role } from '@shared/permissions';
import type { Member } from '@shared/schemas/team';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { roleLabels } from './role-label';
import { formatDate } from '@/utils/format';
import { Options } from '@/components/ui/options';

const selectClass =
  'h-9 rounded-md border border-line bg-white px-2 text-sm text-ink focus:border-primary disabled:opacity-60';

/** One member: name and address, role (a select for owners), and removal with a confirmation. */
export function MemberRow({
  member,
  isSelf,
  canManage,
  busy,
  onChangeRole,
  onRemove,
}: {
  member: Member;
  isSelf: boolean;
  canManage: boolean;
  busy: boolean;
  /** Resolves once the change is saved or refused. */
  onChangeRole: (role: Role) => Promise<unknown>;
  onRemove: () => void;
}) {
  const [confirming, setConfirming] = useState(false);
  // The select only proposes a role; Save sends it, so arrowing through options changes nothing.
  const [draft, setDraft] = useState<Role | null>(null);
  const removeButton = useRef<HTMLButtonElement>(null);
  const selectId = `role-${member.userId}`;

  const keep = () => {
    setConfirming(false);
    // Back to where the person was, for keyboard users.
    requestAnimationFrame(() => removeButton.current?.focus());
  };

  return (
    <li className="py-3">
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <div className="min-w-0 flex-1 basis-48">
          <p className="font-medium text-ink">
            {member.name}
            {isSelf && <span className="ml-2 text-xs font-normal text-ink-muted">(you)</span>}
          </p>
          <p className="break-all text-sm text-ink-soft">{member.email}</p>
          <p className="text-xs text-ink-muted">Joined {formatDate(member.joinedAt)}</p>
        </div>
        {canManage ? (
          <div className="flex flex-wrap items-center gap-2">
            <label htmlFor={selectId} className="sr-only">
              Role of {member.name}
            </label>
            <select
              id={selectId}
              className={selectClass}
              value={draft ?? member.role}
              disabled={busy}
              onChange={(e) => {
                const role = e.target.value as Role;
                setDraft(role === member.role ? null : role);
              }}
            >
              <Options items={roles.map((r) => ({ value: r, label: roleLabels[r] }))} />
            </select>
            {draft && (
              <>
                <Button
                  size="sm"
                  busy={busy}
                  onClick={() => void onChangeRole(draft).finally(() => setDraft(null))}
                >
                  Save role<span className="sr-only"> of {member.name}</span>
                </Button>
                <Button variant="ghost" size="sm" disabled={busy} onClick={() => setDraft(null)}>
                  Undo<span className="sr-only"> role change of {member.name}</span>
                </Button>
              </>
            )}
            <Button
              ref={removeButton}
              variant="ghost"
              size="sm"
              disabled={busy || confirming}
              aria-label={`Remove ${member.name}`}
              onClick={() => setConfirming(true)}
            >
              Remove
            </Button>
          </div>
        ) : (
          <Badge tone={member.role === 'owner' ? 'accent' : 'primary'}>
            {roleLabels[member.role]}
          </Badge>
        )}
      </div>
      {confirming && (
        <div
          role="group"
          aria-label={`Confirm removing ${member.name}`}
          className="mt-3 rounded-md border border-danger/30 bg-danger-soft p-3 text-sm"
        >
          <p className="text-ink">
            Remove <strong>{member.name}</strong> from the team? They lose access to its studies at
            once{isSelf ? ', and so do you' : ''}.
          </p>
          <div className="mt-3 flex flex-wrap gap-2">
            <Button
              variant="danger"
              size="sm"
              autoFocus
              busy={busy}
              onClick={() => {
                setConfirming(false);
                onRemove();
              }}
            >
              Remove {member.name}
            </Button>
            <Button variant="secondary" size="sm" onClick={keep}>
              Keep
            </Button>
          </div>
        </div>
      )}
    </li>
  );
}
