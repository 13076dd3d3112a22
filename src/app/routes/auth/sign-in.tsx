import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { signInSchema, type SignInInput } from '@shared/schemas/auth';
import { paths } from '@/config/paths';
import { AuthLayout } from '@/components/layout/auth-layout';
import { EmailField, PasswordField } from '@/components/ui/auth-fields';
import { Button } from '@/components/ui/button';
import { ErrorText } from '@/components/ui/error-boundary';
import { submitForm } from '@/lib/submit-form';
import { useSignIn } from '@/features/auth/api/sign-in';
import { SecondStepForm } from '@/features/auth/components/second-step-form';
import { safeRedirect, withAuthParams } from './safe-redirect';
import { formField } from '@/components/ui/form-field';

export function Component() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const signIn = useSignIn();
  const form = useForm<SignInInput>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: params.get('email') ?? '', password: '' },
  });
  const { isSubmitting } = form.formState;
  const [secondStep, setSecondStep] = useState(false);
  const goOn = () =>
    navigate(safeRedirect(params.get('redirectTo'), paths.home.getHref()), { replace: true });

  const onSubmit = submitForm(form, async (values) => {
    const result = await signIn.mutateAsync(values);
    if ('twoStepRequired' in result) setSecondStep(true);
    else goOn();
  });

  if (secondStep)
    return (
      <AuthLayout title="Two-step sign-in">
        <SecondStepForm
          onSignedIn={goOn}
          onStartAgain={() => {
            form.setValue('password', '');
            setSecondStep(false);
          }}
        />
      </AuthLayout>
    );

  return (
    <AuthLayout
      title="Sign in to Choicewright"
      footer={
        <>
          New here?{' '}
          <Link
            className="font-medium text-primary underline"
            to={withAuthParams(paths.signUp.getHref(), params)}
          >
            Create an account
          </Link>
        </>
      }
    >
      <form onSubmit={onSubmit} className="space-y-4" noValidate>
        <EmailField {...formField(form, 'email')} />
        <PasswordField purpose="current" {...formField(form, 'password')} />
        <ErrorText error={signIn.error} />
        <Button type="submit" className="w-full" busy={isSubmitting}>
          Sign in
        </Button>
        <p className="text-center text-sm">
          <Link className="text-primary underline" to={paths.forgotPassword.getHref()}>
            Forgot your password?
          </Link>
        </p>
      </form>
    </AuthLayout>
  );
}
