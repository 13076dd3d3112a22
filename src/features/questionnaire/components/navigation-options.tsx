/**
 * How respondents move through the questionnaire: whether a Back button lets them change
 * earlier answers, and whether that reaches the choice tasks. The consent and screening
 * answers can never be changed (shared/survey/going-back.ts).
 */
import type { QuestionnaireOptions } from '@shared/schemas/questionnaire';
import { CheckboxField } from '@/components/ui/checkbox-field';

export function NavigationOptions({
  options,
  onChange,
  disabled,
}: {
  options: QuestionnaireOptions;
  onChange: (options: QuestionnaireOptions) => void;
  disabled: boolean;
}) {
  return (
    <fieldset className="space-y-2" disabled={disabled}>
      <legend className="sr-only">Going back</legend>
      <CheckboxField
        label="Respondents can go back and change earlier answers"
        checked={options.allowBack}
        onChange={(allowBack) => onChange({ ...options, allowBack })}
        hint="The latest answer counts; earlier ones are kept as history and marked in the exports. Consent and screening answers cannot be changed."
      />
      <CheckboxField
        label="Back also reaches the choice tasks"
        checked={options.allowBack && options.backOnTasks}
        disabled={!options.allowBack}
        onChange={(backOnTasks) => onChange({ ...options, backOnTasks })}
        hint="Turn off to keep first reactions to the tasks: respondents can still change their other answers."
      />
    </fieldset>
  );
}
