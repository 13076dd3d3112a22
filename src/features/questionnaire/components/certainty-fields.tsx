/**
 * The certainty question under every design task, switched on from the tasks page. The help
 * names the published sources (docs/methods.md, "Certainty after each choice").
 */
import { CheckboxField } from '@/components/ui/checkbox-field';
import { SelectField, TextField } from '@/components/ui/field';
import {
  defaultCertaintyScale,
  type CertaintyScale,
  type QuestionnairePage,
} from '@shared/schemas/questionnaire';

type TasksPage = Extract<QuestionnairePage, { kind: 'tasks' }>;

export const certaintyHelp =
  'Each answer is stored with its choice and exported beside it, so uncertain choices can be recoded or modelled later. Sources: Ready, Champ & Lawton (2010), Land Economics 86(2); Lundhede et al. (2009), Journal of Choice Modelling 2(2).';

export function CertaintyFields({
  page,
  onChange,
}: {
  page: TasksPage;
  onChange: (page: TasksPage) => void;
}) {
  const scale = page.certainty;
  const set = (patch: Partial<CertaintyScale>) =>
    scale && onChange({ ...page, certainty: { ...scale, ...patch } });
  return (
    <div className="space-y-3">
      <CheckboxField
        label="Ask how sure respondents are after each choice"
        checked={!!scale}
        onChange={(on) =>
          onChange({ ...page, certainty: on ? defaultCertaintyScale() : undefined })
        }
        hint={certaintyHelp}
      />
      {scale && (
        <div className="space-y-3 border-l-2 border-line pl-4">
          <TextField
            label="Question"
            value={scale.question}
            onChange={(e) => set({ question: e.target.value })}
          />
          <SelectField
            label="Points on the scale"
            value={scale.points}
            onChange={(e) => set({ points: Number(e.target.value) })}
            hint="Numbered from 1 (least sure)."
          >
            {[3, 4, 5, 6, 7, 8, 9, 10].map((n) => (
              <option key={n} value={n}>
                1 to {n}
              </option>
            ))}
          </SelectField>
          <div className="grid gap-3 sm:grid-cols-2">
            {(
              [
                ['lowLabel', 'Words at 1'],
                ['highLabel', `Words at ${scale.points}`],
              ] as const
            ).map(([key, label]) => (
              <TextField
                key={key}
                label={label}
                value={scale[key]}
                onChange={(e) => set({ [key]: e.target.value })}
              />
            ))}
          </div>
        </div>
      )}
    </div>
  );
}
