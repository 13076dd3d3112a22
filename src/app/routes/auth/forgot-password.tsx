import { useSearchParams } from 'react-router';
import { AuthLayout } from '@/components/layout/auth-layout';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';
import { BackToSignIn } from './back-to-sign-in';

export function Component() {
  const [params] = useSearchParams();
  return (
    <AuthLayout title="Forgot your password?" footer={<BackToSignIn />}>
      <ForgotPasswordForm defaultEmail={params.get('email') ?? ''} />
    </AuthLayout>
  );
}
