import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { CreateClientBody } from '@benchwright/contracts';
import { applyServerIssues, Button, Field, Notice } from '@benchwright/ui';
import { useCreateClient } from '../api/clients';

/** A client who called or walked in; they are mailed a link to claim the account in the portal. */
export function AddClientForm({ onAdded }: { onAdded?: (id: string) => void }) {
  const form = useForm({
    resolver: zodResolver(CreateClientBody),
    defaultValues: { name: '', email: '', phone: '', address: '' },
  });
  const create = useCreateClient();
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const onSubmit = form.handleSubmit(async (values) => {
    setMessage(null);
    try {
      const client = await create.mutateAsync(values);
      setMessage({ tone: 'ok', text: `${client.name} is added; a mail invites them to claim the account.` });
      form.reset();
      onAdded?.(client.id);
    } catch (err) {
      const text = applyServerIssues(err, form.setError, ['name', 'email', 'phone', 'address']);
      if (text) setMessage({ tone: 'error', text });
    }
  });
  const e = form.formState.errors;
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Add a client">
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <Field label="Client's name" error={e.name?.message} {...form.register('name')} />
      <Field label="Client's e-mail" type="email" error={e.email?.message} {...form.register('email')} />
      <Field label="Phone" type="tel" error={e.phone?.message} {...form.register('phone')} />
      <Field label="Address" error={e.address?.message} {...form.register('address')} />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        Add client
      </Button>
    </form>
  );
}
