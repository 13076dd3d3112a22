import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { paths, type StudySection } from '@/config/paths';

/** The way on from a section that cannot show anything yet to the one that comes first. */
export function GoToSection({
  teamId,
  studyId,
  section,
  children,
}: {
  teamId: string;
  studyId: string;
  section: StudySection;
  children: ReactNode;
}) {
  return (
    <Link
      className="font-medium text-primary underline"
      to={paths.studySection.getHref(teamId, studyId, section)}
    >
      {children}
    </Link>
  );
}
