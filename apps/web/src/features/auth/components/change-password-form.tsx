import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { changePasswordBody, PASSWORD_RULE, type ChangePasswordBody } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, FormError } from '@/components/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useChangePassword } from '../api/change-password';

/** Change your own password: your sessions on other devices end, this one goes on. */
export function ChangePasswordForm() {
  const change = useChangePassword();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState, reset } = useForm<ChangePasswordBody>({
    resolver: zodResolver(changePasswordBody),
    defaultValues: { currentPassword: '', newPassword: '' },
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await change.mutateAsync(values);
      reset();
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['currentPassword', 'newPassword']));
    }
  });
  return (
    <form onSubmit={onSubmit} className="max-w-md space-y-4" noValidate>
      <FormError message={formError} />
      {change.isSuccess && !formState.isDirty && (
        <p role="status" className="rounded-md border border-cell-100 bg-cell-50 px-3 py-2 text-sm text-cell-800">
          Your password is changed. You were signed out everywhere else.
        </p>
      )}
      <Field label="Current password" error={formState.errors.currentPassword?.message}>
        {(p) => <Input {...p} type="password" autoComplete="current-password" {...register('currentPassword')} />}
      </Field>
      <Field label="New password" error={formState.errors.newPassword?.message} hint={PASSWORD_RULE}>
        {(p) => <Input {...p} type="password" autoComplete="new-password" {...register('newPassword')} />}
      </Field>
      <p className="text-xs text-graphite-500">Changing it signs you out on every other device and browser.</p>
      <Button type="submit" variant="primary" busy={change.isPending}>
        Change the password
      </Button>
    </form>
  );
}
