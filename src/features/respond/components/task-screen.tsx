import { useState } from 'react';
import { Button } from '@/components/ui/button';
import {
  ChoiceTaskCard,
  type ChoiceTaskAlternative,
} from '@/components/choice-task/choice-task-card';
import type { AnswerValue, RespondentScreen, RespondentSession } from '@shared/schemas/respondent';
import { NextBar, ScreenFrame } from './screen-frame';

type Props = {
  screen: Extract<RespondentScreen, { kind: 'task' }>;
  definition: RespondentSession['definition'];
  onAnswer: (position: number) => void;
  /** The choice made earlier, when the respondent came back to this task. */
  initial?: AnswerValue;
};

/** One choice task: tap a card to choose it, then Next. The choice can change until Next. */
export function TaskScreen({ screen, definition, onAnswer, initial }: Props) {
  const [chosen, setChosen] = useState<number | null>(
    initial?.kind === 'choice' ? initial.position : null,
  );
  const alternatives: ChoiceTaskAlternative[] = screen.alternatives.map((a) =>
    a.fixed ? { kind: 'fixed' } : { kind: 'designed', designIndex: a.index, levels: a.levels },
  );
  const label = `Choice ${screen.taskIndex} of ${screen.taskCount}`;
  return (
    <ScreenFrame title={screen.title} eyebrow={label} wide>
      <ChoiceTaskCard
        definition={definition}
        alternatives={alternatives}
        selectedIndex={chosen}
        onChoose={setChosen}
        label={`${label}: ${screen.title}`}
      />
      <NextBar>
        <div className="flex items-center gap-3">
          <Button
            size="lg"
            className="w-full sm:w-auto sm:min-w-40"
            disabled={chosen === null}
            onClick={() => chosen !== null && onAnswer(chosen)}
          >
            Next
          </Button>
          <p className="hidden text-sm text-ink-muted sm:block" aria-live="polite">
            {chosen === null
              ? 'Choose one option to continue.'
              : 'You can still change your choice.'}
          </p>
        </div>
      </NextBar>
    </ScreenFrame>
  );
}
