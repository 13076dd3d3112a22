import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  updateQualitySettingsSchema,
  type QualitySettings,
  type UpdateQualitySettingsInput,
} from '@shared/schemas/responses';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { ErrorText } from '@/components/ui/error-boundary';
import { applyFieldErrors } from '@/lib/api-client';
import { useUpdateQualitySettings } from '../api/update-quality-settings';
import { formField } from '@/components/ui/form-field';

/** The speeder threshold as a fraction of the median completion time. */
export function QualitySettingsForm({
  teamId,
  studyId,
  settings,
}: {
  teamId: string;
  studyId: string;
  settings: QualitySettings;
}) {
  const save = useUpdateQualitySettings(teamId, studyId);
  const form = useForm<UpdateQualitySettingsInput>({
    resolver: zodResolver(updateQualitySettingsSchema),
    values: settings,
  });
  const onSubmit = form.handleSubmit((v) =>
    save.mutate(v, { onError: (e) => applyFieldErrors(e, form.setError as never) }),
  );
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-end gap-3">
      <TextField
        label="Speeder threshold (fraction of the median time)"
        hint="Product default: ½ of the median. Set it in your analysis plan before fieldwork ends."
        type="number"
        inputMode="decimal"
        step="0.05"
        min="0.1"
        max="0.9"
        wrapperClassName="w-full sm:w-80"
        className="font-mono"
        {...formField(form, 'speederFraction', { valueAsNumber: true })}
      />
      <Button type="submit" variant="secondary" busy={save.isPending}>
        Apply
      </Button>
      <ErrorText error={save.error && !form.formState.errors.speederFraction ? save.error : null} />
    </form>
  );
}
