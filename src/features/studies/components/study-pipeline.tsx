import { NavLink } from 'react-router';
import { paths, studySections, type StudySection } from '@/config/paths';
import { cn } from '@/lib/cn';

export const sectionLabels: Record<StudySection, string> = {
  attributes: 'Attributes',
  tasks: 'Tasks',
  questionnaire: 'Questionnaire',
  preview: 'Preview',
  fieldwork: 'Fieldwork',
  responses: 'Responses',
  models: 'Models',
  tastes: 'Tastes',
  shares: 'Shares',
  exports: 'Exports',
};

type Props = {
  teamId: string;
  studyId: string;
  /** Sections that have a screen; the others are shown disabled. */
  available: ReadonlySet<StudySection>;
  /** Sections whose work is done (a tick beside the name). */
  done?: ReadonlySet<StudySection>;
  /** A study created from a choice file: "Imported" stands where Fieldwork would be. */
  imported?: boolean;
};

/**
 * The study's sections left to right, in the order the work flows. From 1024 px the steps are
 * packed tighter so all ten fit in the page width (1280 px and up) without scrolling; on phones
 * the bar scrolls sideways. The nav is positioned so that the screen-reader-only "done" words
 * (absolutely positioned) stay inside its scroll area instead of widening the page.
 */
export function StudyPipeline({ teamId, studyId, available, done, imported }: Props) {
  return (
    <nav
      aria-label="Study sections"
      className="relative -mx-4 overflow-x-auto px-4 sm:mx-0 sm:px-0"
    >
      <ol className="flex min-w-max items-center gap-1 pb-1 lg:gap-0.5">
        {studySections.map((section, i) => {
          const importedStep = imported && section === 'fieldwork';
          const label = importedStep ? 'Imported' : sectionLabels[section];
          const step = (
            <>
              <span
                aria-hidden
                className="num inline-flex size-5 items-center justify-center rounded-full border border-current text-[11px]"
              >
                {done?.has(section) ? '✓' : i + 1}
              </span>
              {label}
              {done?.has(section) && <span className="sr-only">, done</span>}
            </>
          );
          return (
            <li key={section} className="flex items-center gap-1">
              {i > 0 && <span aria-hidden className="h-px w-3 bg-line sm:w-5 lg:w-2" />}
              {available.has(section) && !importedStep ? (
                <NavLink
                  to={paths.studySection.getHref(teamId, studyId, section)}
                  className={({ isActive }) =>
                    cn(
                      'inline-flex min-h-10 items-center gap-2 rounded-full px-3 text-sm font-medium whitespace-nowrap transition-colors lg:gap-1.5 lg:px-2.5',
                      isActive
                        ? 'bg-primary text-white'
                        : 'text-ink-soft hover:bg-primary-soft hover:text-primary',
                    )
                  }
                >
                  {step}
                </NavLink>
              ) : (
                <span
                  aria-disabled="true"
                  title={
                    importedStep
                      ? 'The answers were imported from a file: no fieldwork, links or invitations'
                      : 'Available once this section ships'
                  }
                  className="inline-flex min-h-10 cursor-not-allowed items-center gap-2 rounded-full px-3 text-sm whitespace-nowrap text-ink-muted/70 lg:gap-1.5 lg:px-2.5"
                >
                  {step}
                </span>
              )}
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
