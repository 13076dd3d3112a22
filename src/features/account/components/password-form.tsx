import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { passwordSchema, type CurrentUser } from '@shared/schemas/auth';
import {
  NewPasswordFields,
  PasswordField,
  repeatedPasswordSchema,
} from '@/components/ui/auth-fields';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { submitForm } from '@/lib/submit-form';
import { useUpdateAccount } from '../api/update-account';
import { formField } from '@/components/ui/form-field';

// The shared password rule, with the current password required and the new one repeated.
const passwordFormSchema = repeatedPasswordSchema(
  {
    currentPassword: z.string().min(1, 'Enter your current password').max(200),
    newPassword: passwordSchema,
  },
  'newPassword',
);
type PasswordFormValues = z.infer<typeof passwordFormSchema>;

const empty: PasswordFormValues = { currentPassword: '', newPassword: '', confirmPassword: '' };

export function PasswordForm({ onChanged }: { onChanged: (me: CurrentUser) => void }) {
  const update = useUpdateAccount({ onSuccess: onChanged });
  const form = useForm<PasswordFormValues>({
    resolver: zodResolver(passwordFormSchema),
    defaultValues: empty,
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = submitForm(form, async ({ currentPassword, newPassword }) => {
    await update.mutateAsync({ currentPassword, newPassword });
    form.reset(empty);
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate aria-label="Change password">
      <PasswordField
        purpose="current"
        label="Current password"
        {...formField(form, 'currentPassword')}
      />
      <NewPasswordFields
        form={form}
        name="newPassword"
        hint="At least 10 characters. Other devices will be signed out."
      />
      {update.isError && !errors.currentPassword && !errors.newPassword && (
        <Alert tone="danger">{update.error.message}</Alert>
      )}
      {update.isSuccess && (
        <Alert tone="success">Password changed. Other devices have been signed out.</Alert>
      )}
      <Button type="submit" busy={isSubmitting}>
        Change password
      </Button>
    </form>
  );
}
