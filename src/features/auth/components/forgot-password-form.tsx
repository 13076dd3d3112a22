import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { forgotPasswordSchema, type ForgotPasswordInput } from '@shared/schemas/auth';
import { EmailField } from '@/components/ui/auth-fields';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { useRequestPasswordReset } from '../api/forgot-password';
import { FormError } from './form-error';
import { applyServerError } from '@/lib/submit-form';
import { formField } from '@/components/ui/form-field';

export function ForgotPasswordForm({ defaultEmail = '' }: { defaultEmail?: string }) {
  const request = useRequestPasswordReset();
  const form = useForm<ForgotPasswordInput>({
    resolver: zodResolver(forgotPasswordSchema),
    defaultValues: { email: defaultEmail },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await request.mutateAsync(values);
    } catch (err) {
      applyServerError(err, form.setError);
    }
  });

  if (request.isSuccess) {
    return (
      <Alert tone="success" title="Check your inbox">
        {request.data.message} The link works once and expires after 30 minutes.
      </Alert>
    );
  }

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <p className="text-sm text-ink-soft">
        Enter the e-mail address of your account and we will send you a link to choose a new
        password.
      </p>
      <EmailField {...formField(form, 'email')} />
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" className="w-full" busy={isSubmitting}>
        Send reset link
      </Button>
    </form>
  );
}
