import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { signInSchema, type SignInInput } from '@shared/schemas/auth';
import { paths } from '@/config/paths';
import { AuthLayout } from '@/components/layout/auth-layout';
import { TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorText } from '@/components/ui/error-boundary';
import { applyFieldErrors } from '@/lib/api-client';
import { useSignIn } from '@/features/auth/api/sign-in';
import { safeRedirect, withAuthParams } from './safe-redirect';

export function Component() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const signIn = useSignIn();
  const form = useForm<SignInInput>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: params.get('email') ?? '', password: '' },
  });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await signIn.mutateAsync(values);
      navigate(safeRedirect(params.get('redirectTo'), paths.home.getHref()), { replace: true });
    } catch (err) {
      applyFieldErrors(err, form.setError);
    }
  });

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
        <TextField
          label="E-mail"
          type="email"
          autoComplete="email"
          error={errors.email?.message}
          {...form.register('email')}
        />
        <TextField
          label="Password"
          type="password"
          autoComplete="current-password"
          error={errors.password?.message}
          {...form.register('password')}
        />
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
