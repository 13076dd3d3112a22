import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { EmptyState } from '@/components/ui/feedback';
import { paths, type StudySection } from '@/config/paths';

/**
 * A section that cannot show anything yet: why, and the way on to the section that comes first
 * (`Go to <label>`).
 */
export function EmptyUntilSection({
  teamId,
  studyId,
  title,
  section,
  label,
  children,
}: {
  teamId: string;
  studyId: string;
  title: ReactNode;
  section: StudySection;
  label: string;
  children: ReactNode;
}) {
  return (
    <EmptyState
      title={title}
      action={
        <Link
          className="font-medium text-primary underline"
          to={paths.studySection.getHref(teamId, studyId, section)}
        >
          Go to {label}
        </Link>
      }
    >
      {children}
    </EmptyState>
  );
}
