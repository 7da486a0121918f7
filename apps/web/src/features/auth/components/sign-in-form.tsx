import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { loginBody, type LoginBody } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, FormError } from '@/components/field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useLogin } from '../api/login';

/** Only same-site paths are followed after sign-in. */
export function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : paths.home();
}

export function SignInForm() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const login = useLogin();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<LoginBody>({ resolver: zodResolver(loginBody), defaultValues: { email: '', password: '' } });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await login.mutateAsync(values);
      navigate(safeNext(params.get('next')), { replace: true });
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['email']));
    }
  });

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <FormError message={formError} />
      <Field label="E-mail" error={formState.errors.email?.message}>
        {(p) => <Input {...p} type="email" autoComplete="username" autoFocus {...register('email')} />}
      </Field>
      <Field label="Password" error={formState.errors.password?.message}>
        {(p) => <Input {...p} type="password" autoComplete="current-password" {...register('password')} />}
      </Field>
      <Button type="submit" variant="primary" size="lg" className="w-full" busy={login.isPending}>
        Sign in
      </Button>
      <p className="text-sm">
        <Link to={paths.forgotPassword()} className="text-copper-700 hover:underline">
          Forgot your password?
        </Link>
      </p>
    </form>
  );
}
