import { CLIENT_PROJECT_STATUS_LABELS, formatDate, type Project } from '@benchwright/contracts';
import { designs, type DesignSlug } from '@benchwright/pricing/geometry';
import { Link } from 'react-router-dom';
import { Money, Notice } from '@benchwright/ui';
import { paths } from '../../../config/paths';
import { useProjects } from '../api/get-projects';

/** The client's words for a project's status (one map, in the contracts). */
export const STATUS_WORDS = CLIENT_PROJECT_STATUS_LABELS;

export function itemName(spec: unknown): string {
  const slug = (spec as { design?: string }).design;
  return slug && slug in designs ? designs[slug as DesignSlug].name : 'Custom piece';
}

function ProjectRow({ p }: { p: Project }) {
  const latest = p.estimates.at(-1);
  return (
    <li className="border-b border-rule py-4 last:border-0">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-lg font-semibold">
          <Link to={paths.project.getHref(p.id)} className="text-ink underline-offset-4 hover:underline">
            {p.items.map((i) => `${i.quantity > 1 ? `${i.quantity} x ` : ''}${itemName(i.spec)}`).join(', ')}
          </Link>
        </h3>
        <span className="rounded bg-sage-light px-2 py-0.5 text-sm">{STATUS_WORDS[p.status]}</span>
      </div>
      {p.notes ? <p className="text-ink-soft">{p.notes}</p> : null}
      <p className="text-sm text-ink-soft">
        Asked on {formatDate(p.createdAt)}
        {latest ? (
          <>
            {' '}
            · estimate revision {latest.revision}: <Money cents={latest.totals.totalCents} />
          </>
        ) : null}
      </p>
    </li>
  );
}

export function ProjectList() {
  const q = useProjects();
  if (q.isPending) return <p>Loading your projects…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  if (!q.data.length)
    return (
      <p className="text-ink-soft">
        No projects yet. When you ask the shop for an estimate, it appears here with every step that follows.
      </p>
    );
  return (
    <ul aria-label="My projects">
      {q.data.map((p) => (
        <ProjectRow key={p.id} p={p} />
      ))}
    </ul>
  );
}
