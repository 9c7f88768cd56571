import { useEffect, useRef } from 'react';
import { Link, Navigate, useParams, useSearchParams } from 'react-router-dom';
import { canDo, formatDateTime } from '@benchwright/contracts';
import { Button, CommentForm, Money, Notice, Panel, useComment } from '@benchwright/ui';
import { useMe } from '@benchwright/ui/auth';
import { paths } from '../../config/paths';
import { useBalanceCheckout } from '../../features/estimates/api/checkout';
import { EstimateView } from '../../features/estimates/components/estimate-view';
import { useConfirmPayment } from '../../features/projects/api/confirm-payment';
import { useProject } from '../../features/projects/api/get-project';
import { STATUS_WORDS, itemName } from '../../features/projects/components/project-list';
import { ProjectUploads } from '../../features/uploads/components/project-uploads';

export function ProjectRoute() {
  const { id = '' } = useParams();
  const [params] = useSearchParams();
  const sessionId = params.get('session_id');
  const returning = sessionId !== null;
  const me = useMe();
  const q = useProject(id, { waitingForPayment: returning });
  const balance = useBalanceCheckout();
  // back from Checkout: ask once for the payment to be recorded, then poll as the webhook may also record it
  const { mutate: confirmPayment } = useConfirmPayment();
  const confirmed = useRef<string | null>(null);
  useEffect(() => {
    if (!sessionId || me.data?.role !== 'client' || confirmed.current === sessionId) return;
    confirmed.current = sessionId;
    confirmPayment({ sessionId });
  }, [sessionId, me.data?.role, confirmPayment]);
  if (me.isPending) return <p>Loading…</p>;
  if (!me.data) return <Navigate to={paths.signIn.getHref(paths.project.getHref(id))} replace />;
  if (q.isPending) return <p>Loading the project…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  const p = q.data;
  const latest = p.estimates.at(-1);
  const accepted = p.estimates.find((e) => e.status === 'accepted');
  return (
    <>
      <p className="mb-2">
        <Link to={paths.projects.getHref()} className="text-wood underline">
          ← My projects
        </Link>
      </p>
      <h1 className="mb-1 text-2xl font-bold">
        {p.items.map((i) => `${i.quantity > 1 ? `${i.quantity} x ` : ''}${itemName(i.spec)}`).join(', ')}
      </h1>
      <p className="mb-4">
        <span className="rounded bg-sage-light px-2 py-0.5" aria-label="Status">
          {STATUS_WORDS[p.status]}
        </span>
      </p>
      {returning && (p.status === 'accepted' || p.status === 'ready') ? (
        <Notice>Thank you: your payment is being recorded. This page updates by itself.</Notice>
      ) : null}
      {returning && p.status === 'deposit_paid' ? (
        <Notice tone="ok">Thank you: your deposit is paid and your piece is on our production board.</Notice>
      ) : null}
      {p.status === 'ready' && accepted ? (
        <Panel title="Your piece is ready">
          <p className="mb-3">
            The balance of <Money cents={accepted.totals.balanceCents} /> is due before delivery.
          </p>
          {balance.isError ? <Notice tone="error">{balance.error.message}</Notice> : null}
          <Button onClick={() => balance.mutate(p.id)} disabled={balance.isPending}>
            Pay the balance
          </Button>
        </Panel>
      ) : null}
      {latest ? (
        <EstimateView
          estimateId={(accepted ?? latest).id}
          canAct={me.data.role === 'client'}
          depositDue={canDo(p.status, 'pay_deposit')}
        />
      ) : (
        <Panel title="Estimate">We are working out your estimate; you will get an e-mail when it is ready.</Panel>
      )}
      <ProjectUploads projectId={p.id} viewer={me.data} />
      <Panel title="Timeline">
        <ol className="border-l-2 border-wood pl-4" aria-label="Timeline">
          {p.timeline.map((t) => (
            <li key={t.id} className="mb-2">
              <span className="text-sm text-ink-soft">{formatDateTime(t.at)}</span>
              <br />
              {t.by ? <span className="font-semibold">{t.by}: </span> : null}
              {t.message}
              {t.photos?.length ? (
                <ul className="mt-2 flex flex-wrap gap-2" aria-label={`Photos: ${t.message}`}>
                  {t.photos
                    .filter((id) => p.uploads.some((u) => u.id === id))
                    .map((id, i) => (
                      <li key={id}>
                        <a href={paths.upload.getHref(id)} target="_blank" rel="noreferrer">
                          <img
                            src={paths.uploadThumbnail.getHref(id)}
                            alt={`Progress photo ${i + 1}`}
                            className="h-24 w-24 rounded border border-rule object-cover"
                            loading="lazy"
                          />
                        </a>
                      </li>
                    ))}
                </ul>
              ) : null}
            </li>
          ))}
        </ol>
        {me.data.role === 'client' && !me.data.emailVerified ? (
          <Notice tone="info">
            Confirm your e-mail address to write to the shop: open the link we sent you when you signed up.
          </Notice>
        ) : me.data.role === 'client' ? (
          <ProjectComment projectId={p.id} />
        ) : null}
      </Panel>
    </>
  );
}

function ProjectComment({ projectId }: { projectId: string }) {
  const comment = useComment(projectId);
  return (
    <CommentForm
      label="Write to the shop"
      pending={comment.isPending}
      error={comment.error?.message}
      onSend={(message, done) => comment.mutate({ message }, { onSuccess: done })}
    />
  );
}
