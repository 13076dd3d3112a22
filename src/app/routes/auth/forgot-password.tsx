import { Link, useSearchParams } from 'react-router';
import { paths } from '@/config/paths';
import { AuthLayout } from '@/components/layout/auth-layout';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';

export function Component() {
  const [params] = useSearchParams();
  return (
    <AuthLayout
      title="Forgot your password?"
      footer={
        <Link className="font-medium text-primary underline" to={paths.signIn.getHref()}>
          Back to sign in
        </Link>
      }
    >
      <ForgotPasswordForm defaultEmail={params.get('email') ?? ''} />
    </AuthLayout>
  );
}
