import { CLIENT_PROJECT_STATUS_LABELS, formatDate, type ProjectSummary } from '@benchwright/contracts';
import { designs, type DesignSlug } from '@benchwright/pricing/geometry';
import { Link } from 'react-router-dom';
import { MoreButton, Money, Notice } from '@benchwright/ui';
import { paths } from '../../../config/paths';
import { useProjects } from '@benchwright/ui';

/** The client's words for a project's status (one map, in the contracts). */
export const STATUS_WORDS = CLIENT_PROJECT_STATUS_LABELS;

export function itemName(spec: unknown): string {
  const slug = (spec as { design?: string }).design;
  return slug && slug in designs ? designs[slug as DesignSlug].name : 'Custom piece';
}

function ProjectRow({ p }: { p: ProjectSummary }) {
  const latest = p.latestEstimate;
  return (
    <li className="border-b border-rule py-4 last:border-0">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-lg font-semibold">
          <Link to={paths.project.getHref(p.id)} className="text-ink underline-offset-4 hover:underline">
            {p.items.map((i) => `${i.quantity > 1 ? `${i.quantity} x ` : ''}${i.name}`).join(', ')}
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

/** The client's projects, newest first, a page at a time. */
export function ProjectList() {
  const q = useProjects({ sort: 'created', dir: 'desc', limit: 20 });
  if (q.isPending) return <p>Loading your projects…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  const projects = q.data.pages.flatMap((p) => p.projects);
  if (!projects.length)
    return (
      <p className="text-ink-soft">
        No projects yet. When you ask the shop for an estimate, it appears here with every step that follows.
      </p>
    );
  return (
    <>
      <ul aria-label="My projects">
        {projects.map((p) => (
          <ProjectRow key={p.id} p={p} />
        ))}
      </ul>
      <MoreButton list={q} label="Show older projects" />
    </>
  );
}
