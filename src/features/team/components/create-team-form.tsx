import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { TeamSummary } from '@shared/schemas/auth';
import { createTeamSchema, type CreateTeamInput } from '@shared/schemas/team';
import { TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { submitForm } from '@/lib/submit-form';
import { useCreateTeam } from '../api/create-team';
import { formField } from '@/components/ui/form-field';

export function CreateTeamForm({ onCreated }: { onCreated: (team: TeamSummary) => void }) {
  const [created, setCreated] = useState('');
  const create = useCreateTeam({ onSuccess: onCreated });
  const form = useForm<CreateTeamInput>({
    resolver: zodResolver(createTeamSchema),
    defaultValues: { name: '' },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = submitForm(form, async (values) => {
    setCreated('');
    const team = await create.mutateAsync(values);
    setCreated(team.name);
    form.reset({ name: '' });
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate aria-label="Create a team">
      <TextField
        label="New team name"
        hint="You will be its owner. Studies belong to one team."
        {...formField(form, 'name')}
      />
      {create.isError && !errors.name && <Alert tone="danger">{create.error.message}</Alert>}
      {created && <Alert tone="success">Team “{created}” created.</Alert>}
      <Button type="submit" variant="secondary" busy={isSubmitting}>
        Create team
      </Button>
    </form>
  );
}
