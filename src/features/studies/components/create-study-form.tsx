import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { createStudySchema, type Study } from '@shared/schemas/study';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorText } from '@/components/ui/error-boundary';
import { submitForm } from '@/lib/submit-form';
import { useCreateStudy } from '../api/create-study';
import { formField } from '@/components/ui/form-field';

type Values = z.input<typeof createStudySchema>;

export function CreateStudyForm({
  teamId,
  onCreated,
  onCancel,
}: {
  teamId: string;
  onCreated: (study: Study) => void;
  onCancel: () => void;
}) {
  const create = useCreateStudy(teamId);
  const form = useForm<Values>({
    resolver: zodResolver(createStudySchema),
    defaultValues: { name: '', description: '' },
  });
  const { isSubmitting } = form.formState;
  const onSubmit = submitForm(form, async (values) => {
    onCreated(await create.mutateAsync(values));
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="New study">
      <TextField label="Study name" autoFocus {...formField(form, 'name')} />
      <TextAreaField
        label="Description (optional)"
        hint="For your team; respondents do not see it."
        {...formField(form, 'description')}
      />
      {create.error && !create.error.message.includes('name') && <ErrorText error={create.error} />}
      <div className="flex gap-2">
        <Button type="submit" busy={isSubmitting}>
          Create study
        </Button>
        <Button variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
