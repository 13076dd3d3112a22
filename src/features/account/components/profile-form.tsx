import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  updateAccountSchema,
  type UpdateAccountInput,
  type CurrentUser,
} from '@shared/schemas/auth';
import { TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { submitForm } from '@/lib/submit-form';
import { useUpdateAccount } from '../api/update-account';
import { formField } from '@/components/ui/form-field';

export function ProfileForm({
  user,
  onSaved,
}: {
  user: { name: string; email: string };
  onSaved: (me: CurrentUser) => void;
}) {
  const update = useUpdateAccount({ onSuccess: onSaved });
  const form = useForm<UpdateAccountInput>({
    resolver: zodResolver(updateAccountSchema),
    defaultValues: { name: user.name },
  });
  const { errors, isSubmitting, isSubmitSuccessful, isDirty } = form.formState;

  const onSubmit = submitForm(form, async ({ name }) => {
    const me = await update.mutateAsync({ name });
    form.reset({ name: me.name });
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate aria-label="Profile">
      <TextField
        label="Name"
        autoComplete="name"
        hint="Shown to your teammates and on invitations you send."
        {...formField(form, 'name')}
      />
      <div className="space-y-1">
        <p className="text-sm font-medium text-ink">E-mail</p>
        <p className="break-all text-sm text-ink-soft">{user.email}</p>
      </div>
      {update.isError && !errors.name && <Alert tone="danger">{update.error.message}</Alert>}
      {isSubmitSuccessful && !isDirty && update.isSuccess && (
        <Alert tone="success">Your name was saved.</Alert>
      )}
      <Button type="submit" busy={isSubmitting}>
        Save name
      </Button>
    </form>
  );
}
