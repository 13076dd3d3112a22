import { Link } from 'react-router';
import type { StudySummary } from '@shared/schemas/study';
import { paths } from '@/config/paths';
import { Button } from '@/components/ui/button';
import { StudyStatusBadge } from './study-status-badge';

type Props = {
  teamId: string;
  study: StudySummary;
  canWrite: boolean;
  onDuplicate: () => void;
  onArchive: (archived: boolean) => void;
  busy?: boolean;
};

export function StudyCard({ teamId, study, canWrite, onDuplicate, onArchive, busy }: Props) {
  const c = study.counts;
  return (
    <li className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4 sm:flex-row sm:items-center">
      <div className="min-w-0 flex-1">
        <div className="flex flex-wrap items-center gap-2">
          <Link
            to={paths.study.getHref(teamId, study.id)}
            className="truncate text-base font-semibold text-ink hover:text-primary hover:underline"
          >
            {study.name}
          </Link>
          <StudyStatusBadge
            status={study.status}
            source={study.source}
            archived={study.archivedAt !== null}
          />
        </div>
        {study.description && (
          <p className="mt-1 line-clamp-2 text-sm text-ink-soft">{study.description}</p>
        )}
        <dl className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-muted">
          <div className="flex gap-1">
            <dt>Attributes</dt>
            <dd className="num">{c.attributes}</dd>
          </div>
          <div className="flex gap-1">
            <dt>Tasks</dt>
            <dd className="num">{c.tasks}</dd>
          </div>
          <div className="flex gap-1">
            <dt>Blocks</dt>
            <dd className="num">{c.blocks}</dd>
          </div>
          <div className="flex gap-1">
            <dt>Completed responses</dt>
            <dd className="num">{c.respondents}</dd>
          </div>
        </dl>
      </div>
      {canWrite && (
        <div className="flex gap-2">
          <Button variant="secondary" size="sm" onClick={onDuplicate} disabled={busy}>
            Duplicate
          </Button>
          <Button
            variant="ghost"
            size="sm"
            onClick={() => onArchive(study.archivedAt === null)}
            disabled={busy}
          >
            {study.archivedAt === null ? 'Archive' : 'Unarchive'}
          </Button>
        </div>
      )}
    </li>
  );
}
