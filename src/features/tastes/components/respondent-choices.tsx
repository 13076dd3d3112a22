/** A respondent's design-task choices, task by task, on the shared task card (read-only). */
import {
  ChoiceTaskCard,
  type ChoiceTaskAlternative,
} from '@/components/choice-task/choice-task-card';
import type { RespondentChoice } from '@shared/schemas/tastes';
import type { StudyDefinition } from '@shared/schemas/study-definition';

export function RespondentChoices({
  definition,
  choices,
}: {
  definition: StudyDefinition;
  choices: RespondentChoice[];
}) {
  if (choices.length === 0) return <p className="text-sm text-ink-muted">No choice answers.</p>;
  return (
    <ol className="space-y-6">
      {choices.map((c) => {
        const alternatives: ChoiceTaskAlternative[] = c.alternatives.map((a) =>
          a.fixed
            ? { kind: 'fixed' }
            : { kind: 'designed', designIndex: a.index, levels: a.levelIds },
        );
        const selected = c.alternatives.findIndex((a) => a.index === c.chosen);
        const chosen = c.alternatives[selected];
        return (
          <li key={c.task}>
            <h4 className="mb-2 text-sm font-semibold text-ink">
              Task {c.task}
              <span className="ml-2 font-normal text-ink-muted">
                answered {c.position}
                {c.position === 1 ? 'st' : c.position === 2 ? 'nd' : c.position === 3 ? 'rd' : 'th'}
                {c.responseMs !== null && ` · ${(c.responseMs / 1000).toFixed(1)} s`}
                {chosen && ` · chose ${chosen.label}`}
              </span>
            </h4>
            <ChoiceTaskCard
              definition={definition}
              alternatives={alternatives}
              selectedIndex={selected >= 0 ? selected : null}
              label={`Task ${c.task}: the respondent's choice`}
            />
          </li>
        );
      })}
    </ol>
  );
}
