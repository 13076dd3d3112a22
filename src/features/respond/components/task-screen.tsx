import { useState } from 'react';
import { Button } from '@/components/ui/button';
import {
  ChoiceTaskCard,
  type ChoiceTaskAlternative,
} from '@/components/choice-task/choice-task-card';
import type { AnswerValue, RespondentScreen, RespondentSession } from '@shared/schemas/respondent';
import { CertaintyScaleField } from './certainty-scale';
import { NextBar, ScreenFrame } from './screen-frame';
import { useInterfaceText } from '@/lib/interface-texts';

type Props = {
  screen: Extract<RespondentScreen, { kind: 'task' }>;
  definition: RespondentSession['definition'];
  onAnswer: (answer: { position: number; certainty?: number }) => void;
  /** The choice made earlier, when the respondent came back to this task. */
  initial?: AnswerValue;
};

/** One choice task: tap a card to choose it, then Next. The choice can change until Next. */
export function TaskScreen({ screen, definition, onAnswer, initial }: Props) {
  const [chosen, setChosen] = useState<number | null>(
    initial?.kind === 'choice' ? initial.position : null,
  );
  const [certainty, setCertainty] = useState<number | null>(
    initial?.kind === 'choice' ? (initial.certainty ?? null) : null,
  );
  const ready = chosen !== null && (!screen.certainty || certainty !== null);
  const alternatives: ChoiceTaskAlternative[] = screen.alternatives.map((a) =>
    a.fixed ? { kind: 'fixed' } : { kind: 'designed', designIndex: a.index, levels: a.levels },
  );
  const t = useInterfaceText();
  const label = t('ui.task_progress', { n: screen.taskIndex, total: screen.taskCount });
  return (
    <ScreenFrame title={screen.title} eyebrow={label} wide>
      <ChoiceTaskCard
        definition={definition}
        alternatives={alternatives}
        selectedIndex={chosen}
        onChoose={setChosen}
        label={`${label}: ${screen.title}`}
      />
      {screen.certainty && (
        <CertaintyScaleField scale={screen.certainty} value={certainty} onChange={setCertainty} />
      )}
      <NextBar>
        <div className="flex items-center gap-3">
          <Button
            size="lg"
            className="w-full sm:w-auto sm:min-w-40"
            disabled={!ready}
            onClick={() =>
              chosen !== null &&
              ready &&
              onAnswer({ position: chosen, ...(certainty !== null ? { certainty } : {}) })
            }
          >
            {t('ui.next')}
          </Button>
          <p className="hidden text-sm text-ink-muted sm:block" aria-live="polite">
            {chosen === null
              ? t('ui.choose_prompt')
              : !ready
                ? t('ui.certainty_prompt')
                : t('ui.can_change')}
          </p>
        </div>
      </NextBar>
    </ScreenFrame>
  );
}
