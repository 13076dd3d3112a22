import { useState } from 'react';
import type { AnswerValue, RespondentScreen, RespondentSession } from '@shared/schemas/respondent';
import { ConsentScreen } from './consent-screen';
import { InstructionsScreen } from './instructions-screen';
import { QuestionScreen } from './question-screen';
import { TaskScreen } from './task-screen';

/**
 * Whether a screen uses the wide frame: a choice task sets its alternatives side by side on a
 * large screen, so its frame, and the study title above it, span more of the page.
 */
export function isWideScreen(screen: RespondentScreen | null | undefined): boolean {
  return screen?.kind === 'task';
}

/**
 * One screen of the questionnaire, for the respondent app and the Preview section alike (the
 * preview must never differ from what respondents see). Give it a `key` per screen so every
 * screen is a fresh component with its own timer.
 */
export function RespondentScreenView({
  screen,
  definition,
  onAnswer,
  initial,
}: {
  screen: RespondentScreen;
  definition: RespondentSession['definition'];
  onAnswer: (value: AnswerValue, responseMs: number) => void;
  /** The answer given earlier, when the respondent came back to this screen through Back. */
  initial?: AnswerValue;
}) {
  const [shownAt] = useState(() => performance.now());
  const give = (value: AnswerValue) => onAnswer(value, performance.now() - shownAt);
  switch (screen.kind) {
    case 'consent':
      return (
        <ConsentScreen screen={screen} onAnswer={() => give({ kind: 'consent', agreed: true })} />
      );
    case 'instructions':
      return <InstructionsScreen screen={screen} onContinue={() => give({ kind: 'ack' })} />;
    case 'question':
      return <QuestionScreen screen={screen} onAnswer={give} initial={initial} />;
    case 'task':
      return (
        <TaskScreen
          screen={screen}
          definition={definition}
          onAnswer={(answer) => give({ kind: 'choice', ...answer })}
          initial={initial}
        />
      );
  }
}
