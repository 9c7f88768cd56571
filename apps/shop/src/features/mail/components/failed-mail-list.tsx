import { formatDateTime } from '@benchwright/contracts';
import { Button, Notice, TableHead } from '@benchwright/ui';
import { useFailedMail, useRetryMail } from '../api/failed-mail';

const when = (iso: string) => formatDateTime(iso);

/** Mail the relay has refused so far: the worker keeps trying with growing waits; the owner can try one now. */
export function FailedMailList() {
  const q = useFailedMail();
  const retry = useRetryMail();
  if (q.isPending) return <p>Loading…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  if (!q.data.length) return <Notice tone="ok">Every e-mail has gone out.</Notice>;
  return (
    <>
      <p className="mb-3 text-ink-soft">
        These have not reached the mail server yet. Each is tried again by itself, waiting longer each time (up to five
        minutes); nothing is lost. Check the address, or the mail server settings, if the error says so.
      </p>
      {retry.isError ? <Notice tone="error">{retry.error.message}</Notice> : null}
      <table className="w-full text-left" aria-label="Failed e-mails">
        <TableHead columns={['To', 'Subject', 'Tries', 'Last error', 'Next try', '']} />
        <tbody>
          {q.data.map((m) => (
            <tr key={m.id} className="border-b border-rule/50 align-top">
              <td className="py-2">{m.to}</td>
              <td>{m.subject}</td>
              <td className="tabular-nums">{m.attempts}</td>
              <td className="text-sm">{m.lastError}</td>
              <td className="text-sm">{when(m.nextAttemptAt)}</td>
              <td>
                <Button
                  variant="quiet"
                  className="px-1 py-0"
                  disabled={retry.isPending}
                  onClick={() => retry.mutate(m.id)}
                >
                  Try now
                </Button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </>
  );
}
