import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { passwordSchema, resetPasswordSchema, type CurrentUser } from '@shared/schemas/auth';
import { NewPasswordFields, repeatedPasswordSchema } from '@/components/ui/auth-fields';
import { Button } from '@/components/ui/button';
import { ApiError } from '@/lib/api-client';
import { useResetPassword } from '../api/reset-password';
import { FormError } from './form-error';
import { applyServerError } from '@/lib/submit-form';

// The shared schema plus a repeat of the password, checked only here in the browser.
const resetFormSchema = repeatedPasswordSchema(
  { token: resetPasswordSchema.shape.token, password: passwordSchema },
  'password',
);
type ResetFormValues = z.infer<typeof resetFormSchema>;

export function ResetPasswordForm({
  token,
  onReset,
}: {
  token: string;
  onReset: (me: CurrentUser) => void;
}) {
  const reset = useResetPassword();
  const form = useForm<ResetFormValues>({
    resolver: zodResolver(resetFormSchema),
    defaultValues: { token, password: '', confirmPassword: '' },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async ({ password }) => {
    try {
      onReset(await reset.mutateAsync({ token, password }));
    } catch (err) {
      // The token is not a field the person can fix: say what to do instead.
      if (err instanceof ApiError && err.code === 'invalid_token') {
        form.setError('root.server', { type: 'server', message: err.message });
      } else {
        applyServerError(err, form.setError);
      }
    }
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <NewPasswordFields form={form} name="password" hint="At least 10 characters." />
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" className="w-full" busy={isSubmitting}>
        Set new password
      </Button>
    </form>
  );
}
