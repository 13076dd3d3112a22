import { Link, useNavigate, useSearchParams } from 'react-router';
import { paths } from '@/config/paths';
import { AuthLayout } from '@/components/layout/auth-layout';
import { Alert } from '@/components/ui/feedback';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';

export function Component() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const newLink = (
    <Link className="font-medium text-primary underline" to={paths.forgotPassword.getHref()}>
      Ask for a new reset link
    </Link>
  );

  return (
    <AuthLayout title="Choose a new password" footer={newLink}>
      {token.length < 20 ? (
        <Alert tone="danger" title="This reset link is incomplete">
          Open the link from the e-mail again, or ask for a new one.
        </Alert>
      ) : (
        <ResetPasswordForm
          token={token}
          onReset={() => navigate(paths.home.getHref(), { replace: true })}
        />
      )}
    </AuthLayout>
  );
}
