import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { SignUpBody } from '@benchwright/contracts';
import { applyServerIssues, Button, Field, Notice } from '@benchwright/ui';
import { useSignUp } from '../api/sign-up';

export function SignUpForm({ onDone }: { onDone: () => void }) {
  const form = useForm({ resolver: zodResolver(SignUpBody), defaultValues: { name: '', email: '', password: '' } });
  const signUp = useSignUp();
  const [message, setMessage] = useState<string | null>(null);
  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await signUp.mutateAsync(values);
      onDone();
    } catch (err) {
      setMessage(applyServerIssues(err, form.setError, ['name', 'email', 'password']));
    }
  });
  const e = form.formState.errors;
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Create your account">
      {message ? <Notice tone="error">{message}</Notice> : null}
      <Field label="Your name" autoComplete="name" error={e.name?.message} {...form.register('name')} />
      <Field label="E-mail" type="email" autoComplete="email" error={e.email?.message} {...form.register('email')} />
      <Field
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters."
        error={e.password?.message}
        {...form.register('password')}
      />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        Create account
      </Button>
    </form>
  );
}
