import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { cn } from '@/lib/cn';
import type { AnswerValue, RespondentScreen } from '@shared/schemas/respondent';
import type { Question } from '@shared/schemas/questionnaire';
import { NextBar, ScreenFrame } from './screen-frame';
import { useInterfaceText } from '@/lib/interface-texts';
import { readTypedNumber } from '@/lib/typed-number';
import { questionAnswerProblem } from '@shared/survey/question-answer';

type Props = {
  screen: Extract<RespondentScreen, { kind: 'question' }>;
  onAnswer: (value: AnswerValue) => void;
  /** The answer given earlier, when the respondent came back to this question. */
  initial?: AnswerValue;
};

const optionClass =
  'flex min-h-14 cursor-pointer items-center gap-3 rounded-lg border-2 border-line bg-white px-4 py-3 text-base text-ink has-[:checked]:border-primary has-[:checked]:bg-primary-soft has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-accent';

/** The answer a question's current input gives, or an error to show. */
function toValue(
  t: ReturnType<typeof useInterfaceText>,
  q: Question,
  raw: { single: string | null; multiple: string[]; number: string; text: string },
): { value: AnswerValue } | { error: string } {
  const value: AnswerValue =
    q.type === 'single'
      ? { kind: 'single', optionId: raw.single }
      : q.type === 'multiple'
        ? { kind: 'multiple', optionIds: raw.multiple }
        : q.type === 'number'
          ? { kind: 'number', number: readTypedNumber(raw.number) }
          : { kind: 'text', text: raw.text.slice(0, q.maxLength) };
  // The server checks the answer with the same rule (shared/survey/question-answer.ts).
  const problem = questionAnswerProblem(q, value);
  return problem ? { error: t(problem.key, problem.values) } : { value };
}

export function QuestionScreen({ screen, onAnswer, initial }: Props) {
  const q = screen.question;
  const t = useInterfaceText();
  const id = useId();
  const [single, setSingle] = useState(initial?.kind === 'single' ? initial.optionId : null);
  const [multiple, setMultiple] = useState(initial?.kind === 'multiple' ? initial.optionIds : []);
  const [number, setNumber] = useState(
    initial?.kind === 'number' && initial.number !== null ? String(initial.number) : '',
  );
  const [text, setText] = useState(initial?.kind === 'text' ? initial.text : '');
  const [error, setError] = useState<string | null>(null);
  const describedBy =
    [q.help ? `${id}-help` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') ||
    undefined;

  const submit = () => {
    const result = toValue(t, q, { single, multiple, number, text });
    if ('error' in result) setError(result.error);
    else onAnswer(result.value);
  };

  return (
    <ScreenFrame title={q.text}>
      {q.help && (
        <p id={`${id}-help`} className="-mt-2 mb-4 text-sm text-ink-muted">
          {q.help}
        </p>
      )}
      <form
        noValidate
        onSubmit={(e) => {
          e.preventDefault();
          submit();
        }}
      >
        {(q.type === 'single' || q.type === 'multiple') && (
          <fieldset aria-describedby={describedBy}>
            <legend className="sr-only">{q.text}</legend>
            <div className="space-y-2">
              {q.options.map((o) => (
                <label key={o.id} className={optionClass}>
                  <input
                    type={q.type === 'single' ? 'radio' : 'checkbox'}
                    name={id}
                    value={o.id}
                    checked={q.type === 'single' ? single === o.id : multiple.includes(o.id)}
                    onChange={(e) => {
                      setError(null);
                      if (q.type === 'single') setSingle(o.id);
                      else
                        setMultiple((m) =>
                          e.target.checked ? [...m, o.id] : m.filter((x) => x !== o.id),
                        );
                    }}
                    className="size-5 shrink-0 accent-[var(--color-primary)]"
                  />
                  <span>{o.label}</span>
                </label>
              ))}
            </div>
          </fieldset>
        )}
        {q.type === 'number' && (
          <div className="flex items-center gap-3">
            <label htmlFor={`${id}-n`} className="sr-only">
              {q.text}
            </label>
            <input
              id={`${id}-n`}
              type="text"
              inputMode={q.integer ? 'numeric' : 'decimal'}
              autoComplete="off"
              value={number}
              onChange={(e) => {
                setError(null);
                setNumber(e.target.value);
              }}
              aria-invalid={error ? true : undefined}
              aria-describedby={describedBy}
              className="h-14 w-40 rounded-lg border-2 border-line bg-white px-4 text-lg text-ink focus:border-primary focus:outline-none aria-[invalid=true]:border-danger"
            />
            {q.unit && <span className="text-base text-ink-soft">{q.unit}</span>}
            <span className="text-sm text-ink-muted">
              ({q.min}–{q.max})
            </span>
          </div>
        )}
        {q.type === 'text' && (
          <>
            <label htmlFor={`${id}-t`} className="sr-only">
              {q.text}
            </label>
            <textarea
              id={`${id}-t`}
              value={text}
              maxLength={q.maxLength}
              onChange={(e) => {
                setError(null);
                setText(e.target.value);
              }}
              aria-invalid={error ? true : undefined}
              aria-describedby={describedBy}
              className="min-h-32 w-full rounded-lg border-2 border-line bg-white p-3 text-base text-ink focus:border-primary focus:outline-none aria-[invalid=true]:border-danger"
            />
          </>
        )}
        {error && (
          <p id={`${id}-error`} role="alert" className="mt-3 text-sm font-medium text-danger">
            {error}
          </p>
        )}
        <NextBar>
          <Button type="submit" size="lg" className={cn('w-full sm:w-auto sm:min-w-40')}>
            {t('ui.next')}
          </Button>
        </NextBar>
      </form>
    </ScreenFrame>
  );
}
