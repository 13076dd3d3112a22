import { useParams } from 'react-router';
import { roleCan, type Permission, type Role } from '@shared/permissions';
import { useMe } from '../api/get-me';

/** The team named in the URL and the signed-in user's role in it. */
export function useCurrentTeam(): {
  teamId: string;
  teamName: string;
  role: Role | null;
  can: (p: Permission) => boolean;
} {
  const { teamId = '' } = useParams();
  const { data: me } = useMe();
  const team = me?.teams.find((t) => t.id === teamId);
  const role = team?.role ?? null;
  return {
    teamId,
    teamName: team?.name ?? '',
    role,
    can: (p) => (role ? roleCan(role, p) : false),
  };
}
