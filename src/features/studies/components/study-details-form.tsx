import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import type { Study } from '@shared/schemas/study';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorText } from '@/components/ui/error-boundary';
import { applyFieldErrors } from '@/lib/api-client';
import { useUpdateStudy } from '../api/update-study';

const detailsSchema = z.object({
  name: z.string().trim().min(1, 'Give the study a name').max(160),
  description: z.string().trim().max(2000),
});
type Values = z.infer<typeof detailsSchema>;

/** Rename a study and edit its internal description. */
export function StudyDetailsForm({
  teamId,
  study,
  onDone,
}: {
  teamId: string;
  study: Study;
  onDone: () => void;
}) {
  const update = useUpdateStudy(teamId, study.id);
  const form = useForm<Values>({
    resolver: zodResolver(detailsSchema),
    defaultValues: { name: study.name, description: study.description },
  });
  const { errors, isSubmitting } = form.formState;
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await update.mutateAsync(values);
      onDone();
    } catch (err) {
      applyFieldErrors(err, form.setError);
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Study details" className="max-w-xl space-y-3">
      <TextField label="Study name" error={errors.name?.message} {...form.register('name')} />
      <TextAreaField
        label="Description"
        hint="For your team; respondents do not see it."
        error={errors.description?.message}
        {...form.register('description')}
      />
      {update.error && <ErrorText error={update.error} />}
      <div className="flex gap-2">
        <Button type="submit" size="sm" busy={isSubmitting}>
          Save details
        </Button>
        <Button size="sm" variant="ghost" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
