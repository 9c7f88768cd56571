import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { AcceptEstimateBody, formatDate, LINE_GROUP_LABELS, LINE_GROUPS, replacedBy } from '@benchwright/contracts';
import { formatQuantity } from '@benchwright/pricing/geometry';
import { applyServerIssues, Button, ChoicesList, Drawing, Field, Money, Notice, Panel } from '@benchwright/ui';
import { paths } from '../../../config/paths';
import { useAcceptEstimate } from '../api/accept-estimate';
import { useDepositCheckout } from '../api/checkout';
import { useEstimate, type ClientEstimate } from '../api/get-estimate';

function Lines({ e }: { e: ClientEstimate }) {
  return (
    <table className="w-full border-collapse text-left" aria-label="Priced items">
      <thead>
        <tr className="border-b-2 border-rule">
          <th className="py-1">Item</th>
          <th className="py-1 text-right">Quantity</th>
          <th className="py-1 text-right">Amount</th>
        </tr>
      </thead>
      {LINE_GROUPS.filter((g) => e.lines.some((l) => l.group === g)).map((g) => (
        <tbody key={g}>
          <tr>
            <th colSpan={3} className="pt-3 font-semibold">
              {LINE_GROUP_LABELS[g]}
            </th>
          </tr>
          {e.lines
            .filter((l) => l.group === g)
            .map((l) => (
              <tr key={l.id} className="border-b border-rule">
                <td className="py-1">{l.description}</td>
                <td className="py-1 text-right">{formatQuantity(l.quantity, l.unit, e.units)}</td>
                <td className="py-1 text-right">
                  <Money cents={l.amountCents} />
                </td>
              </tr>
            ))}
        </tbody>
      ))}
      <tfoot>
        {[
          ['Subtotal', e.totals.subtotalCents],
          ...(e.totals.discountCents ? [['Discount', -e.totals.discountCents] as const] : []),
          ['Tax', e.totals.taxCents],
          ['Total', e.totals.totalCents],
          ['Deposit to start', e.totals.depositCents],
          ['Balance on completion', e.totals.balanceCents],
        ].map(([label, cents]) => (
          <tr key={label as string} className={label === 'Total' ? 'border-t-2 border-ink font-bold' : ''}>
            <td className="py-1" colSpan={2}>
              {label}
            </td>
            <td className="py-1 text-right">
              <Money cents={cents as number} />
            </td>
          </tr>
        ))}
      </tfoot>
    </table>
  );
}

function AcceptForm({ e }: { e: ClientEstimate }) {
  const form = useForm({ resolver: zodResolver(AcceptEstimateBody), defaultValues: { acceptedName: '' } });
  const accept = useAcceptEstimate();
  const [message, setMessage] = useState<string | null>(null);
  const onSubmit = form.handleSubmit(async ({ acceptedName }) => {
    setMessage(null);
    try {
      await accept.mutateAsync({ id: e.id, acceptedName });
    } catch (err) {
      setMessage(applyServerIssues(err, form.setError, ['acceptedName']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Accept the estimate">
      {message ? <Notice tone="error">{message}</Notice> : null}
      <p className="mb-3">
        To accept revision {e.revision} for <Money cents={e.totals.totalCents} />, type your full name. It is recorded
        with the date and time.
      </p>
      <Field
        label="Your full name"
        autoComplete="name"
        error={form.formState.errors.acceptedName?.message}
        {...form.register('acceptedName')}
      />
      <Button type="submit" disabled={form.formState.isSubmitting}>
        Accept the estimate
      </Button>
    </form>
  );
}

function PayDeposit({ e }: { e: ClientEstimate }) {
  const checkout = useDepositCheckout();
  return (
    <div>
      {checkout.isError ? <Notice tone="error">{checkout.error.message}</Notice> : null}
      <p className="mb-3">
        Accepted by {e.acceptedName}. The deposit of <Money cents={e.totals.depositCents} /> starts the work: we order
        material once it arrives.
      </p>
      <Button onClick={() => checkout.mutate(e.id)} disabled={checkout.isPending}>
        Pay the deposit
      </Button>
    </div>
  );
}

/** `depositDue`: the project waits for its deposit (once paid, the estimate stays accepted but asks for nothing). */
export function EstimateView({
  estimateId,
  canAct,
  depositDue,
}: {
  estimateId: string;
  canAct: boolean;
  depositDue: boolean;
}) {
  const q = useEstimate(estimateId);
  if (q.isPending) return <p>Loading the estimate…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  const e = q.data;
  return (
    <Panel title={`Estimate ${e.number}, revision ${e.revision}`}>
      <p className="mb-3 text-ink-soft">
        {e.status === 'sent' && e.validUntil ? `Valid until ${formatDate(e.validUntil)}. ` : null}
        <a href={paths.estimatePdf.getHref(e.id)} className="text-wood underline">
          Download the PDF
        </a>
      </p>
      {e.drawings.map((d, i) => (
        <div key={i} className="mb-4 max-w-xl">
          <Drawing drawing={d} />
        </div>
      ))}
      <ChoicesList
        heading="Your choices"
        pieces={(e.choices ?? []).map((choices, i) => ({ title: e.drawings[i]?.title, choices }))}
      />
      <Lines e={e} />
      {e.checks.length ? (
        <div className="mt-4">
          <h3 className="mb-2 font-semibold">Good to know</h3>
          <ul className="list-disc pl-6">
            {e.checks.map((c) => (
              <li key={c.code + c.message}>{c.message}</li>
            ))}
          </ul>
        </div>
      ) : null}
      <div className="mt-6">
        {e.status === 'sent' && canAct ? <AcceptForm e={e} /> : null}
        {e.status === 'accepted' && canAct && depositDue ? <PayDeposit e={e} /> : null}
        {e.status === 'accepted' && !depositDue ? (
          <p className="text-ink-soft">
            Accepted by {e.acceptedName}
            {e.acceptedAt ? ` on ${formatDate(e.acceptedAt)}` : ''}.
          </p>
        ) : null}
        {e.status === 'superseded' ? (
          <Notice>{e.replacedBy ? `${replacedBy(e.replacedBy)}.` : 'Replaced by a newer revision.'}</Notice>
        ) : null}
        {e.status === 'expired' ? <Notice>This estimate expired; ask the shop for a new one.</Notice> : null}
        {e.status === 'withdrawn' ? (
          <Notice>The shop withdrew this revision; the project page says why, and a new revision will follow.</Notice>
        ) : null}
      </div>
    </Panel>
  );
}
