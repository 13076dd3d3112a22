import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { roleDescriptions, roles } from '@shared/permissions';
import { createInvitationSchema, type CreateInvitationInput } from '@shared/schemas/team';
import { SelectField, TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { applyServerError } from '@/lib/submit-form';
import { useCreateInvitation } from '../api/create-invitation';
import { roleLabels } from './role-label';
import { formField } from '@/components/ui/form-field';
import { Options } from '@/components/ui/options';

export function InviteForm({ teamId }: { teamId: string }) {
  const invite = useCreateInvitation();
  const [sentTo, setSentTo] = useState('');
  const form = useForm<CreateInvitationInput>({
    resolver: zodResolver(createInvitationSchema),
    defaultValues: { email: '', role: 'viewer' },
  });
  const { errors, isSubmitting } = form.formState;
  const role = form.watch('role');

  const onSubmit = form.handleSubmit(async (values) => {
    setSentTo('');
    try {
      const inv = await invite.mutateAsync({ teamId, ...values });
      setSentTo(inv.email);
      form.reset({ email: '', role: values.role });
    } catch (err) {
      applyServerError(err, form.setError);
    }
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate aria-label="Invite a teammate">
      <TextField
        label="E-mail address"
        type="email"
        autoComplete="off"
        {...formField(form, 'email')}
      />
      <SelectField
        label="Role"
        hint={roleDescriptions[role] ? `${roleDescriptions[role]}.` : undefined}
        {...formField(form, 'role')}
      >
        <Options items={roles.map((r) => ({ value: r, label: roleLabels[r] }))} />
      </SelectField>
      {errors.root?.server && <Alert tone="danger">{errors.root.server.message}</Alert>}
      {sentTo && (
        <Alert tone="success">
          Invitation sent to <span className="break-all">{sentTo}</span>.
        </Alert>
      )}
      <Button type="submit" busy={isSubmitting} className="w-full sm:w-auto">
        Send invitation
      </Button>
    </form>
  );
}
