import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router';
import { PASSWORD_RULE, resetConfirmBody, resetRequestBody, type ResetConfirmBody, type ResetRequestBody } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, FormError } from '@/components/field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useConfirmReset, useRequestReset } from '../api/password-reset';

export function RequestResetForm() {
  const request = useRequestReset();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<ResetRequestBody>({ resolver: zodResolver(resetRequestBody), defaultValues: { email: '' } });

  if (request.isSuccess) {
    return (
      <p role="status" className="rounded-md border border-cell-100 bg-cell-50 px-3 py-2 text-sm text-cell-800">
        {request.data.message} The link works once, for one hour.
      </p>
    );
  }
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await request.mutateAsync(values);
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
      <Button type="submit" variant="primary" size="lg" className="w-full" busy={request.isPending}>
        Send the reset link
      </Button>
    </form>
  );
}

export function ConfirmResetForm({ token }: { token: string }) {
  const confirm = useConfirmReset();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<ResetConfirmBody>({
    resolver: zodResolver(resetConfirmBody),
    defaultValues: { token, password: '' },
  });
  if (confirm.isSuccess) {
    return (
      <div className="space-y-4">
        <p role="status" className="rounded-md border border-cell-100 bg-cell-50 px-3 py-2 text-sm text-cell-800">
          Your password is changed.
        </p>
        <Link to={paths.signIn()} className="font-medium text-copper-700 hover:underline">
          Sign in with the new password
        </Link>
      </div>
    );
  }
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await confirm.mutateAsync(values);
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['password']));
    }
  });
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <FormError message={formError ?? (formState.errors.token ? 'This page needs the link from the reset e-mail.' : null)} />
      <input type="hidden" {...register('token')} />
      <Field label="New password" error={formState.errors.password?.message} hint={PASSWORD_RULE}>
        {(p) => <Input {...p} type="password" autoComplete="new-password" autoFocus {...register('password')} />}
      </Field>
      <Button type="submit" variant="primary" size="lg" className="w-full" busy={confirm.isPending}>
        Set the new password
      </Button>
    </form>
  );
}
