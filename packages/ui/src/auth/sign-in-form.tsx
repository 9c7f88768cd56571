import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { SignInBody } from '@benchwright/contracts';
import { applyServerIssues, Button, Field, Notice } from '../index';
import { useSignIn } from './sign-in';

export function SignInForm({ onDone }: { onDone: () => void }) {
  const form = useForm({ resolver: zodResolver(SignInBody), defaultValues: { email: '', password: '' } });
  const signIn = useSignIn();
  const [message, setMessage] = useState<string | null>(null);
  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await signIn.mutateAsync(values);
      onDone();
    } catch (err) {
      setMessage(applyServerIssues(err, form.setError, ['email', 'password']));
    }
  });
  const e = form.formState.errors;
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Sign in">
      {message ? <Notice tone="error">{message}</Notice> : null}
      <Field label="E-mail" type="email" autoComplete="email" error={e.email?.message} {...form.register('email')} />
      <Field
        label="Password"
        type="password"
        autoComplete="current-password"
        error={e.password?.message}
        {...form.register('password')}
      />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        Sign in
      </Button>
    </form>
  );
}
