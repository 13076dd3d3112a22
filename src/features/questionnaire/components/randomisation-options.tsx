/**
 * What each respondent gets in their own random order: the tasks, the alternatives within a
 * task, and the attributes on every card. The orders are drawn from one stored seed per
 * respondent and exported as the randomisation record (server/services/respondent-plan.ts).
 */
import type { QuestionnaireOptions } from '@shared/schemas/questionnaire';
import { CheckboxField } from '@/components/ui/checkbox-field';

export function RandomisationOptions({
  options,
  labeled,
  onChange,
  disabled,
}: {
  options: QuestionnaireOptions;
  /** Labeled alternatives always keep their order: the label is part of what is chosen. */
  labeled: boolean;
  onChange: (options: QuestionnaireOptions) => void;
  disabled: boolean;
}) {
  return (
    <fieldset className="space-y-2" disabled={disabled}>
      <legend className="sr-only">Randomisation</legend>
      <CheckboxField
        label="Shuffle the order of the choice tasks for each respondent"
        checked={options.shuffleTasks}
        onChange={(shuffleTasks) => onChange({ ...options, shuffleTasks })}
        hint="Spreads learning and fatigue over the tasks. Off: every respondent sees the block's tasks in design order."
      />
      <CheckboxField
        label="Shuffle the left-to-right order of the alternatives on each task"
        checked={!labeled && options.shuffleAlternatives}
        disabled={labeled}
        onChange={(shuffleAlternatives) => onChange({ ...options, shuffleAlternatives })}
        hint={
          labeled
            ? 'Labeled alternatives always keep their order. The opt-out or current situation always stays last.'
            : 'Keeps a habit of choosing the left card from looking like a preference. The opt-out or current situation always stays last.'
        }
      />
      <CheckboxField
        label="Give each respondent their own attribute order"
        checked={options.shuffleAttributes}
        onChange={(shuffleAttributes) => onChange({ ...options, shuffleAttributes })}
        hint="Drawn once per respondent and kept on every task, so cards stay easy to compare. Off: attributes appear as listed under Attributes."
      />
      <p className="text-xs text-ink-soft">
        Every respondent's orders are kept and can be downloaded as the randomisation record under
        Exports.
      </p>
    </fieldset>
  );
}
