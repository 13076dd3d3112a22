import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signUpSchema, type AcceptedMessage, type SignUpInput } from '@shared/schemas/auth';
import { TextField } from '@/components/ui/field';
import { EmailField, PasswordField } from '@/components/ui/auth-fields';
import { Button } from '@/components/ui/button';
import { useSignUp } from '../api/sign-up';
import { FormError } from './form-error';
import { applyServerError } from '@/lib/submit-form';
import { formField } from '@/components/ui/form-field';

export function SignUpForm({
  defaultValues,
  teamHint = 'Your studies live in a team. You can invite colleagues and rename it later.',
  redirectTo,
  onSubmitted,
}: {
  defaultValues?: Partial<SignUpInput>;
  teamHint?: string;
  /** Where the confirmation link should lead once the address is confirmed. */
  redirectTo?: string;
  onSubmitted: (result: AcceptedMessage & { email: string }) => void;
}) {
  const signUp = useSignUp();
  const form = useForm<SignUpInput>({
    resolver: zodResolver(signUpSchema),
    defaultValues: { name: '', email: '', password: '', teamName: '', ...defaultValues },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      const result = await signUp.mutateAsync(redirectTo ? { ...values, redirectTo } : values);
      onSubmitted({ ...result, email: values.email });
    } catch (err) {
      applyServerError(err, form.setError);
    }
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <TextField label="Your name" autoComplete="name" {...formField(form, 'name')} />
      <EmailField {...formField(form, 'email')} />
      <PasswordField
        purpose="new"
        hint="At least 10 characters. A few unrelated words work well."
        {...formField(form, 'password')}
      />
      <TextField
        label="Team name"
        autoComplete="organization"
        hint={teamHint}
        {...formField(form, 'teamName')}
      />
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" className="w-full" busy={isSubmitting}>
        Create account
      </Button>
    </form>
  );
}
