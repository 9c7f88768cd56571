import { formatDate } from '@benchwright/contracts';
import { useEffect, useState } from 'react';
import { Button, formatMoney, MoreButton, Money, Notice, TableHead } from '@benchwright/ui';
import { toCents, toDollars } from '../../../lib/money';
import { usePayments, useRefund, type Payment } from '../api/payments';

const STATUS: Record<Payment['status'], string> = {
  open: 'waiting for the client',
  paid: 'paid',
  expired: 'checkout expired',
  refunded: 'refunded',
  partially_refunded: 'partly refunded',
};

/** A refund amount as typed ("25", "25.50") in cents, or null if it is not dollars and cents. */
const refundCents = (text: string): number | null => (/^\s*\d+(\.\d{1,2})?\s*$/.test(text) ? toCents(text) : null);

function RefundForm({ p, onAsked }: { p: Payment; onAsked: (id: string, refundedBefore: number) => void }) {
  const left = p.amountCents - p.refundedCents;
  const [text, setText] = useState(toDollars(left));
  const [error, setError] = useState<string | null>(null);
  const refund = useRefund();
  return (
    <form
      aria-label={`Refund ${p.clientName}'s ${p.kind}`}
      className="flex flex-wrap items-center gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        const cents = refundCents(text);
        if (cents === null || cents <= 0) return setError('enter an amount in dollars, like 25 or 25.50');
        if (cents > left) return setError(`at most ${formatMoney(left)} is left to refund`);
        if (!window.confirm(`Refund ${formatMoney(cents)} to ${p.clientName}'s card?`)) return;
        setError(null);
        refund.mutate(
          { id: p.id, amountCents: cents },
          { onSuccess: () => onAsked(p.id, p.refundedCents), onError: (err) => setError(err.message) },
        );
      }}
    >
      <label className="text-sm">
        $
        <input
          aria-label="Amount to refund"
          className="ml-1 w-24 rounded border border-rule bg-white px-1"
          inputMode="decimal"
          value={text}
          onChange={(e) => setText(e.target.value)}
        />
      </label>
      <Button type="submit" variant="quiet" className="px-1 py-0 text-sm" disabled={refund.isPending}>
        Refund
      </Button>
      {error ? (
        <span role="alert" className="w-full text-sm text-alert">
          {error}
        </span>
      ) : null}
    </form>
  );
}

/** Every deposit and balance, with refunds through the card processor for those paid. */
export function PaymentsTable() {
  const [asked, setAsked] = useState<Record<string, number>>({});
  const waiting = Object.keys(asked).length > 0;
  const q = usePayments(waiting);
  const rows = q.data?.pages.flatMap((p) => p.payments) ?? [];
  // a refund is confirmed once the webhook has raised the refunded amount
  const pending = Object.entries(asked).filter(
    ([id, before]) => (rows.find((p) => p.id === id)?.refundedCents ?? before) === before,
  );
  useEffect(() => {
    if (waiting && pending.length === 0) setAsked({});
  }, [waiting, pending.length]);
  if (q.isPending) return <p>Loading payments…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  return (
    <>
      {pending.length ? <Notice>Refund asked of the card processor; the table updates when it confirms.</Notice> : null}
      {!rows.length ? <p className="text-ink-soft">No payments yet.</p> : null}
      <table className="w-full text-left" aria-label="Payments">
        <TableHead columns={['Date', 'Client', 'For', 'Amount', 'Refunded', 'Status', 'Refund']} />
        <tbody>
          {rows.map((p) => (
            <tr key={p.id} className="border-b border-rule/50 align-top">
              <td className="py-2">{formatDate(p.createdAt)}</td>
              <td>{p.clientName}</td>
              <td>{p.kind}</td>
              <td>
                <Money cents={p.amountCents} />
              </td>
              <td>{p.refundedCents ? <Money cents={p.refundedCents} /> : '–'}</td>
              <td>{STATUS[p.status]}</td>
              <td>
                {(p.status === 'paid' || p.status === 'partially_refunded') && p.amountCents > p.refundedCents ? (
                  <RefundForm p={p} onAsked={(id, before) => setAsked((a) => ({ ...a, [id]: before }))} />
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <MoreButton list={q} />
    </>
  );
}
