/**
 * Which answered screens a respondent may go back to and change. The consent is given once; a
 * screening answer decided whether the respondent could go on, so it stands; choice tasks are
 * revisable unless the researcher turned that off (some designs want first reactions only).
 * The server enforces the same rule when a revision arrives.
 */
import type { QuestionnaireOptions } from '../schemas/questionnaire';
import type { RespondentScreen } from '../schemas/respondent';

export type BackOptions = Pick<QuestionnaireOptions, 'allowBack' | 'backOnTasks'>;

export function canRevise(screen: RespondentScreen, options: BackOptions): boolean {
  if (!options.allowBack) return false;
  switch (screen.kind) {
    case 'consent':
      return false;
    case 'question':
      return !screen.screening;
    case 'task':
      return options.backOnTasks;
    case 'instructions':
      return true;
  }
}

/** The screen Back leads to from `currentKey`: the answered screen just before it, if revisable. */
export function previousRevisable(
  screens: readonly RespondentScreen[],
  answered: ReadonlySet<string>,
  currentKey: string,
  options: BackOptions,
): RespondentScreen | null {
  const before = screens[screens.findIndex((s) => s.key === currentKey) - 1];
  if (!before || !answered.has(before.key)) return null;
  return canRevise(before, options) ? before : null;
}
