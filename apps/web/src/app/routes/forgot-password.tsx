import { Link } from 'react-router';
import { paths } from '@/config/paths';
import { AuthLayout } from '@/features/auth/components/auth-layout';
import { RequestResetForm } from '@/features/auth/components/password-reset-forms';

export function Component() {
  return (
    <AuthLayout
      title="Reset your password"
      footer={
        <Link to={paths.signIn()} className="text-copper-700 hover:underline">
          Back to sign-in
        </Link>
      }
    >
      <p className="mb-4 text-sm text-graphite-600">Give the e-mail address of your account; we send a link to choose a new password.</p>
      <RequestResetForm />
    </AuthLayout>
  );
}
