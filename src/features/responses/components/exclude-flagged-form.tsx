/** Bulk exclusion of flagged respondents, with a reason recorded on each of them. */
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  excludeFlaggedSchema,
  qualityFlagKeys,
  qualityFlagLabels,
  type ExcludeFlaggedInput,
  type ResponsesSummary,
} from '@shared/schemas/responses';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { TextField } from '@/components/ui/field';
import { ErrorText } from '@/components/ui/error-boundary';
import { useExcludeFlagged } from '../api/exclude-flagged';
import { formField } from '@/components/ui/form-field';

export function ExcludeFlaggedForm({
  teamId,
  studyId,
  summary,
}: {
  teamId: string;
  studyId: string;
  summary: ResponsesSummary;
}) {
  const exclude = useExcludeFlagged(teamId, studyId);
  const form = useForm<ExcludeFlaggedInput>({
    resolver: zodResolver(excludeFlaggedSchema),
    defaultValues: { flags: ['speeder', 'samePosition'], reason: '' },
  });
  const onSubmit = form.handleSubmit((v) => exclude.mutate(v));
  const { errors } = form.formState;
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3">
      <fieldset>
        <legend className="text-sm font-medium text-ink">Exclude respondents flagged as</legend>
        <div className="mt-2 grid gap-1 sm:grid-cols-2">
          {qualityFlagKeys.map((k) => (
            <label key={k} className="flex items-center gap-2 text-sm text-ink">
              <input
                type="checkbox"
                value={k}
                className="size-4 accent-primary"
                {...form.register('flags')}
              />
              {qualityFlagLabels[k].label}
              <span className="num text-ink-muted">({summary.flagged[k]})</span>
            </label>
          ))}
        </div>
        {errors.flags && (
          <p role="alert" className="mt-1 text-xs font-medium text-danger">
            {errors.flags.message}
          </p>
        )}
      </fieldset>
      <TextField
        label="Reason (kept with each exclusion)"
        placeholder="e.g. Analysis plan §5: speeders and same-position answers"
        {...formField(form, 'reason')}
      />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant="danger" busy={exclude.isPending}>
          Exclude flagged
        </Button>
        <p className="text-xs text-ink-muted">
          Excluded respondents stay in the data and can be included again.
        </p>
      </div>
      <ErrorText error={exclude.error} />
      {exclude.data && (
        <Alert tone="success">
          {exclude.data.excluded} respondent{exclude.data.excluded === 1 ? '' : 's'} excluded.
        </Alert>
      )}
    </form>
  );
}
