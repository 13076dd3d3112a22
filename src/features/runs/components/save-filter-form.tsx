/**
 * Saves a named respondent filter from one background question: respondents whose answer is
 * one of the ticked options. Runs can then be limited to that filter.
 */
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  createRespondentFilterSchema,
  type CreateRespondentFilterInput,
} from '@shared/schemas/run';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Alert } from '@/components/ui/feedback';
import { applyFieldErrors } from '@/lib/api-client';
import { useCreateRespondentFilter } from '../api/create-respondent-filter';
import { formField } from '@/components/ui/form-field';
import { Options } from '@/components/ui/options';

export type FilterQuestion = {
  key: string;
  text: string;
  options: { id: string; label: string }[];
};

export function SaveFilterForm({
  teamId,
  studyId,
  questions,
}: {
  teamId: string;
  studyId: string;
  questions: FilterQuestion[];
}) {
  const save = useCreateRespondentFilter(teamId, studyId);
  const [saved, setSaved] = useState<string | null>(null);
  const form = useForm<CreateRespondentFilterInput>({
    resolver: zodResolver(createRespondentFilterSchema),
    defaultValues: {
      name: '',
      definition: { conditions: [{ question: questions[0]?.key ?? '', values: [] }] },
    },
  });
  const {
    register,
    handleSubmit,
    setError,
    reset,
    control,
    formState: { errors },
  } = form;
  const key = useWatch({ control, name: 'definition.conditions.0.question' });
  const question = questions.find((q) => q.key === key);
  if (questions.length === 0)
    return (
      <p className="text-sm text-ink-soft">
        Filters use background questions with answer options; this study has none.
      </p>
    );
  const onSubmit = handleSubmit(async (input) => {
    try {
      const filter = await save.mutateAsync(input);
      setSaved(filter.name);
      reset();
    } catch (err) {
      if (!applyFieldErrors(err, setError))
        setError('root', { message: err instanceof Error ? err.message : 'Not saved.' });
    }
  });
  const conditionError =
    errors.definition?.conditions?.[0]?.values?.message ?? errors.definition?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Filter name" {...formField(form, 'name')} />
        <SelectField label="Background question" {...register('definition.conditions.0.question')}>
          <Options items={questions.map((q) => ({ value: q.key, label: q.text }))} />
        </SelectField>
      </div>
      <fieldset>
        <legend className="mb-1 text-sm font-medium text-ink">Keep respondents who answered</legend>
        <div className="flex flex-wrap gap-x-5 gap-y-2">
          {question?.options.map((o) => (
            <label key={o.id} className="flex items-center gap-2 text-sm text-ink">
              <input
                type="checkbox"
                value={o.id}
                className="size-4 accent-primary"
                {...register('definition.conditions.0.values')}
              />
              {o.label}
            </label>
          ))}
        </div>
        {conditionError && (
          <p role="alert" className="mt-1 text-xs font-medium text-danger">
            {conditionError}
          </p>
        )}
      </fieldset>
      {errors.root?.message && <Alert tone="danger">{errors.root.message}</Alert>}
      {saved && <Alert tone="success">Saved “{saved}”; choose it under Respondents.</Alert>}
      <div className="flex justify-end">
        <Button type="submit" variant="secondary" busy={save.isPending}>
          Save filter
        </Button>
      </div>
    </form>
  );
}
