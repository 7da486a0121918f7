import { AuthLayout } from '@/features/auth/components/auth-layout';
import { SignInForm } from '@/features/auth/components/sign-in-form';

export function Component() {
  return (
    <AuthLayout title="Sign in to Splitcase" footer="New here? An admin of your workspace sends you an invitation by e-mail.">
      <SignInForm />
    </AuthLayout>
  );
}
