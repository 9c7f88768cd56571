import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import * as z from 'zod';
import { ForgotPasswordBody, PASSWORD_MIN } from '@benchwright/contracts';
import { applyServerIssues, Button, Field, Notice } from '../index';
import { useForgotPassword, useResetPassword } from './password-reset';

export function ForgotPasswordForm() {
  const form = useForm({ resolver: zodResolver(ForgotPasswordBody), defaultValues: { email: '' } });
  const forgot = useForgotPassword();
  const [message, setMessage] = useState<string | null>(null);
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await forgot.mutateAsync(values);
    } catch (err) {
      setMessage(applyServerIssues(err, form.setError, ['email']));
    }
  });
  if (forgot.isSuccess)
    return (
      <Notice tone="ok">
        If an account uses that e-mail, a link to choose a new password is on its way. It works for one hour.
      </Notice>
    );
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Forgot password">
      {message ? <Notice tone="error">{message}</Notice> : null}
      <Field
        label="E-mail"
        type="email"
        autoComplete="email"
        error={form.formState.errors.email?.message}
        {...form.register('email')}
      />
      <Button type="submit">Send me a link</Button>
    </form>
  );
}

const ResetForm = z.object({
  password: z.string().min(PASSWORD_MIN, `use at least ${PASSWORD_MIN} characters`).max(200),
});

export function ResetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const form = useForm({ resolver: zodResolver(ResetForm), defaultValues: { password: '' } });
  const reset = useResetPassword();
  const [message, setMessage] = useState<string | null>(null);
  const onSubmit = form.handleSubmit(async ({ password }) => {
    try {
      await reset.mutateAsync({ token, password });
      onDone();
    } catch (err) {
      setMessage(applyServerIssues(err, form.setError, ['password']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Choose a new password">
      {message ? <Notice tone="error">{message}</Notice> : null}
      <Field
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={form.formState.errors.password?.message}
        {...form.register('password')}
      />
      <Button type="submit">Save the new password</Button>
    </form>
  );
}
