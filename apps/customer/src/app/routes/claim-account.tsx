import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { useNavigate, useSearchParams } from 'react-router-dom';
import * as z from 'zod';
import { PASSWORD_MIN } from '@benchwright/contracts';
import { applyServerIssues, Button, Field, Notice, Panel } from '@benchwright/ui';
import { paths } from '../../config/paths';
import { useClaimAccount } from '../../features/auth/api/claim-account';

const SetPassword = z.object({
  password: z.string().min(PASSWORD_MIN, `use at least ${PASSWORD_MIN} characters`).max(200),
});

/** The link in the mail the shop sends when it adds a client who called or walked in: choose a password, go in. */
export function ClaimAccountRoute() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const navigate = useNavigate();
  const claim = useClaimAccount();
  const form = useForm({ resolver: zodResolver(SetPassword), defaultValues: { password: '' } });
  const [message, setMessage] = useState<string | null>(null);
  const onSubmit = form.handleSubmit(async ({ password }) => {
    try {
      await claim.mutateAsync({ token, password });
      navigate(paths.projects.getHref());
    } catch (err) {
      setMessage(applyServerIssues(err, form.setError, ['password']));
    }
  });
  if (!token) return <Notice tone="error">This link has no code. Open the link from the e-mail again.</Notice>;
  return (
    <Panel title="Claim your account">
      <p className="mb-4 text-ink-soft">
        The shop has made you an account. Choose a password to see your projects, estimates and drawings.
      </p>
      {message ? <Notice tone="error">{message}</Notice> : null}
      <form onSubmit={onSubmit} noValidate aria-label="Claim your account">
        <Field
          label="Password"
          type="password"
          autoComplete="new-password"
          hint={`At least ${PASSWORD_MIN} characters.`}
          error={form.formState.errors.password?.message}
          {...form.register('password')}
        />
        <Button type="submit">Set password and see my projects</Button>
      </form>
    </Panel>
  );
}
