import { Link } from 'react-router';
import { paths } from '@/config/paths';
import { Badge } from '@/components/ui/badge';
import { Spinner } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { useMyTeams } from '../api/get-my-teams';
import { roleLabels } from './role-label';

const linkClass = 'text-sm font-medium text-primary underline-offset-2 hover:underline';

/** The teams of the signed-in user with their role in each. */
export function MyTeams() {
  const teams = useMyTeams();
  if (teams.isPending) return <Spinner />;
  if (teams.isError) return <ErrorText error={teams.error} />;
  if (teams.data.length === 0) {
    return <p className="text-sm text-ink-muted">You are not in any team yet. Create one below.</p>;
  }
  return (
    <ul className="divide-y divide-line" aria-label="Your teams">
      {teams.data.map((team) => (
        <li key={team.id} className="flex flex-wrap items-center gap-x-4 gap-y-2 py-3">
          <div className="flex min-w-0 flex-1 basis-40 items-center gap-2">
            <span className="truncate font-medium text-ink">{team.name}</span>
            <Badge tone={team.role === 'owner' ? 'accent' : 'primary'}>
              {roleLabels[team.role]}
            </Badge>
          </div>
          <div className="flex gap-4">
            <Link to={paths.studies.getHref(team.id)} className={linkClass}>
              Studies<span className="sr-only"> of {team.name}</span>
            </Link>
            <Link to={paths.members.getHref(team.id)} className={linkClass}>
              Members<span className="sr-only"> of {team.name}</span>
            </Link>
          </div>
        </li>
      ))}
    </ul>
  );
}
