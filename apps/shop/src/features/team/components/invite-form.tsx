import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { InvitationBody } from '@benchwright/contracts';
import { applyServerIssues, Button, Field, Notice } from '@benchwright/ui';
import { useInviteBuilder } from '../api/team';

export function InviteForm() {
  const form = useForm({ resolver: zodResolver(InvitationBody), defaultValues: { name: '', email: '' } });
  const invite = useInviteBuilder();
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      const { user } = await invite.mutateAsync(values);
      setMessage({ tone: 'ok', text: `Invitation sent to ${user.email}.` });
      form.reset();
    } catch (err) {
      const text = applyServerIssues(err, form.setError, ['name', 'email']);
      if (text) setMessage({ tone: 'error', text });
    }
  });
  const e = form.formState.errors;
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Invite a builder">
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <Field label="Builder's name" error={e.name?.message} {...form.register('name')} />
      <Field label="Builder's e-mail" type="email" error={e.email?.message} {...form.register('email')} />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        Send invitation
      </Button>
    </form>
  );
}
