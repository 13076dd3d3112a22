import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { studyDetailsSchema, type Study } from '@shared/schemas/study';
import { TextAreaField } from '@/components/ui/field';
import { FormTextFields, type TextFieldSpec } from '@/components/ui/form-text-fields';
import { Button } from '@/components/ui/button';
import { ErrorText } from '@/components/ui/error-boundary';
import { submitForm } from '@/lib/submit-form';
import { useUpdateStudy } from '../api/update-study';
import { formField } from '@/components/ui/form-field';

type Values = z.infer<typeof studyDetailsSchema>;

const nameFields: TextFieldSpec<Values>[] = [
  { name: 'name', label: 'Study name', hint: 'For your team; respondents never see it.' },
  {
    name: 'publicTitle',
    label: 'Public title',
    hint: 'Respondents see this on the survey and in invitation e-mails.',
  },
];

/** Rename a study, set the title respondents see, and edit the internal description. */
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
    resolver: zodResolver(studyDetailsSchema),
    defaultValues: {
      name: study.name,
      publicTitle: study.publicTitle,
      description: study.description,
    },
  });
  const { isSubmitting } = form.formState;
  const onSubmit = submitForm(form, async (values) => {
    await update.mutateAsync(values);
    onDone();
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Study details" className="max-w-xl space-y-3">
      <FormTextFields form={form} fields={nameFields} />
      <TextAreaField
        label="Description"
        hint="For your team; respondents do not see it."
        {...formField(form, 'description')}
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
