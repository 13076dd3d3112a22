import { roleDescriptions, roles, type Role } from '@shared/permissions';
import { Badge } from '@/components/ui/badge';
import { roleLabels } from './role-label';

/** What each role may do, from the same table the server enforces (shared/permissions.ts). */
export function RoleGuide({ currentRole }: { currentRole: Role | null }) {
  return (
    <dl className="space-y-3">
      {roles.map((r) => (
        <div key={r}>
          <dt className="flex items-center gap-2 text-sm font-semibold text-ink">
            {roleLabels[r]}
            {r === currentRole && <Badge tone="accent">your role</Badge>}
          </dt>
          <dd className="text-sm text-ink-soft">{roleDescriptions[r]}.</dd>
        </div>
      ))}
    </dl>
  );
}
