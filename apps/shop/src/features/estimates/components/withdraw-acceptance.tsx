import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { WithdrawEstimateBody } from '@benchwright/contracts';
import { applyServerIssues, Button, Field, Notice } from '@benchwright/ui';
import { useWithdrawEstimate, type OwnerEstimate } from '../api/estimates';

/** For an accepted revision before its deposit: the owner takes it back, with a reason the client will read. */
export function WithdrawAcceptance({ estimate }: { estimate: OwnerEstimate }) {
  const form = useForm({ resolver: zodResolver(WithdrawEstimateBody), defaultValues: { reason: '' } });
  const withdraw = useWithdrawEstimate();
  const [message, setMessage] = useState<string | null>(null);
  const onSubmit = form.handleSubmit(async (body) => {
    setMessage(null);
    try {
      await withdraw.mutateAsync({ id: estimate.id, body });
    } catch (err) {
      setMessage(applyServerIssues(err, form.setError, ['reason']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Withdraw this revision" className="mt-4">
      {message ? <Notice tone="error">{message}</Notice> : null}
      <Field
        label="Why withdraw it?"
        hint="The client reads this. Only before the deposit is paid; you can then send a new revision."
        error={form.formState.errors.reason?.message}
        {...form.register('reason')}
      />
      <Button type="submit" variant="quiet" disabled={form.formState.isSubmitting}>
        Withdraw revision {estimate.revision}
      </Button>
    </form>
  );
}
