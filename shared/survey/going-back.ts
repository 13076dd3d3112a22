/**
 * Which answered screens a respondent may go back to and change. The consent is given once; a
 * screening answer decided whether the respondent could go on, so it stands; choice tasks are
 * revisable unless the researcher turned that off (some designs want first reactions only).
 * The server enforces the same rule when a revision arrives.
 */
import type { QuestionnaireOptions } from '../schemas/questionnaire';
import { answerValueSchema, type AnswerValue, type RespondentScreen } from '../schemas/respondent';

export type BackOptions = Pick<QuestionnaireOptions, 'allowBack' | 'backOnTasks'>;

export function canRevise(screen: RespondentScreen, options: BackOptions): boolean {
  if (!options.allowBack) return false;
  switch (screen.kind) {
    case 'consent':
      return false;
    case 'question':
      // A skip rule's answer, and a page shown or skipped by one, stand once given: changing
      // them would change which later pages apply after those were answered or skipped.
      return !screen.screening && !screen.showIf && !screen.decidesSkips;
    case 'task':
      return options.backOnTasks;
    case 'instructions':
      return !screen.showIf;
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

/**
 * The stored answers of the screens Back may lead to (and of questions a skip rule reads), as
 * the respondent gave them (a choice
 * task's stored row also carries its task kind; only the on-screen position goes back).
 */
export function givenOnRevisable(
  screens: readonly RespondentScreen[],
  stored: ReadonlyMap<string, unknown>,
  options: BackOptions,
): Record<string, AnswerValue> {
  const given: Record<string, AnswerValue> = {};
  for (const screen of screens) {
    // Answers a skip rule reads come back too, so a session resumed elsewhere skips alike.
    const needed =
      canRevise(screen, options) || (screen.kind === 'question' && screen.decidesSkips);
    if (!stored.has(screen.key) || !needed) continue;
    const raw = stored.get(screen.key) as { kind?: unknown; position?: unknown } | null;
    const value = answerValueSchema.safeParse(
      raw?.kind === 'choice' ? { kind: 'choice', position: raw.position } : raw,
    );
    if (value.success) given[screen.key] = value.data;
  }
  return given;
}
