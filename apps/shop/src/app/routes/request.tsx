import { Link, useParams } from 'react-router-dom';
import { designs, type DesignSlug } from '@benchwright/pricing/geometry';
import { Button, CommentForm, Notice, Panel, useComment } from '@benchwright/ui';
import { canStartRevision, formatDateTime, SHOP_PROJECT_STATUS_LABELS, type Project } from '@benchwright/contracts';
import { RoleGate } from '../../components/layout';
import { paths } from '../../config/paths';
import { useCreateEstimate, useEstimate } from '../../features/estimates/api/estimates';
import { EstimateEditor } from '../../features/estimates/components/estimate-editor';
import { useProject } from '../../features/projects/api/get-project';
import { useLayouts } from '../../features/projects/api/get-layouts';
import { CutListPanel, PickListPanel, SheetLayoutsPanel } from '../../components/shop-paper';
import { useState } from 'react';
import { canSeeRequests } from '../../lib/policies';
import { useMe } from '@benchwright/ui/auth';
import { ProjectUploads } from '../../features/uploads/components/project-uploads';

function RequestPage({ id }: { id: string }) {
  const q = useProject(id);
  const latestId = q.data?.estimates.at(-1)?.id;
  const estimate = useEstimate(latestId);
  const create = useCreateEstimate();
  const [showLayouts, setShowLayouts] = useState(false);
  const layouts = useLayouts(id, showLayouts);
  const me = useMe();
  if (q.isPending) return <p>Loading…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  const p = q.data;
  const latest = p.estimates.at(-1);
  const canStart = canStartRevision(p.status) && latest?.status !== 'draft';
  return (
    <>
      <p className="mb-2">
        <Link to={paths.requests.getHref()} className="text-wood underline">
          ← Requests
        </Link>
      </p>
      <Panel level={1} title={`${p.client.name}: ${SHOP_PROJECT_STATUS_LABELS[p.status]}`}>
        {p.notes ? <p className="mb-2">“{p.notes}”</p> : null}
        <ul className="list-disc pl-6">
          {p.items.map((i) => {
            const s = i.spec as { design: DesignSlug };
            return <li key={i.id}>{`${i.quantity} x ${designs[s.design]?.name ?? s.design}`}</li>;
          })}
        </ul>
        {canStart ? (
          <div className="mt-4 flex gap-3">
            {create.isError ? <Notice tone="error">{create.error.message}</Notice> : null}
            <Button onClick={() => create.mutate({ projectId: p.id, source: 'engine' })} disabled={create.isPending}>
              {create.isPending
                ? 'Pricing the cut list and sheet layouts…'
                : latest
                  ? 'Price a new revision'
                  : 'Price an estimate'}
            </Button>
            {latest ? (
              <Button variant="quiet" onClick={() => create.mutate({ projectId: p.id, source: 'copy' })}>
                Start a revision from revision {latest.revision}
              </Button>
            ) : null}
          </div>
        ) : null}
      </Panel>
      {me.data ? <ProjectUploads projectId={p.id} viewer={me.data} /> : null}
      <Conversation project={p} />
      {estimate.data ? <EstimateEditor key={estimate.data.id} estimate={estimate.data} /> : null}
      {!showLayouts ? (
        <p className="mb-6">
          <Button variant="quiet" onClick={() => setShowLayouts(true)}>
            Show the cut list and sheet layouts
          </Button>
        </p>
      ) : layouts.isPending ? (
        <p className="mb-6">Laying out the sheets…</p>
      ) : layouts.isError ? (
        <Notice tone="error">{layouts.error.message}</Notice>
      ) : (
        <>
          <CutListPanel layouts={layouts.data} />
          <SheetLayoutsPanel layouts={layouts.data} />
          <PickListPanel layouts={layouts.data} />
        </>
      )}
    </>
  );
}

/** What the client and the shop have written to each other about the request. */
function Conversation({ project }: { project: Project }) {
  const comment = useComment(project.id);
  const comments = project.timeline.filter((t) => t.kind === 'comment');
  return (
    <Panel title="Conversation with the client">
      {comments.length ? (
        <ol className="mb-3 border-l-2 border-wood pl-4" aria-label="Comments">
          {comments.map((c) => (
            <li key={c.id} className="mb-2">
              <span className="text-sm text-ink-soft">{formatDateTime(c.at)}</span>
              <br />
              <span className="font-semibold">{c.by}: </span>
              {c.message}
            </li>
          ))}
        </ol>
      ) : (
        <p className="mb-3 text-ink-soft">No comments yet.</p>
      )}
      <CommentForm
        label={`Write to ${project.client.name}`}
        pending={comment.isPending}
        error={comment.error?.message}
        onSend={(message, done) => comment.mutate({ message }, { onSuccess: done })}
      />
    </Panel>
  );
}

export function RequestRoute() {
  const { id = '' } = useParams();
  return (
    <RoleGate allow={canSeeRequests}>
      <RequestPage id={id} />
    </RoleGate>
  );
}
