import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { ChangeEmailBody, ChangePasswordBody, UpdateAccountBody, type AccountSession } from '@benchwright/contracts';
import { Button, Field, Notice, Panel } from '../components';
import { applyServerIssues } from '../form-errors';
import {
  useAccount,
  useChangeEmail,
  useChangePassword,
  useConfirmEmailChange,
  useEndOtherSessions,
  useEndSession,
  useRenameAccount,
  useSessions,
} from './account-api';

/**
 * A short, plain name for a browser from its User-Agent ("Firefox on Android"). Our own few lines rather than a
 * parsing package: the page only needs a hint beside the full text, which is shown too.
 */
export function describeBrowser(ua: string): string {
  if (!ua) return 'An unknown browser';
  const browser = /Edg\//.test(ua)
    ? 'Edge'
    : /Firefox\//.test(ua)
      ? 'Firefox'
      : /Chrom(e|ium)\//.test(ua)
        ? 'Chrome'
        : /Safari\//.test(ua)
          ? 'Safari'
          : 'A browser';
  const system = /Android/.test(ua)
    ? 'Android'
    : /iPhone|iPad/.test(ua)
      ? 'iOS'
      : /Windows/.test(ua)
        ? 'Windows'
        : /Mac OS X/.test(ua)
          ? 'macOS'
          : /Linux/.test(ua)
            ? 'Linux'
            : null;
  return system ? `${browser} on ${system}` : browser;
}

const when = (iso: string | null) =>
  iso ? new Date(iso).toLocaleString('en-US', { dateStyle: 'medium', timeStyle: 'short' }) : 'not yet';

function NameForm({ name }: { name: string }) {
  const form = useForm({ resolver: zodResolver(UpdateAccountBody), defaultValues: { name } });
  const rename = useRenameAccount();
  const [message, setMessage] = useState<string | null>(null);
  useEffect(() => form.reset({ name }), [name, form]);
  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await rename.mutateAsync(values);
    } catch (err) {
      setMessage(applyServerIssues(err, form.setError, ['name']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Your name">
      {message ? <Notice tone="error">{message}</Notice> : null}
      {rename.isSuccess && !form.formState.isDirty ? <Notice tone="ok">Your name is saved.</Notice> : null}
      <Field label="Name" autoComplete="name" error={form.formState.errors.name?.message} {...form.register('name')} />
      <Button type="submit" disabled={rename.isPending}>
        Save the name
      </Button>
    </form>
  );
}

function EmailForm({ email, pendingEmail }: { email: string; pendingEmail: string | null }) {
  const form = useForm({ resolver: zodResolver(ChangeEmailBody), defaultValues: { email: '', currentPassword: '' } });
  const change = useChangeEmail();
  const [message, setMessage] = useState<string | null>(null);
  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await change.mutateAsync(values);
      form.reset({ email: '', currentPassword: '' });
    } catch (err) {
      setMessage(applyServerIssues(err, form.setError, ['email', 'currentPassword']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Your e-mail">
      <p className="mb-4">
        Mail goes to <strong>{email}</strong>.
      </p>
      {pendingEmail ? (
        <Notice tone="ok">
          A link is on its way to {pendingEmail}. Your e-mail changes when you follow it; until then mail keeps going to{' '}
          {email}.
        </Notice>
      ) : null}
      {message ? <Notice tone="error">{message}</Notice> : null}
      <Field
        label="New e-mail"
        type="email"
        autoComplete="email"
        error={form.formState.errors.email?.message}
        {...form.register('email')}
      />
      <Field
        label="Current password"
        type="password"
        autoComplete="current-password"
        hint="So that no one else at this screen can move your account."
        error={form.formState.errors.currentPassword?.message}
        {...form.register('currentPassword')}
      />
      <Button type="submit" disabled={change.isPending}>
        Send a link to the new e-mail
      </Button>
    </form>
  );
}

function PasswordForm() {
  const form = useForm({
    resolver: zodResolver(ChangePasswordBody),
    defaultValues: { currentPassword: '', newPassword: '' },
  });
  const change = useChangePassword();
  const [message, setMessage] = useState<string | null>(null);
  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      await change.mutateAsync(values);
      form.reset({ currentPassword: '', newPassword: '' });
    } catch (err) {
      setMessage(applyServerIssues(err, form.setError, ['currentPassword', 'newPassword']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Your password">
      {change.isSuccess ? (
        <Notice tone="ok">
          Your password is changed, and every other browser signed in to your account is signed out.
        </Notice>
      ) : null}
      {message ? <Notice tone="error">{message}</Notice> : null}
      <Field
        label="Current password"
        type="password"
        autoComplete="current-password"
        error={form.formState.errors.currentPassword?.message}
        {...form.register('currentPassword')}
      />
      <Field
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. Your other browsers will be signed out."
        error={form.formState.errors.newPassword?.message}
        {...form.register('newPassword')}
      />
      <Button type="submit" disabled={change.isPending}>
        Change the password
      </Button>
    </form>
  );
}

function SessionRow({ s, onEnd, busy }: { s: AccountSession; onEnd: () => void; busy: boolean }) {
  const label = describeBrowser(s.userAgent);
  return (
    <li className="flex flex-wrap items-start justify-between gap-2 border-b border-rule py-3 last:border-b-0">
      <div className="min-w-0">
        <p className="font-semibold">
          {label}
          {s.current ? <span className="ml-2 rounded bg-sage-light px-2 py-0.5 text-sm">this browser</span> : null}
        </p>
        <p className="text-sm text-ink-soft">
          Signed in {when(s.createdAt)} · last seen {when(s.lastSeenAt)}
        </p>
        {s.userAgent ? <p className="break-all text-xs text-ink-soft">{s.userAgent}</p> : null}
      </div>
      <Button
        variant="quiet"
        disabled={busy}
        onClick={onEnd}
        aria-label={
          s.current ? 'Sign out of this browser' : `End the session of ${label}, signed in ${when(s.createdAt)}`
        }
      >
        {s.current ? 'Sign out here' : 'End'}
      </Button>
    </li>
  );
}

function Sessions({ onSignedOut }: { onSignedOut: () => void }) {
  const sessions = useSessions();
  const end = useEndSession();
  const endOthers = useEndOtherSessions();
  if (sessions.isPending) return <p>Loading your sessions…</p>;
  if (sessions.isError) return <Notice tone="error">{sessions.error.message}</Notice>;
  const others = sessions.data.filter((s) => !s.current).length;
  return (
    <>
      <p className="mb-2">Each browser signed in to your account. End any you do not recognise.</p>
      {end.isError ? <Notice tone="error">{end.error.message}</Notice> : null}
      <ul aria-label="Signed-in sessions" className="mb-4">
        {sessions.data.map((s) => (
          <SessionRow
            key={s.id}
            s={s}
            busy={end.isPending}
            onEnd={() => end.mutate(s.id, { onSuccess: () => (s.current ? onSignedOut() : undefined) })}
          />
        ))}
      </ul>
      {endOthers.isSuccess ? (
        <Notice tone="ok">
          {endOthers.data.ended === 1 ? 'One other session ended.' : `${endOthers.data.ended} other sessions ended.`}
        </Notice>
      ) : null}
      <Button variant="quiet" disabled={others === 0 || endOthers.isPending} onClick={() => endOthers.mutate()}>
        Sign out everywhere else
      </Button>
    </>
  );
}

/** The account page of both apps: name, e-mail (confirmed by mail), password, signed-in sessions. */
export function AccountPage({ onSignedOut }: { onSignedOut: () => void }) {
  const account = useAccount();
  return (
    <>
      <h1 className="mb-6 text-2xl font-bold">Your account</h1>
      {account.isPending ? <p>Loading…</p> : null}
      {account.isError ? <Notice tone="error">{account.error.message}</Notice> : null}
      {account.data ? (
        <>
          <Panel title="Name">
            <NameForm name={account.data.name} />
          </Panel>
          <Panel title="E-mail">
            <EmailForm email={account.data.email} pendingEmail={account.data.pendingEmail} />
          </Panel>
          <Panel title="Password">
            <PasswordForm />
          </Panel>
          <Panel title="Signed-in sessions">
            <Sessions onSignedOut={onSignedOut} />
          </Panel>
        </>
      ) : null}
    </>
  );
}

/** What the link mailed to a new address opens: confirms the change once and says so. */
export function ConfirmEmailChange({ token }: { token: string }) {
  const confirm = useConfirmEmailChange();
  const sent = useRef(false);
  useEffect(() => {
    if (token && !sent.current) {
      sent.current = true;
      confirm.mutate(token);
    }
  }, [token, confirm]);
  return (
    <>
      {!token ? (
        <Notice tone="error">This link has no confirmation code. Open the link from the e-mail again.</Notice>
      ) : null}
      {confirm.isPending ? <p>Confirming…</p> : null}
      {confirm.isSuccess ? <Notice tone="ok">Done: your account now uses {confirm.data.user.email}.</Notice> : null}
      {confirm.isError ? <Notice tone="error">{confirm.error.message}</Notice> : null}
    </>
  );
}
