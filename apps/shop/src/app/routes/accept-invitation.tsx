import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useNavigate, useSearchParams } from 'react-router-dom';
import * as z from 'zod';
import { PASSWORD_MIN } from '@benchwright/contracts';
import { applyServerIssues, Button, Field, Notice, Panel } from '@benchwright/ui';
import { paths } from '../../config/paths';
import { useAcceptInvitation } from '../../features/auth/api/accept-invitation';

const SetPassword = z.object({
  password: z.string().min(PASSWORD_MIN, `use at least ${PASSWORD_MIN} characters`).max(200),
});

export function AcceptInvitationRoute() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const navigate = useNavigate();
  const accept = useAcceptInvitation();
  const form = useForm({ resolver: zodResolver(SetPassword), defaultValues: { password: '' } });
  const [message, setMessage] = useState<string | null>(null);
  const onSubmit = form.handleSubmit(async ({ password }) => {
    try {
      await accept.mutateAsync({ token, password });
      navigate(paths.home.getHref());
    } catch (err) {
      setMessage(applyServerIssues(err, form.setError, ['password']));
    }
  });
  if (!token)
    return (
      <Panel level={1} title="Set your password">
        <Notice tone="error">This invitation link has no code. Open the link from the e-mail again.</Notice>
      </Panel>
    );
  return (
    <Panel level={1} title="Set your password">
      <p className="mb-4 text-ink-soft">Welcome to the shop. Choose a password to finish setting up your account.</p>
      {message ? <Notice tone="error">{message}</Notice> : null}
      <form onSubmit={onSubmit} noValidate aria-label="Set your password">
        <Field
          label="Password"
          type="password"
          autoComplete="new-password"
          hint="At least 10 characters."
          error={form.formState.errors.password?.message}
          {...form.register('password')}
        />
        <Button type="submit">Set password and sign in</Button>
      </form>
    </Panel>
  );
}
