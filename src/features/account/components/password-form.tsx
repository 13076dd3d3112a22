import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { passwordSchema, type CurrentUser } from '@shared/schemas/auth';
import { PasswordField } from '@/components/ui/auth-fields';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { applyFieldErrors } from '@/lib/api-client';
import { useUpdateAccount } from '../api/update-account';
import { formField } from '@/components/ui/form-field';

// The shared password rule, with the current password required and the new one repeated.
const passwordFormSchema = z
  .object({
    currentPassword: z.string().min(1, 'Enter your current password').max(200),
    newPassword: passwordSchema,
    confirmPassword: z.string(),
  })
  .refine((v) => v.newPassword === v.confirmPassword, {
    path: ['confirmPassword'],
    message: 'The two passwords differ',
  });
type PasswordFormValues = z.infer<typeof passwordFormSchema>;

const empty: PasswordFormValues = { currentPassword: '', newPassword: '', confirmPassword: '' };

export function PasswordForm({ onChanged }: { onChanged: (me: CurrentUser) => void }) {
  const update = useUpdateAccount({ onSuccess: onChanged });
  const form = useForm<PasswordFormValues>({
    resolver: zodResolver(passwordFormSchema),
    defaultValues: empty,
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async ({ currentPassword, newPassword }) => {
    try {
      await update.mutateAsync({ currentPassword, newPassword });
      form.reset(empty);
    } catch (err) {
      applyFieldErrors(err, form.setError);
    }
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate aria-label="Change password">
      <PasswordField
        purpose="current"
        label="Current password"
        {...formField(form, 'currentPassword')}
      />
      <PasswordField
        purpose="new"
        label="New password"
        hint="At least 10 characters. Other devices will be signed out."
        {...formField(form, 'newPassword')}
      />
      <PasswordField
        purpose="new"
        label="Repeat the new password"
        {...formField(form, 'confirmPassword')}
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
