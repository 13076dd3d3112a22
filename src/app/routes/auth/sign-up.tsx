import { useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import { paths } from '@/config/paths';
import { AuthLayout } from '@/components/layout/auth-layout';
import { Alert } from '@/components/ui/feedback';
import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { safeRedirect, withAuthParams } from './safe-redirect';

export function Component() {
  const [params] = useSearchParams();
  const [sent, setSent] = useState<{ email: string; message: string } | null>(null);
  const email = params.get('email') ?? '';
  const redirectTo = params.get('redirectTo');
  // Coming from an invitation: the person joins that team next, so their own team is secondary.
  const invited = !!redirectTo?.startsWith('/invitations/');
  const next = redirectTo ? safeRedirect(redirectTo, '') : '';

  return (
    <AuthLayout
      title={sent ? 'Check your inbox' : 'Create your Choicewright account'}
      footer={
        <>
          Already have an account?{' '}
          <Link
            className="font-medium text-primary underline"
            to={withAuthParams(paths.signIn.getHref(), params)}
          >
            Sign in
          </Link>
        </>
      }
    >
      {sent ? (
        <Alert tone="info" title="Confirm your e-mail address">
          <p>{sent.message}</p>
          <p className="mt-2">
            Open the link in that message to finish creating your account. It works once and expires
            in 48 hours. Nothing arrived? Check your spam folder, or sign up again.
          </p>
        </Alert>
      ) : (
        <SignUpForm
          defaultValues={{ email, teamName: invited ? 'My workspace' : '' }}
          teamHint={
            invited
              ? 'Every account gets a team of its own. You join the team that invited you next.'
              : undefined
          }
          redirectTo={next || undefined}
          onSubmitted={setSent}
        />
      )}
    </AuthLayout>
  );
}
