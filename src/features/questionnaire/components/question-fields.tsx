import { nanoid } from 'nanoid';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { NumberTextField } from '@/components/ui/number-text-field';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import type { ChoiceOption, Question, QuestionType } from '@shared/schemas/questionnaire';
import { isGeneratedKey, questionKeyFromText } from '@shared/schemas/question-keys';

const typeLabels: Record<QuestionType, string> = {
  single: 'Single choice',
  multiple: 'Multiple choice',
  number: 'Number in a range',
  text: 'Short text',
};

/** Switching the type keeps what still makes sense (key, wording, options). */
function changeType(q: Question, type: QuestionType): Question {
  const base = { key: q.key, text: q.text, help: q.help, required: q.required };
  const options: ChoiceOption[] =
    'options' in q
      ? q.options
      : [
          { id: 'a', label: 'First option' },
          { id: 'b', label: 'Second option' },
        ];
  if (type === 'single' || type === 'multiple') return { ...base, type, options };
  if (type === 'number') return { ...base, type, min: 0, max: 10, integer: true, unit: '' };
  return { ...base, type, maxLength: 500 };
}

export function QuestionFields({
  question,
  onChange,
  allowText = true,
  otherKeys = [],
}: {
  question: Question;
  onChange: (q: Question) => void;
  allowText?: boolean;
  /** Keys of the questionnaire's other questions: a generated key stays unique among them. */
  otherKeys?: string[];
}) {
  const q = question;
  // A key still generated from the text follows the text; a key the researcher typed stays.
  const changeText = (text: string) =>
    onChange({
      ...q,
      text,
      key: isGeneratedKey(q.key, q.text, otherKeys) ? questionKeyFromText(text, otherKeys) : q.key,
    });
  return (
    <div className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="Answer type"
          value={q.type}
          onChange={(e) => onChange(changeType(q, e.target.value as QuestionType))}
        >
          {(Object.keys(typeLabels) as QuestionType[])
            .filter((t) => allowText || t !== 'text')
            .map((t) => (
              <option key={t} value={t}>
                {typeLabels[t]}
              </option>
            ))}
        </SelectField>
        <TextField
          label="Key (column name in exports)"
          hint="Made from the question; type your own to keep it fixed."
          value={q.key}
          onChange={(e) => onChange({ ...q, key: e.target.value })}
          className="font-mono"
        />
      </div>
      <TextAreaField label="Question" value={q.text} onChange={(e) => changeText(e.target.value)} />
      <TextField
        label="Help text (optional)"
        value={q.help}
        onChange={(e) => onChange({ ...q, help: e.target.value })}
      />
      <CheckboxField
        label="An answer is required"
        checked={q.required}
        onChange={(required) => onChange({ ...q, required })}
      />
      {(q.type === 'single' || q.type === 'multiple') && (
        <fieldset className="space-y-2">
          <legend className="mb-1 text-sm font-medium text-ink">Options</legend>
          {q.options.map((o, i) => (
            <div key={o.id} className="flex items-end gap-2">
              <TextField
                label={`Option ${i + 1}`}
                value={o.label}
                wrapperClassName="flex-1"
                onChange={(e) =>
                  onChange({
                    ...q,
                    options: q.options.map((x) =>
                      x.id === o.id ? { ...x, label: e.target.value } : x,
                    ),
                  })
                }
              />
              <Button
                variant="ghost"
                size="sm"
                aria-label={`Remove option ${i + 1}`}
                disabled={q.options.length <= 2}
                onClick={() => onChange({ ...q, options: q.options.filter((x) => x.id !== o.id) })}
              >
                Remove
              </Button>
            </div>
          ))}
          <Button
            variant="secondary"
            size="sm"
            onClick={() =>
              onChange({
                ...q,
                options: [...q.options, { id: nanoid(8), label: `Option ${q.options.length + 1}` }],
              })
            }
          >
            Add option
          </Button>
        </fieldset>
      )}
      {q.type === 'number' && (
        <div className="grid gap-4 sm:grid-cols-4">
          <NumberTextField
            label="Lowest"
            required
            value={q.min}
            onCommit={(min) => onChange({ ...q, min: min ?? q.min })}
          />
          <NumberTextField
            label="Highest"
            required
            value={q.max}
            onCommit={(max) => onChange({ ...q, max: max ?? q.max })}
          />
          <TextField
            label="Unit (optional)"
            value={q.unit}
            onChange={(e) => onChange({ ...q, unit: e.target.value })}
          />
          <div className="self-end pb-1">
            <CheckboxField
              label="Whole numbers only"
              checked={q.integer}
              onChange={(integer) => onChange({ ...q, integer })}
            />
          </div>
        </div>
      )}
      {q.type === 'text' && (
        <NumberTextField
          label="Longest answer (characters)"
          required
          integer
          range={{ min: 1, max: 2000 }}
          value={q.maxLength}
          onCommit={(n) => onChange({ ...q, maxLength: n ?? q.maxLength })}
        />
      )}
    </div>
  );
}
