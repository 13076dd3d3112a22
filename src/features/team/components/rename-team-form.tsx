import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { renameTeamSchema, type CreateTeamInput } from '@shared/schemas/team';
import { TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { submitForm } from '@/lib/submit-form';
import { useRenameTeam } from '../api/rename-team';
import { formField } from '@/components/ui/form-field';

export function RenameTeamForm({
  teamId,
  currentName,
  onRenamed,
}: {
  teamId: string;
  currentName: string;
  onRenamed: () => void;
}) {
  const rename = useRenameTeam({ onSuccess: onRenamed });
  const form = useForm<CreateTeamInput>({
    resolver: zodResolver(renameTeamSchema),
    defaultValues: { name: currentName },
  });
  const { errors, isSubmitting, isDirty } = form.formState;

  const onSubmit = submitForm(form, async (values) => {
    const team = await rename.mutateAsync({ teamId, ...values });
    form.reset({ name: team.name });
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate aria-label="Rename the team">
      <TextField label="Team name" {...formField(form, 'name')} />
      {rename.isError && !errors.name && <Alert tone="danger">{rename.error.message}</Alert>}
      {rename.isSuccess && !isDirty && <Alert tone="success">Team renamed.</Alert>}
      <Button type="submit" variant="secondary" busy={isSubmitting} disabled={!isDirty}>
        Rename team
      </Button>
    </form>
  );
}
